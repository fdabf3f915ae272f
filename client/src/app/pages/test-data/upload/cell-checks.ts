/**
 * The checks the browser can make on the first rows before sending, so the
 * person sees mistakes in the preview at once: empty required cells, numbers
 * that are not numbers (or use a decimal comma), whole numbers, positive
 * values, dates. The catalogue checks (unknown material, test method and so
 * on) are the server's.
 */
import { ColumnMapping } from './column-mapping';
import { RESULT_FIELDS, TEMPLATE_FIELDS, TemplateField } from './template-fields';

export interface CellProblem {
  /** 0-based data row of the preview (spreadsheet row = index + 2). */
  readonly rowIndex: number;
  /** Header of the column, null for a problem of the whole row. */
  readonly header: string | null;
  readonly field: string;
  readonly message: string;
}

const PLAIN_NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
const DECIMAL_COMMA = /^[-+]?\d+,\d+$/;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

function isCalendarDate(text: string): boolean {
  const match = ISO_DATE.exec(text);
  if (!match) return false;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const date = new Date(Date.UTC(year, month - 1, day));
  return date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
}

/** The problem of one cell, or null. */
export function cellProblem(field: TemplateField, raw: string): string | null {
  const text = raw.trim();
  if (text === '') return field.required ? 'empty, but required' : null;
  if (field.kind === 'date') return isCalendarDate(text) ? null : 'not a date: write YYYY-MM-DD';
  if (field.kind !== 'number' && field.kind !== 'integer') return null;
  if (DECIMAL_COMMA.test(text)) return 'decimal comma: write a point (1.52)';
  if (!PLAIN_NUMBER.test(text)) return 'not a number';
  const value = Number(text);
  if (field.kind === 'integer' && !Number.isInteger(value)) return 'not a whole number';
  if (field.positive && !(value > 0)) return 'must be greater than zero';
  return null;
}

/** Every problem of the preview rows under a mapping. */
export function previewProblems(headers: readonly string[], rows: readonly (readonly string[])[], mapping: ColumnMapping): CellProblem[] {
  const columnIndex = new Map(headers.map((h, i) => [h, i]));
  const mapped = TEMPLATE_FIELDS.flatMap((field) => {
    const header = mapping[field.field];
    const index = header ? columnIndex.get(header) : undefined;
    return header && index !== undefined ? [{ field, header, index }] : [];
  });
  const problems: CellProblem[] = [];
  rows.forEach((cells, rowIndex) => {
    if (cells.length === 1 && cells[0].trim() === '') return;
    if (cells.length !== headers.length) {
      problems.push({ rowIndex, header: null, field: 'row', message: `${cells.length} fields, but the header has ${headers.length}: check for a comma inside a value` });
    }
    for (const { field, header, index } of mapped) {
      const message = cellProblem(field, cells[index] ?? '');
      if (message) problems.push({ rowIndex, header, field: field.field, message });
    }
    const hasResult = mapped.some(({ field, index }) => RESULT_FIELDS.includes(field.field) && (cells[index] ?? '').trim() !== '');
    if (!hasResult) problems.push({ rowIndex, header: null, field: 'strength', message: 'no result: give strength, modulus, failure strain or Poisson’s ratio' });
  });
  return problems;
}
