/**
 * Line colours of Plyledger's plots, in order of use: the product's fjord
 * teal and amber, then heather, moss and slate. Distinct in hue and in
 * lightness, so the curves stay apart for readers with a red-green deficiency.
 */
export const SERIES_COLOURS = ['#1a6872', '#c2841f', '#7b5ea7', '#5f8a3c', '#44546a', '#b0413e'] as const;

/** The round number at or above `value` (1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8 times a power of ten), for axis limits. */
export function roundAxisLimit(value: number): number {
  if (!(value > 0) || !Number.isFinite(value)) return 1;
  const decade = 10 ** Math.floor(Math.log10(value));
  const step = [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10].find((m) => m * decade >= value * (1 - 1e-12)) ?? 10;
  return step * decade;
}
