/**
 * The section engine's request bodies, checked and run without HTTP (so the
 * worker threads of engine-pool.ts can run them): { laminate, options } for an
 * export, { laminate, strip | plate } for a built-in check.
 */
import {
  assertSectionFormat, exportSection, plateCheck, stripCantileverCheck, type SectionFile, type SectionOptions,
} from '../sections/index.ts';
import { sectionSourceFromLaminateInput } from '../sections/source.ts';
import { InputError } from '../shared/input-error.ts';

type Json = Record<string, unknown>;

const BODY_KEYS = ['laminate', 'options'];
const CHECK_BODY_KEYS = ['laminate', 'strip', 'plate'];

function objectBody(body: unknown, keys: string[], fix: string): Json {
  if (body === null || typeof body !== 'object' || Array.isArray(body)) {
    throw new InputError({ field: 'body', message: 'is not a JSON object', fix });
  }
  const obj = body as Json;
  const unknown = Object.keys(obj).filter((k) => !keys.includes(k));
  if (unknown.length) throw new InputError(unknown.map((k) => ({ field: k, message: 'is not a field of this request', fix: `use only ${keys.join(', ')}` })));
  if (obj.laminate === undefined) throw new InputError({ field: 'laminate', message: 'is missing', fix });
  return obj;
}

const SECTION_OPTION_KEYS = [
  'units', 'propertyId', 'materialId', 'elset', 'referenceOffset', 'layupName', 'layupRevision', 'allowables', 'date', 'freeField', 'failureTheory', 'xAxis', 'normal',
] as const satisfies ReadonlyArray<keyof SectionOptions>;

function optionsOf(value: unknown): SectionOptions {
  if (value === undefined) return {};
  if (value === null || typeof value !== 'object' || Array.isArray(value)) {
    throw new InputError({ field: 'options', message: 'is not an object', fix: 'give { "units", "elset", "propertyId", ... } or leave it out' });
  }
  // A misspelt option (say "unit" for "units") must not pass silently as the default.
  const unknown = Object.keys(value).filter((k) => !(SECTION_OPTION_KEYS as readonly string[]).includes(k));
  if (unknown.length) {
    throw new InputError(unknown.map((k) => ({ field: `options.${k}`, message: 'is not an export option', fix: `use only ${SECTION_OPTION_KEYS.join(', ')}` })));
  }
  return value as SectionOptions;
}

const LAMINATE_FIX = 'send { "laminate": { "plies": [...] } or { "code", "material", "plyThickness" }';

export function runSectionExport({ format, body }: { format: string; body: unknown }): SectionFile {
  const checked = assertSectionFormat(format, 'format');
  const request = objectBody(body, BODY_KEYS, `${LAMINATE_FIX}, "options": { ... } }`);
  return exportSection(checked, sectionSourceFromLaminateInput(request.laminate), optionsOf(request.options));
}

export function runSectionCheck({ check, body }: { check: string; body: unknown }) {
  if (check !== 'strip' && check !== 'plate') {
    throw new InputError({ field: 'check', message: `'${check}' is not a section check`, fix: 'use strip or plate' });
  }
  const request = objectBody(body, CHECK_BODY_KEYS, `${LAMINATE_FIX}, "strip" or "plate": { ... } }`);
  const source = sectionSourceFromLaminateInput(request.laminate);
  const params = (request[check] ?? {}) as Json;
  return check === 'strip' ? stripCantileverCheck(source.stiffness, params) : plateCheck(source.stiffness, params);
}
