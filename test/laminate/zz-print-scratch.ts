import { printStackingCode, parseStackingCode } from '../../api/src/laminate/index.ts';
let seed = 1; const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
for (const n of [64, 500, 2000]) {
  const angles = Array.from({ length: n }, () => [0, 45, -45, 90][Math.floor(rnd() * 4)]);
  const t0 = performance.now(); const code = printStackingCode(angles); const t = performance.now() - t0;
  console.log(n, t.toFixed(1), 'ms', code.length, JSON.stringify(parseStackingCode(code)) === JSON.stringify(angles));
}
