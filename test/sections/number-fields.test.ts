/**
 * Numbers printed to the solvers' field widths: Nastran small field 8
 * characters with a decimal point (implied-E exponents allowed), free field
 * 16, CalculiX 20 (its reader cuts a field at 20 characters). The rules of
 * the formats are common practice of Nastran bulk data and CalculiX input.
 */
import { expect } from 'chai';
import { keywordReal, nastranReal, parseNastranReal, printedRelativeRounding, snapZero } from '../../api/src/sections/number-fields.ts';
import { seededRandom } from './support/generated-laminates.ts';

describe('numbers printed to field widths', () => {
  it('Nastran small field: every value fits 8 characters, has a decimal point and reads back within its printed rounding', () => {
    const rnd = seededRandom(8);
    for (let i = 0; i < 5000; i++) {
      const v = (rnd() < 0.5 ? -1 : 1) * Math.pow(10, -12 + 24 * rnd()) * (1 + rnd());
      const text = nastranReal(v);
      expect(text.length, text).to.be.at.most(8);
      expect(text, text).to.include('.');
      const back = parseNastranReal(text);
      expect(Math.abs(back - v) / Math.abs(v), `${v} printed ${text}`).to.be.at.most(printedRelativeRounding(text) * 1.000001 + 1e-15);
      // at least three significant digits survive even for negative numbers with two-digit exponents
      expect(Math.abs(back - v) / Math.abs(v), `${v} printed ${text}`).to.be.below(5e-3);
    }
  });

  it('keeps four digits where a plain exponent keeps three: -2.3451E10 prints as -2345.+7', () => {
    expect(nastranReal(-2.3451e10)).to.equal('-2345.+7');
    expect(parseNastranReal('-2345.+7')).to.equal(-2.345e10);
  });

  it('prints exact short values plainly, and 0 as 0.', () => {
    expect(nastranReal(181000)).to.equal('181000.');
    expect(nastranReal(0.28)).to.equal('.28');
    expect(nastranReal(-45)).to.equal('-45.');
    expect(nastranReal(0)).to.equal('0.');
    expect(nastranReal(1.6e-9)).to.equal('1.6-9');
    expect(nastranReal(0.125, 16)).to.equal('.125');
  });

  it('reads every Nastran real form: 1.5+3, .25, -1.E-4, 2.D0, 7.', () => {
    expect(parseNastranReal('1.5+3')).to.equal(1500);
    expect(parseNastranReal('.25')).to.equal(0.25);
    expect(parseNastranReal('-1.E-4')).to.equal(-1e-4);
    expect(parseNastranReal('2.D0')).to.equal(2);
    expect(parseNastranReal('7.')).to.equal(7);
  });

  it('free field: 16 characters, more digits kept', () => {
    const text = nastranReal(Math.PI * 1e10, 16);
    expect(text.length).to.be.at.most(16);
    expect(Math.abs(parseNastranReal(text) / (Math.PI * 1e10) - 1)).to.be.below(1e-12);
  });

  it('CalculiX: at most 20 characters, exact where JavaScript\'s shortest form fits', () => {
    const rnd = seededRandom(20);
    for (let i = 0; i < 5000; i++) {
      const v = (rnd() < 0.5 ? -1 : 1) * Math.pow(10, -30 + 60 * rnd()) * (1 + rnd());
      const text = keywordReal(v);
      expect(text.length, text).to.be.at.most(20);
      expect(Math.abs(Number(text) - v) / Math.abs(v), text).to.be.below(1e-13);
    }
    expect(keywordReal(0.7071067811865476)).to.equal('0.7071067811865476');
    expect(keywordReal(-6.123233995736766e-17)).to.have.length.at.most(20);
  });

  it('values zero to rounding print as 0 (cos 90° is 6.1e-17 in floating point)', () => {
    expect(snapZero(Math.cos(Math.PI / 2))).to.equal(0);
    expect(keywordReal(snapZero(Math.cos(Math.PI / 2)))).to.equal('0');
    expect(snapZero(1e-9)).to.equal(1e-9);
    expect(snapZero(1e-3, 1e12)).to.equal(0);
  });

  it('printed rounding is half a unit of the last digit, relative', () => {
    expect(printedRelativeRounding('1.2346+5')).to.be.closeTo(0.5e1 / 1.2346e5, 1e-18);
    expect(printedRelativeRounding('-.1235-9')).to.be.closeTo(0.5e-13 / 0.1235e-9, 1e-15);
    expect(printedRelativeRounding('0.')).to.equal(0);
  });
});
