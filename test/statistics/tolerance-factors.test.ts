/**
 * One-sided normal tolerance factors from the exact noncentral t.
 */
import { expect } from 'chai';
import { kFactorNormal, kFactorWithDegreesOfFreedom } from '../../api/src/statistics/index.ts';

describe('tolerance factors (noncentral t)', () => {
  it('match the check table of ENGINEERING.md section 2 (Natrella, NBS Handbook 91, from memory) to its 3 decimals', () => {
    const table: [number, number, number][] = [
      [5, 3.407, 5.741], [10, 2.355, 3.981], [15, 2.068, 3.52], [20, 1.926, 3.295], [30, 1.777, 3.064], [100, 1.527, 2.684],
    ];
    for (const [n, kB, kA] of table) {
      expect(kFactorNormal(n, 0.9), `kB(${n})`).to.be.closeTo(kB, 0.0005 + 1e-9);
      expect(kFactorNormal(n, 0.99), `kA(${n})`).to.be.closeTo(kA, 0.0005 + 1e-9);
    }
  });

  it('match the CMH-17-1G tables of kB and kA (3 decimals, as reproduced in the cmstatr test suite)', () => {
    const kB: Record<number, number> = { 2: 20.581, 3: 6.157, 4: 4.163, 6: 3.007, 8: 2.583, 12: 2.211, 18: 1.974, 25: 1.839, 40: 1.698, 60: 1.609, 95: 1.534, 137: 1.488 };
    const kA: Record<number, number> = { 2: 37.094, 3: 10.553, 4: 7.042, 6: 5.062, 8: 4.354, 12: 3.747, 18: 3.37, 25: 3.158, 40: 2.941, 60: 2.807, 75: 2.748, 137: 2.626 };
    // The handbook's tables round up in a few places (n = 5: 3.408); 0.002 is the tolerance its users apply.
    for (const [n, k] of Object.entries(kB)) expect(kFactorNormal(Number(n), 0.9), `kB(${n})`).to.be.closeTo(k, 0.002);
    for (const [n, k] of Object.entries(kA)) expect(kFactorNormal(Number(n), 0.99), `kA(${n})`).to.be.closeTo(k, 0.002);
  });

  it('approach the normal quantile as n grows and fall with n', () => {
    // k → z_p as n → ∞ (Owen 1963): z_0.90 = 1.2816, z_0.99 = 2.3263.
    expect(kFactorNormal(1e6, 0.9)).to.be.closeTo(1.2816, 0.005);
    expect(kFactorNormal(1e6, 0.99)).to.be.closeTo(2.3263, 0.006);
    for (let n = 2; n < 200; n++) expect(kFactorNormal(n + 1, 0.9)).to.be.below(kFactorNormal(n, 0.9));
  });

  it('pooled degrees of freedom give a smaller factor than the single sample (more information on the SD)', () => {
    expect(kFactorWithDegreesOfFreedom(20, 79, 0.9)).to.be.below(kFactorNormal(20, 0.9));
    expect(kFactorWithDegreesOfFreedom(20, 19, 0.9)).to.equal(kFactorNormal(20, 0.9));
  });
});
