import { parseLaminateInput, CRITERIA } from '../../api/src/laminate/index.ts';
import { buildPlyTable } from '../../api/src/laminate/ply-table.ts';
import { sectionStiffnessOf, stiffnessRows, transverseShearInto } from '../../api/src/laminate/stiffness.ts';
import { emptyStackResponse, stackResponse } from '../../api/src/laminate/stack-response.ts';
import { evaluateCriteria } from '../../api/src/laminate/failure/ply-failure.ts';
import { PlanCache } from '../../api/src/laminate/failure/plans.ts';
import { designRuleChecks } from '../../api/src/laminate/design-rules.ts';
import { printStackingCode } from '../../api/src/laminate/stacking-code-printer.ts';
import { describeAssumptions } from '../../api/src/laminate/analysis-notes.ts';
const material = { E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92, alpha1: -0.3e-6, alpha2: 28e-6, density: 1570 };
for (const n of [8, 64]) {
  const input = parseLaminateInput({ code: `[45/0/-45/90]${n / 8}s`, material, plyThickness: 0.125, loads: { N: [300, 100, 20], M: [5, 0, 0], deltaT: -120 }, criteria: [...CRITERIA] });
  const time = (label: string, fn: () => unknown) => { for (let i = 0; i < 300; i++) fn(); const t0 = performance.now(); for (let i = 0; i < 3000; i++) fn(); console.log(n, label, ((performance.now() - t0) / 3000 * 1000).toFixed(1), 'us'); };
  const table = buildPlyTable(input.plies); const section = sectionStiffnessOf(table); const response = emptyStackResponse(n); stackResponse(table, section, input.loads!, response);
  time('table', () => buildPlyTable(input.plies));
  time('section', () => sectionStiffnessOf(table));
  time('rows', () => { transverseShearInto(table, {}, section.H); return stiffnessRows(table, section, {}); });
  time('response', () => stackResponse(table, section, input.loads!, response));
  const plans = new PlanCache(input.failure);
  time('criteria (cached plans)', () => evaluateCriteria(table, response, input.criteria, plans));
  time('plans', () => { const p = new PlanCache(input.failure); for (const c of input.criteria) p.get(input.plies[0].material, c); });
  for (const c of CRITERIA) time('criterion ' + c, () => evaluateCriteria(table, response, [c], plans));
  time('rules', () => designRuleChecks(input.plies));
  time('code', () => printStackingCode(input.plies.map((p) => p.thetaDeg)));
  time('notes', () => describeAssumptions(input));
}
import { analyseLaminate } from '../../api/src/laminate/index.ts';
{
  const input = parseLaminateInput({ code: `[45/0/-45/90]s`, material, plyThickness: 0.125, loads: { N: [300, 100, 20], M: [5, 0, 0], deltaT: -120 }, criteria: [...CRITERIA] });
  for (let round = 0; round < 3; round++) {
    for (let i = 0; i < 3000; i++) analyseLaminate(input);
    const t0 = performance.now(); for (let i = 0; i < 5000; i++) analyseLaminate(input); console.log('full 8', ((performance.now() - t0) / 5000 * 1000).toFixed(1), 'us');
    const noCrit = { ...input, criteria: [] as never[] };
    const t1 = performance.now(); for (let i = 0; i < 5000; i++) analyseLaminate(noCrit); console.log('no criteria 8', ((performance.now() - t1) / 5000 * 1000).toFixed(1), 'us');
    const noLoad = { ...input, criteria: [] as never[], loads: null };
    const t2 = performance.now(); for (let i = 0; i < 5000; i++) analyseLaminate(noLoad); console.log('no loads 8', ((performance.now() - t2) / 5000 * 1000).toFixed(1), 'us');
  }
}
