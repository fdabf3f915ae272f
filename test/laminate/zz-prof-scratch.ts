import { analyseLaminate, parseLaminateInput, CRITERIA } from '../../api/src/laminate/index.ts';
const material = { E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92, alpha1: -0.3e-6, alpha2: 28e-6, density: 1570 };
const input = parseLaminateInput({ code: '[45/0/-45/90]s', material, plyThickness: 0.125, loads: { N: [300, 100, 20], M: [5, 0, 0], deltaT: -120 }, criteria: [...CRITERIA] });
for (let i = 0; i < 60000; i++) analyseLaminate(input);
