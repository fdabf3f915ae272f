import { analyseLaminate, parseLaminateInput, CRITERIA } from '../../api/src/laminate/index.ts';
const material = { E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, G13: 5200, G23: 3400, Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92, alpha1: -0.3e-6, alpha2: 28e-6, density: 1570 };
for (const [code, n] of [['[45/0/-45/90]s', 8], ['[45/0/-45/90]8s', 64]] as const) {
  const full = parseLaminateInput({ code, material, plyThickness: 0.125, loads: { N: [300, 100, 20], M: [5, -2, 0], deltaT: -120 }, criteria: [...CRITERIA] });
  const variants = { full, nocrit: { ...full, criteria: [] as never[] }, noload: { ...full, criteria: [] as never[], loads: null } };
  for (const [name, input] of Object.entries(variants)) {
    for (let i = 0; i < 2000; i++) analyseLaminate(input);
    let best = Infinity;
    for (let k = 0; k < 60; k++) { const t0 = performance.now(); for (let i = 0; i < 100; i++) analyseLaminate(input); best = Math.min(best, (performance.now() - t0) / 100); }
    console.log(n, name, 'min', (best * 1000).toFixed(1), 'us');
  }
}
