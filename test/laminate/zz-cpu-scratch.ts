import { analyseLaminate, parseLaminateInput, CRITERIA } from '../../api/src/laminate/index.ts';
const material = { E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92, alpha1: -0.3e-6, alpha2: 28e-6, density: 1570 };
const input = parseLaminateInput({ code: '[45/0/-45/90]8s', material, plyThickness: 0.125, loads: { N: [300, 100, 20], M: [5, 0, 0], deltaT: -120 }, criteria: [...CRITERIA] });
for (let round = 0; round < 6; round++) {
  const N = 2000;
  const c0 = process.cpuUsage(); const t0 = performance.now();
  for (let i = 0; i < N; i++) analyseLaminate(input);
  const wall = (performance.now() - t0) / N; const cpu = process.cpuUsage(c0);
  console.log('wall', (wall * 1000).toFixed(1), 'us; cpu user', (cpu.user / N).toFixed(1), 'sys', (cpu.system / N).toFixed(1));
}
