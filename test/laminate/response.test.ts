import { expect } from 'chai';
import { analyseLaminate, expansionLaminateAxes, parseLaminateInput, type LaminateAnalysis } from '../../api/src/laminate/index.ts';
import { DEMO_CARBON, randomStack, seededRandom, T300_5208 } from './support/generators.ts';

/** N and M carried by the ply stresses: stress is linear through each ply, so the integrals are exact (theory). */
function resultantsFromStresses(a: LaminateAnalysis): { N: number[]; M: number[] } {
  const N = [0, 0, 0], M = [0, 0, 0];
  for (const p of a.plies) {
    const t = p.zTop - p.zBottom;
    for (let k = 0; k < 3; k++) {
      const sb = p.bottom.stressLaminate[k], st = p.top.stressLaminate[k];
      N[k] += ((sb + st) / 2) * t;
      M[k] += (t * (sb * (2 * p.zBottom + p.zTop) + st * (p.zBottom + 2 * p.zTop))) / 6;
    }
  }
  return { N, M };
}

const close = (a: number, b: number, scale: number, tol = 1e-9) => Math.abs(a - b) <= tol * scale;

describe('laminate engine: response to loads, temperature and moisture', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  it('ply stresses carry the applied N and M (equilibrium; theory; 200 random stacks and loads)', () => {
    const rnd = seededRandom(501);
    for (let k = 0; k < 200; k++) {
      const plies = randomStack(rnd);
      const N = [0, 1, 2].map(() => -200 + 400 * rnd()), M = [0, 1, 2].map(() => -50 + 100 * rnd());
      const a = analyseLaminate(parseLaminateInput({ plies, loads: { N, M, deltaT: -100 * rnd() } }));
      const carried = resultantsFromStresses(a);
      const scaleN = Math.max(...N.map(Math.abs)), scaleM = Math.max(...M.map(Math.abs));
      for (let i = 0; i < 3; i++) {
        expect(close(carried.N[i], N[i], scaleN + scaleM / a.thickness), `N${i}`).to.equal(true);
        expect(close(carried.M[i], M[i], scaleM + scaleN * a.thickness), `M${i}`).to.equal(true);
      }
    }
  });

  it('thermal residual stresses are self-equilibrated: no net N or M (theory)', () => {
    const a = analyseLaminate(parseLaminateInput({ code: '[0/90/45/-45/0]T', material: T300_5208, plyThickness: 0.15, loads: { deltaT: -155 } }));
    const carried = resultantsFromStresses(a);
    const scale = Math.max(...a.plies.flatMap((p) => p.bottom.stressLaminate.map(Math.abs))) * a.thickness;
    for (let i = 0; i < 3; i++) {
      expect(Math.abs(carried.N[i])).to.be.below(1e-10 * scale);
      expect(Math.abs(carried.M[i])).to.be.below(1e-10 * scale * a.thickness);
    }
    expect(a.plies[0].residualStressPly!.bottom).to.deep.equal(a.plies[0].bottom.stressPly);
  });

  it('a free unidirectional laminate expands without stress: strain α ΔT + β Δm (theory)', () => {
    const a = analyseLaminate(parseLaminateInput({ code: '[30_3]T', material: DEMO_CARBON, plyThickness: 0.2, loads: { deltaT: 80, deltaMoisture: 0.01 } }));
    const alpha = expansionLaminateAxes(DEMO_CARBON.alpha1!, DEMO_CARBON.alpha2!, 30), beta = expansionLaminateAxes(DEMO_CARBON.beta1!, DEMO_CARBON.beta2!, 30);
    for (const p of a.plies) {
      for (const side of [p.bottom, p.top]) {
        for (let k = 0; k < 3; k++) {
          expect(Math.abs(side.stressLaminate[k])).to.be.below(1e-9);
          expect(side.strainLaminate[k]).to.be.closeTo(alpha[k] * 80 + beta[k] * 0.01, 1e-15);
        }
      }
    }
    for (let k = 0; k < 3; k++) {
      expect(a.cte!.strain[k]).to.be.closeTo(alpha[k], 1e-18);
      expect(a.cme!.strain[k]).to.be.closeTo(beta[k], 1e-15);
    }
  });

  it('a symmetric laminate does not curve on cooling; an unsymmetric cross-ply does (theory)', () => {
    const sym = analyseLaminate(parseLaminateInput({ code: '[0/90]s', material: T300_5208, plyThickness: 0.125, loads: { deltaT: -150 } }));
    const unsym = analyseLaminate(parseLaminateInput({ code: '[0_2/90_2]T', material: T300_5208, plyThickness: 0.125, loads: { deltaT: -150 } }));
    expect(Math.max(...sym.midplane!.curvature.map(Math.abs))).to.be.below(1e-15);
    expect(Math.abs(unsym.midplane!.curvature[0])).to.be.above(1e-4);
    // cooling: the 0° plies (bottom) shrink less along x than the 90° plies (top), so the plate bends with κx > 0... in our z-up sign
    expect(Math.sign(unsym.midplane!.curvature[0])).to.equal(-Math.sign(unsym.midplane!.curvature[1]));
  });

  it('superposition: the response to N1 + N2 is the sum of the responses (theory)', () => {
    const base = { code: '[45/0/-45/90_2]T', material: DEMO_CARBON, plyThickness: 0.2 };
    const r = (N: number[], M: number[]) => analyseLaminate(parseLaminateInput({ ...base, loads: { N, M } }));
    const a = r([100, -20, 5], [1, 0, 0]), b = r([-30, 60, 0], [0, 2, -1]), ab = r([70, 40, 5], [1, 2, -1]);
    for (let i = 0; i < a.plies.length; i++) {
      for (let k = 0; k < 3; k++) {
        expect(ab.plies[i].top.stressPly[k]).to.be.closeTo(a.plies[i].top.stressPly[k] + b.plies[i].top.stressPly[k], 1e-9);
      }
    }
  });

  it('mixed input: prescribing the strains a load produces gives the same state and returns that load (theory)', () => {
    const base = { code: '[0/45/90/-45]T', material: DEMO_CARBON, plyThickness: 0.2 };
    const loaded = analyseLaminate(parseLaminateInput({ ...base, loads: { N: [120, -40, 15], M: [3, -1, 0.5], deltaT: -60 } }));
    const e = loaded.midplane!.strain, kappa = loaded.midplane!.curvature;
    const mixed = analyseLaminate(parseLaminateInput({
      ...base,
      loads: { N: [null, -40, 15], M: [3, null, 0.5], midplaneStrain: [e[0], null, null], curvature: [null, kappa[1], null], deltaT: -60 },
    }));
    expect(mixed.resultants!.N[0]).to.be.closeTo(120, 1e-8);
    expect(mixed.resultants!.M[1]).to.be.closeTo(-1, 1e-9);
    for (let i = 0; i < 3; i++) {
      expect(mixed.midplane!.strain[i]).to.be.closeTo(e[i], 1e-15);
      expect(mixed.midplane!.curvature[i]).to.be.closeTo(kappa[i], 1e-15);
    }
    expect(mixed.plies[2].top.stressPly[1]).to.be.closeTo(loaded.plies[2].top.stressPly[1], 1e-8);
  });

  it('ply-axis values are the laminate-axis values turned by the ply angle (theory)', () => {
    const a = analyseLaminate(parseLaminateInput({ code: '[60]T', material: T300_5208, plyThickness: 1, loads: { N: [2, -3, 4] } }));
    // a single ply under N = (2, -3, 4) N/mm and h = 1 mm carries σ = (2, -3, 4) MPa; Kaw Example 2.13 (from memory): σ1 = 1.714, σ2 = -2.714, τ12 = -4.165 MPa
    const s = a.plies[0].bottom;
    expect(s.stressLaminate.map((v) => Number(v.toPrecision(4)))).to.deep.equal([2, -3, 4]);
    expect(s.stressPly.map((v) => Number(v.toPrecision(4)))).to.deep.equal([1.714, -2.714, -4.165]);
  });
});
