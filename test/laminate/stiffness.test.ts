import { expect } from 'chai';
import { invariants, laminateStiffness, parseStackingCode, rotateStiffness, type PlyInput } from '../../api/src/laminate/index.ts';
import { analyseLaminate, parseLaminateInput } from '../../api/src/laminate/index.ts';
import { abdByQuadrature } from './support/independent-clt.ts';
import {
  DEMO_CARBON, maxAbs, randomBalancedStack, randomQuasiIsotropicStack, randomStack, randomSymmetricStack, seededRandom, T300_5208,
} from './support/generators.ts';

const printed = (value: number, digits: number) => Number(value.toPrecision(digits));
const stackOf = (code: string, t = 0.125, material = T300_5208): PlyInput[] => parseStackingCode(code).map((thetaDeg) => ({ material, thetaDeg, thickness: t }));

describe('laminate engine: A, B, D and H', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  it('reproduces Kaw Example 4.2: [0/30/-45] T300/5208, 5 mm plies (from memory)', () => {
    const s = laminateStiffness(stackOf('[0/30/-45]T', 5));
    // Kaw Ex. 4.2 (from memory), A in N/m -> N/mm (x 1e-3), B in N, D in N·m -> N·mm (x 1e3)
    expect(printed(s.A[0][0], 4)).to.equal(1.739e6);
    expect(printed(s.A[0][1], 4)).to.equal(3.884e5);
    expect(printed(s.A[0][2], 4)).to.equal(5.663e4);
    expect(printed(s.A[1][1], 4)).to.equal(4.533e5);
    expect(printed(s.A[1][2], 4)).to.equal(-1.141e5);
    expect(printed(s.A[2][2], 4)).to.equal(4.525e5);
    expect(printed(s.B[0][0], 4)).to.equal(-3.129e6);
    expect(printed(s.B[0][1], 4)).to.equal(9.855e5);
    expect(printed(s.B[0][2], 4)).to.equal(-1.072e6);
    expect(printed(s.D[0][0], 4)).to.equal(3.343e7);
    expect(printed(s.D[0][1], 4)).to.equal(6.461e6);
    expect(printed(s.D[0][2], 4)).to.equal(-5.240e6);
    expect(s.thickness).to.equal(15);
    expect(s.arealMass).to.be.closeTo((1600 * 15) / 1000, 1e-12); // ρ h by definition: kg/m³ · mm / 1000
  });

  it('agrees with Gauss quadrature of Q-bar through the thickness (independent code) on 100 stacks to 1e-10', () => {
    const rnd = seededRandom(401);
    for (let k = 0; k < 100; k++) {
      const plies = randomStack(rnd);
      const engine = laminateStiffness(plies), independent = abdByQuadrature(plies);
      for (const key of ['A', 'B', 'D'] as const) {
        const scale = Math.max(maxAbs(engine[key]), maxAbs(independent[key]), key === 'B' ? maxAbs(engine.A) * engine.thickness : 0);
        for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
          expect(Math.abs(engine[key][i][j] - independent[key][i][j]), `stack ${k} ${key}${i}${j}`).to.be.at.most(1e-10 * scale);
        }
      }
    }
  });

  it('symmetric stacks have B = 0 (theory; 500 generated stacks)', () => {
    const rnd = seededRandom(402);
    for (let k = 0; k < 500; k++) {
      const s = laminateStiffness(randomSymmetricStack(rnd));
      expect(maxAbs(s.B)).to.be.at.most(1e-9 * maxAbs(s.A) * s.thickness);
    }
  });

  it('balanced stacks have A16 = A26 = 0 (theory; 500 generated stacks)', () => {
    const rnd = seededRandom(403);
    for (let k = 0; k < 500; k++) {
      const s = laminateStiffness(randomBalancedStack(rnd));
      expect(Math.abs(s.A[0][2])).to.be.at.most(1e-9 * maxAbs(s.A));
      expect(Math.abs(s.A[1][2])).to.be.at.most(1e-9 * maxAbs(s.A));
    }
  });

  it('quasi-isotropic stacks have isotropic A: A11 = A22, A66 = (A11 - A12)/2, A16 = A26 = 0 (theory; 500 stacks)', () => {
    const rnd = seededRandom(404);
    for (let k = 0; k < 500; k++) {
      const s = laminateStiffness(randomQuasiIsotropicStack(rnd));
      const tol = 1e-9 * maxAbs(s.A);
      expect(Math.abs(s.A[0][0] - s.A[1][1])).to.be.at.most(tol);
      expect(Math.abs(s.A[2][2] - (s.A[0][0] - s.A[0][1]) / 2)).to.be.at.most(tol);
      expect(Math.abs(s.A[0][2])).to.be.at.most(tol);
      expect(Math.abs(s.A[1][2])).to.be.at.most(tol);
    }
  });

  it('[0/±60]s and [0/±45/90]s: isotropic A and modulus (U1² - U4²)/U1 (ENGINEERING.md section 3; theory)', () => {
    const U = invariants(T300_5208);
    for (const code of ['[0/±60]s', '[0/±45/90]s']) {
      const a = analyseLaminate(parseLaminateInput({ code, material: T300_5208, plyThickness: 0.125 }));
      expect(a.A[0][0]).to.be.closeTo(a.A[1][1], 1e-9 * a.A[0][0]);
      expect(a.A[2][2]).to.be.closeTo((a.A[0][0] - a.A[0][1]) / 2, 1e-9 * a.A[0][0]);
      expect(a.membrane.Ex).to.be.closeTo((U.U1 ** 2 - U.U4 ** 2) / U.U1, 1e-9 * U.U1);
      expect(a.membrane.Gxy).to.be.closeTo(U.U5, 1e-9 * U.U1);
    }
  });

  it('turning the laminate by φ equals turning every ply by φ, for A, B and D (theory; 500 stacks)', () => {
    const rnd = seededRandom(405);
    for (let k = 0; k < 500; k++) {
      const plies = randomStack(rnd);
      const phi = -180 + 360 * rnd();
      const base = laminateStiffness(plies);
      const turned = laminateStiffness(plies.map((p) => ({ ...p, thetaDeg: p.thetaDeg + phi })));
      for (const key of ['A', 'B', 'D'] as const) {
        const expected = rotateStiffness(base[key], phi);
        const scale = key === 'B' ? Math.max(maxAbs(base.B), 1e-6 * maxAbs(base.A) * base.thickness) : maxAbs(base[key]);
        for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(Math.abs(turned[key][i][j] - expected[i][j])).to.be.at.most(1e-9 * scale);
      }
    }
  });

  it('ABD times abd is the identity (theory; 500 stacks, 1e-9 of the product scale)', () => {
    const rnd = seededRandom(406);
    for (let k = 0; k < 500; k++) {
      const s = laminateStiffness(randomStack(rnd));
      for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) {
        let product = 0, scale = 0;
        for (let m = 0; m < 6; m++) { product += s.ABD[i][m] * s.abd[m][j]; scale += Math.abs(s.ABD[i][m] * s.abd[m][j]); }
        expect(Math.abs(product - (i === j ? 1 : 0)), `stack ${k} (${i},${j})`).to.be.at.most(1e-9 * scale);
      }
    }
  });

  it('unidirectional laminate: membrane and flexural constants are the ply constants (theory)', () => {
    const a = analyseLaminate(parseLaminateInput({ code: '[0_8]T', material: DEMO_CARBON, plyThickness: 0.2 }));
    const m = DEMO_CARBON;
    for (const set of [a.membrane, a.flexural]) {
      expect(set.Ex).to.be.closeTo(m.E1, 1e-9 * m.E1);
      expect(set.Ey).to.be.closeTo(m.E2, 1e-9 * m.E1);
      expect(set.Gxy).to.be.closeTo(m.G12, 1e-9 * m.E1);
      expect(set.nuxy).to.be.closeTo(m.nu12, 1e-12);
    }
    expect(a.membrane.nuyx).to.be.closeTo((m.nu12 * m.E2) / m.E1, 1e-12);
  });

  it('shear coupling coefficients of an off-axis ply equal the lamina ones from S-bar (theory)', () => {
    const a = analyseLaminate(parseLaminateInput({ code: '[30_4]T', material: DEMO_CARBON, plyThickness: 0.2 }));
    const h = a.thickness;
    // a = abd upper-left block = S-bar / h for a single orientation (theory)
    const sbar = a.abd.slice(0, 3).map((row) => row.slice(0, 3).map((v) => v * h));
    expect(a.membrane.etaxs).to.be.closeTo(sbar[0][2] / sbar[0][0], 1e-12);
    expect(a.membrane.etays).to.be.closeTo(sbar[1][2] / sbar[1][1], 1e-12);
    expect(a.membrane.etaxs).to.not.equal(0);
  });

  it('H: 5/6 G h for one homogeneous ply under both shear models; G13 and G23 swap at 90° (Reddy 2004; theory)', () => {
    const one = [{ material: DEMO_CARBON, thetaDeg: 0, thickness: 2 }];
    const k = laminateStiffness(one);
    const p = laminateStiffness(one, { transverseShearModel: 'parabolic' });
    expect(k.H[0][0]).to.be.closeTo((5 / 6) * DEMO_CARBON.G23! * 2, 1e-9);
    expect(k.H[1][1]).to.be.closeTo((5 / 6) * DEMO_CARBON.G13! * 2, 1e-9);
    expect(p.H[0][0]).to.be.closeTo(k.H[0][0], 1e-9);
    expect(k.transverseShear?.model).to.equal('correction-factor');
    expect(k.transverseShear?.correctionFactor).to.equal(5 / 6);
    const turned = laminateStiffness([{ ...one[0], thetaDeg: 90 }], { shearCorrectionFactor: 1 });
    expect(turned.H[0][0]).to.be.closeTo(DEMO_CARBON.G13! * 2, 1e-9);
    expect(turned.H[1][1]).to.be.closeTo(DEMO_CARBON.G23! * 2, 1e-9);
    const at45 = laminateStiffness([{ ...one[0], thetaDeg: 45 }], { shearCorrectionFactor: 1 });
    expect(at45.H[0][1]).to.be.closeTo(((DEMO_CARBON.G13! - DEMO_CARBON.G23!) / 2) * 2, 1e-9);
  });

  it('a sandwich is plies with a core of its own: D11 = Qf (h³ - hc³)/12 + Qc hc³/12 for isotropic faces and core (ENGINEERING.md section 3 item 8; Whitney 1987)', () => {
    const face = { E1: 70000, E2: 70000, G12: 70000 / (2 * 1.33), nu12: 0.33, density: 2700 };
    const core = { E1: 80, E2: 80, G12: 80 / (2 * 1.3), nu12: 0.3, G13: 30, G23: 30, density: 80 };
    const s = laminateStiffness([{ material: face, thetaDeg: 0, thickness: 0.5 }, { material: core, thetaDeg: 0, thickness: 20 }, { material: face, thetaDeg: 0, thickness: 0.5 }]);
    const h = 21, hc = 20, Qf = 70000 / (1 - 0.33 ** 2), Qc = 80 / (1 - 0.3 ** 2);
    expect(s.D[0][0]).to.be.closeTo((Qf * (h ** 3 - hc ** 3)) / 12 + (Qc * hc ** 3) / 12, 1e-9 * s.D[0][0]);
    expect(s.A[0][0]).to.be.closeTo(Qf * 1 + Qc * 20, 1e-9 * s.A[0][0]);
    expect(s.arealMass).to.be.closeTo((2700 * 1 + 80 * 20) / 1000, 1e-12);
    expect(maxAbs(s.B)).to.be.below(1e-9 * s.A[0][0] * h);
  });

  it('states the defaults it took for missing G13, G23 and density', () => {
    const s = laminateStiffness([{ material: { E1: 100000, E2: 8000, G12: 4000, nu12: 0.3 }, thetaDeg: 0, thickness: 1 }]);
    expect(s.transverseShear!.assumed.join(' ')).to.match(/G13 = G12/).and.to.match(/G23 = G13/);
    expect(s.pliesWithoutDensity).to.deep.equal([0]);
    expect(s.arealMass).to.equal(0);
  });
});
