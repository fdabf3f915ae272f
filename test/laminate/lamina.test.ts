import { expect } from 'chai';
import { expansionLaminateAxes, invariants, Q, Qbar, rotateStiffness, S, Sbar, stressToPlyAxes, strainToPlyAxes } from '../../api/src/laminate/index.ts';
import { qBarByMatrices } from './support/independent-clt.ts';
import { seededRandom, T300_5208, randomMaterial } from './support/generators.ts';

/** The value rounded to the digits a textbook prints. */
const printed = (value: number, digits: number) => Number(value.toPrecision(digits));
const relClose = (a: number, b: number, scale: number, tol: number) => Math.abs(a - b) <= tol * scale;

describe('laminate engine: lamina stiffness', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  it('reproduces Q of T300/5208 (Kaw Example 2.6, from memory: 181.8, 2.897, 10.35, 7.17 GPa)', () => {
    const q = Q(T300_5208);
    expect(printed(q[0][0] / 1000, 4)).to.equal(181.8); // Kaw Ex. 2.6, from memory
    expect(printed(q[0][1] / 1000, 4)).to.equal(2.897); // Kaw Ex. 2.6, from memory
    expect(printed(q[1][1] / 1000, 4)).to.equal(10.35); // Kaw Ex. 2.6, from memory
    expect(printed(q[2][2] / 1000, 3)).to.equal(7.17); // Kaw Ex. 2.6, from memory
    expect(q[0][2]).to.equal(0);
  });

  it('reproduces Q-bar at 60° (Kaw Example 2.7, from memory)', () => {
    const b = Qbar(T300_5208, 60);
    // Kaw Ex. 2.7, from memory: 23.65, 32.46, 20.05, 109.4, 54.19, 36.74 GPa
    expect(printed(b[0][0] / 1000, 4)).to.equal(23.65);
    expect(printed(b[0][1] / 1000, 4)).to.equal(32.46);
    expect(printed(b[0][2] / 1000, 4)).to.equal(20.05);
    expect(printed(b[1][1] / 1000, 4)).to.equal(109.4);
    expect(printed(b[1][2] / 1000, 4)).to.equal(54.19);
    expect(printed(b[2][2] / 1000, 4)).to.equal(36.74);
  });

  it('agrees with Q-bar by explicit matrix products T⁻¹ Q R T R⁻¹ (theory; independent code) on 300 random plies', () => {
    const rnd = seededRandom(11);
    for (let k = 0; k < 300; k++) {
      const m = randomMaterial(rnd);
      const theta = -180 + 360 * rnd();
      const engine = Qbar(m, theta), independent = qBarByMatrices(m, theta);
      const scale = Math.max(...engine.flat().map(Math.abs));
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(relClose(engine[i][j], independent[i][j], scale, 1e-12), `θ=${theta} [${i}][${j}]`).to.equal(true);
    }
  });

  it('S-bar is the inverse of Q-bar (theory) and S of Q', () => {
    const rnd = seededRandom(12);
    for (let k = 0; k < 100; k++) {
      const m = randomMaterial(rnd);
      const theta = 360 * rnd();
      for (const [stiff, comp] of [[Qbar(m, theta), Sbar(m, theta)], [Q(m), S(m)]]) {
        for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
          const product = stiff[i][0] * comp[0][j] + stiff[i][1] * comp[1][j] + stiff[i][2] * comp[2][j];
          expect(Math.abs(product - (i === j ? 1 : 0))).to.be.below(1e-12);
        }
      }
    }
  });

  it('invariants: Q-bar11 = U1 + U2 cos2θ + U3 cos4θ and U5 = (U1 - U4)/2 (Jones section 2.7-2.94; theory)', () => {
    const U = invariants(T300_5208);
    expect(U.U5).to.be.closeTo((U.U1 - U.U4) / 2, 1e-9 * U.U1);
    for (const theta of [0, 15, 33, 60, 90, 135]) {
      const t = (theta * Math.PI) / 180;
      expect(Qbar(T300_5208, theta)[0][0]).to.be.closeTo(U.U1 + U.U2 * Math.cos(2 * t) + U.U3 * Math.cos(4 * t), 1e-9 * U.U1);
    }
    // trace-like invariants: Q11 + Q22 + 2 Q12 and Q66 - Q12 do not depend on θ (Tsai and Pagano; theory)
    const q0 = Qbar(T300_5208, 0), q37 = Qbar(T300_5208, 37);
    expect(q37[0][0] + q37[1][1] + 2 * q37[0][1]).to.be.closeTo(q0[0][0] + q0[1][1] + 2 * q0[0][1], 1e-9 * U.U1);
    expect(q37[2][2] - q37[0][1]).to.be.closeTo(q0[2][2] - q0[0][1], 1e-9 * U.U1);
  });

  it('rotateStiffness(Q, θ) is Q-bar(θ) and turning by φ then ψ is turning by φ + ψ (theory)', () => {
    const q = Q(T300_5208);
    for (const theta of [10, 45, -60, 123]) {
      const a = rotateStiffness(q, theta), b = Qbar(T300_5208, theta);
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(a[i][j]).to.be.closeTo(b[i][j], 1e-9 * q[0][0]);
      const twice = rotateStiffness(rotateStiffness(q, theta), 25), once = Qbar(T300_5208, theta + 25);
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(twice[i][j]).to.be.closeTo(once[i][j], 1e-9 * q[0][0]);
    }
  });

  it('transforms stress and strain so that work is invariant and 90° swaps the axes (theory)', () => {
    const stress = [12, -7, 5], strain = [1e-3, -4e-4, 6e-4];
    for (const theta of [0, 30, 90, -72]) {
      const s = stressToPlyAxes(stress, theta), e = strainToPlyAxes(strain, theta);
      const w0 = stress[0] * strain[0] + stress[1] * strain[1] + stress[2] * strain[2];
      expect(s[0] * e[0] + s[1] * e[1] + s[2] * e[2]).to.be.closeTo(w0, 1e-15);
    }
    expect(stressToPlyAxes(stress, 90)).to.deep.equal([-7, 12, -5]);
    // Kaw Example 2.13 (from memory; also checked by hand): σx = 2, σy = -3, τxy = 4 MPa on a 60° ply gives σ1 = 1.714, σ2 = -2.714, τ12 = -4.165 MPa
    const local = stressToPlyAxes([2, -3, 4], 60);
    expect([printed(local[0], 4), printed(local[1], 4), printed(local[2], 4)]).to.deep.equal([1.714, -2.714, -4.165]);
  });

  it('expansion coefficients in laminate axes: αx = α1 c² + α2 s², αxy = 2 (α1 - α2) c s (Kaw chapter 2)', () => {
    const [ax, ay, axy] = expansionLaminateAxes(T300_5208.alpha1!, T300_5208.alpha2!, 60);
    // hand calculation with these formulas and Kaw Table 2.1 α1 = 0.02, α2 = 22.5 µ/°C (from memory):
    // c² = 0.25, s² = 0.75, cs = 0.4330 -> αx = 16.88, αy = 5.640, αxy = -19.47 µ/°C
    expect(printed(ax * 1e6, 4)).to.equal(16.88);
    expect(printed(ay * 1e6, 4)).to.equal(5.64);
    expect(printed(axy * 1e6, 4)).to.equal(-19.47);
  });
});
