/**
 * Lays out one Nastran bulk data entry: small field (ten 8-column fields a
 * line, fields 2-9 holding data, continuation lines starting with `+` in field
 * 1 and field 10 left blank) or free field (comma separated, a continuation
 * line starting with `+,`). Real numbers are printed to the field width: 8
 * characters in small field, 16 in free field (what current Nastran input
 * processors read from a free-field value).
 */
import { integerField, nastranReal } from '../number-fields.ts';

export interface NastranLayout {
  freeField: boolean;
}

/** A field already printed, or blank. */
export type NastranField = string | null;

export function fieldWidth(layout: NastranLayout): number {
  return layout.freeField ? 16 : 8;
}

/** Printers bound to a layout, so card writers read as the format's field list. */
export function nastranPrinters(layout: NastranLayout) {
  const width = fieldWidth(layout);
  return {
    real: (v: number | undefined): NastranField => (v === undefined ? null : nastranReal(v, width)),
    int: (v: number | undefined): NastranField => (v === undefined ? null : integerField(v, 8)),
    text: (v: string | undefined): NastranField => {
      if (v === undefined) return null;
      if (v.length > 8 || /[\s,]/.test(v)) throw new Error(`'${v}' is not a Nastran character field`);
      return v;
    },
  };
}

/** The lines of one entry; `fields` are fields 2, 3, ... of the entry in order, continuations added every eight. */
export function nastranCard(name: string, fields: NastranField[], layout: NastranLayout): string[] {
  let last = fields.length;
  while (last > 0 && fields[last - 1] === null) last--;
  const data = fields.slice(0, Math.max(last, 1));
  const lines: string[] = [];
  for (let start = 0; start < data.length; start += 8) {
    const chunk = data.slice(start, start + 8);
    const lead = start === 0 ? name : '+';
    if (layout.freeField) {
      let end = chunk.length;
      while (end > 0 && chunk[end - 1] === null) end--;
      lines.push(end === 0 ? `${lead},` : [lead, ...chunk.slice(0, end).map((f) => f ?? '')].join(','));
    } else {
      lines.push((lead.padEnd(8) + chunk.map((f) => (f ?? '').padStart(8)).join('')).trimEnd());
    }
  }
  return lines;
}
