/**
 * Shell sections for solvers: the one entry the CLI, the API and the UI call.
 * `exportSection` writes a laminate's section in a solver's syntax,
 * `readSection` reads an export back (the round-trip check), and the checks
 * (strip cantilever, simply supported plate) let an analyst test a section
 * before exporting it. Pure functions, internal units in, text out.
 */
import { InputError } from '../shared/input-error.ts';
import { prepareSection } from './prepare.ts';
import { readCalculix, readGeneralShell, type KeywordReadOptions } from './readers/keyword.ts';
import { readCsvSection, readJsonSection } from './readers/json-csv.ts';
import { readNastranPcomp, readNastranPshell } from './readers/nastran.ts';
import { SECTION_FORMATS, type SectionFile, type SectionFormat, type SectionOptions, type SectionReadBack, type SectionSource } from './types.ts';
import { writeCalculix } from './writers/calculix.ts';
import { writeGeneralShell } from './writers/general-shell.ts';
import { writeCsv, writeJson } from './writers/json-csv.ts';
import { writeNastranPcomp } from './writers/nastran-pcomp.ts';
import { writeNastranPshell } from './writers/nastran-pshell.ts';

export * from './types.ts';
export { readBackToInternal } from './readers/read-back.ts';
export { UNIT_SYSTEMS, UNIT_SYSTEM_NAMES, conversionFactor, toUnitSystem, fromUnitSystem, type UnitSystemName } from './units.ts';
export { SECTION_CAUTION, SECTION_WRITER_VERSION } from './header.ts';
export { stripCantileverCheck, type StripCheckInput, type StripCheckResult } from './checks/strip-cantilever.ts';
export { plateCheck, type PlateCheckInput, type PlateCheckResult } from './checks/plate.ts';

interface FormatEntry {
  extension: string;
  contentType: string;
  write: (section: ReturnType<typeof prepareSection>) => string;
  read: (text: string, options?: KeywordReadOptions) => SectionReadBack;
}

const FORMATS: Record<SectionFormat, FormatEntry> = {
  'nastran-pcomp': { extension: 'bdf', contentType: 'text/plain; charset=utf-8', write: writeNastranPcomp, read: readNastranPcomp },
  'nastran-pshell': { extension: 'bdf', contentType: 'text/plain; charset=utf-8', write: writeNastranPshell, read: readNastranPshell },
  calculix: { extension: 'inp', contentType: 'text/plain; charset=utf-8', write: writeCalculix, read: readCalculix },
  'general-shell': { extension: 'inp', contentType: 'text/plain; charset=utf-8', write: writeGeneralShell, read: readGeneralShell },
  json: { extension: 'json', contentType: 'application/json; charset=utf-8', write: writeJson, read: readJsonSection },
  csv: { extension: 'csv', contentType: 'text/csv; charset=utf-8', write: writeCsv, read: readCsvSection },
};

export function isSectionFormat(value: string): value is SectionFormat {
  return (SECTION_FORMATS as readonly string[]).includes(value);
}

export function assertSectionFormat(value: string | undefined, field = 'format'): SectionFormat {
  if (value && isSectionFormat(value)) return value;
  throw new InputError({ field, message: `'${value ?? ''}' is not a section format`, fix: `use one of ${SECTION_FORMATS.join(', ')}` });
}

function slug(text: string): string {
  return text.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'section';
}

/** Writes the section of one laminate in `format`. Throws InputError for bad options. */
export function exportSection(format: SectionFormat, source: SectionSource, options: SectionOptions = {}): SectionFile {
  const entry = FORMATS[assertSectionFormat(format)];
  const section = prepareSection(source, options);
  const o = section.options;
  const name = [slug(o.layupName), o.layupRevision !== 'none' ? `r${slug(o.layupRevision)}` : '', format, o.units.toLowerCase()].filter(Boolean).join('-');
  return { format, text: entry.write(section), fileName: `${name}.${entry.extension}`, contentType: entry.contentType };
}

/** Reads an export back to A, B, D (and H where the format has it), in the file's unit system. */
export function readSection(format: SectionFormat, text: string, options: KeywordReadOptions = {}): SectionReadBack {
  return FORMATS[assertSectionFormat(format)].read(text, options);
}
