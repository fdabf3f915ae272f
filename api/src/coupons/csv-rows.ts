/**
 * Validation of one coupon row of an upload: each cell is read by its
 * template field's kind, converted to internal units, and checked against the
 * catalogue (material, test method and the properties it yields, condition).
 * Every problem of the row is reported, each with row, column and fix.
 */
import { isCalendarDate } from '../shared/read-fields.ts';
import type { MappedColumn } from './csv-header.ts';
import type { ProblemCollector } from './csv-problems.ts';
import { RESULT_FIELDS } from './csv-template.ts';

/** What the import knows of the catalogue while it reads rows. */
export interface RowCatalogue {
  materials: Map<string, { id: number }>;
  /** By lower-case code. */
  testMethods: Map<string, { id: number; code: string; dominance: Map<string, string> }>;
  /** By upper-case code. */
  conditions: Map<string, { id: number }>;
  properties: Set<string>;
}

export interface SpecimenDraft {
  row: number;
  specimenCode: string;
  materialId: number;
  batchCode: string;
  panelCode: string | null;
  testMethodId: number;
  propertyCode: string;
  conditionId: number;
  widthMm: number;
  thicknessMm: number;
  plyCount: number;
  failureLoadN: number | null;
  strengthMpa: number | null;
  modulusMpa: number | null;
  poissonRatio: number | null;
  failureStrain: number | null;
  failureMode: string | null;
  testDate: string;
  laboratory: string;
}

const DECIMAL = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;
const DECIMAL_COMMA = /^[-+]?\d+,\d+$/;

/** Upper bounds that keep values inside the database's checks (internal units). */
const UPPER_BOUND: Record<string, number> = { width: 9999, thickness: 999, ply_count: 10000, failure_strain: 0.999 };

type Cells = Record<string, string>;

function readNumber(column: MappedColumn, raw: string, row: number, problems: ProblemCollector): number | null {
  const { field } = column;
  const at = { row, column: column.header, field: field.field };
  if (!DECIMAL.test(raw)) {
    if (DECIMAL_COMMA.test(raw)) problems.push({ ...at, code: 'decimal_comma', message: `'${raw}' uses a comma as decimal separator`, fix: 'write decimals with a point (1.52)' });
    else problems.push({ ...at, code: 'not_a_number', message: `'${raw}' is not a number`, fix: `write ${field.field} as a number${column.unit ? ` in ${column.unit}` : ''}` });
    return null;
  }
  const fileValue = Number(raw);
  if (field.kind === 'integer' && !Number.isInteger(fileValue)) {
    problems.push({ ...at, code: 'not_whole_number', message: `'${raw}' is not a whole number`, fix: `write ${field.field} as a whole number` });
    return null;
  }
  if (field.positive && !(fileValue > 0)) {
    problems.push({ ...at, code: 'not_positive', message: `${field.field} must be greater than zero, got ${raw}`, fix: `correct the ${field.description}` });
    return null;
  }
  const value = fileValue * column.factor;
  if (!Number.isFinite(value)) {
    problems.push({ ...at, code: 'out_of_range', message: `'${raw}' is too large`, fix: 'check the value and its unit' });
    return null;
  }
  if (field.field === 'poisson_ratio' && !(value > -1 && value < 1)) {
    problems.push({ ...at, code: 'out_of_range', message: `a Poisson's ratio must lie between -1 and 1, got ${raw}`, fix: 'check the value (it is dimensionless)' });
    return null;
  }
  const upper = UPPER_BOUND[field.field];
  if (upper !== undefined && value > upper) {
    problems.push({ ...at, code: 'out_of_range', message: `${raw}${column.unit ? ' ' + column.unit : ''} is implausibly large for ${field.field}`, fix: 'check the value and the unit chosen' });
    return null;
  }
  return value;
}

/**
 * A reader of data rows for one header and catalogue: the per-file work (which
 * column is which, the catalogue lookups' lists for messages) is done once, so
 * reading a row allocates little (large files have 100 000 of them).
 */
export function couponRowReader(columns: MappedColumn[], catalogue: RowCatalogue) {
  const columnOf = new Map(columns.map((c) => [c.field.field, c.header]));
  const methodCodes = () => [...catalogue.testMethods.values()].map((m) => m.code).join(', ');
  const validDates = new Map<string, boolean>();
  const isDate = (raw: string) => {
    let ok = validDates.get(raw);
    if (ok === undefined) {
      ok = isCalendarDate(raw);
      if (validDates.size < 10_000) validDates.set(raw, ok);
    }
    return ok;
  };

  /** Reads one data row; returns the draft, or null with the problems added. */
  return function readCouponRow(cellsOfRow: string[], row: number, problems: ProblemCollector): SpecimenDraft | null {
    const before = problems.length;
    const text: Cells = {};
    const numbers: Record<string, number | null> = {};
    for (const column of columns) {
      const raw = (cellsOfRow[column.index] ?? '').trim();
      const { field } = column;
      if (raw === '') {
        if (field.required) problems.push({ row, column: column.header, field: field.field, code: 'required', message: `${field.field} is empty`, fix: `give the ${field.description}` });
        continue;
      }
      if (field.kind === 'number' || field.kind === 'integer') numbers[field.field] = readNumber(column, raw, row, problems);
      else if (field.kind === 'date' && !isDate(raw)) problems.push({ row, column: column.header, field: field.field, code: 'not_a_date', message: `'${raw}' is not a date`, fix: 'write the date as YYYY-MM-DD' });
      else if (field.maxLength && raw.length > field.maxLength) problems.push({ row, column: column.header, field: field.field, code: 'too_long', message: `${field.field} is longer than ${field.maxLength} characters`, fix: 'shorten it' });
      else text[field.field] = raw;
    }

    const problem = (field: string, code: string, message: string, fix: string) => problems.push({ row, column: columnOf.get(field), field, code, message, fix });
    const material = text.material ? catalogue.materials.get(text.material) : undefined;
    if (text.material && !material) problem('material', 'unknown_material', `material '${text.material}' is not in the catalogue`, 'register the material system first, or correct the code');
    const method = text.test_method ? catalogue.testMethods.get(text.test_method.toLowerCase()) : undefined;
    if (text.test_method && !method) problem('test_method', 'unknown_test_method', `test method '${text.test_method}' is not in the reference list`, `use one of ${methodCodes()}`);
    const property = text.property?.toLowerCase();
    if (property && !catalogue.properties.has(property)) problem('property', 'unknown_property', `'${text.property}' is not a test property`, `use one of ${[...catalogue.properties].join(', ')}`);
    else if (property && method && !method.dominance.has(property)) problem('property', 'property_not_of_method', `${method.code} does not yield ${property}`, `use ${[...method.dominance.keys()].join(' or ')}, or another test method`);
    const condition = text.condition ? catalogue.conditions.get(text.condition.toUpperCase()) : undefined;
    if (text.condition && !condition) problem('condition', 'unknown_condition', `condition '${text.condition}' is not in the reference list`, `use one of ${[...catalogue.conditions.keys()].join(', ')}`);
    if (!RESULT_FIELDS.some((f) => numbers[f] !== undefined)) problem(RESULT_FIELDS[0], 'no_result', 'the row gives no result (strength, modulus, failure strain or Poisson\'s ratio)', 'fill in at least one result column');

    if (problems.length > before) return null;
    return {
      row,
      specimenCode: text.specimen_id,
      materialId: material!.id,
      batchCode: text.batch,
      panelCode: text.panel ?? null,
      testMethodId: method!.id,
      propertyCode: property!,
      conditionId: condition!.id,
      widthMm: numbers.width!,
      thicknessMm: numbers.thickness!,
      plyCount: numbers.ply_count!,
      failureLoadN: numbers.failure_load ?? null,
      strengthMpa: numbers.strength ?? null,
      modulusMpa: numbers.modulus ?? null,
      poissonRatio: numbers.poisson_ratio ?? null,
      failureStrain: numbers.failure_strain ?? null,
      failureMode: text.failure_mode ?? null,
      testDate: text.test_date,
      laboratory: text.laboratory,
    };
  };
}
