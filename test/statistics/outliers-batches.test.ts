/**
 * Maximum normed residual outlier test (CMH-17-1G Vol. 1 chapter 8) and the k-sample
 * Anderson-Darling test between batches (CMH-17-1G Vol. 1 chapter 8; Scholz & Stephens
 * 1987).
 */
import { expect } from 'chai';
import { kSampleAndersonDarling, maximumNormedResidualTest, mnrCriticalValue } from '../../api/src/statistics/index.ts';
import { batchOf8_3_11_1_1, SCHOLZ_STEPHENS_SMOOTHNESS } from './support/handbook-data.ts';
import { SeededRandom } from './support/random.ts';

describe('maximum normed residual (MNR) outlier test', () => {
  it('reproduces the CMH-17-1G 8.3.11.1.1 ETW batch examples (STAT-17 results quoted by cmstatr)', () => {
    const batch2 = maximumNormedResidualTest(batchOf8_3_11_1_1('ETW', 2));
    expect(batch2.statistic).to.be.closeTo(2.008, 0.0005); // MNR = 2.008
    expect(batch2.critical).to.be.closeTo(2.127, 0.0005); // critical 2.127
    expect(batch2.outliers).to.have.length(0);
    const batch3 = maximumNormedResidualTest(batchOf8_3_11_1_1('ETW', 3));
    expect(batch3.statistic).to.be.closeTo(2.119, 0.0005); // MNR = 2.119
    expect(batch3.critical).to.be.closeTo(2.02, 0.0005); // critical 2.020
    expect(batch3.outliers.map((o) => o.value)).to.deep.equal([80.2334815]); // one outlier, the lowest value
  });

  it('has the two-sided 5 % Grubbs critical values', () => {
    // Grubbs (1969), Technometrics 11:1, Table 1, two-sided α = 0.05 (from memory): n = 10 → 2.29, n = 20 → 2.71.
    expect(mnrCriticalValue(10)).to.be.closeTo(2.29, 0.005);
    expect(mnrCriticalValue(20)).to.be.closeTo(2.709, 0.005);
  });

  it('repeats after each flagged value, and needs 3 values', () => {
    // 40 stands out first; once it is set aside, 11 stands out from the rest.
    const result = maximumNormedResidualTest([10, 10.1, 9.9, 10.05, 9.95, 10.02, 9.98, 10.03, 11, 40]);
    expect(result.outliers.map((o) => o.value)).to.deep.equal([40, 11]);
    expect(result.outliers[1].critical).to.equal(mnrCriticalValue(9));
    expect(maximumNormedResidualTest([1, 2])).to.deep.include({ tested: false, statistic: null, critical: null });
    expect(maximumNormedResidualTest([5, 5, 5, 5]).outliers).to.have.length(0);
  });
});

describe('k-sample Anderson-Darling test between batches', () => {
  it('reproduces the Scholz & Stephens (1987) worked example', () => {
    // Smoothness data of four laboratories: A²akN = 8.3926, σN = 1.2038 (Scholz & Stephens 1987, section 5).
    const outcome = kSampleAndersonDarling(SCHOLZ_STEPHENS_SMOOTHNESS);
    if (!outcome.ok) throw new Error(outcome.reason);
    expect(outcome.result.a2akN).to.be.closeTo(8.3926, 0.00005);
    expect(outcome.result.sigmaN).to.be.closeTo(1.2038, 0.00005);
    expect(outcome.result.pass).to.equal(false);
  });

  it('reproduces the CMH-17-1G 8.3.11.1.1 examples (STAT-17 ADK quoted by cmstatr)', () => {
    const adk = (condition: string) => {
      const outcome = kSampleAndersonDarling([1, 2, 3].map((b) => batchOf8_3_11_1_1(condition, b)));
      if (!outcome.ok) throw new Error(outcome.reason);
      return outcome.result;
    };
    expect(adk('ETW').statistic).to.be.closeTo(0.793, 0.0005); // ADK 0.793: batches may be pooled
    expect(adk('ETW').pass).to.equal(true);
    expect(adk('ETW2').statistic).to.be.closeTo(3.024, 0.0005); // ADK 3.024: batches may not be pooled
    expect(adk('ETW2').pass).to.equal(false);
  });

  it('depends on ranks only: any increasing transform leaves it unchanged (Scholz & Stephens 1987)', () => {
    const random = new SeededRandom(7);
    const samples = [0, 1, 2].map(() => Array.from({ length: 8 }, () => random.normal(100, 5)));
    const a = kSampleAndersonDarling(samples);
    const b = kSampleAndersonDarling(samples.map((s) => s.map((x) => Math.log(x) * 3 + 1)));
    if (!a.ok || !b.ok) throw new Error('not computed');
    expect(b.result.statistic).to.be.closeTo(a.result.statistic, 1e-12);
  });

  it('says why it cannot run instead of returning NaN', () => {
    expect(kSampleAndersonDarling([[1, 2, 3]])).to.deep.include({ ok: false });
    expect(kSampleAndersonDarling([[1], [2]])).to.deep.include({ ok: false });
    expect(kSampleAndersonDarling([[4, 4], [4, 4]])).to.deep.include({ ok: false });
  });
});
