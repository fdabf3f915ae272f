/**
 * Goodness of fit with OSL (CMH-17-1G Vol. 1 chapter 8) and the basis values by
 * distribution: normal, lognormal, Weibull (exact conditional, and the
 * handbook's approximation).
 */
import { expect } from 'chai';
import {
  andersonDarlingNormal, andersonDarlingWeibull, fitWeibullMaximumLikelihood, kFactorNormal, weibullBasisApproximate, weibullBasisExact,
} from '../../api/src/statistics/index.ts';
import { example8_3_11_1_1, STAT17_18_VALUES } from './support/handbook-data.ts';
import { SeededRandom } from './support/random.ts';

function meanSd(values: number[]): [number, number] {
  const mean = values.reduce((s, x) => s + x, 0) / values.length;
  return [mean, Math.sqrt(values.reduce((s, x) => s + (x - mean) ** 2, 0) / (values.length - 1))];
}
const sorted = (values: number[]) => [...values].sort((a, b) => a - b);
function fit(values: number[]) {
  const outcome = fitWeibullMaximumLikelihood(values);
  if (!outcome.ok) throw new Error(outcome.reason);
  return outcome.fit;
}

describe('Anderson-Darling goodness of fit with OSL', () => {
  it('gives the STAT-17 OSLs of the 18-value example (quoted by cmstatr)', () => {
    const [mean, sd] = meanSd(STAT17_18_VALUES);
    expect(andersonDarlingNormal(sorted(STAT17_18_VALUES), mean, sd).osl).to.be.closeTo(0.465, 0.0005); // normal OSL 0.465
    const logs = sorted(STAT17_18_VALUES).map(Math.log);
    const [mu, sigma] = meanSd(logs);
    expect(andersonDarlingNormal(logs, mu, sigma).osl).to.be.closeTo(0.48, 0.0005); // lognormal OSL 0.480
    expect(andersonDarlingWeibull(sorted(STAT17_18_VALUES), fit(STAT17_18_VALUES)).osl).to.be.closeTo(0.179, 0.0005); // Weibull OSL 0.179
  });

  it('rejects all three distributions for CMH-17-1G 8.3.11.1.1 ETW (STAT-17 OSLs quoted by cmstatr)', () => {
    const etw = example8_3_11_1_1('ETW').values;
    const [mean, sd] = meanSd(etw);
    const normal = andersonDarlingNormal(sorted(etw), mean, sd);
    expect(normal.osl).to.be.closeTo(0.006051, 0.000005); // 0.006051
    expect(normal.rejected).to.equal(true);
    const logs = sorted(etw).map(Math.log);
    const [mu, sigma] = meanSd(logs);
    expect(andersonDarlingNormal(logs, mu, sigma).osl).to.be.closeTo(0.000307, 0.0000005); // 0.000307
    const weibull = andersonDarlingWeibull(sorted(etw), fit(etw));
    expect(weibull.osl).to.be.closeTo(0.0219, 0.00005); // 0.0219
    expect(weibull.rejected).to.equal(true);
  });
});

describe('normal and lognormal basis values', () => {
  it('match STAT-17 for the 18-value example (quoted by cmstatr)', () => {
    const [mean, sd] = meanSd(STAT17_18_VALUES);
    // STAT-17 B 129.287, A 120.336; its factors are tabulated to 3 decimals, so agreement is to about 2e-4.
    expect(mean - kFactorNormal(18, 0.9) * sd).to.be.closeTo(129.287, 129.287 * 2e-4);
    expect(mean - kFactorNormal(18, 0.99) * sd).to.be.closeTo(120.336, 120.336 * 2e-4);
    const [mu, sigma] = meanSd(STAT17_18_VALUES.map(Math.log));
    expect(Math.exp(mu - kFactorNormal(18, 0.9) * sigma)).to.be.closeTo(129.664, 129.664 * 2e-4); // STAT-17 lognormal B
    expect(Math.exp(mu - kFactorNormal(18, 0.99) * sigma)).to.be.closeTo(121.71, 121.71 * 2e-4); // STAT-17 lognormal A
  });
});

describe('Weibull maximum likelihood and basis values', () => {
  it('solves the likelihood equations from CV 0.5 % to 40 % and n = 3 to 10,000', () => {
    const random = new SeededRandom(11);
    for (const cv of [0.005, 0.02, 0.1, 0.4]) {
      for (const n of [3, 10, 100, 10000]) {
        const values = Array.from({ length: n }, () => random.weibull(1.2 / cv, 500));
        const { shape, scale } = fit(values);
        // Score equations of the Weibull likelihood (Lawless 1982, eq. 4.1.3): both residuals vanish.
        const logs = values.map(Math.log);
        const meanLog = logs.reduce((s, y) => s + y, 0) / n;
        const w = values.map((x) => Math.pow(x / scale, shape));
        const sumW = w.reduce((s, x) => s + x, 0);
        expect(sumW / n, `scale equation cv=${cv} n=${n}`).to.be.closeTo(1, 1e-9);
        const shapeEquation = w.reduce((s, wi, i) => s + wi * logs[i], 0) / sumW - 1 / shape - meanLog;
        expect(Math.abs(shapeEquation) * shape, `shape equation cv=${cv} n=${n}`).to.be.below(1e-9);
      }
    }
  });

  it("handbook approximation reproduces STAT-17's Weibull basis values (18-value example, quoted by cmstatr)", () => {
    const f = fit(STAT17_18_VALUES);
    expect(weibullBasisApproximate(f, 18, 0.9)).to.be.closeTo(125.441, 0.001); // STAT-17 B 125.441
    expect(weibullBasisApproximate(f, 18, 0.99)).to.be.closeTo(109.15, 0.001); // STAT-17 A 109.150
  });

  it('exact conditional limits lie within 0.5 % of the approximation for the 18-value example', () => {
    // cmstatr reports its exact conditional result within about 0.5 % of STAT-17's.
    const [b, a] = weibullBasisExact(STAT17_18_VALUES, fit(STAT17_18_VALUES), [0.9, 0.99]);
    expect(Math.abs(b / 125.441 - 1)).to.be.below(0.005);
    expect(Math.abs(a / 109.15 - 1)).to.be.below(0.005);
  });

  it('exact conditional limits are converged: a grid three times as fine changes them by less than 1e-10', () => {
    const random = new SeededRandom(5);
    for (const n of [3, 5, 12, 40, 300, 3000]) {
      const values = Array.from({ length: n }, () => random.weibull(random.between(4, 60), 100));
      const f = fit(values);
      const coarse = weibullBasisExact(values, f, [0.9, 0.99]);
      const fine = weibullBasisExact(values, f, [0.9, 0.99], 0.95, 3);
      coarse.forEach((v, i) => expect(Math.abs(v / fine[i] - 1), `n=${n}`).to.be.below(1e-10));
    }
  });

  it('exact conditional B-basis covers the true 10th percentile with 95 % confidence (Monte Carlo, 3000 samples)', function () {
    this.timeout(20000);
    // The conditional limit has exact unconditional coverage (Lawless 1982, 4.1.2): the share of samples
    // whose limit lies below the true quantile is 0.95 up to Monte Carlo error (sd 0.004 for 3000 samples).
    const random = new SeededRandom(99);
    const shape = 12;
    const scale = 100;
    const trueQuantile = scale * Math.pow(-Math.log(0.9), 1 / shape);
    let covered = 0;
    const samples = 3000;
    for (let s = 0; s < samples; s++) {
      const values = Array.from({ length: 8 }, () => random.weibull(shape, scale));
      if (weibullBasisExact(values, fit(values), [0.9])[0] <= trueQuantile) covered++;
    }
    expect(covered / samples).to.be.closeTo(0.95, 0.013);
  });
});
