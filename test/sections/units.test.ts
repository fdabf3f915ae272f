/**
 * Unit systems of the export. Factors checked against NIST SP 811 (2008),
 * Appendix B (conversion factors): 1 in = 2.54E-02 m exactly, 1 lbf =
 * 4.448 222 E+00 N, 1 psi = 6.894 757 E+03 Pa, 1 lbf·in = 1.129 848 E-01 N·m,
 * 1 lbf/in = 1.751 268 E+02 N/m (the values as printed there, 7 digits).
 */
import { expect } from 'chai';
import { laminateStiffness } from '../../api/src/laminate/index.ts';
import type { PlyInput } from '../../api/src/laminate/types.ts';
import {
  conversionFactor, exportSection, fromUnitSystem, readBackToInternal, readSection, toUnitSystem, UNIT_SYSTEMS,
  type SectionFormat,
} from '../../api/src/sections/index.ts';
import { unitSystemNamed } from '../../api/src/sections/units.ts';
import { InputError } from '../../api/src/shared/input-error.ts';
import { generateLaminates } from './support/generated-laminates.ts';

const lbfIn = UNIT_SYSTEMS['lbf-in'];
const si = UNIT_SYSTEMS['N-m-kg'];
const nmmt = UNIT_SYSTEMS['N-mm-t'];

function relative(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

describe('unit systems (NIST SP 811 factors)', () => {
  it('lbf-in: 1 psi = 6.894 757 E+03 Pa, 1 lbf/in = 1.751 268 E+02 N/m, 1 lbf·in = 1.129 848 E-01 N·m (NIST SP 811, Appendix B)', () => {
    // internal stress is MPa: 1 MPa in psi = 1e6 / 6894.757
    expect(relative(1 / toUnitSystem(1, 'stress', lbfIn), 6.894757e3 / 1e6)).to.be.below(1e-6);
    // internal A is N/mm = 1000 N/m
    expect(relative(1000 / toUnitSystem(1, 'forcePerLength', lbfIn), 1.751268e2)).to.be.below(1e-6);
    // internal D is N·mm = 1e-3 N·m
    expect(relative(1e-3 / toUnitSystem(1, 'moment', lbfIn), 1.129848e-1)).to.be.below(1e-6);
    expect(relative(1 / toUnitSystem(1, 'length', lbfIn), 25.4)).to.be.below(1e-15);
  });

  it('mass units are force·s²/length: 1 lbf·s²/in = 175.126 8 kg (4.448 222 N / 0.0254 m/s², NIST SP 811 factors)', () => {
    // an areal mass of 1 kg/m² in lbf·s²/in³: kg → lbf·s²/in divides by 175.1268, per m² → per in² multiplies by 0.0254²
    const expected = (0.0254 * 0.0254) / (4.448222 / 0.0254);
    expect(relative(toUnitSystem(1, 'arealMass', lbfIn), expected)).to.be.below(1e-6);
    // N-mm-t: 1600 kg/m³ = 1.6e-9 t/mm³ (common practice of that system)
    expect(relative(toUnitSystem(1600, 'density', nmmt), 1.6e-9)).to.be.below(1e-15);
    expect(toUnitSystem(1600, 'density', si)).to.equal(1600);
    expect(relative(toUnitSystem(135000, 'stress', si), 1.35e11)).to.be.below(1e-15);
  });

  it('converting there and back is the identity to 1e-15 for every kind and system', () => {
    for (const system of Object.values(UNIT_SYSTEMS)) {
      for (const kind of ['length', 'stress', 'forcePerLength', 'force', 'moment', 'density', 'arealMass', 'perKelvin'] as const) {
        expect(relative(fromUnitSystem(toUnitSystem(1.2345, kind, system), kind, system), 1.2345), `${kind} ${system.name}`).to.be.below(1e-15);
        expect(conversionFactor(kind, system)).to.be.above(0);
      }
    }
  });

  it('rejects an unknown unit system naming the field and the choices', () => {
    expect(() => unitSystemNamed('kip-ft')).to.throw(InputError, /units.*N-mm-t, N-m-kg, lbf-in/);
  });

  for (const format of ['json', 'csv', 'calculix', 'general-shell'] as SectionFormat[]) {
    it(`${format}: a section exported in lbf-in and converted back equals the N-mm-t export to 1e-9 relative`, () => {
      for (const laminate of generateLaminates(30, 811)) {
        const plies: PlyInput[] = laminate.plies;
        const source = { stiffness: laminateStiffness(plies), plies, engineVersion: 'test' };
        const options = { referenceOffset: laminate.referenceOffset, date: '2026-12-03' };
        const imperial = readBackToInternal(readSection(format, exportSection(format, source, { ...options, units: 'lbf-in' }).text));
        const metric = readBackToInternal(readSection(format, exportSection(format, source, { ...options, units: 'N-mm-t' }).text));
        const pairs: [number[][], number[][], string][] = [[imperial.A, metric.A, 'A'], [imperial.B, metric.B, 'B'], [imperial.D, metric.D, 'D'], [imperial.H!, metric.H!, 'H']];
        for (const [x, y, name] of pairs) {
          const scale = Math.max(...y.flat().map(Math.abs), name === 'B' ? Math.max(...metric.A.flat()) * metric.thickness : 0);
          x.flat().forEach((v, i) => expect(Math.abs(v - y.flat()[i]) / scale, `${name} of ${laminate.kind}`).to.be.below(1e-9));
        }
        expect(relative(imperial.thickness, metric.thickness)).to.be.below(1e-9);
        if (metric.arealMass) expect(relative(imperial.arealMass!, metric.arealMass)).to.be.below(1e-9);
      }
    });
  }
});
