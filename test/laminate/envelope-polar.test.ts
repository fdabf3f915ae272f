import { expect } from 'chai';
import { analyseLaminate, failureEnvelope, parseEnvelopeInput, parseLaminateInput, parseStackingCode, polarStiffness } from '../../api/src/laminate/index.ts';
import { DEMO_CARBON, T300_5208 } from './support/generators.ts';

describe('laminate engine: failure envelopes', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  it('each envelope point is a first-ply failure load: analysing the laminate there gives strength ratio 1 (residual held fixed)', () => {
    for (const axes of ['Nx-Ny', 'Nx-Nxy'] as const) {
      for (const criterion of ['tsai-wu', 'max-stress', 'puck'] as const) {
        const base = { code: '[0/±45/90]s', material: DEMO_CARBON, plyThickness: 0.125 };
        const env = failureEnvelope(parseEnvelopeInput({ ...base, criterion, axes, points: 24, deltaT: -120 }));
        expect(env.points).to.have.length(24);
        for (const p of env.points) {
          const N = axes === 'Nx-Ny' ? [p.N![0], p.N![1], 0] : [p.N![0], 0, p.N![1]];
          const a = analyseLaminate(parseLaminateInput({ ...base, loads: { N, deltaT: -120 }, criteria: [criterion] }));
          expect(a.firstPlyFailure![criterion]!.strengthRatio, `${axes} ${criterion} ${p.angleDeg}°`).to.be.closeTo(1, 1e-9);
          // mirror plies of a symmetric laminate tie under in-plane loads: the ply the envelope names must fail at 1 too
          expect(a.plies[p.ply!].failure![criterion]!.strengthRatio).to.be.closeTo(1, 1e-9);
          expect(p.stress![0]).to.be.closeTo(p.N![0] / env.thickness, 1e-12 * Math.abs(p.N![0]) + 1e-15);
        }
      }
    }
  });

  it('a unidirectional laminate under max stress meets the axes at Xt·h, Yt·h, Xc·h and Yc·h (definition of the strengths)', () => {
    const env = failureEnvelope(parseEnvelopeInput({ code: '[0_2]T', material: T300_5208, plyThickness: 0.5, criterion: 'max-stress', points: 4 }));
    const h = env.thickness;
    expect(env.points.map((p) => p.angleDeg)).to.deep.equal([0, 90, 180, 270]);
    expect(env.points[0].N![0]).to.be.closeTo(T300_5208.Xt! * h, 1e-9);
    expect(env.points[1].N![1]).to.be.closeTo(T300_5208.Yt! * h, 1e-9);
    expect(env.points[2].N![0]).to.be.closeTo(-T300_5208.Xc! * h, 1e-9);
    expect(env.points[3].N![1]).to.be.closeTo(-T300_5208.Yc! * h, 1e-9);
    expect(env.points[1].mode).to.equal('matrix-tension');
  });
});

describe('laminate engine: polar stiffness', () => {
  it('a unidirectional laminate follows the off-axis modulus 1/Ex = c⁴/E1 + (1/G12 - 2 nu12/E1) c²s² + s⁴/E2 (Jones section 2.6)', () => {
    const m = DEMO_CARBON;
    const polar = polarStiffness(parseStackingCode('[0_4]T').map((thetaDeg) => ({ material: m, thetaDeg, thickness: 0.2 })), { stepDeg: 7.5 });
    expect(polar.points[0].angleDeg).to.equal(0);
    expect(polar.points[polar.points.length - 1].angleDeg).to.equal(180);
    for (const p of polar.points) {
      const t = (p.angleDeg * Math.PI) / 180, c = Math.cos(t), s = Math.sin(t);
      const inverse = c ** 4 / m.E1 + (1 / m.G12 - (2 * m.nu12) / m.E1) * c * c * s * s + s ** 4 / m.E2;
      expect(p.Ex).to.be.closeTo(1 / inverse, 1e-9 * m.E1);
    }
  });

  it('a quasi-isotropic laminate has the same membrane constants in every direction; the points match turned analyses (theory)', () => {
    const plies = parseStackingCode('[0/±60]s').map((thetaDeg) => ({ material: T300_5208, thetaDeg, thickness: 0.2 }));
    const polar = polarStiffness(plies, { stepDeg: 15 });
    const first = polar.points[0];
    for (const p of polar.points) {
      expect(p.Ex).to.be.closeTo(first.Ex, 1e-9 * first.Ex);
      expect(p.Gxy).to.be.closeTo(first.Gxy, 1e-9 * first.Ex);
      const turned = analyseLaminate(parseLaminateInput({ plies: plies.map((q) => ({ ...q, thetaDeg: q.thetaDeg + p.angleDeg })) }));
      expect(p.flexural.Ex).to.be.closeTo(turned.flexural.Ex, 1e-9 * first.Ex);
      expect(p.Ey).to.be.closeTo(turned.membrane.Ey, 1e-9 * first.Ex);
      expect(p.nuxy).to.be.closeTo(turned.membrane.nuxy, 1e-9);
    }
  });
});
