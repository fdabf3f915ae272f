/**
 * Numbers printed to fit a solver's field, with as many significant digits as
 * the width allows.
 *
 * Widths: Nastran bulk data small field 8 characters, large and free field 16;
 * CalculiX reads at most 20 characters of a field (its input reader cuts the
 * rest, so a longer number is silently read as a different one). Nastran real
 * fields need a decimal point and accept an exponent without the E
 * (`1.2345+5`); both forms are common practice of the format.
 */

/** Values whose size is below this fraction of their scale are zero to rounding (cos 90° = 6.1e-17). */
export const ZERO_TO_ROUNDING = 1e-12;

/** Returns 0 for a value that is zero to rounding relative to `scale` (defaults to 1, right for direction cosines). */
export function snapZero(value: number, scale = 1): number {
  return Math.abs(value) <= ZERO_TO_ROUNDING * Math.abs(scale) ? 0 : value;
}

function assertFinite(value: number): void {
  if (!Number.isFinite(value)) throw new Error(`cannot print ${value} in a solver field`);
}

function withPoint(mantissa: string): string {
  const m = mantissa.includes('.') ? mantissa : mantissa + '.';
  return m.replace(/^(-?)0\./, '$1.');
}

function exponentSuffix(exponent: number): string {
  return exponent === 0 ? '' : exponent < 0 ? String(exponent) : `+${exponent}`;
}

/** The usual forms: fixed point and one digit before the point (`2.25-5`), every length that fits. */
function plainNastranForms(value: number, width: number): string[] {
  const out: string[] = [];
  for (let digits = 0; digits <= width; digits++) {
    if (Math.abs(value) < 1e21) {
      const fixed = withPoint(value.toFixed(digits));
      if (fixed.length <= width) out.push(fixed);
    }
    const [mantissa, exponent] = value.toExponential(Math.min(digits, 20)).split('e');
    const s = withPoint(mantissa) + exponentSuffix(Number(exponent));
    if (s.length <= width) out.push(s);
  }
  return out;
}

/**
 * For a number that must be rounded: at every split of the digits around the
 * point, the longest mantissa that fits, so `-2345.+7` keeps four digits of
 * -2.345E10 where `-2.35+10` keeps three.
 */
function denseNastranForms(value: number, width: number): string[] {
  const out: string[] = [];
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  for (let exponent = magnitude - width; exponent <= magnitude + 1; exponent++) {
    const mantissa = value / Math.pow(10, exponent);
    const suffix = exponentSuffix(exponent);
    const integerDigits = Math.max(1, Math.floor(Math.log10(Math.abs(mantissa))) + 1);
    for (let decimals = Math.max(0, width - suffix.length - integerDigits - 2); decimals <= width; decimals++) {
      const s = withPoint(mantissa.toFixed(decimals)) + suffix;
      if (s.length > width) break;
      if (!/e/i.test(s)) out.push(s);
    }
  }
  return out;
}

/** Parses what `nastranReal` prints (and any Nastran real: `1.5+3`, `.25`, `1.E-4`, `2.D0`). */
export function parseNastranReal(text: string): number {
  const t = text.trim().toUpperCase().replace('D', 'E');
  const implied = /^([-+]?(?:\d+\.?\d*|\.\d+))([-+]\d+)$/.exec(t);
  const value = implied ? Number(`${implied[1]}E${implied[2]}`) : Number(t);
  return value;
}

/** Ranks print forms a person reads most easily: no exponent, then one digit before the point (`2.25-5`), then shorter. */
function readability(text: string): [number, number, number] {
  const [, mantissa, exponent] = /^([-+]?[\d.]*)((?:[eE][-+]?|[-+])\d+)?$/.exec(text) ?? [text, text, undefined];
  const manyLeadingZeros = !exponent && /^[-+]?\.0000/.test(mantissa);
  const conventional = /^[-+]?([1-9]\.|\.[1-9])/.test(mantissa) ? 0 : 1;
  return [exponent || manyLeadingZeros ? 1 : 0, conventional, text.length];
}

function byReadability(a: string, b: string): number {
  const ra = readability(a), rb = readability(b);
  return ra[0] - rb[0] || ra[1] - rb[1] || ra[2] - rb[2];
}

/**
 * Picks what to print: when some candidates read back within a few units in
 * the last place of the double (the value "is" a short decimal), the most
 * readable of them; otherwise the closest, the longest on a tie. So a number
 * shorter than its field is exact, and a rounded one fills the field, which is
 * what lets a reader tell the printed precision (`printedRelativeRounding`).
 */
function closest(value: number, candidates: string[], parse: (s: string) => number): string {
  const nearlyExact = 4 * Number.EPSILON * Math.abs(value);
  const scored = candidates.map((text) => ({ text, error: Math.abs(parse(text) - value) })).filter((c) => Number.isFinite(c.error));
  if (!scored.length) throw new Error(`${value} has no printable form`);
  const exact = scored.filter((c) => c.error <= nearlyExact).map((c) => c.text);
  if (exact.length) return exact.sort(byReadability)[0];
  const minError = Math.min(...scored.map((c) => c.error));
  const best = scored.filter((c) => c.error === minError).map((c) => c.text);
  const longest = Math.max(...best.map((t) => t.length));
  return best.filter((t) => t.length === longest).sort(byReadability)[0];
}

/**
 * A Nastran real in at most `width` characters (8 small field, 16 large or free
 * field), always with a decimal point, 0 printed as `0.`.
 */
export function nastranReal(value: number, width = 8): string {
  assertFinite(value);
  if (value === 0) return '0.';
  const plain = plainNastranForms(value, width);
  const nearlyExact = 4 * Number.EPSILON * Math.abs(value);
  if (plain.some((s) => Math.abs(parseNastranReal(s) - value) <= nearlyExact)) return closest(value, plain, parseNastranReal);
  const candidates = [...plain, ...denseNastranForms(value, width)];
  if (candidates.length === 0) throw new Error(`${value} does not fit a ${width}-character Nastran field`);
  return closest(value, candidates, parseNastranReal);
}

/** An integer field; Nastran and CalculiX ids must fit the field too. */
export function integerField(value: number, width: number): string {
  if (!Number.isInteger(value)) throw new Error(`${value} is not an integer id`);
  const s = String(value);
  if (s.length > width) throw new Error(`${value} does not fit a ${width}-character field`);
  return s;
}

/**
 * A real for keyword-style decks (CalculiX and the general-shell syntax): the
 * shortest of JavaScript's exact round-trip form and fixed significant digits
 * that fits `width` (20 for CalculiX), read back closest to the value.
 */
export function keywordReal(value: number, width = 20): string {
  assertFinite(value);
  if (value === 0) return '0';
  const exact = String(value);
  if (exact.length <= width) return exact;
  const candidates: string[] = [];
  for (let digits = 17; digits >= 1; digits--) {
    const s = value.toPrecision(digits);
    if (s.length <= width) candidates.push(s);
    const e = value.toExponential(digits - 1);
    if (e.length <= width) candidates.push(e);
  }
  if (candidates.length === 0) throw new Error(`${value} does not fit a ${width}-character field`);
  return closest(value, candidates, Number);
}

/**
 * Half a unit in the last printed digit, relative to the value: the rounding a
 * reader must allow for a printed number (0 for exact zero or an integer-valued
 * field printed in full).
 */
export function printedRelativeRounding(text: string): number {
  const t = text.trim().toUpperCase().replace('D', 'E');
  const m = /^([-+]?)(\d*)(?:\.(\d*))?(?:E?([-+]?\d+))?$/.exec(t);
  if (!m) return 0;
  const value = Math.abs(parseNastranReal(t));
  if (value === 0) return 0;
  const decimals = (m[3] ?? '').length;
  const exponent = m[4] ? Number(m[4]) : 0;
  const halfUlp = 0.5 * Math.pow(10, exponent - decimals);
  return halfUlp / value;
}
