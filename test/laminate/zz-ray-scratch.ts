import { DEFAULT_FAILURE_OPTIONS } from '../../api/src/laminate/index.ts';
import { criterionPlan } from '../../api/src/laminate/failure/plans.ts';
import { failureIndexAt, RayFailure, strengthRatioAlongRay } from '../../api/src/laminate/failure/ray-solver.ts';
const m = { E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92 };
const out = new RayFailure();
for (const c of ['tsai-wu', 'tsai-hill', 'max-stress', 'max-strain', 'hashin', 'puck'] as const) {
  const plan = criterionPlan(c, m, DEFAULT_FAILURE_OPTIONS);
  let sink = 0;
  const N = 1e6;
  for (let i = 0; i < 1e5; i++) sink += strengthRatioAlongRay(plan, 10, 20, 3, 100 + (i & 7), 5, 7, false, out).ratio;
  let t0 = performance.now();
  for (let i = 0; i < N; i++) sink += strengthRatioAlongRay(plan, 10, 20, 3, 100 + (i & 7), 5, 7, false, out).ratio;
  const tRay = (performance.now() - t0) / N * 1e6;
  t0 = performance.now();
  for (let i = 0; i < N; i++) sink += failureIndexAt(plan, 10, 20 + (i & 7), 3, false).index;
  const tIdx = (performance.now() - t0) / N * 1e6;
  console.log(c, 'ray', tRay.toFixed(1), 'ns; index', tIdx.toFixed(1), 'ns', sink > 0);
}
