/**
 * Weibull basis values (CMH-17-1G Vol. 1 chapter 8).
 *
 * Exact: the conditional lower confidence limit of Lawless (1982, 4.1.2b;
 * Lawless 1975, Technometrics 17:255). With y = ln x, û = ln α̂, b̂ = 1/β̂ and
 * the ancillaries a_i = (y_i - û)/b̂, the pivot Z = (û - y_p)/b̂ has, given a,
 *
 *   P(Z <= t | a) = ∫ h(z) P_n(e^{w_p + t z} Σ e^{a_i z}) dz / ∫ h(z) dz,
 *   h(z) = z^{n-2} e^{z Σ a_i} / (Σ e^{a_i z})^n,  w_p = ln(-ln p),
 *
 * (P_n the regularised lower incomplete gamma); the basis value is
 * exp(û - t b̂) at P = 0.95. The integral is taken by the trapezoidal rule
 * on a uniform grid over the span where h carries mass, and t solved by
 * Newton from the handbook approximation (weibull-conditional.ts).
 *
 * Approximate (the handbook's closed form, reported beside the exact one):
 *   B = q̂ exp(-V_B / (β̂ √n)),  q̂ = α̂ (0.10536)^{1/β̂},  V_B = 3.803 + exp(1.79 - 0.516 ln n + 5.1/(n-1))
 *   A = q̂ exp(-V_A / (β̂ √n)),  q̂ = α̂ (0.01005)^{1/β̂},  V_A = 6.649 + exp(2.55 - 0.526 ln n + 4.76/n)
 * (coefficients from memory of the handbook; with them the tests reproduce
 * STAT-17's Weibull basis values to 1e-5).
 */
import { conditionalDensity, solveConditionalPivot } from './weibull-conditional.ts';
import { A_PROPORTION, B_PROPORTION, BASIS_CONFIDENCE } from './tolerance-factors.ts';
import type { WeibullParameters } from './weibull-fit.ts';

/** The handbook's V factor for B (p = 0.90) or A (p = 0.99) basis. */
export function weibullVFactor(n: number, proportion: number): number {
  if (proportion === B_PROPORTION) return 3.803 + Math.exp(1.79 - 0.516 * Math.log(n) + 5.1 / (n - 1));
  if (proportion === A_PROPORTION) return 6.649 + Math.exp(2.55 - 0.526 * Math.log(n) + 4.76 / n);
  return Number.NaN;
}

/** The handbook's closed-form Weibull basis value (B for p = 0.90, A for p = 0.99). */
export function weibullBasisApproximate(fit: WeibullParameters, n: number, proportion: number): number {
  const quantile = fit.scale * Math.pow(-Math.log(proportion), 1 / fit.shape);
  return quantile * Math.exp(-weibullVFactor(n, proportion) / (fit.shape * Math.sqrt(n)));
}

/**
 * Exact conditional Weibull basis values for the requested proportions
 * (0.90 for B, 0.99 for A), in the order given. `values` are the positive
 * data the fit came from.
 */
export function weibullBasisExact(values: readonly number[], fit: WeibullParameters, proportions: readonly number[], confidence = BASIS_CONFIDENCE, refinement = 1): number[] {
  const n = values.length;
  const u = Math.log(fit.scale);
  const b = 1 / fit.shape;
  const a = Float64Array.from(values, (x) => (Math.log(x) - u) / b);
  // Start from the handbook's approximation: ln B = û + b̂ (w_p - V/√n), so t = V/√n - w_p.
  const starts = proportions.map((proportion) => {
    const t = weibullVFactor(n, proportion) / Math.sqrt(n) - Math.log(-Math.log(proportion));
    return Number.isFinite(t) ? t : -Math.log(-Math.log(proportion));
  });
  let largestStart = 0;
  for (const t of starts) largestStart = Math.max(largestStart, Math.abs(t));
  const density = conditionalDensity(a, largestStart, refinement);
  return proportions.map((proportion, which) => {
    const t = solveConditionalPivot(density, Math.log(-Math.log(proportion)), confidence, starts[which]);
    return Math.exp(u - t * b);
  });
}
