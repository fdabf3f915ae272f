/**
 * The noncentral t distribution T'(ν, δ) = (Z + δ) / sqrt(χ²_ν / ν): cdf and
 * quantile. Its 95 % quantile gives the exact one-sided normal tolerance
 * factor k = t'_{0.95}(n - 1, z_p √n) / √n (Owen 1963; Natrella 1963, NBS
 * Handbook 91, table A-7) used for every normal-theory basis value.
 *
 * The cdf is the Poisson mixture of incomplete beta functions of Lenth
 * (1989, AS 243), summed outward from the Poisson mode as Benton and
 * Krishnamoorthy (2003, Comput. Stat. Data Anal. 43:249) do, so that large
 * noncentralities (δ²/2 near 3·10^4 for A-basis with n = 10,000) need only a
 * few thousand terms and keep full precision. Own code; neither mathjs nor
 * simple-statistics has a noncentral t.
 */
import { regularizedBeta } from './beta.ts';
import { lnGamma, regularizedGammaP } from './gamma.ts';
import { normalCdf, normalQuantile } from './normal.ts';
import { solveIncreasing } from './roots.ts';

const TERM_EPS = 1e-17;

/** F(t; ν, δ) for t >= 0. */
function cdfNonNegativeT(t: number, df: number, delta: number): number {
  const base = normalCdf(-delta);
  if (t === 0) return base;
  const t2 = t * t;
  const x = t2 / (t2 + df);
  const y = df / (t2 + df);
  const lambda = 0.5 * delta * delta;
  const b = 0.5 * df;
  if (lambda === 0) return base + 0.5 * regularizedBeta(x, 0.5, b, y);

  const sign = delta < 0 ? -1 : 1;
  const k = Math.floor(lambda);
  const lnLambda = Math.log(lambda);
  const lnX = Math.log(x);
  const lnY = Math.log(y);
  const lnGammaB = lnGamma(b);
  // Poisson-type weights at the mode: P_k = e^-λ λ^k / k!, Q_k = e^-λ λ^(k+1/2) / Γ(k + 3/2).
  const pMode = Math.exp(-lambda + k * lnLambda - lnGamma(k + 1));
  const qMode = Math.exp(-lambda + (k + 0.5) * lnLambda - lnGamma(k + 1.5));
  const a1 = k + 0.5;
  const a2 = k + 1;
  const i1Mode = regularizedBeta(x, a1, b, y);
  const i2Mode = regularizedBeta(x, a2, b, y);
  // g(a) = Γ(a+b) / (Γ(a+1) Γ(b)) x^a y^b, the step I_x(a,b) - I_x(a+1,b).
  const g1Mode = Math.exp(lnGamma(a1 + b) - lnGamma(a1 + 1) - lnGammaB + a1 * lnX + b * lnY);
  const g2Mode = Math.exp(lnGamma(a2 + b) - lnGamma(a2 + 1) - lnGammaB + a2 * lnX + b * lnY);

  let sum = pMode * i1Mode + sign * qMode * i2Mode;
  let weightP = pMode;
  let weightQ = qMode;

  // Backward from the mode: I_x(a-1, b) = I_x(a, b) + g(a-1), g(a-1) = g(a) a / (x (a+b-1)).
  {
    let p = pMode;
    let q = qMode;
    let i1 = i1Mode;
    let i2 = i2Mode;
    let g1 = g1Mode;
    let g2 = g2Mode;
    for (let i = k; i >= 1; i--) {
      const nextA1 = i - 0.5;
      const nextA2 = i;
      g1 = (g1 * (nextA1 + 1)) / (x * (nextA1 + b));
      g2 = (g2 * (nextA2 + 1)) / (x * (nextA2 + b));
      i1 += g1;
      i2 += g2;
      p *= i / lambda;
      q *= (i + 0.5) / lambda;
      const term = p * i1 + sign * q * i2;
      sum += term;
      weightP += p;
      weightQ += q;
      const ratio = (i - 1) / lambda;
      if ((p + q) * (ratio / (1 - ratio + 1e-300)) < TERM_EPS * Math.abs(sum)) break;
    }
  }

  // Forward from the mode: I_x(a+1, b) = I_x(a, b) - g(a), g(a+1) = g(a) x (a+b) / (a+1).
  {
    const totalQ = sumOfQWeights(lambda);
    let p = pMode;
    let q = qMode;
    let i1 = i1Mode;
    let i2 = i2Mode;
    let g1 = g1Mode;
    let g2 = g2Mode;
    const maxTerms = k + 100 + Math.ceil(40 * Math.sqrt(lambda + 1));
    for (let i = k + 1; i <= maxTerms; i++) {
      const previousA1 = i - 0.5;
      const previousA2 = i;
      i1 -= g1;
      i2 -= g2;
      g1 *= (x * (previousA1 + b)) / (previousA1 + 1);
      g2 *= (x * (previousA2 + b)) / (previousA2 + 1);
      p *= lambda / i;
      q *= lambda / (i + 0.5);
      sum += p * i1 + sign * q * i2;
      weightP += p;
      weightQ += q;
      const remaining = Math.max(0, 1 - weightP) * Math.max(i1, 0) + Math.max(0, totalQ - weightQ) * Math.max(i2, 0);
      if (remaining < TERM_EPS * Math.abs(sum) || (p + q < TERM_EPS * Math.abs(sum) && i > lambda)) break;
    }
  }
  const value = base + 0.5 * sum;
  return Math.min(1, Math.max(0, value));
}

/** Σ_i e^-λ λ^(i+1/2) / Γ(i + 3/2) = erf(√λ) = P(1/2, λ), the total Q weight. */
function sumOfQWeights(lambda: number): number {
  return regularizedGammaP(0.5, lambda);
}

/** Distribution function P(T' <= t) of the noncentral t with df > 0 and noncentrality delta. */
export function noncentralTCdf(t: number, df: number, delta: number): number {
  if (Number.isNaN(t) || !(df > 0) || !Number.isFinite(delta)) return Number.NaN;
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  if (t >= 0) return cdfNonNegativeT(t, df, delta);
  return 1 - cdfNonNegativeT(-t, df, -delta);
}

/**
 * Quantile of the noncentral t: the t with noncentralTCdf(t, df, delta) = p.
 * Start from the normal approximation of Z + δ - t sqrt(χ²/ν) (Johnson, Kotz
 * & Balakrishnan, Continuous Univariate Distributions 2, 31.5), then Brent's
 * method on a widened bracket to 1e-14 relative.
 */
export function noncentralTQuantile(p: number, df: number, delta: number): number {
  if (!(p > 0 && p < 1) || !(df > 0) || !Number.isFinite(delta)) return Number.NaN;
  const z = normalQuantile(p);
  const c = 1 - 1 / (4 * df);
  const s2 = 1 / (2 * df);
  const aq = c * c - z * z * s2;
  let guess: number;
  const disc = c * c * delta * delta - aq * (delta * delta - z * z);
  if (aq > 0.05 && disc >= 0) guess = (c * delta + Math.sign(z || 1) * Math.sqrt(disc)) / aq;
  else guess = delta + z * (1 + Math.abs(delta)) * 3;
  const width = Math.max(0.05 * Math.abs(guess), 0.05);
  return solveIncreasing((t) => noncentralTCdf(t, df, delta) - p, guess - width, guess + width, { relativeTolerance: 1e-14, absoluteTolerance: 1e-300 });
}
