/**
 * Nonparametric basis values (CMH-17-1G Vol. 1 chapter 8).
 *
 * By ranks (large samples): the r-th smallest value, r the largest rank with
 * P(Binomial(n, 1 - p) >= r) >= 0.95, i.e. the order statistic that lies
 * below the (1 - p) quantile with 95 % confidence (Guenther 1969; the
 * handbook's Tables 8.5.12 and 8.5.13). It exists only from n = 29 (B-basis)
 * and n = 299 (A-basis).
 *
 * Hanson-Koopmans (smaller samples): T = x_(r) (x_(1) / x_(r))^k, valid for
 * the wide class of distributions the handbook assumes (Hanson & Koopmans
 * 1964, Ann. Math. Stat. 35:1561), with k from the confidence integral of
 * Vangel (1994, Commun. Stat. Simul. Comput. 23:1137) for order statistics
 * 1 and r, q = 1 - p:
 *
 *   conf(k) = I_q(r, n - r + 1) + ∫_q^1 [1 - (1 - (q/t)^{1/k})^{r-1}] β(t; r, n - r + 1) dt
 *
 * For B-basis r is the handbook's choice for each n <= 28 (Table 8.5.14); for
 * A-basis r = n (Table 8.5.15). k is computed, not looked up.
 */
import { betaDensity, binomialUpperTail, regularizedBeta } from './numeric/beta.ts';
import { BoundedCache } from './numeric/bounded-cache.ts';
import { integrateAdaptive } from './numeric/quadrature.ts';
import { findRootBrent } from './numeric/roots.ts';
import { A_PROPORTION, B_PROPORTION, BASIS_CONFIDENCE } from './tolerance-factors.ts';

const rankCache = new BoundedCache<number | null>();

/** Largest rank r with P(Bin(n, 1 - p) >= r) >= confidence, or null when even r = 1 falls short. */
export function rankForBasis(n: number, proportion: number, confidence = BASIS_CONFIDENCE): number | null {
  return rankCache.getOrCompute(`${n}|${proportion}|${confidence}`, () => {
    const q = 1 - proportion;
    if (binomialUpperTail(1, n, q) < confidence) return null;
    // P(X >= r) falls as r grows: walk from the normal approximation to the boundary.
    let r = Math.max(1, Math.floor(n * q - 1.645 * Math.sqrt(n * q * (1 - q))));
    while (r > 1 && binomialUpperTail(r, n, q) < confidence) r--;
    while (r < n && binomialUpperTail(r + 1, n, q) >= confidence) r++;
    return r;
  });
}

/** Order statistic r used for the Hanson-Koopmans B-basis, n = 2..28 (CMH-17-1G Table 8.5.14). */
const B_ORDER_BY_N: Record<number, number> = {
  2: 2, 3: 3, 4: 4, 5: 4, 6: 5, 7: 5, 8: 6, 9: 6, 10: 6, 11: 7, 12: 7, 13: 7, 14: 8, 15: 8,
  16: 8, 17: 8, 18: 9, 19: 9, 20: 10, 21: 10, 22: 10, 23: 11, 24: 11, 25: 11, 26: 11, 27: 11, 28: 12,
};

/** The handbook's order statistic r for the Hanson-Koopmans basis value of n values. */
export function hansonKoopmansOrder(n: number, proportion: number): number | null {
  if (proportion === B_PROPORTION) return B_ORDER_BY_N[n] ?? null;
  if (proportion === A_PROPORTION) return n >= 2 ? n : null;
  return null;
}

/** Vangel's confidence that x_(r) (x_(1)/x_(r))^k lies below the (1 - p) quantile. */
export function hansonKoopmansConfidence(n: number, r: number, proportion: number, k: number): number {
  const q = 1 - proportion;
  const head = regularizedBeta(q, r, n - r + 1);
  const integrand = (t: number): number => {
    const y = Math.pow(q / t, 1 / k);
    return (1 - Math.pow(1 - y, r - 1)) * betaDensity(t, r, n - r + 1);
  };
  return head + integrateAdaptive(integrand, q, 1, 1e-13);
}

const factorCache = new BoundedCache<number | null>();

/**
 * The Hanson-Koopmans factor k >= 1 for n values and order statistic r
 * (1 < r <= n), or null when x_(1) alone already has the confidence (then the
 * ranks method applies).
 */
export function hansonKoopmansFactor(n: number, r: number, proportion: number, confidence = BASIS_CONFIDENCE): number | null {
  return factorCache.getOrCompute(`${n}|${r}|${proportion}|${confidence}`, () => {
    if (!(r >= 2 && r <= n) || hansonKoopmansConfidence(n, r, proportion, 1) >= confidence) return null;
    let hi = 2;
    while (hansonKoopmansConfidence(n, r, proportion, hi) < confidence && hi < 1e6) hi *= 2;
    const root = findRootBrent((k) => hansonKoopmansConfidence(n, r, proportion, k) - confidence, Math.max(1, hi / 2), hi, { relativeTolerance: 1e-12 });
    return Number.isFinite(root) ? root : null;
  });
}

export interface NonparametricBasis {
  value: number | null;
  method: 'ranks' | 'hanson-koopmans' | null;
  /** Rank r of the ranks method, or order statistic r of Hanson-Koopmans. */
  order: number | null;
  /** The Hanson-Koopmans exponent k (null for ranks). */
  k: number | null;
  /** Why there is no value (null when there is one). */
  reason: string | null;
}

/** Basis value by ranks, or null with the reason when the sample is too small. */
export function basisByRanks(sorted: readonly number[], proportion: number): NonparametricBasis {
  const n = sorted.length;
  const rank = rankForBasis(n, proportion);
  if (rank === null) {
    const needed = proportion === A_PROPORTION ? 299 : 29;
    return { value: null, method: null, order: null, k: null, reason: `${proportion === A_PROPORTION ? 'A' : 'B'}-basis by ranks needs at least ${needed} values (n = ${n})` };
  }
  return { value: sorted[rank - 1], method: 'ranks', order: rank, k: null, reason: null };
}

/** Basis value by Hanson-Koopmans, or null with the reason. Needs positive values. */
export function basisByHansonKoopmans(sorted: readonly number[], proportion: number): NonparametricBasis {
  const n = sorted.length;
  const r = hansonKoopmansOrder(n, proportion);
  const none = (reason: string): NonparametricBasis => ({ value: null, method: null, order: null, k: null, reason });
  if (r === null) return none(`Hanson-Koopmans ${proportion === A_PROPORTION ? 'A' : 'B'}-basis is tabulated for 2 <= n <= ${proportion === A_PROPORTION ? 298 : 28} (n = ${n})`);
  if (sorted[0] <= 0) return none('Hanson-Koopmans needs positive values');
  const k = hansonKoopmansFactor(n, r, proportion);
  if (k === null) return none(`Hanson-Koopmans does not apply for n = ${n}: the ranks method does`);
  const value = sorted[r - 1] * Math.pow(sorted[0] / sorted[r - 1], k);
  return { value, method: 'hanson-koopmans', order: r, k, reason: null };
}

/**
 * The handbook's nonparametric basis value: ranks when the sample is large
 * enough for them (n >= 29 for B, n >= 299 for A), Hanson-Koopmans below.
 */
export function nonparametricBasis(sorted: readonly number[], proportion: number): NonparametricBasis {
  const byRanks = basisByRanks(sorted, proportion);
  if (byRanks.value !== null) return byRanks;
  return basisByHansonKoopmans(sorted, proportion);
}
