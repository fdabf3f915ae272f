import * as A from './zz-engine-a/laminate/index.ts';
import * as B from '../../api/src/laminate/index.ts';
const material = { E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, G13: 5200, G23: 3400, Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92, alpha1: -0.3e-6, alpha2: 28e-6, density: 1570 };
const json = { code: '[45/0/-45/90]8s', material, plyThickness: 0.125, loads: { N: [300, 100, 20], M: [5, -2, 0], deltaT: -120 }, criteria: [...B.CRITERIA] };
const ia = A.parseLaminateInput(json), ib = B.parseLaminateInput(json);
for (let i = 0; i < 3000; i++) { A.analyseLaminate(ia); B.analyseLaminate(ib); }
let ba = Infinity, bb = Infinity; const ra: number[] = [];
for (let k = 0; k < 80; k++) {
  let t0 = performance.now(); for (let i = 0; i < 50; i++) A.analyseLaminate(ia); const ta = (performance.now() - t0) / 50;
  t0 = performance.now(); for (let i = 0; i < 50; i++) B.analyseLaminate(ib); const tb = (performance.now() - t0) / 50;
  ba = Math.min(ba, ta); bb = Math.min(bb, tb); ra.push(tb / ta);
}
ra.sort((x, y) => x - y);
console.log('A min', (ba * 1000).toFixed(1), 'us; B min', (bb * 1000).toFixed(1), 'us; B/A median', ra[40].toFixed(3));
