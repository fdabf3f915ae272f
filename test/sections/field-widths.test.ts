/**
 * Every number of every export fits its solver's field: Nastran small field 8
 * characters (data in columns 9-72), free field 16, CalculiX and the
 * general-shell deck 20 (CalculiX cuts a field at 20 characters); values that
 * are zero to rounding are printed as 0. Field widths are common practice of
 * the formats.
 */
import { expect } from 'chai';
import { laminateStiffness } from '../../api/src/laminate/index.ts';
import { exportSection, UNIT_SYSTEM_NAMES, type SectionFormat } from '../../api/src/sections/index.ts';
import { generateLaminates } from './support/generated-laminates.ts';

const LAMINATES = generateLaminates(60, 72);

function files(format: SectionFormat, freeField = false): string[] {
  const out: string[] = [];
  for (const laminate of LAMINATES) {
    const source = { stiffness: laminateStiffness(laminate.plies), plies: laminate.plies, engineVersion: 'test' };
    for (const units of UNIT_SYSTEM_NAMES) {
      out.push(exportSection(format, source, { units, freeField, referenceOffset: laminate.referenceOffset, date: '2026-12-03' }).text);
    }
  }
  return out;
}

function dataLines(text: string, comment: string): string[] {
  return text.split('\n').filter((l) => l.trim() !== '' && !l.startsWith(comment));
}

/** A value below 1e-12 of 1 printed where an exact zero belongs (cos 90°, balanced-laminate A16). */
const TINY = /^-?\d*\.?\d*(e-?|[-])(1[3-9]|[2-9]\d|\d{3})$/i;

describe('field widths of the exports', function () {
  this.timeout(30_000);

  for (const format of ['nastran-pcomp', 'nastran-pshell'] as SectionFormat[]) {
    it(`${format} small field: at most 72 columns, every field 8 characters, reals with a decimal point`, () => {
      for (const text of files(format)) {
        for (const line of dataLines(text, '$')) {
          expect(line.length, line).to.be.at.most(72);
          for (let k = 1; k * 8 < line.length; k++) {
            const field = line.slice(8 * k, 8 * k + 8).trim();
            if (field === '' || /^[A-Z]+$/.test(field)) continue;
            expect(/^-?\d+$/.test(field) || field.includes('.'), `${field} in ${line}`).to.equal(true);
          }
        }
      }
    });

    it(`${format} free field: every value at most 16 characters`, () => {
      for (const text of files(format, true)) {
        for (const line of dataLines(text, '$')) {
          for (const token of line.split(',')) expect(token.length, line).to.be.at.most(16);
        }
      }
    });
  }

  for (const format of ['calculix', 'general-shell'] as SectionFormat[]) {
    it(`${format}: every data field at most 20 characters, no value that is zero to rounding printed as such`, () => {
      for (const text of files(format)) {
        for (const line of dataLines(text, '**').filter((l) => !l.startsWith('*'))) {
          for (const token of line.split(',').map((t) => t.trim())) {
            expect(token.length, line).to.be.at.most(20);
            expect(TINY.test(token), `${token} in ${line}`).to.equal(false);
          }
        }
      }
    });
  }

  it('CalculiX orientations of 0 and 90 degree plies are exact: 1, 0, 0, 0, 1, 0 and 0, 1, 0, -1, 0, 0', () => {
    const text = files('calculix').join('\n');
    expect(text).to.include('*ORIENTATION, NAME=OR_P90, SYSTEM=RECTANGULAR\n0, 1, 0, -1, 0, 0\n');
    expect(text).to.include('*ORIENTATION, NAME=OR_0, SYSTEM=RECTANGULAR\n1, 0, 0, 0, 1, 0\n');
  });
});
