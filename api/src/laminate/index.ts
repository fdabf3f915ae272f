/**
 * The laminate engine: plies in; stiffness, response, failure, envelopes,
 * polar data, stacking codes and design rules out. Pure functions in internal
 * units (ENGINEERING.md sections 1 and 3); imports nothing from HTTP, the
 * database or the client.
 */
export type { LaminateStiffness, Matrix2, Matrix3, Matrix6, PlyInput, PlyMaterial, TransverseShearDescription } from './types.ts';
export { ENGINE_VERSION, LAMINATE_UNITS } from './version.ts';
export { Q, S, Qbar, Sbar, invariants, expansionLaminateAxes, rotateStiffness, stressToPlyAxes, strainToPlyAxes, type StiffnessInvariants } from './lamina.ts';
export { laminateStiffness, DEFAULT_SHEAR_CORRECTION, type StiffnessOptions, type TransverseShearModel } from './stiffness.ts';
export { membraneConstants, flexuralConstants, type MembraneConstants, type FlexuralConstants } from './engineering-constants.ts';
export { analyseLaminate, type LaminateAnalysis, type PlyResult, type FirstPlyFailure } from './analyse.ts';
export { parseLaminateInput, type LaminateInput } from './input.ts';
export { parseEnvelopeInput, parsePolarInput, type EnvelopeInput } from './input-plots.ts';
export { failureEnvelope, type FailureEnvelope, type EnvelopePoint, type EnvelopeAxes } from './envelope.ts';
export { polarStiffness, type PolarStiffness, type PolarPoint } from './polar.ts';
export { parseStackingCode } from './stacking-code.ts';
export { printStackingCode } from './stacking-code-printer.ts';
export { designRuleChecks, type RuleCheck } from './design-rules.ts';
export { CRITERIA, DEFAULT_FAILURE_OPTIONS, DEFAULT_PUCK, DEFAULT_TSAI_WU_F12_STAR, type CriterionName, type FailureMode, type FailureOptions, type PuckParameters } from './failure/criterion.ts';
export { MAX_PLIES } from './ply-checks.ts';
export type { LoadCase } from './stack-response.ts';
