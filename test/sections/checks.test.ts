/**
 * The built-in checks: the laminated strip cantilever (beam finite elements
 * against the closed form) and the simply supported plate (Navier series and
 * Rayleigh-Ritz).
 */
import { expect } from 'chai';
import { laminateStiffness } from '../../api/src/laminate/index.ts';
import type { PlyMaterial } from '../../api/src/laminate/types.ts';
import { plateCheck, stripCantileverCheck } from '../../api/src/sections/index.ts';
import { navierCentreDeflection, ritzCentreDeflection } from '../../api/src/sections/checks/plate-series.ts';
import { InputError } from '../../api/src/shared/input-error.ts';
import { generateLaminates } from './support/generated-laminates.ts';

const TAPE: PlyMaterial = { name: 'FR-UC300', E1: 135000, E2: 9000, G12: 5000, nu12: 0.3 };
const crossPly = laminateStiffness([0, 90, 90, 0].map((thetaDeg) => ({ material: TAPE, thetaDeg, thickness: 0.25 })));

describe('strip cantilever check', () => {
  it('finite-element tip deflection equals the closed form to 1e-9 relative for any element count (cubic Hermite elements are exact for end loads)', () => {
    for (const laminate of generateLaminates(30, 17)) {
      const k = laminateStiffness(laminate.plies);
      for (const elements of [1, 2, 5, 10, 100, 1000]) {
        const result = stripCantileverCheck(k, { widthMm: 20, lengthMm: 150, tipLoadN: 5, elements });
        expect(Math.abs(result.tip.ratio - 1), `${elements} elements`).to.be.below(1e-9);
        expect(Math.abs(result.tip.rotationRatio - 1)).to.be.below(1e-9);
        expect(result.nodes).to.have.length(elements + 1);
      }
    }
  });

  it('reports deflection and rotation at every node, matching w = P x² (3L - x) / (6 EI) (closed form, common practice) there too', () => {
    const result = stripCantileverCheck(crossPly, { widthMm: 25, lengthMm: 200, tipLoadN: 10, elements: 8 });
    for (const node of result.nodes.slice(1)) {
      expect(Math.abs(node.deflectionMm / node.closedFormDeflectionMm - 1)).to.be.below(1e-9);
      expect(Math.abs(node.rotationRad / node.closedFormRotationRad - 1)).to.be.below(1e-9);
    }
    expect(result.nodes[0].deflectionMm).to.equal(0);
    // EI = b / d11 with d11 from the engine's abd (narrow-strip stiffness)
    expect(result.bendingStiffnessNmm2).to.be.closeTo(25 / crossPly.abd[3][3], 1e-6 * result.bendingStiffnessNmm2);
    // for a single-material symmetric laminate: tip deflection P L³ / (3 EI)
    expect(result.tip.closedFormDeflectionMm).to.be.closeTo((10 * 200 ** 3) / (3 * result.bendingStiffnessNmm2), 1e-12);
  });

  it('rejects bad input naming the field and the fix', () => {
    expect(() => stripCantileverCheck(crossPly, { widthMm: 25, lengthMm: -1, tipLoadN: 10, elements: 0 }))
      .to.throw(InputError).with.property('problems').that.satisfies((p: { field: string }[]) => p.some((x) => x.field === 'strip.lengthMm') && p.some((x) => x.field === 'strip.elements'));
  });
});

describe('simply supported plate check', () => {
  it('isotropic square plate: Navier gives w_max = 0.00406 q a⁴ / D (Timoshenko and Woinowsky-Krieger, Theory of Plates and Shells, table 8, nu = 0.3; from memory)', () => {
    const E = 70000, nu = 0.3, h = 2;
    const iso: PlyMaterial = { E1: E, E2: E, G12: E / (2 * (1 + nu)), nu12: nu };
    const k = laminateStiffness([{ material: iso, thetaDeg: 0, thickness: h }]);
    const D = (E * h ** 3) / (12 * (1 - nu * nu));
    const result = plateCheck(k, { aMm: 500, bMm: 500, pressureMPa: 0.01 });
    const coefficient = (result.navier.centreDeflectionMm * D) / (0.01 * 500 ** 4);
    expect(coefficient).to.be.closeTo(0.00406, 0.000005);
    expect(result.warnings).to.deep.equal([]);
  });

  it('the Navier series converges and says so: terms used and the last change are reported', () => {
    const result = plateCheck(crossPly, { aMm: 300, bMm: 200, pressureMPa: 0.001 });
    expect(result.navier.converged).to.equal(true);
    expect(result.navier.lastRelativeChange).to.be.below(1e-10);
    expect(result.navier.termsUsed).to.be.greaterThan(1);
    const few = navierCentreDeflection(crossPly.D, { aMm: 300, bMm: 200, pressureMPa: 0.001 }, 1);
    expect(few.termsUsed).to.equal(1);
    expect(few.converged).to.equal(false);
    // one term is already within a few per cent, as the series converges fast at the centre (common practice)
    expect(Math.abs(few.centreDeflectionMm / result.navier.centreDeflectionMm - 1)).to.be.below(0.05);
  });

  it('for a specially orthotropic laminate the Ritz system is diagonal and equals the Navier terms (ratio 1 to the truncation)', () => {
    const plate = { aMm: 300, bMm: 200, pressureMPa: 0.001 };
    const navier = navierCentreDeflection(crossPly.D, plate, 13, 0);
    const ritz = ritzCentreDeflection(crossPly.D, plate, 13);
    expect(Math.abs(ritz / navier.centreDeflectionMm - 1)).to.be.below(1e-12);
    const result = plateCheck(crossPly, plate);
    expect(Math.abs(result.navier.ratioToRitz - 1)).to.be.below(1e-4);
    expect(result.ritz.ratioToNavier).to.be.closeTo(1 / result.navier.ratioToRitz, 1e-12);
  });

  it('warns when D16, D26 or B are not negligible, or when the plate is thick', () => {
    const angled = laminateStiffness([45, -45, -45, 45].map((thetaDeg) => ({ material: TAPE, thetaDeg, thickness: 0.25 })));
    const w1 = plateCheck(angled, { aMm: 300, bMm: 300, pressureMPa: 0.001 }).warnings.join(' ');
    expect(w1).to.match(/D16 or D26 is not negligible/);
    const unsymmetric = laminateStiffness([0, 0, 90, 90].map((thetaDeg) => ({ material: TAPE, thetaDeg, thickness: 0.25 })));
    const w2 = plateCheck(unsymmetric, { aMm: 300, bMm: 300, pressureMPa: 0.001 }).warnings.join(' ');
    expect(w2).to.match(/B is not negligible/);
    const w3 = plateCheck(crossPly, { aMm: 10, bMm: 10, pressureMPa: 0.001 }).warnings.join(' ');
    expect(w3).to.match(/span over thickness/);
  });

  it('rejects bad input naming the field', () => {
    expect(() => plateCheck(crossPly, { aMm: 0, bMm: 200, pressureMPa: 0.001 })).to.throw(InputError, /plate\.aMm/);
    expect(() => plateCheck(crossPly, { aMm: 300, bMm: 200, pressureMPa: 0.001, ritzTerms: 99 })).to.throw(InputError, /plate\.ritzTerms/);
  });
});
