/**
 * Checks the export options and fills in the defaults, so that a writer only
 * ever sees values it can print: ids that fit a Nastran field, names a keyword
 * deck accepts, a finite offset.
 */
import { InputError, type InputProblem } from '../shared/input-error.ts';
import type { ResolvedSectionOptions, SectionOptions } from './types.ts';
import { UNIT_SYSTEMS, UNIT_SYSTEM_NAMES, type UnitSystemName } from './units.ts';

/** Nastran small-field integers have 8 characters. */
const MAX_NASTRAN_ID = 99_999_999;
/** CalculiX keeps names of sets, materials and orientations to 80 characters. */
const MAX_KEYWORD_NAME = 80;
const FAILURE_THEORIES = ['HILL', 'HOFF', 'TSAI', 'STRN'] as const;

export function todayIsoDate(): string {
  return new Date().toISOString().slice(0, 10);
}

function isVector3(v: unknown): v is [number, number, number] {
  return Array.isArray(v) && v.length === 3 && v.every((x) => typeof x === 'number' && Number.isFinite(x));
}

function checkId(value: unknown, field: string, problems: InputProblem[]): number | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'number' || !Number.isInteger(value) || value < 1 || value > MAX_NASTRAN_ID) {
    problems.push({ field, message: `must be a whole number from 1 to ${MAX_NASTRAN_ID}`, fix: 'give a positive integer id that fits an 8-character field' });
    return undefined;
  }
  return value;
}

function checkText(value: unknown, field: string, problems: InputProblem[]): string | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'string' || value.length > 200) {
    problems.push({ field, message: 'must be text of at most 200 characters', fix: 'shorten it' });
    return undefined;
  }
  return value;
}

/** Validates `options` (from the CLI or the API) and returns them complete. Throws InputError naming each bad field. */
export function resolveSectionOptions(options: SectionOptions = {}, fieldPrefix = 'options'): ResolvedSectionOptions {
  const problems: InputProblem[] = [];
  const f = (name: string) => `${fieldPrefix}.${name}`;

  const units = (options.units ?? 'N-mm-t') as UnitSystemName;
  if (!UNIT_SYSTEMS[units]) problems.push({ field: f('units'), message: `'${options.units}' is not a unit system`, fix: `use one of ${UNIT_SYSTEM_NAMES.join(', ')}` });

  const propertyId = checkId(options.propertyId, f('propertyId'), problems) ?? 1;
  const materialId = checkId(options.materialId, f('materialId'), problems) ?? 1;

  const elset = options.elset ?? 'LAMINATE';
  if (typeof elset !== 'string' || !/^[A-Za-z][A-Za-z0-9_-]*$/.test(elset) || elset.length > MAX_KEYWORD_NAME) {
    problems.push({ field: f('elset'), message: 'must start with a letter and hold only letters, digits, _ and - (at most 80)', fix: 'rename the element set, e.g. SKIN_UPPER' });
  }

  const referenceOffset = options.referenceOffset ?? 0;
  if (typeof referenceOffset !== 'number' || !Number.isFinite(referenceOffset) || Math.abs(referenceOffset) > 10) {
    problems.push({ field: f('referenceOffset'), message: 'must be a number of thicknesses between -10 and 10', fix: 'use 0 for the mid-plane, -0.5 for the bottom surface, 0.5 for the top' });
  }

  const date = options.date ?? todayIsoDate();
  if (typeof date !== 'string' || !/^\d{4}-\d{2}-\d{2}/.test(date)) {
    problems.push({ field: f('date'), message: 'must be an ISO date', fix: 'write it as YYYY-MM-DD' });
  }

  if (options.failureTheory !== undefined && !FAILURE_THEORIES.includes(options.failureTheory)) {
    problems.push({ field: f('failureTheory'), message: `'${options.failureTheory}' is not a PCOMP failure theory`, fix: `use one of ${FAILURE_THEORIES.join(', ')}` });
  }

  const xAxis = options.xAxis ?? [1, 0, 0];
  const normal = options.normal ?? [0, 0, 1];
  if (!isVector3(xAxis)) problems.push({ field: f('xAxis'), message: 'must be three finite numbers', fix: 'give the laminate x direction, e.g. [1, 0, 0]' });
  if (!isVector3(normal)) problems.push({ field: f('normal'), message: 'must be three finite numbers', fix: 'give the element normal, e.g. [0, 0, 1]' });
  if (isVector3(xAxis) && isVector3(normal)) {
    const cross = [xAxis[1] * normal[2] - xAxis[2] * normal[1], xAxis[2] * normal[0] - xAxis[0] * normal[2], xAxis[0] * normal[1] - xAxis[1] * normal[0]];
    const size = Math.hypot(...xAxis) * Math.hypot(...normal);
    if (size === 0 || Math.hypot(...cross) < 1e-6 * size) {
      problems.push({ field: f('xAxis'), message: 'must not be zero or parallel to the normal', fix: 'choose an x axis in the plane of the shell' });
    }
  }

  const layupName = checkText(options.layupName, f('layupName'), problems) ?? 'unnamed layup';
  const layupRevision = checkText(options.layupRevision, f('layupRevision'), problems) ?? 'none';
  const allowables = checkText(options.allowables, f('allowables'), problems) ?? 'none stated (stiffness only)';

  if (problems.length) throw new InputError(problems);
  return {
    units, propertyId, materialId, elset, referenceOffset, layupName, layupRevision, allowables, date,
    freeField: options.freeField === true,
    failureTheory: options.failureTheory,
    xAxis, normal,
  };
}
