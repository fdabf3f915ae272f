import { expect } from 'chai';
import { InputError } from '../../api/src/shared/input-error.ts';
import { MAX_PLIES, parseStackingCode, printStackingCode } from '../../api/src/laminate/index.ts';
import { seededRandom } from './support/generators.ts';

function parseError(code: string): string {
  try {
    parseStackingCode(code);
  } catch (err) {
    expect(err).to.be.instanceOf(InputError);
    expect((err as InputError).problems[0].field).to.equal('code');
    return (err as InputError).message;
  }
  throw new Error(`${code} parsed`);
}

describe('laminate engine: stacking code', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  // expansions by the notation's definition (ENGINEERING.md section 3 item 7; common practice)
  const cases: [string, number[]][] = [
    ['[0/±45/90]2s', [0, 45, -45, 90, 0, 45, -45, 90, 90, -45, 45, 0, 90, -45, 45, 0]],
    ['[45/-45/0_2/90]s', [45, -45, 0, 0, 90, 90, 0, 0, -45, 45]],
    ['[(0/90)2/45]s', [0, 90, 0, 90, 45, 45, 90, 0, 90, 0]],
    ['[0/90/45]T', [0, 90, 45]],
    ['[0/90/45]', [0, 90, 45]],
    ['[0/45/90*]s', [0, 45, 90, 45, 0]],
    ['[0/45/9\u03050\u0305]s', [0, 45, 90, 45, 0]],
    ['[0/45/90\u0304]s', [0, 45, 90, 45, 0]],
    ['[∓30/0₂]T', [-30, 30, 0, 0]],
    ['[+-45/-+60]', [45, -45, -60, 60]],
    ['[ 0° / −45 / 22.5 ]T', [0, -45, 22.5]],
    ['[±45_2]T', [45, -45, 45, -45]],
    ['[0/90]_{2s}', [0, 90, 0, 90, 90, 0, 90, 0]],
    ['[((0/90)2/45)2]T', [0, 90, 0, 90, 45, 0, 90, 0, 90, 45]],
  ];
  for (const [code, angles] of cases) {
    it(`parses ${code}`, () => expect(parseStackingCode(code)).to.deep.equal(angles));
  }

  it('gives the place as a structured 0-based position too, the character the message counts from 1', () => {
    const positionOf = (code: string) => {
      try {
        parseStackingCode(code);
      } catch (err) {
        return (err as InputError).problems[0].position;
      }
      throw new Error(`${code} parsed`);
    };
    expect(positionOf('0/45')).to.equal(0);
    expect(positionOf('[0/x]')).to.equal(3);
    expect(positionOf('[0/90]s2')).to.equal(7);
  });

  it('says where and what was expected', () => {
    expect(parseError('0/45')).to.match(/position 1 .*expected '\[' to open the code but found '0'/);
    expect(parseError('[0/45')).to.match(/position 6 .*expected '\/' or '\]' but found the end of the code/);
    expect(parseError('[0/45/]s')).to.match(/position 7 .*expected an angle in degrees, '\(' or '±' but found '\]'/);
    expect(parseError('[0/x]')).to.match(/position 4 .*found 'x'/);
    expect(parseError('[±-45]')).to.match(/position 3 .*without a sign/);
    expect(parseError('[(0/90]')).to.match(/position 7 .*expected '\/' or '\)'/);
    expect(parseError('[0/90]s2')).to.match(/position 8 .*expected the end of the code/);
    expect(parseError('[0_0]')).to.match(/repeat count must be at least 1/);
    expect(parseError('[0*/45]s')).to.match(/position 2 .*mid-plane mark/);
    expect(parseError('[0/45*]T')).to.match(/mid-plane mark/);
    expect(parseError('[0/45_2*]s')).to.match(/mid-plane mark/);
    expect(parseError('')).to.match(/empty/);
  });

  it(`refuses codes that expand beyond ${MAX_PLIES} plies without expanding them`, () => {
    expect(parseError('[(0/90)1000]3s')).to.match(/more than 2000 plies/);
    expect(parseError('[((0_2000)2000)2000]T')).to.match(/more than 2000 plies/);
    expect(parseStackingCode('[0_1000]s')).to.have.length(2000);
  });

  it('prints the usual compact forms', () => {
    expect(printStackingCode([0, 45, -45, 90, 90, -45, 45, 0])).to.equal('[0/±45/90]s');
    expect(printStackingCode(parseStackingCode('[0/±45/90]2s'))).to.equal('[0/±45/90]2s');
    expect(printStackingCode([45, -45, 0, 0, 90, 90, 0, 0, -45, 45])).to.equal('[±45/0_2/90]s');
    expect(printStackingCode([0, 90, 0, 90, 45, 45, 90, 0, 90, 0])).to.equal('[(0/90)2/45]s');
    expect(printStackingCode([0, 45, 90, 45, 0])).to.equal('[0/45/9\u03050\u0305]s');
    expect(printStackingCode([0, 45, 90, 45, 0], { midPlaneMark: 'star' })).to.equal('[0/45/90*]s');
    expect(printStackingCode([0, 30, -45])).to.equal('[0/30/-45]T');
    expect(printStackingCode([15])).to.equal('[15]T');
    expect(() => printStackingCode([])).to.throw(InputError);
  });

  it('printing then parsing returns the same plies (600 random stacks)', () => {
    const rnd = seededRandom(801);
    const pool = [0, 45, -45, 90, 30, -30, 60, 22.5, -67.5];
    for (let k = 0; k < 600; k++) {
      const n = 1 + Math.floor(rnd() * 16);
      let angles = Array.from({ length: n }, () => pool[Math.floor(rnd() * pool.length)]);
      if (rnd() < 0.3) angles = [...angles, ...angles]; // periodic
      if (rnd() < 0.4) angles = [...angles, ...(rnd() < 0.5 ? [pool[Math.floor(rnd() * pool.length)]] : []), ...angles.slice().reverse()]; // symmetric
      const code = printStackingCode(angles);
      expect(parseStackingCode(code), code).to.deep.equal(angles);
      expect(parseStackingCode(printStackingCode(angles, { midPlaneMark: 'star' }))).to.deep.equal(angles);
    }
  });
});
