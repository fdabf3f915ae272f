/**
 * Reads the fields of a request body or query string, collecting every problem
 * (field, message, fix) before throwing one InputError, so a person fixes all
 * of them at once. Routes use it to validate; services receive typed values.
 */
import { InputError, type InputProblem } from './input-error.ts';

type Source = Record<string, unknown>;

interface TextOptions { maxLength?: number; pattern?: RegExp; patternFix?: string }
interface NumberOptions { min?: number; max?: number; exclusiveMin?: number }

export class FieldReader {
  readonly problems: InputProblem[] = [];
  private readonly source: Source;

  constructor(source: unknown, private readonly prefix = '') {
    this.source = source && typeof source === 'object' && !Array.isArray(source) ? (source as Source) : {};
    if (source !== undefined && (typeof source !== 'object' || source === null || Array.isArray(source))) {
      this.problems.push({ field: prefix || 'body', message: 'must be a JSON object', fix: 'send an object with the fields this route takes' });
    }
  }

  private name(field: string) {
    return this.prefix ? `${this.prefix}.${field}` : field;
  }

  private raw(field: string): unknown {
    const value = this.source[field];
    return value === '' || value === null ? undefined : value;
  }

  has(field: string): boolean {
    return this.raw(field) !== undefined;
  }

  problem(field: string, message: string, fix?: string): void {
    this.problems.push({ field: this.name(field), message, ...(fix ? { fix } : {}) });
  }

  text(field: string, required: true, options?: TextOptions): string;
  text(field: string, required?: false, options?: TextOptions): string | undefined;
  text(field: string, required = false, options: TextOptions = {}): string | undefined {
    const value = this.raw(field);
    if (value === undefined) {
      if (required) this.problem(field, 'is required', `give ${field} as text`);
      return undefined;
    }
    if (typeof value !== 'string') {
      this.problem(field, `must be text, got ${typeof value}`, `send ${field} as a string`);
      return undefined;
    }
    const trimmed = value.trim();
    if (required && !trimmed) this.problem(field, 'must not be blank', `give ${field}`);
    if (options.maxLength && trimmed.length > options.maxLength) this.problem(field, `is longer than ${options.maxLength} characters`, 'shorten it');
    if (options.pattern && trimmed && !options.pattern.test(trimmed)) this.problem(field, `'${trimmed}' has characters that are not allowed`, options.patternFix);
    return trimmed || undefined;
  }

  number(field: string, required: true, options?: NumberOptions): number;
  number(field: string, required?: false, options?: NumberOptions): number | undefined;
  number(field: string, required = false, options: NumberOptions = {}): number | undefined {
    const value = this.raw(field);
    if (value === undefined) {
      if (required) this.problem(field, 'is required', `give ${field} as a number`);
      return undefined;
    }
    const parsed = typeof value === 'number' ? value : typeof value === 'string' && value.trim() !== '' ? Number(value) : NaN;
    if (!Number.isFinite(parsed)) {
      this.problem(field, `must be a finite number, got ${JSON.stringify(value)}`, `send ${field} as a number`);
      return undefined;
    }
    if (options.exclusiveMin !== undefined && !(parsed > options.exclusiveMin)) this.problem(field, `must be greater than ${options.exclusiveMin}, got ${parsed}`);
    if (options.min !== undefined && parsed < options.min) this.problem(field, `must be at least ${options.min}, got ${parsed}`);
    if (options.max !== undefined && parsed > options.max) this.problem(field, `must be at most ${options.max}, got ${parsed}`);
    return parsed;
  }

  integer(field: string, required: true, options?: NumberOptions): number;
  integer(field: string, required?: false, options?: NumberOptions): number | undefined;
  integer(field: string, required = false, options: NumberOptions = {}): number | undefined {
    const before = this.problems.length;
    const value = required ? this.number(field, true, options) : this.number(field, false, options);
    if (value !== undefined && this.problems.length === before && !Number.isInteger(value)) {
      this.problem(field, `must be a whole number, got ${value}`);
      return undefined;
    }
    return value;
  }

  oneOf<T extends string>(field: string, allowed: readonly T[], required: true): T;
  oneOf<T extends string>(field: string, allowed: readonly T[], required?: false): T | undefined;
  oneOf<T extends string>(field: string, allowed: readonly T[], required = false): T | undefined {
    const value = this.raw(field);
    if (value === undefined) {
      if (required) this.problem(field, 'is required', `use one of ${allowed.join(', ')}`);
      return undefined;
    }
    if (typeof value !== 'string' || !allowed.includes(value as T)) {
      this.problem(field, `${JSON.stringify(value)} is not allowed`, `use one of ${allowed.join(', ')}`);
      return undefined;
    }
    return value as T;
  }

  boolean(field: string): boolean | undefined {
    const value = this.raw(field);
    if (value === undefined) return undefined;
    if (typeof value === 'boolean') return value;
    if (value === 'true' || value === 'false') return value === 'true';
    this.problem(field, `must be true or false, got ${JSON.stringify(value)}`);
    return undefined;
  }

  /** A calendar date as YYYY-MM-DD (returned as given). */
  date(field: string, required = false): string | undefined {
    const value = required ? this.text(field, true) : this.text(field);
    if (value === undefined) return undefined;
    if (!isCalendarDate(value)) {
      this.problem(field, `'${value}' is not a date`, 'write it as YYYY-MM-DD');
      return undefined;
    }
    return value;
  }

  /** A list of strings (a JSON array, or a comma-separated query value). */
  textList(field: string, required = false): string[] | undefined {
    const value = this.raw(field);
    if (value === undefined) {
      if (required) this.problem(field, 'is required', `give ${field} as a list`);
      return undefined;
    }
    const list = Array.isArray(value) ? value : typeof value === 'string' ? value.split(',') : null;
    if (!list || list.some((v) => typeof v !== 'string' || !v.trim())) {
      this.problem(field, 'must be a list of non-blank texts', `send ${field} as ["a", "b"] or a,b`);
      return undefined;
    }
    const items = [...new Set(list.map((v: string) => v.trim()))];
    if (required && items.length === 0) this.problem(field, 'must not be empty');
    return items;
  }

  /** Throws one InputError with every problem found so far. */
  done(): void {
    if (this.problems.length) throw new InputError(this.problems);
  }
}

/** YYYY-MM-DD naming a real calendar day (no 2026-02-30). */
export function isCalendarDate(value: string): boolean {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(value);
  if (!match) return false;
  const [y, m, d] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const day = new Date(Date.UTC(y, m - 1, d));
  return day.getUTCFullYear() === y && day.getUTCMonth() === m - 1 && day.getUTCDate() === d;
}

/** A positive whole-number id from a route parameter, or an InputError naming it. */
export function readId(value: unknown, field = 'id'): number {
  const id = typeof value === 'string' && /^\d{1,9}$/.test(value) ? Number(value) : NaN;
  if (!Number.isInteger(id) || id < 1) throw new InputError({ field, message: `'${String(value)}' is not an id`, fix: 'use the whole-number id from the list' });
  return id;
}
