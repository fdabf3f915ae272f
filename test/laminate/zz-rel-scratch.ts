import { analyseLaminate, parseLaminateInput, CRITERIA } from '../../api/src/laminate/index.ts';
const material = { E1: 135000, E2: 9500, G12: 5200, nu12: 0.31, G13: 5200, G23: 3400, Xt: 2100, Xc: 1350, Yt: 62, Yc: 210, S12: 92, alpha1: -0.3e-6, alpha2: 28e-6, density: 1570 };
const full = parseLaminateInput({ code: '[45/0/-45/90]8s', material, plyThickness: 0.125, loads: { N: [300, 100, 20], M: [5, -2, 0], deltaT: -120 }, criteria: [...CRITERIA] });
const input = process.env.VARIANT === "nocrit" ? { ...full, criteria: [] as never[] } : process.env.VARIANT === "noload" ? { ...full, criteria: [] as never[], loads: null } : full;
const ref = new Float64Array(4096).map((_, i) => Math.sin(i));
let sink = 0;
function reference() { let s = 0; for (let r = 0; r < 20; r++) for (let i = 0; i < 4096; i++) s += ref[i] * ref[(i * 7) & 4095] + Math.sqrt(Math.abs(ref[i])); sink += s; }
const cpu = (fn: () => void, n: number) => { const c0 = process.cpuUsage(); for (let i = 0; i < n; i++) fn(); const c = process.cpuUsage(c0); return (c.user + c.system) / n; };
for (let i = 0; i < 3000; i++) analyseLaminate(input);
const ratios: number[] = []; const abs: number[] = [];
for (let k = 0; k < 15; k++) { const a = cpu(() => analyseLaminate(input), 300); const b = cpu(reference, 300); ratios.push(a / b); abs.push(a); }
ratios.sort((x, y) => x - y); abs.sort((x, y) => x - y);
console.log('ratio median', ratios[7].toFixed(3), 'analysis cpu median', abs[7].toFixed(1), 'us', sink > 0);
