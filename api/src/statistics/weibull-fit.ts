/**
 * Maximum likelihood fit of the two-parameter Weibull distribution
 * F(x) = 1 - exp(-(x/α)^β) (CMH-17-1G Vol. 1 chapter 8; Lawless 1982, section 4.1).
 *
 * The shape β solves the profile score equation
 *   g(β) = Σ u_i e^{β u_i} / Σ e^{β u_i} - 1/β = 0,  u_i = ln x_i - mean(ln x),
 * which is strictly increasing in β (g' = weighted variance of u + 1/β²), so
 * a safeguarded Newton iteration on a bracket always converges; centring and
 * shifting by max u keeps e^{β u} finite for β in the thousands (CV 0.5 %)
 * as well as near 1 (CV 100 %). Then α = (Σ x^β / n)^{1/β}.
 */

export interface WeibullParameters {
  shape: number;
  scale: number;
}

export type WeibullFitOutcome = { ok: true; fit: WeibullParameters } | { ok: false; reason: string };

interface ScoreParts {
  g: number;
  slope: number;
  lnMeanExp: number;
}

/** g(β), g'(β) and ln(mean e^{β(u - u_max)}) from one pass over the data. */
function score(u: Float64Array, uMax: number, beta: number): ScoreParts {
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  for (let i = 0; i < u.length; i++) {
    const w = Math.exp(beta * (u[i] - uMax));
    s0 += w;
    s1 += w * u[i];
    s2 += w * u[i] * u[i];
  }
  const m1 = s1 / s0;
  return { g: m1 - 1 / beta, slope: s2 / s0 - m1 * m1 + 1 / (beta * beta), lnMeanExp: Math.log(s0 / u.length) };
}

/** Maximum likelihood Weibull shape and scale; needs n >= 2 positive values that are not all equal. */
export function fitWeibullMaximumLikelihood(values: readonly number[]): WeibullFitOutcome {
  const n = values.length;
  if (n < 2) return { ok: false, reason: 'the Weibull fit needs at least 2 values' };
  if (values.some((x) => !(x > 0))) return { ok: false, reason: 'the Weibull distribution needs positive values' };
  const logs = values.map(Math.log);
  const meanLog = logs.reduce((s, y) => s + y, 0) / n;
  const u = Float64Array.from(logs, (y) => y - meanLog);
  let uMax = -Infinity;
  let squares = 0;
  for (const v of u) {
    if (v > uMax) uMax = v;
    squares += v * v;
  }
  const sdLog = Math.sqrt(squares / (n - 1));
  if (!(sdLog > 0)) return { ok: false, reason: 'all values are equal; no Weibull distribution fits' };

  // Start from the moment estimate β ≈ π / (√6 · sd(ln x)) (Menon 1963), then bracket the root.
  let beta = 1.2825498301618641 / sdLog;
  let lo = beta;
  let hi = beta;
  while (score(u, uMax, lo).g > 0) lo /= 2;
  while (score(u, uMax, hi).g < 0) hi *= 2;
  let parts = score(u, uMax, beta);
  for (let iter = 0; iter < 200; iter++) {
    if (parts.g < 0) lo = beta;
    else hi = beta;
    let next = beta - parts.g / parts.slope;
    if (!(next > lo && next < hi)) next = Math.sqrt(lo * hi); // bisect in ln β when Newton leaves the bracket
    const converged = Math.abs(next - beta) <= 1e-15 * beta || hi - lo <= 1e-15 * beta;
    beta = next;
    parts = score(u, uMax, beta);
    if (converged) break;
  }
  const scale = Math.exp(meanLog + uMax + parts.lnMeanExp / beta);
  if (!Number.isFinite(beta) || !Number.isFinite(scale)) return { ok: false, reason: 'the Weibull likelihood has no finite maximum for these values' };
  return { ok: true, fit: { shape: beta, scale } };
}
