/**
 * Round trip of every text format: 200 generated laminates (symmetric,
 * unsymmetric, sandwich with a core ply) written in each unit system and read
 * back must give the engine's A, B, D (and H where the format carries it)
 * within the precision the file was printed to, compared about the reference
 * surface the solver's element sees. The expected values are the
 * laminate engine's own (api/src/laminate); the readers rebuild ply formats
 * through the same engine, so this tests the writing and reading of the
 * numbers, the units and the layer order, not lamination theory itself.
 */
import { expect } from 'chai';
import { laminateStiffness } from '../../api/src/laminate/index.ts';
import type { LaminateStiffness } from '../../api/src/laminate/types.ts';
import {
  exportSection, readBackToInternal, readSection, UNIT_SYSTEM_NAMES,
  type SectionFormat, type SectionOptions,
} from '../../api/src/sections/index.ts';
import { roundTripTolerance, scaledErrors } from './support/compare.ts';
import { generateLaminates, type GeneratedLaminate } from './support/generated-laminates.ts';

const LAMINATES = generateLaminates(200);
const STIFFNESS = new Map<GeneratedLaminate, LaminateStiffness>(LAMINATES.map((l) => [l, laminateStiffness(l.plies)]));

interface Variant {
  format: SectionFormat;
  label: string;
  options: SectionOptions;
  hasH: boolean;
}

const VARIANTS: Variant[] = [
  { format: 'nastran-pcomp', label: 'Nastran PCOMP, small field', options: {}, hasH: true },
  { format: 'nastran-pcomp', label: 'Nastran PCOMP, free field', options: { freeField: true }, hasH: true },
  { format: 'nastran-pshell', label: 'Nastran PSHELL/MAT2, small field', options: {}, hasH: true },
  { format: 'nastran-pshell', label: 'Nastran PSHELL/MAT2, free field', options: { freeField: true }, hasH: true },
  { format: 'calculix', label: 'CalculiX *SHELL SECTION, COMPOSITE', options: {}, hasH: true },
  { format: 'general-shell', label: '*SHELL GENERAL SECTION', options: {}, hasH: true },
  { format: 'json', label: 'JSON', options: {}, hasH: true },
  { format: 'csv', label: 'CSV', options: {}, hasH: true },
];

describe('section round trip: write, read back, compare with the engine', function () {
  this.timeout(60_000);

  it('generates the three kinds of laminate it claims to', () => {
    const kinds = new Set(LAMINATES.map((l) => l.kind));
    expect([...kinds].sort()).to.deep.equal(['sandwich', 'symmetric', 'unsymmetric']);
    const unsymmetric = LAMINATES.filter((l) => l.kind === 'unsymmetric').map((l) => STIFFNESS.get(l)!);
    // most unsymmetric stacks must really couple, or the B comparison would be empty
    const coupled = unsymmetric.filter((k) => Math.max(...k.B.flat().map(Math.abs)) > 1e-6 * Math.max(...k.A.flat()) * k.thickness);
    expect(coupled.length).to.be.greaterThan(unsymmetric.length * 0.8);
  });

  for (const variant of VARIANTS) {
    it(`${variant.label}: A, B, D${variant.hasH ? ', H' : ''} within printed precision for 200 laminates in N-mm-t, N-m-kg and lbf-in`, () => {
      let worst = 0;
      for (const laminate of LAMINATES) {
        const engine = STIFFNESS.get(laminate)!;
        for (const units of UNIT_SYSTEM_NAMES) {
          const file = exportSection(variant.format, { stiffness: engine, plies: laminate.plies, engineVersion: 'test' }, {
            ...variant.options, units, referenceOffset: laminate.referenceOffset, date: '2026-12-03',
          });
          const read = readBackToInternal(readSection(variant.format, file.text));
          const tolerance = roundTripTolerance(read.maxRelativeRounding);
          const errors = scaledErrors(read, engine, laminate.referenceOffset);
          const where = `${variant.label}, ${units}, ${laminate.kind} laminate of ${laminate.plies.length} plies, offset ${laminate.referenceOffset}`;
          expect(read.unitSystem, where).to.equal(units);
          expect(errors.A, `A: ${where}`).to.be.at.most(tolerance);
          expect(errors.B, `B: ${where}`).to.be.at.most(tolerance);
          expect(errors.D, `D: ${where}`).to.be.at.most(tolerance);
          if (variant.hasH) expect(errors.H, `H: ${where}`).to.be.at.most(tolerance);
          expect(Math.abs(read.thickness - engine.thickness) / engine.thickness, `thickness: ${where}`).to.be.at.most(tolerance);
          expect(Math.abs(read.referenceOffset - laminate.referenceOffset), `offset: ${where}`).to.be.at.most(tolerance);
          if (read.arealMass !== undefined) {
            expect(Math.abs(read.arealMass - engine.arealMass) / engine.arealMass, `areal mass: ${where}`).to.be.at.most(tolerance);
          }
          worst = Math.max(worst, errors.A, errors.B, errors.D);
        }
      }
      // the comparison is not vacuous: something was compared, and it was close
      expect(worst).to.be.a('number').and.to.be.below(1e-2);
    });
  }

  it('a wrong layer order would be caught: the unsymmetric laminates read back reversed differ in B', () => {
    const laminate = LAMINATES.find((l) => l.kind === 'unsymmetric' && l.referenceOffset === 0)!;
    const engine = STIFFNESS.get(laminate)!;
    const reversed = [...laminate.plies].reverse();
    const file = exportSection('calculix', { stiffness: laminateStiffness(reversed), plies: reversed, engineVersion: 'test' }, { date: '2026-12-03' });
    const errors = scaledErrors(readBackToInternal(readSection('calculix', file.text)), engine);
    expect(errors.B).to.be.above(1e-3);
  });
});
