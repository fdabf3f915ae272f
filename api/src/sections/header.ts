/**
 * The comment header every export starts with: product, engine version, layup
 * name and revision, allowables used, unit system, date and the caution
 * (PRODUCT.md, "Cautions the product must show": shown where sections are
 * exported).
 */
import type { PreparedSection } from './prepare.ts';

export const PRODUCT_NAME = 'Plyledger';
/** Version of the section writers; the file layout changes only with it. */
export const SECTION_WRITER_VERSION = '1.0.0';

export const SECTION_CAUTION =
  'Allowables and laminate results support engineering judgement; they do not replace it. ' +
  'Basis values are only as good as the test programme behind them. Check this section against ' +
  'the design before use; structures that can hurt someone are certified under the applicable ' +
  'regulations and local codes, by licensed or authorised engineers.';

/** Plain ASCII for solver decks (old parsers choke on other bytes, even in comments). */
export function asciiText(text: string): string {
  return text.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').replace(/[^\x20-\x7e]/g, '?');
}

/** Wraps text to lines of at most `width` characters (comment lines must stay inside a card's 80 columns). */
export function wrapText(text: string, width: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/).filter(Boolean)) {
    if (line && line.length + 1 + word.length > width) {
      lines.push(line);
      line = word;
    } else {
      line = line ? `${line} ${word}` : word;
    }
  }
  if (line) lines.push(line);
  return lines;
}

export interface HeaderFields {
  product: string;
  formatDescription: string;
  engineVersion: string;
  sectionWriterVersion: string;
  layupName: string;
  layupRevision: string;
  allowables: string;
  unitSystem: string;
  unitsDescription: string;
  date: string;
  referenceSurface: string;
  caution: string;
}

export function describeReferenceSurface(section: PreparedSection): string {
  const r = section.referenceOffset;
  const where = r === 0 ? 'the mid-plane' : r === -0.5 ? 'the bottom surface (first ply)' : r === 0.5 ? 'the top surface (last ply)' : `${r} of the thickness from the mid-plane along the normal`;
  return `element nodes on ${where}`;
}

export function headerFields(section: PreparedSection, formatDescription: string): HeaderFields {
  const o = section.options;
  const l = section.system.labels;
  return {
    product: PRODUCT_NAME,
    formatDescription,
    engineVersion: section.engineVersion,
    sectionWriterVersion: SECTION_WRITER_VERSION,
    layupName: o.layupName,
    layupRevision: o.layupRevision,
    allowables: o.allowables,
    unitSystem: section.system.name,
    unitsDescription: `length ${l.length}, force ${l.force}, stress ${l.stress}, density ${l.density}, time s, temperature degC`,
    date: o.date,
    referenceSurface: describeReferenceSurface(section),
    caution: SECTION_CAUTION,
  };
}

/** The header as comment lines with the format's comment mark (`$`, `**`, `#`). */
export function headerComment(section: PreparedSection, formatDescription: string, mark: string, width = 72): string[] {
  const h = headerFields(section, formatDescription);
  const entries: [string, string][] = [
    ['Product', `${h.product} shell section export`],
    ['Format', h.formatDescription],
    ['Engine', `laminate engine ${h.engineVersion}, section writer ${h.sectionWriterVersion}`],
    ['Layup', `${h.layupName}, revision ${h.layupRevision}`],
    ['Allowables', h.allowables],
    ['Units', `${h.unitSystem} (${h.unitsDescription})`],
    ['Date', h.date],
    ['Reference surface', h.referenceSurface],
    ['Caution', h.caution],
  ];
  const lines: string[] = [];
  for (const [key, value] of entries) {
    wrapText(asciiText(`${key}: ${value}`), width - mark.length - 1).forEach((text, i) => {
      lines.push(`${mark} ${i === 0 ? '' : '  '}${text}`);
    });
  }
  return lines;
}

/** Reads the unit system back from a header (what the readers use to know the file's units). */
export function unitSystemInHeader(text: string): string | undefined {
  return /Units:\s*([A-Za-z-]+)\s*\(/.exec(text)?.[1];
}
