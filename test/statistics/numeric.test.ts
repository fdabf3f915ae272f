/**
 * Numerical foundations: special functions, distributions and the numerical
 * tools, against tabulated values (Abramowitz & Stegun, "A&S", values from
 * memory where marked) and exact identities. The broad cross-check against
 * scipy is in scipy-reference.test.ts.
 */
import { expect } from 'chai';
import { binomialUpperTail, regularizedBeta } from '../../api/src/statistics/numeric/beta.ts';
import { chiSquareCdf, chiSquareQuantile } from '../../api/src/statistics/numeric/chi-square.ts';
import { convolutionPower } from '../../api/src/statistics/numeric/fft.ts';
import { lnGamma, regularizedGammaP, regularizedGammaQ } from '../../api/src/statistics/numeric/gamma.ts';
import { noncentralTCdf, noncentralTQuantile } from '../../api/src/statistics/numeric/noncentral-t.ts';
import { erfc, lnNormalCdf, normalCdf, normalQuantile } from '../../api/src/statistics/numeric/normal.ts';
import { gaussLegendreRule, integrateAdaptive, integrateGaussLegendre } from '../../api/src/statistics/numeric/quadrature.ts';
import { findRootBrent } from '../../api/src/statistics/numeric/roots.ts';
import { fCriticalValue, fSurvival, tCdf, tQuantile } from '../../api/src/statistics/numeric/student-t.ts';

const close = (actual: number, expected: number, relative: number) => expect(Math.abs(actual - expected)).to.be.at.most(relative * Math.abs(expected));

describe('numeric: gamma family', () => {
  it('ln Γ matches exact values', () => {
    close(lnGamma(0.5), 0.5 * Math.log(Math.PI), 1e-14); // Γ(1/2) = √π (A&S 6.1.8)
    close(lnGamma(5), Math.log(24), 1e-14); // Γ(5) = 4!
    close(lnGamma(101), 363.73937555556347, 1e-14); // ln 100! (from memory; equals Σ ln k, k = 1..100, checked below)
    let lnFactorial = 0;
    for (let k = 2; k <= 100; k++) lnFactorial += Math.log(k);
    close(lnGamma(101), lnFactorial, 1e-14);
    expect(Math.abs(lnGamma(1))).to.be.below(1e-14);
  });

  it('incomplete gamma P and Q obey their closed forms', () => {
    for (const x of [0.01, 0.7, 3, 25]) close(regularizedGammaP(1, x), -Math.expm1(-x), 1e-14); // P(1, x) = 1 - e^-x
    // P(n, x) = 1 - e^-x Σ_{k<n} x^k/k! (A&S 6.5.13)
    const poisson = (n: number, x: number) => { let t = Math.exp(-x); let s = t; for (let k = 1; k < n; k++) { t *= x / k; s += t; } return 1 - s; };
    for (const [n, x] of [[5, 3], [30, 28], [30, 40], [80, 60]]) close(regularizedGammaP(n, x), poisson(n, x), 1e-12);
    close(regularizedGammaP(7.5, 4) + regularizedGammaQ(7.5, 4), 1, 1e-14);
    close(regularizedGammaQ(0.5, 100), erfc(10), 1e-13); // erfc(x) = Q(1/2, x²) (A&S 7.1.2, 6.5.17)
  });

  it('chi-square quantile inverts the cdf and matches the table', () => {
    close(chiSquareQuantile(0.95, 1), 3.841458820694124, 1e-12); // χ²_{0.95,1} = 1.95996² (A&S 26.4)
    close(chiSquareQuantile(0.95, 10), 18.307038053275146, 1e-12); // A&S Table 26.8 gives 18.3070 (from memory)
    for (const [p, df] of [[0.001, 3], [0.5, 40], [0.999, 500]]) close(chiSquareCdf(chiSquareQuantile(p, df), df), p, 1e-12);
  });
});

describe('numeric: normal distribution', () => {
  it('Φ and erfc match tabulated values', () => {
    close(normalCdf(1.96), 0.9750021048517795, 1e-14); // A&S Table 26.1 (from memory)
    close(normalCdf(-1), 0.15865525393145707, 1e-14);
    close(erfc(1), 0.15729920705028513, 1e-14); // A&S Table 7.1 (from memory)
    close(normalCdf(-10), 7.61985302416047e-24, 1e-12); // lower tail without cancellation: scipy 1.10.1 norm.cdf(-10), run once by hand
  });

  it('ln Φ stays finite far in the tail', () => {
    const z = -40;
    // Φ(z) = φ(z)/|z| (1 - 1/z² + 3/z⁴ - 15/z⁶ + 105/z⁸ - ...) for large -z (A&S 26.2.12)
    const u = 1 / (z * z);
    close(lnNormalCdf(z), -800 - Math.log(40 * Math.sqrt(2 * Math.PI)) + Math.log1p(-u + 3 * u ** 2 - 15 * u ** 3 + 105 * u ** 4), 1e-14);
    expect(lnNormalCdf(-1e3)).to.be.finite;
  });

  it('Φ⁻¹ inverts Φ to full precision from 1e-300 to 1 - 1e-12', () => {
    close(normalQuantile(0.975), 1.959963984540054, 1e-14); // A&S Table 26.5 (from memory)
    for (const p of [1e-300, 1e-50, 1e-8, 0.02425, 0.3, 0.5000001, 0.9, 1 - 1e-12]) close(normalCdf(normalQuantile(p)), p, 1e-13);
    expect(normalQuantile(0.5)).to.equal(0);
    expect(Number.isNaN(normalQuantile(1.5))).to.equal(true);
  });
});

describe('numeric: beta family, t and F', () => {
  it('incomplete beta obeys exact identities', () => {
    close(regularizedBeta(0.3, 1, 1), 0.3, 1e-14); // I_x(1, 1) = x
    close(regularizedBeta(0.3, 4, 1), 0.3 ** 4, 1e-14); // I_x(a, 1) = x^a
    close(regularizedBeta(0.3, 1, 7), 1 - 0.7 ** 7, 1e-14); // I_x(1, b) = 1 - (1-x)^b
    close(regularizedBeta(0.8, 3.5, 9) + regularizedBeta(0.2, 9, 3.5), 1, 1e-14); // I_x(a,b) = 1 - I_{1-x}(b,a)
  });

  it('binomial tail equals the direct sum', () => {
    const direct = (r: number, n: number, q: number) => { let s = 0; let c = 1; for (let k = 0; k <= n; k++) { if (k >= r) s += c * q ** k * (1 - q) ** (n - k); c = (c * (n - k)) / (k + 1); } return s; };
    for (const [r, n, q] of [[1, 29, 0.1], [3, 61, 0.1], [2, 10, 0.3]]) close(binomialUpperTail(r, n, q), direct(r, n, q), 1e-12);
  });

  it('t distribution matches closed forms and tables', () => {
    close(tCdf(1, 1), 0.75, 1e-14); // Cauchy: F(1) = 3/4
    close(tCdf(2, 2), 0.5 + 2 / (2 * Math.sqrt(6)), 1e-14); // ν = 2: F(t) = 1/2 + t / (2 sqrt(t² + 2))
    close(tQuantile(0.975, 10), 2.228138851986, 1e-11); // Student's table 2.228 (from memory); digits by round trip
    close(tCdf(tQuantile(1 - 0.05 / 60, 28), 28), 1 - 0.05 / 60, 1e-14);
  });

  it('F distribution: survival of the critical value is alpha', () => {
    const f = fCriticalValue(0.05, 3, 79);
    close(fSurvival(f, 3, 79), 0.05, 1e-12);
    close(fCriticalValue(0.05, 1, 10), 4.964602743730711, 1e-10); // F_{0.95}(1, 10) = t_{0.975,10}², tables give 4.96 (from memory)
  });
});

describe('numeric: noncentral t', () => {
  it('reduces to the central t when δ = 0', () => {
    for (const [t, df] of [[0.5, 3], [2.2, 10], [-1.3, 40]]) close(noncentralTCdf(t, df, 0), tCdf(t, df), 1e-13);
  });

  it('obeys F(t; ν, δ) = 1 - F(-t; ν, -δ)', () => {
    close(noncentralTCdf(-1.2, 7, -2), 1 - noncentralTCdf(1.2, 7, 2), 1e-13);
  });

  it('tends to the normal N(δ, 1) for large ν', () => {
    // P(T' <= t) ≈ Φ((t - δ) / sqrt(1 + t²/(2ν))) for large ν (JKB, Continuous Univariate Distributions 2, 31.5)
    close(noncentralTCdf(41, 1e7, 40), normalCdf(1 / Math.sqrt(1 + 41 ** 2 / 2e7)), 1e-6);
  });

  it('quantile inverts the cdf', () => {
    for (const [p, df, nc] of [[0.95, 1, 1.8], [0.95, 29, 7.02], [0.95, 9999, 232.6], [0.05, 12, -3]]) close(noncentralTCdf(noncentralTQuantile(p, df, nc), df, nc), p, 1e-12);
  });
});

describe('numeric: quadrature, roots, FFT', () => {
  it('an m-point Gauss-Legendre rule integrates polynomials of degree 2m - 1 exactly', () => {
    const rule = gaussLegendreRule(5);
    expect(rule.weights.reduce((s, w) => s + w, 0)).to.be.closeTo(2, 1e-14);
    close(integrateGaussLegendre((x) => x ** 9 + 3 * x ** 8, -1, 1, 5), 6 / 9, 1e-13);
  });

  it('the adaptive integrator handles an endpoint singularity of the derivative', () => {
    close(integrateAdaptive(Math.sqrt, 0, 1), 2 / 3, 1e-12);
    close(integrateAdaptive((x) => Math.exp(-x * x), -12, 12), Math.sqrt(Math.PI), 1e-14);
  });

  it("Brent's method finds a root and refuses a non-bracket", () => {
    close(findRootBrent((x) => Math.cos(x) - x, 0, 1), 0.7390851332151607, 1e-14); // the Dottie number, root of cos x = x (common value)
    expect(Number.isNaN(findRootBrent((x) => x * x + 1, -1, 1))).to.equal(true);
  });

  it('FFT convolution power equals repeated direct convolution', () => {
    const p = new Float64Array([0.2, 0.5, 0.3]);
    let direct = Float64Array.from(p);
    for (let k = 1; k < 4; k++) {
      const next = new Float64Array(direct.length + 2);
      direct.forEach((a, i) => p.forEach((b, j) => (next[i + j] += a * b)));
      direct = next;
    }
    const viaFft = convolutionPower(p, 4);
    expect(viaFft.length).to.equal(direct.length);
    viaFft.forEach((x, i) => expect(x).to.be.closeTo(direct[i], 1e-15));
  });
});
