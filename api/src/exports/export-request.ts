/**
 * Reads an export request (POST /exports and /exports/preview): the layup
 * revision, the format, the unit system and the solver ids. The sections
 * engine checks the values again when it writes (ids that fit a Nastran
 * field, element set names a keyword deck accepts); this reader checks the
 * shape and names each field.
 */
import { SECTION_FORMATS, UNIT_SYSTEM_NAMES } from '../sections/index.ts';
import { InputError } from '../shared/input-error.ts';
import { FieldReader } from '../shared/read-fields.ts';
import type { ExportChoice } from './export-file.ts';

const EXPORT_KEYS = ['layupRevisionId', 'format', 'units', 'propertyId', 'materialId', 'elset', 'referenceOffset', 'freeField'];

export interface ExportRequest {
  layupRevisionId: number;
  choice: ExportChoice;
  checks: { strip?: Record<string, unknown>; plate?: Record<string, unknown> };
}

const isObject = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);

export function readExportRequest(body: unknown, options: { withChecks: boolean }): ExportRequest {
  const f = new FieldReader(body);
  const raw = isObject(body) ? body : {};
  const known = options.withChecks ? [...EXPORT_KEYS, 'checks'] : EXPORT_KEYS;
  for (const key of Object.keys(raw).filter((k) => !known.includes(k))) f.problem(key, 'is not a field of an export', `use only ${known.join(', ')}`);
  const layupRevisionId = f.integer('layupRevisionId', true, { min: 1 });
  const format = f.oneOf('format', SECTION_FORMATS, true);
  const units = f.oneOf('units', UNIT_SYSTEM_NAMES);
  const propertyId = f.integer('propertyId');
  const materialId = f.integer('materialId');
  const elset = f.text('elset');
  const referenceOffset = f.number('referenceOffset');
  const freeField = f.boolean('freeField');
  const checks: ExportRequest['checks'] = {};
  if (options.withChecks && raw.checks !== undefined) {
    if (!isObject(raw.checks)) f.problem('checks', 'is not an object', 'give { "strip": { widthMm, lengthMm, tipLoadN, elements }, "plate": { aMm, bMm, pressureMPa } } or leave it out');
    else {
      for (const key of Object.keys(raw.checks).filter((k) => k !== 'strip' && k !== 'plate')) f.problem(`checks.${key}`, 'is not a section check', 'use strip or plate');
      for (const key of ['strip', 'plate'] as const) {
        const given = raw.checks[key];
        if (given === undefined) continue;
        if (!isObject(given)) f.problem(`checks.${key}`, 'is not an object', 'give its parameters or leave it out for the defaults');
        else checks[key] = given;
      }
    }
  }
  f.done();
  if (!format) throw new InputError({ field: 'format', message: 'is required', fix: `use one of ${SECTION_FORMATS.join(', ')}` });
  return { layupRevisionId, choice: { format, units, propertyId, materialId, elset, referenceOffset, freeField }, checks };
}
