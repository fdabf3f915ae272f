import { analyseLaminate, CRITERIA, parseLaminateInput } from '../../api/src/laminate/index.ts';
const material = { E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, density: 1570, alpha1: -0.3e-6, alpha2: 28e-6, Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92 };
const variants: Record<string, unknown> = {
  bench: { N: [300, 100, 20], M: [5, -2, 0], deltaT: -120 },
  noMy: { N: [300, 100, 20], M: [5, 0, 0], deltaT: -120 },
  noDT: { N: [300, 100, 20], M: [5, -2, 0] },
};
for (const [name, loads] of Object.entries(variants)) {
  const input = parseLaminateInput({ code: '[45/0/-45/90]8s', material, plyThickness: 0.125, loads, criteria: [...CRITERIA] });
  for (let r = 0; r < 3; r++) {
    const N = 2000; const c0 = process.cpuUsage();
    for (let i = 0; i < N; i++) analyseLaminate(input);
    const cpu = process.cpuUsage(c0); console.log(name, ((cpu.user + cpu.system) / N).toFixed(1), 'us');
  }
}
