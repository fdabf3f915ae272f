import { analyseLaminate, parseLaminateInput, failureEnvelope, parseEnvelopeInput, CRITERIA } from '../../api/src/laminate/index.ts';
const material = { E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92, alpha1: -0.3e-6, alpha2: 28e-6, density: 1570 };
for (const n of [8, 64, 512]) {
  const code = `[45/0/-45/90]${n / 8}s`;
  const input = parseLaminateInput({ code, material, plyThickness: 0.125, loads: { N: [300, 100, 20], M: [5, 0, 0], deltaT: -120 }, criteria: [...CRITERIA] });
  for (let i = 0; i < 200; i++) analyseLaminate(input);
  const reps = n === 512 ? 50 : 2000;
  const t0 = performance.now();
  for (let i = 0; i < reps; i++) analyseLaminate(input);
  console.log(n, ((performance.now() - t0) / reps).toFixed(4), 'ms');
}
const env = parseEnvelopeInput({ code: '[45/0/-45/90]8s', material, plyThickness: 0.125, criterion: 'tsai-wu', points: 360, deltaT: -120 });
for (const c of ['tsai-wu', 'puck', 'hashin', 'max-stress'] as const) {
  const e = { ...env, criterion: c };
  for (let i = 0; i < 5; i++) failureEnvelope(e);
  const t0 = performance.now();
  for (let i = 0; i < 20; i++) failureEnvelope(e);
  console.log('envelope', c, ((performance.now() - t0) / 20).toFixed(3), 'ms');
}
