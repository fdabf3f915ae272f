/**
 * Validation of a basis request from JSON (CLI file, HTTP body): every
 * problem is reported with the field (`values[12]`, `batches`) and the fix,
 * collected into one InputError so the user can correct them in one go.
 */
import { InputError, type InputProblem } from '../shared/input-error.ts';
import { BASIS_METHODS, type BasisRequest, type MethodRequest, type ParsedBasisInput, type ValueExclusion } from './types.ts';

/** Largest data set accepted in one request (keeps one request within a second or so). */
export const MAX_VALUES = 100_000;
const MAX_PROBLEMS = 20;
const KNOWN_FIELDS = ['values', 'batches', 'conditions', 'basis', 'method', 'modifiedCv', 'exclusions'];
const METHOD_REQUESTS: readonly string[] = ['auto', ...BASIS_METHODS];

function isRecord(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

/** Largest magnitude accepted for a value: far beyond any property in any unit (a strength in Pa is about 1e9), small enough that every statistic of 10,000 values stays finite. */
export const MAX_ABS_VALUE = 1e15;

function parseValues(raw: unknown, problems: InputProblem[]): number[] {
  if (!Array.isArray(raw)) {
    problems.push({ field: 'values', message: raw === undefined ? 'is missing' : 'must be an array of numbers', fix: 'give the measured values as "values": [number, ...]' });
    return [];
  }
  if (raw.length > MAX_VALUES) problems.push({ field: 'values', message: `has ${raw.length} entries, more than the ${MAX_VALUES} allowed`, fix: 'split the data into data groups' });
  raw.forEach((x, i) => {
    if (typeof x !== 'number' || !Number.isFinite(x)) problems.push({ field: `values[${i}]`, message: `is ${JSON.stringify(x) ?? 'undefined'}, not a finite number`, fix: 'give a number (no text, null, NaN or Infinity)' });
    // Sums and squares of the values must stay finite (1e308 would overflow the mean to Infinity).
    else if (Math.abs(x) > MAX_ABS_VALUE) problems.push({ field: `values[${i}]`, message: `is ${x}, beyond ±${MAX_ABS_VALUE.toExponential()}`, fix: 'check the unit and the decimal point: no material property comes near this' });
  });
  return raw as number[];
}

function parseLabels(field: 'batches' | 'conditions', raw: unknown, count: number, problems: InputProblem[]): string[] {
  const what = field === 'batches' ? 'batch' : 'condition';
  if (!Array.isArray(raw)) {
    problems.push({ field, message: raw === undefined ? 'is missing' : `must be an array of ${what} labels`, fix: `give one ${what} label per value, e.g. "${field}": ["A", "A", "B", ...]` });
    return [];
  }
  if (raw.length !== count) problems.push({ field, message: `has ${raw.length} entries but values has ${count}`, fix: `give exactly one ${what} label per value` });
  return raw.map((label, i) => {
    if ((typeof label === 'string' && label.trim() !== '') || (typeof label === 'number' && Number.isFinite(label))) return String(label);
    problems.push({ field: `${field}[${i}]`, message: `is ${JSON.stringify(label) ?? 'undefined'}, not a ${what} label`, fix: `give a non-empty text label for the ${what}` });
    return '';
  });
}

function parseExclusions(raw: unknown, count: number, problems: InputProblem[]): ValueExclusion[] {
  if (raw === undefined) return [];
  if (!Array.isArray(raw)) {
    problems.push({ field: 'exclusions', message: 'must be an array of { index, reason }', fix: 'list each excluded value with its index and the reason' });
    return [];
  }
  const seen = new Set<number>();
  return raw.flatMap((entry, i) => {
    const field = `exclusions[${i}]`;
    if (!isRecord(entry) || !Number.isInteger(entry.index) || (entry.index as number) < 0 || (entry.index as number) >= count) {
      problems.push({ field: `${field}.index`, message: `must be the index of a value (0 to ${count - 1})`, fix: 'give the position of the value in "values", counting from 0' });
      return [];
    }
    if (typeof entry.reason !== 'string' || entry.reason.trim() === '') {
      problems.push({ field: `${field}.reason`, message: 'is missing', fix: 'record why the value is excluded (for example a specimen failure mode outside the gauge section)' });
      return [];
    }
    const index = entry.index as number;
    if (seen.has(index)) problems.push({ field: `${field}.index`, message: `excludes value ${index} a second time`, fix: 'list each excluded value once' });
    seen.add(index);
    return [{ index, reason: entry.reason.trim() }];
  });
}

/** Validates a basis request; throws InputError naming each bad field. */
export function parseBasisInput(json: unknown): ParsedBasisInput {
  if (!isRecord(json)) {
    throw new InputError({ field: 'input', message: 'must be a JSON object', fix: 'send { "values": [...], "batches": [...] }' });
  }
  const problems: InputProblem[] = [];
  for (const key of Object.keys(json)) {
    if (!KNOWN_FIELDS.includes(key)) problems.push({ field: key, message: 'is not a known field', fix: `use only ${KNOWN_FIELDS.join(', ')}` });
  }
  const values = parseValues(json.values, problems);
  const batches = parseLabels('batches', json.batches, values.length, problems);
  const conditions = json.conditions === undefined ? null : parseLabels('conditions', json.conditions, values.length, problems);
  const basis = json.basis ?? 'both';
  if (basis !== 'A' && basis !== 'B' && basis !== 'both') problems.push({ field: 'basis', message: `is ${JSON.stringify(basis)}`, fix: 'use "A", "B" or "both"' });
  const method = json.method ?? 'auto';
  if (typeof method !== 'string' || !METHOD_REQUESTS.includes(method)) problems.push({ field: 'method', message: `is ${JSON.stringify(method)}`, fix: `use one of ${METHOD_REQUESTS.join(', ')}` });
  const modifiedCv = json.modifiedCv ?? false;
  if (typeof modifiedCv !== 'boolean') problems.push({ field: 'modifiedCv', message: 'must be true or false', fix: 'use true to apply the modified CV method' });
  const exclusions = parseExclusions(json.exclusions, values.length, problems);
  if (values.length === 0 && Array.isArray(json.values)) problems.push({ field: 'values', message: 'is empty', fix: 'give at least two measured values' });
  if (problems.length) throw new InputError(problems.slice(0, MAX_PROBLEMS));
  return { values, batches, conditions, basis: basis as BasisRequest, method: method as MethodRequest, modifiedCv: modifiedCv as boolean, exclusions };
}
