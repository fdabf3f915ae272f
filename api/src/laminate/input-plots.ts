/** Validation of the inputs of `envelope` and `polar` (CLI) and their routes. */
import type { InputProblem } from '../shared/input-error.ts';
import type { EnvelopeAxes, EnvelopeRequest } from './envelope.ts';
import { CRITERIA, type CriterionName } from './failure/criterion.ts';
import { criterionStrengthProblems, optionalNumber, parseFailureOptions, parseStack, requireExpansion, requireObject, type StackInput, unknownKeyProblems } from './input.ts';
import { throwIfProblems } from './ply-checks.ts';
import type { PlyInput } from './types.ts';

const STACK_KEYS = ['plies', 'code', 'material', 'plyThickness'];
const AXES: EnvelopeAxes[] = ['Nx-Ny', 'Nx-Nxy'];

export interface EnvelopeInput extends EnvelopeRequest {
  code: string | null;
}

/** { plies | code, criterion = "tsai-wu", axes = "Nx-Ny", points = 360, deltaT?, deltaMoisture?, tsaiWu?, puck? } */
export function parseEnvelopeInput(json: unknown): EnvelopeInput {
  const obj = requireObject(json, 'a laminate ("plies" or "code") with optional "criterion", "axes", "points", "deltaT", "deltaMoisture"');
  const problems: InputProblem[] = unknownKeyProblems(obj, [...STACK_KEYS, 'criterion', 'axes', 'points', 'deltaT', 'deltaMoisture', 'tsaiWu', 'puck'], '');
  const stack: StackInput = parseStack(obj, problems);
  const criterion = (obj.criterion ?? 'tsai-wu') as CriterionName;
  if (!(CRITERIA as readonly string[]).includes(criterion)) problems.push({ field: 'criterion', message: `is ${JSON.stringify(obj.criterion)}`, fix: `use one of ${CRITERIA.join(', ')}` });
  else problems.push(...criterionStrengthProblems(stack, criterion));
  const axes = (obj.axes ?? 'Nx-Ny') as EnvelopeAxes;
  if (!AXES.includes(axes)) problems.push({ field: 'axes', message: `is ${JSON.stringify(obj.axes)}`, fix: 'use "Nx-Ny" or "Nx-Nxy"' });
  const points = optionalNumber(obj, 'points', '', problems, 360, { min: 4, max: 3600, fix: 'give a whole number of load directions from 4 to 3600' });
  if (!Number.isInteger(points)) problems.push({ field: 'points', message: `is ${points}`, fix: 'give a whole number of load directions from 4 to 3600' });
  const deltaT = optionalNumber(obj, 'deltaT', '', problems, 0, { min: -1e4, max: 1e4, fix: 'give the temperature change from the stress-free temperature in °C' });
  const deltaMoisture = optionalNumber(obj, 'deltaMoisture', '', problems, 0, { min: -1, max: 1, fix: 'give the moisture change as a mass fraction' });
  requireExpansion(stack, deltaT !== 0, ['alpha1', 'alpha2'], 'deltaT is not zero', problems);
  requireExpansion(stack, deltaMoisture !== 0, ['beta1', 'beta2'], 'deltaMoisture is not zero', problems);
  const failure = parseFailureOptions(obj, problems);
  throwIfProblems(problems);
  return { plies: stack.plies, code: stack.code, criterion, axes, points, deltaT, deltaMoisture, failure };
}

/** { plies | code, stepDeg = 1 } */
export function parsePolarInput(json: unknown): { plies: PlyInput[]; code: string | null; stepDeg: number } {
  const obj = requireObject(json, 'a laminate ("plies" or "code") with optional "stepDeg"');
  const problems: InputProblem[] = unknownKeyProblems(obj, [...STACK_KEYS, 'stepDeg'], '');
  const stack = parseStack(obj, problems);
  const stepDeg = optionalNumber(obj, 'stepDeg', '', problems, 1, { min: 0.05, max: 90, fix: 'give the angular step in degrees, from 0.05 to 90' });
  throwIfProblems(problems);
  return { plies: stack.plies, code: stack.code, stepDeg };
}
