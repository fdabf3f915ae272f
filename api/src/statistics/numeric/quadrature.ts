/**
 * Gauss-Legendre quadrature: nodes and weights by Newton iteration on the
 * Legendre polynomial (Golub & Welsch give the same nodes; the Newton form
 * is the one in Davis & Rabinowitz, Methods of Numerical Integration, 2.7),
 * and an adaptive integrator that halves intervals until a G16 rule on the
 * whole agrees with G16 on the halves. Used for the Hanson-Koopmans
 * confidence integral and the exact conditional Weibull limits.
 */

export interface GaussLegendreRule {
  nodes: Float64Array;
  weights: Float64Array;
}

const ruleCache = new Map<number, GaussLegendreRule>();

/** The m-point Gauss-Legendre rule on [-1, 1], cached by m. */
export function gaussLegendreRule(m: number): GaussLegendreRule {
  const cached = ruleCache.get(m);
  if (cached) return cached;
  const nodes = new Float64Array(m);
  const weights = new Float64Array(m);
  for (let i = 0; i < Math.ceil(m / 2); i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (m + 0.5));
    let derivative = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = x;
      for (let j = 2; j <= m; j++) {
        const p2 = ((2 * j - 1) * x * p1 - (j - 1) * p0) / j;
        p0 = p1;
        p1 = p2;
      }
      derivative = (m * (x * p1 - p0)) / (x * x - 1);
      const step = p1 / derivative;
      x -= step;
      if (Math.abs(step) < 1e-16) break;
    }
    if (m === 1) derivative = 1;
    const w = 2 / ((1 - x * x) * derivative * derivative);
    nodes[i] = -x;
    nodes[m - 1 - i] = x;
    weights[i] = m === 1 ? 2 : w;
    weights[m - 1 - i] = m === 1 ? 2 : w;
  }
  const rule = { nodes, weights };
  ruleCache.set(m, rule);
  return rule;
}

/** ∫_a^b f with the m-point rule mapped onto [a, b]. */
export function integrateGaussLegendre(f: (x: number) => number, a: number, b: number, m = 16): number {
  const { nodes, weights } = gaussLegendreRule(m);
  const half = 0.5 * (b - a);
  const mid = 0.5 * (a + b);
  let sum = 0;
  for (let i = 0; i < m; i++) sum += weights[i] * f(mid + half * nodes[i]);
  return sum * half;
}

/**
 * Adaptive ∫_a^b f: accepts an interval when G16 over it and the sum of G16
 * over its halves agree to `absoluteTolerance` (scaled to the interval's
 * share of [a, b]), otherwise recurses; depth is capped so a singular
 * integrand returns its best estimate instead of hanging.
 */
export function integrateAdaptive(f: (x: number) => number, a: number, b: number, absoluteTolerance = 1e-13, maxDepth = 40): number {
  const whole = integrateGaussLegendre(f, a, b);
  return refine(f, a, b, whole, absoluteTolerance, maxDepth);
}

function refine(f: (x: number) => number, a: number, b: number, whole: number, tolerance: number, depth: number): number {
  const mid = 0.5 * (a + b);
  const left = integrateGaussLegendre(f, a, mid);
  const right = integrateGaussLegendre(f, mid, b);
  const halves = left + right;
  if (depth <= 0 || Math.abs(halves - whole) <= tolerance) return halves;
  return refine(f, a, mid, left, tolerance / 2, depth - 1) + refine(f, mid, b, right, tolerance / 2, depth - 1);
}
