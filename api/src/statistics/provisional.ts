/**
 * Sample-size status of a basis value (ENGINEERING.md section 2 item 11;
 * common practice in qualification programmes, no single source): a B-basis
 * value from fewer than 3 batches or 18 specimens, or an A-basis value from
 * fewer than 5 batches or 55 specimens, is provisional.
 */

export const B_MINIMUM = { batches: 3, specimens: 18 } as const;
export const A_MINIMUM = { batches: 5, specimens: 55 } as const;

export interface ProvisionalStatus {
  bBasis: boolean;
  aBasis: boolean;
  reasons: string[];
}

/** Which basis values are provisional for a data group of `specimens` values in `batches` batches. */
export function provisionalStatus(batches: number, specimens: number): ProvisionalStatus {
  const reasons: string[] = [];
  const short = (kind: 'B' | 'A', minimum: { batches: number; specimens: number }): boolean => {
    const missing: string[] = [];
    if (batches < minimum.batches) missing.push(`${batches} batch${batches === 1 ? '' : 'es'} (at least ${minimum.batches} needed)`);
    if (specimens < minimum.specimens) missing.push(`${specimens} specimens (at least ${minimum.specimens} needed)`);
    if (missing.length) reasons.push(`${kind}-basis is provisional: ${missing.join(' and ')}`);
    return missing.length > 0;
  };
  const bBasis = short('B', B_MINIMUM);
  const aBasis = short('A', A_MINIMUM);
  return { bBasis, aBasis, reasons };
}
