import { expect } from 'chai';
import { CRITERIA, DEFAULT_FAILURE_OPTIONS, analyseLaminate, parseLaminateInput, type CriterionName, type PlyMaterial } from '../../api/src/laminate/index.ts';
import { criterionPlan } from '../../api/src/laminate/failure/plans.ts';
import { failureIndexAt, RayFailure, strengthRatioAlongRay } from '../../api/src/laminate/failure/ray-solver.ts';
import { derivedPerpPerpCompression } from '../../api/src/laminate/failure/puck.ts';
import { firstCrossingByScan, INDEPENDENT_INDEX, puckIndex, tsaiWuIndex } from './support/independent-criteria.ts';
import { DEMO_CARBON, randomMaterial, seededRandom, T300_5208 } from './support/generators.ts';

const printed = (value: number, digits: number) => Number(value.toPrecision(digits));

/** Strength ratio of one ply stress state by the engine (no laminate around it). */
function ratio(criterion: CriterionName, m: PlyMaterial, r: number[], mech: number[]): RayFailure {
  return strengthRatioAlongRay(criterionPlan(criterion, m, DEFAULT_FAILURE_OPTIONS), r[0], r[1], r[2], mech[0], mech[1], mech[2], false, new RayFailure());
}

function uniaxial(criterion: CriterionName, m: PlyMaterial, direction: number[]): number {
  return ratio(criterion, m, [0, 0, 0], direction).ratio;
}

describe('laminate engine: failure criteria of one ply', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  for (const criterion of CRITERIA) {
    it(`${criterion}: a unidirectional ply fails at Xt, Xc, Yt, Yc and S12 under the matching uniaxial stress (definition of the strengths)`, () => {
      for (const m of [T300_5208, DEMO_CARBON]) {
        expect(uniaxial(criterion, m, [1, 0, 0])).to.be.closeTo(m.Xt!, 1e-9 * m.Xt!);
        expect(uniaxial(criterion, m, [-1, 0, 0])).to.be.closeTo(m.Xc!, 1e-9 * m.Xc!);
        expect(uniaxial(criterion, m, [0, 1, 0])).to.be.closeTo(m.Yt!, 1e-9 * m.Yt!);
        expect(uniaxial(criterion, m, [0, -1, 0])).to.be.closeTo(m.Yc!, 1e-9 * m.Yc!);
        expect(uniaxial(criterion, m, [0, 0, 1])).to.be.closeTo(m.S12!, 1e-9 * m.S12!);
        expect(uniaxial(criterion, m, [0, 0, -1])).to.be.closeTo(m.S12!, 1e-9 * m.S12!);
      }
    });
  }

  it('a unidirectional laminate pulled along the fibres fails at Xt under every criterion (issue 4 acceptance)', () => {
    const a = analyseLaminate(parseLaminateInput({ code: '[0_4]T', material: DEMO_CARBON, plyThickness: 0.25, loads: { N: [1, 0, 0] }, criteria: [...CRITERIA] }));
    for (const c of CRITERIA) {
      const f = a.firstPlyFailure![c]!;
      expect(f.strengthRatio! / a.thickness, c).to.be.closeTo(DEMO_CARBON.Xt!, 1e-9 * DEMO_CARBON.Xt!);
      expect(f.mode, c).to.equal('fibre-tension');
    }
  });

  it('Kaw Examples 2.13-2.16 stress state on a 60° T300/5208 ply (σ1 = 1.714, σ2 = -2.714, τ12 = -4.165 MPa)', () => {
    const s = [1.714, -2.714, -4.165].map((v) => v); // rounded local stresses of Kaw Ex. 2.13 (from memory)
    const exact = (() => { const c = 0.5, n = Math.sqrt(3) / 2; return [c * c * 2 - n * n * 3 + 2 * c * n * 4, n * n * 2 - c * c * 3 - 2 * c * n * 4, -c * n * 2 - c * n * 3 + (c * c - n * n) * 4]; })();
    expect(exact.map((v) => printed(v, 4))).to.deep.equal(s);
    // max stress: min(1500/1.714, 246/2.714, 68/4.165) = 16.33, shear governs (Kaw Ex. 2.13, from memory)
    const ms = ratio('max-stress', T300_5208, [0, 0, 0], exact);
    expect(printed(ms.ratio, 4)).to.equal(16.33);
    // max strain: γ12 allowable S12/G12 gives the same 16.33 (hand calculation; Kaw Ex. 2.14 uses strain allowables from the strengths, from memory)
    expect(printed(ratio('max-strain', T300_5208, [0, 0, 0], exact).ratio, 4)).to.equal(16.33);
    // Tsai-Hill: 1/sqrt((σ1/Xt)² - σ1σ2/Xt² + (σ2/Yc)² + (τ12/S)²) = 1/sqrt(3.877e-3) = 16.06 (hand calculation, the form of Kaw eq. for Tsai-Hill)
    expect(printed(ratio('tsai-hill', T300_5208, [0, 0, 0], exact).ratio, 4)).to.equal(16.06);
    // Tsai-Wu with F12* = -0.5: a R² + b R - 1 = 0 with a = 4.533e-3, b = -5.680e-2 gives R = 22.39 (hand calculation)
    expect(printed(ratio('tsai-wu', T300_5208, [0, 0, 0], exact).ratio, 4)).to.equal(22.39);
  });

  it('the engine indices equal the independently written published formulas on 2000 random states', () => {
    const rnd = seededRandom(601);
    for (let k = 0; k < 2000; k++) {
      const m = randomMaterial(rnd);
      const s = [(-2 + 4 * rnd()) * m.Xt!, (-2 + 4 * rnd()) * m.Yc!, (-2 + 4 * rnd()) * m.S12!];
      for (const c of CRITERIA) {
        const engine = failureIndexAt(criterionPlan(c, m, DEFAULT_FAILURE_OPTIONS), s[0], s[1], s[2], false).index;
        const independent = INDEPENDENT_INDEX[c](m, s[0], s[1], s[2]);
        expect(engine, `${c} at ${s}`).to.be.closeTo(independent, 1e-9 * Math.max(1, Math.abs(independent)));
      }
    }
  });

  it('strength ratio with residual stress held fixed equals the first crossing found by scan and bisection of the published index (400 states x 6 criteria)', () => {
    const rnd = seededRandom(602);
    for (let k = 0; k < 400; k++) {
      const m = randomMaterial(rnd);
      const r = [(-0.3 + 0.6 * rnd()) * m.Xt!, (-0.4 + 0.8 * rnd()) * m.Yt!, (-0.4 + 0.8 * rnd()) * m.S12!];
      const mech = [(-1 + 2 * rnd()) * m.Xt!, (-1 + 2 * rnd()) * m.Yc!, (-1 + 2 * rnd()) * m.S12!].map((v) => v / 100);
      for (const c of CRITERIA) {
        const engine = ratio(c, m, r, mech).ratio;
        const index = (R: number) => INDEPENDENT_INDEX[c](m, r[0] + R * mech[0], r[1] + R * mech[1], r[2] + R * mech[2]);
        const scanned = firstCrossingByScan(index, Number.isFinite(engine) ? 2 * engine + 1 : 1e4);
        expect(engine, `${c} state ${k}`).to.be.closeTo(scanned, 1e-8 * Math.max(1, scanned));
      }
    }
  });

  it('strength ratio times the load lands on failure index 1 (every criterion; residual stress held fixed; 400 states)', () => {
    const rnd = seededRandom(603);
    let jumps = 0;
    for (let k = 0; k < 400; k++) {
      const m = randomMaterial(rnd);
      const r = [(-0.3 + 0.6 * rnd()) * m.Xt!, (-0.4 + 0.8 * rnd()) * m.Yt!, (-0.4 + 0.8 * rnd()) * m.S12!];
      const mech = [(-1 + 2 * rnd()) * m.Xt!, (-1 + 2 * rnd()) * m.Yc!, (-1 + 2 * rnd()) * m.S12!].map((v) => v / 50);
      for (const c of CRITERIA) {
        const R = ratio(c, m, r, mech).ratio;
        const at = (x: number) => INDEPENDENT_INDEX[c](m, r[0] + x * mech[0], r[1] + x * mech[1], r[2] + x * mech[2]);
        if (R === 0) { expect(at(0)).to.be.at.least(1); continue; }
        const value = at(R);
        if (c === 'hashin' && Math.abs(value - 1) > 1e-9) {
          // Hashin's fibre-tension mode carries shear and fibre compression does not: where σ1 changes sign the index can jump past 1 (Hashin 1980)
          expect(Math.abs(r[0] + R * mech[0])).to.be.below(1e-9 * m.Xt!);
          expect(at(R * (1 - 1e-9))).to.be.below(1);
          jumps++;
          continue;
        }
        expect(value, `${c} state ${k}`).to.be.closeTo(1, 1e-9);
      }
    }
    expect(jumps).to.be.below(40);
  });

  it('without residual stress the ratio is 1/sqrt(index) for Tsai-Hill and 1/f_E for Puck (homogeneous criteria; theory)', () => {
    const rnd = seededRandom(604);
    for (let k = 0; k < 300; k++) {
      const m = randomMaterial(rnd);
      const s = [(-1 + 2 * rnd()) * 100, (-1 + 2 * rnd()) * 30, (-1 + 2 * rnd()) * 30];
      const th = INDEPENDENT_INDEX['tsai-hill'](m, s[0], s[1], s[2]);
      expect(ratio('tsai-hill', m, [0, 0, 0], s).ratio).to.be.closeTo(1 / Math.sqrt(th), 1e-9 / Math.sqrt(th));
      const fe = puckIndex(m, s[0], s[1], s[2], { pT: 0.35, pC: 0.3 });
      expect(ratio('puck', m, [0, 0, 0], s).ratio).to.be.closeTo(1 / fe, 1e-9 / fe);
    }
  });

  it('Tsai-Wu: F12* is user-settable and equal-biaxial failure follows (F1 + F2) σ + (F11 + F22 + 2 F12) σ² = 1 (Tsai and Wu 1971)', () => {
    const m = DEMO_CARBON;
    for (const f12Star of [-0.5, 0, 0.3]) {
      const plan = criterionPlan('tsai-wu', m, { ...DEFAULT_FAILURE_OPTIONS, tsaiWuF12Star: f12Star });
      const R = strengthRatioAlongRay(plan, 0, 0, 0, 1, 1, 0, false, new RayFailure()).ratio;
      const F1 = 1 / m.Xt! - 1 / m.Xc!, F2 = 1 / m.Yt! - 1 / m.Yc!, F11 = 1 / (m.Xt! * m.Xc!), F22 = 1 / (m.Yt! * m.Yc!);
      const a = F11 + F22 + 2 * f12Star * Math.sqrt(F11 * F22), b = F1 + F2;
      expect(R).to.be.closeTo((-b + Math.sqrt(b * b + 4 * a)) / (2 * a), 1e-9 * R);
      expect(tsaiWuIndex(m, R, R, 0, f12Star)).to.be.closeTo(1, 1e-9);
    }
  });

  it('Puck: modes B and C meet at (σ2, τ21) = (-R⊥⊥A, τ21c) with the derived p⊥⊥(-) (Puck and Schürmann 2002)', () => {
    const m = DEMO_CARBON;
    const pPP = derivedPerpPerpCompression(0.3, m.Yc!, m.S12!);
    const RA = m.Yc! / (2 * (1 + pPP)), tau21c = m.S12! * Math.sqrt(1 + 2 * pPP);
    const plan = criterionPlan('puck', m, DEFAULT_FAILURE_OPTIONS);
    // mode B just inside, mode C just outside the boundary both give f_E = 1 at the corner point
    expect(plan.value(3, 0, -RA, tau21c)).to.be.closeTo(1, 1e-12);
    expect(plan.value(4, 0, -RA, tau21c)).to.be.closeTo(1, 1e-12);
    expect(pPP).to.be.within(0.2, 0.5);
    // pure transverse compression fails at Yc in mode C, a little shear with it still in mode C
    const c = strengthRatioAlongRay(plan, 0, 0, 0, 0, -1, 0.01, false, new RayFailure());
    expect(plan.describe(c.modeIndex, 0, 0, 0)).to.equal('iff-mode-c');
    const b = strengthRatioAlongRay(plan, 0, 0, 0, 0, -0.2, 1, false, new RayFailure());
    expect(plan.describe(b.modeIndex, 0, 0, 0)).to.equal('iff-mode-b');
  });

  it('Puck: user p⊥⊥(-) and inclination parameters change the result as the formulas say', () => {
    const m = DEMO_CARBON;
    const plan = criterionPlan('puck', m, { ...DEFAULT_FAILURE_OPTIONS, puck: { pPerpParTension: 0.3, pPerpParCompression: 0.25, pPerpPerpCompression: 0.2 } });
    const s = [10, -120, 30];
    const R = strengthRatioAlongRay(plan, 0, 0, 0, s[0], s[1], s[2], false, new RayFailure()).ratio;
    expect(R).to.be.closeTo(1 / puckIndex(m, s[0], s[1], s[2], { pT: 0.3, pC: 0.25, pPP: 0.2 }), 1e-9);
  });

  it('Hashin: S23 given changes matrix compression only; default S23 = Yc/2 gives (σ2/Yc)² + (τ/S)² (Hashin 1980)', () => {
    const base = ratio('hashin', DEMO_CARBON, [0, 0, 0], [0, -1, 0.5]).ratio;
    expect(1 / base ** 2).to.be.closeTo((1 / DEMO_CARBON.Yc!) ** 2 + (0.5 / DEMO_CARBON.S12!) ** 2, 1e-12);
    const withS23 = ratio('hashin', { ...DEMO_CARBON, S23: 70 }, [0, 0, 0], [0, -1, 0.5]).ratio;
    expect(withS23).to.not.be.closeTo(base, 1e-3);
    expect(ratio('hashin', { ...DEMO_CARBON, S23: 70 }, [0, 0, 0], [0, 1, 0.5]).ratio).to.equal(ratio('hashin', DEMO_CARBON, [0, 0, 0], [0, 1, 0.5]).ratio);
  });

  it('Hashin: where σ1 turns tensile under shear above S12 the index jumps past 1, and the ply fails at that point (Hashin 1980)', () => {
    // S23 = 40 MPa makes matrix compression lenient under σ2 = -30 MPa; σ1 = -10 + R, τ12 = 10 R: fibre compression
    // holds until R = 10, where fibre tension with (τ/S12)² = (100/92)² > 1 takes over (hand calculation)
    const m = { ...DEMO_CARBON, S23: 40 };
    const r = ratio('hashin', m, [-10, -30, 0], [1, 0, 10]);
    expect(r.ratio).to.be.closeTo(10, 1e-12);
    expect(criterionPlan('hashin', m, DEFAULT_FAILURE_OPTIONS).modes[r.modeIndex].mode).to.equal('fibre-tension');
    expect(INDEPENDENT_INDEX.hashin(m, -10 + 9.999, -30, 99.99)).to.be.below(1);
    expect(INDEPENDENT_INDEX.hashin(m, -10 + 10.001, -30, 100.01)).to.be.above(1);
  });

  it('residual stress alone beyond the surface gives strength ratio 0; a load that never fails gives none', () => {
    expect(ratio('max-stress', DEMO_CARBON, [0, 80, 0], [1, 0, 0]).ratio).to.equal(0);
    expect(ratio('tsai-wu', DEMO_CARBON, [0, 0, 0], [0, 0, 0]).ratio).to.equal(Infinity);
  });
});
