/**
 * Reading the header of an uploaded coupon file: which file column feeds which
 * template field (the client's mapping, else the template's names), and in
 * which unit each numeric column is read (the client's unit choice, else the
 * unit the header states, else SI). A unit choice that contradicts the header
 * (strength_mpa read as ksi) is refused rather than guessed.
 */
import { knownHeaders, TEMPLATE_FIELDS, unitStatedBy, type TemplateField } from './csv-template.ts';
import { SI_UNITS, toInternalFactor, unitKeyOf, type UploadUnits } from './csv-units.ts';
import type { CsvProblem } from './csv-problems.ts';

export interface MappedColumn {
  field: TemplateField;
  /** 0-based index of the column in the file. */
  index: number;
  header: string;
  /** The unit the column is read in ('' for unitless). */
  unit: string;
  /** Multiplies a file value into internal units. */
  factor: number;
}

export type HeaderReading =
  | { ok: true; columns: MappedColumn[]; ignoredHeaders: string[]; fieldCount: number }
  | { ok: false; code: 'csv_wrong_header' | 'csv_missing_columns' | 'csv_invalid_mapping'; message: string; problems: CsvProblem[] };

const FIELD_BY_NAME = new Map(TEMPLATE_FIELDS.map((f) => [f.field, f]));

export function readHeader(cells: string[], mapping: Record<string, string>, units: Partial<UploadUnits>): HeaderReading {
  const headers = cells.map((c) => c.trim());
  const byLowerName = new Map<string, number>();
  const problems: CsvProblem[] = [];
  headers.forEach((h, i) => {
    const key = h.toLowerCase();
    if (key === '') return; // spreadsheets leave empty header cells after the last column
    if (byLowerName.has(key)) problems.push({ row: 1, column: h, field: 'header', code: 'duplicate_column', message: `column '${h}' appears twice`, fix: 'keep one column of each name' });
    else byLowerName.set(key, i);
  });

  const chosen = new Map<string, number>();
  for (const [field, header] of Object.entries(mapping)) {
    if (!FIELD_BY_NAME.has(field)) {
      problems.push({ field: `columns.${field}`, code: 'unknown_field', message: `'${field}' is not a template field`, fix: `map only ${TEMPLATE_FIELDS.map((f) => f.field).join(', ')}` });
      continue;
    }
    // an empty header in the mapping says "this field is not in the file"
    if (String(header).trim() === '') continue;
    const index = byLowerName.get(String(header).trim().toLowerCase());
    if (index === undefined) problems.push({ field: `columns.${field}`, column: String(header), code: 'mapped_column_missing', message: `the mapping reads ${field} from column '${header}', which the file does not have`, fix: 'map it to a column of the header line' });
    else chosen.set(field, index);
  }
  if (problems.length) return { ok: false, code: 'csv_invalid_mapping', message: 'The column mapping or the header line is not usable; see the problems', problems };

  for (const field of TEMPLATE_FIELDS) {
    if (chosen.has(field.field) || Object.hasOwn(mapping, field.field)) continue;
    const index = knownHeaders(field).map((h) => byLowerName.get(h)).find((i) => i !== undefined);
    if (index !== undefined) chosen.set(field.field, index);
  }

  if (chosen.size === 0) {
    return {
      ok: false,
      code: 'csv_wrong_header',
      message: `The first line is not a coupon template header: none of its columns (${headers.slice(0, 6).join(', ')}${headers.length > 6 ? ', ...' : ''}) is a template column`,
      problems: [{ row: 1, field: 'header', code: 'wrong_header', message: 'no template column found in the first line', fix: 'start the file with the header line of the template (download it), or map the columns' }],
    };
  }
  const missing = TEMPLATE_FIELDS.filter((f) => f.required && !chosen.has(f.field));
  if (missing.length) {
    return {
      ok: false,
      code: 'csv_missing_columns',
      message: `The file has no column for ${missing.map((f) => f.field).join(', ')}`,
      problems: missing.map((f) => ({ row: 1, field: f.field, column: knownHeaders(f).at(-1), code: 'missing_column', message: `required column ${f.field} is missing`, fix: `add a column ${knownHeaders(f).slice(-1)[0]} (${f.description}) or map one` })),
    };
  }

  const columns: MappedColumn[] = [];
  for (const [name, index] of chosen) {
    const field = FIELD_BY_NAME.get(name)!;
    const key = unitKeyOf(field.dimension);
    const stated = unitStatedBy(field, headers[index]);
    const explicit = key ? units[key] : undefined;
    if (explicit && stated && explicit !== stated) {
      problems.push({ row: 1, column: headers[index], field: name, code: 'unit_mismatch', message: `the header says ${stated} but the upload was sent with ${key} unit ${explicit}`, fix: `choose ${stated} for ${key}, or rename the column` });
      continue;
    }
    const unit = key ? explicit ?? stated ?? SI_UNITS[key] : field.dimension === 'microstrain' ? 'microstrain' : '';
    const effective: UploadUnits = { ...SI_UNITS, ...(key ? { [key]: unit } : {}) };
    const label = field.dimension === 'modulus' ? (unit === 'ksi' ? 'Msi' : 'GPa') : unit;
    columns.push({ field, index, header: headers[index], unit: label, factor: toInternalFactor(field.dimension, effective) });
  }
  if (problems.length) return { ok: false, code: 'csv_invalid_mapping', message: 'The units chosen contradict the header; see the problems', problems };
  const used = new Set(columns.map((c) => c.index));
  return { ok: true, columns, ignoredHeaders: headers.filter((_, i) => !used.has(i)), fieldCount: headers.length };
}
