/**
 * How numbers are written on the page: a fixed number of significant digits,
 * plain notation between 0.001 and 1 000 000, exponent notation outside, and
 * never "-0", "NaN" or "Infinity" (missing values are a dash).
 */
export const MISSING_VALUE = '–';

export function formatSignificant(value: number | null | undefined, significantDigits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return MISSING_VALUE;
  if (value === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(value)));
  if (magnitude >= 6 || magnitude < -3) {
    return value.toExponential(Math.max(0, significantDigits - 1)).replace('e+', 'e');
  }
  const decimals = Math.max(0, significantDigits - 1 - magnitude);
  const text = value.toFixed(decimals);
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** Ratios and margins: two decimals (a margin of 0.004 and of -0.004 must not both read "0.00"). */
export function formatMargin(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return MISSING_VALUE;
  if (Math.abs(value) < 0.005 && value !== 0) return value < 0 ? '-0.00…' : '+0.00…';
  return (value > 0 ? '+' : '') + value.toFixed(2);
}

/** A value put back into an input: six significant digits, no trailing zeros, empty when missing. */
export function formatForInput(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return String(Number(value.toPrecision(6)) + 0);
}

/** A number typed by a person ("1,5" reads 1.5); null when it is not one. */
export function parseTypedNumber(text: string): number | null {
  const trimmed = text.trim().replace(',', '.').replace('−', '-');
  if (trimmed === '' || !/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(trimmed)) return null;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : null;
}

/**
 * 0 for a value that is round-off against `scale` (the largest value of its
 * table): sums that cancel in exact arithmetic leave about 1e-16 of their terms.
 */
export function withoutRoundOff(value: number, scale: number, relative = 1e-10): number {
  return Math.abs(value) <= relative * Math.abs(scale) ? 0 : value;
}
