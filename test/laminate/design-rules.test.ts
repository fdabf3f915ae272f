import { expect } from 'chai';
import { designRuleChecks, parseStackingCode, type PlyInput, type RuleCheck } from '../../api/src/laminate/index.ts';
import { DEMO_CARBON, T300_5208 } from './support/generators.ts';

const stack = (code: string): PlyInput[] => parseStackingCode(code).map((thetaDeg) => ({ material: DEMO_CARBON, thetaDeg, thickness: 0.125 }));
const byRule = (checks: RuleCheck[]) => Object.fromEntries(checks.map((c) => [c.rule, c]));

// the rules are common practice (ENGINEERING.md section 3 item 7); the verdicts follow from their wording
describe('laminate engine: design rules', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  it('a ±45-skinned quasi-isotropic symmetric laminate passes every rule', () => {
    const r = byRule(designRuleChecks(stack('[45/0/-45/90]s')));
    for (const rule of Object.values(r)) expect(rule.pass, rule.rule).to.equal(true);
    expect(r['ten-percent-rule'].detail).to.match(/0°: 25 %, ±45°: 50 %, 90°: 25 %/);
  });

  it('reports each failing rule with a detail, enforcing none', () => {
    const r = byRule(designRuleChecks(stack('[0_5/45/90]T')));
    expect(r.symmetric.pass).to.equal(false);
    expect(r.symmetric.detail).to.match(/ply 0 and its mirror ply 6/);
    expect(r.balanced.pass).to.equal(false);
    expect(r.balanced.detail).to.match(/45°/);
    expect(r['ten-percent-rule'].pass).to.equal(true);
    expect(r['max-four-adjacent'].pass).to.equal(false);
    expect(r['max-four-adjacent'].detail).to.match(/5 adjacent plies .*plies 0-4/);
    expect(r['outer-plies-45'].pass).to.equal(false);
  });

  it('compares orientations as fibre lines and checks materials and thicknesses for symmetry', () => {
    expect(byRule(designRuleChecks(stack('[135/45]T'))).balanced.pass).to.equal(true); // 135° is -45°
    const mixed: PlyInput[] = [{ material: DEMO_CARBON, thetaDeg: 0, thickness: 0.1 }, { material: T300_5208, thetaDeg: 0, thickness: 0.1 }];
    expect(byRule(designRuleChecks(mixed)).symmetric.detail).to.match(/different materials/);
    const thick: PlyInput[] = [{ material: DEMO_CARBON, thetaDeg: 0, thickness: 0.1 }, { material: DEMO_CARBON, thetaDeg: 0, thickness: 0.2 }];
    expect(byRule(designRuleChecks(thick)).symmetric.pass).to.equal(false);
    const unbalancedByMaterial: PlyInput[] = [{ material: DEMO_CARBON, thetaDeg: 30, thickness: 0.1 }, { material: T300_5208, thetaDeg: -30, thickness: 0.1 }];
    expect(byRule(designRuleChecks(unbalancedByMaterial)).balanced.pass).to.equal(false);
    expect(byRule(designRuleChecks(stack('[0/90_4/0]T')))['ten-percent-rule'].pass).to.equal(false);
  });
});
