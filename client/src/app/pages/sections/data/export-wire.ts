/**
 * The section export routes as the client sees them (issue-7 server,
 * api/src/exports): preview (nothing recorded), record-and-download, history.
 * Check inputs and results in internal units (mm, N, MPa).
 */
import type { Impact } from '../../../shared/impact-banner/impact';

export const SECTION_FORMATS = ['nastran-pcomp', 'nastran-pshell', 'calculix', 'general-shell', 'json', 'csv'] as const;
export type SectionFormat = (typeof SECTION_FORMATS)[number];

export const FORMAT_LABELS: Readonly<Record<SectionFormat, string>> = {
  'nastran-pcomp': 'Nastran bulk data: PCOMP with MAT8 plies',
  'nastran-pshell': 'Nastran bulk data: PSHELL with MAT2 (equivalent stiffness)',
  calculix: 'CalculiX: *SHELL SECTION, COMPOSITE',
  'general-shell': 'Keyword deck: *SHELL GENERAL SECTION (6×6 ABD)',
  json: 'JSON (A, B, D, H, constants, plies)',
  csv: 'CSV (A, B, D, H, constants, plies)',
};

export const SECTION_UNIT_SYSTEMS = ['N-mm-t', 'N-m-kg', 'lbf-in'] as const;
export type SectionUnitSystem = (typeof SECTION_UNIT_SYSTEMS)[number];

export const UNIT_SYSTEM_LABELS: Readonly<Record<SectionUnitSystem, string>> = {
  'N-mm-t': 'N, mm, tonne (MPa)',
  'N-m-kg': 'N, m, kg (Pa)',
  'lbf-in': 'lbf, in, lbf·s²/in (psi)',
};

export interface ExportRequest {
  readonly layupRevisionId: number;
  readonly format: SectionFormat;
  readonly units: SectionUnitSystem;
  readonly propertyId: number;
  readonly materialId: number;
  readonly elset: string;
  readonly referenceOffset: number;
  readonly freeField: boolean;
}

export interface StripCheckInput {
  readonly widthMm: number;
  readonly lengthMm: number;
  readonly tipLoadN: number;
  readonly elements: number;
}

export interface PlateCheckInput {
  readonly aMm: number;
  readonly bMm: number;
  readonly pressureMPa: number;
}

export interface StripCheckResult {
  readonly method: string;
  readonly bendingStiffnessNmm2: number;
  readonly tip: { readonly deflectionMm: number; readonly closedFormDeflectionMm: number; readonly ratio: number };
  readonly assumptions: readonly string[];
}

export interface PlateCheckResult {
  readonly method: string;
  readonly navier: { readonly centreDeflectionMm: number; readonly converged: boolean; readonly ratioToRitz: number };
  readonly ritz: { readonly centreDeflectionMm: number; readonly ratioToNavier: number };
  readonly bendingTwistCoupling: number;
  readonly membraneBendingCoupling: number;
  readonly spanToThickness: number;
  readonly warnings: readonly string[];
}

export interface ExportPreview {
  readonly format: SectionFormat;
  readonly units: SectionUnitSystem;
  readonly fileName: string;
  readonly contentType: string;
  readonly text: string;
  readonly header: { readonly layupName: string; readonly layupRevision: string; readonly allowables: string; readonly date: string };
  readonly checks: {
    readonly strip: StripCheckResult | { readonly error: string };
    readonly plate: PlateCheckResult | { readonly error: string };
  };
  readonly impact: readonly Impact[];
}

export interface ExportSummary {
  readonly id: number;
  readonly layupId: number;
  readonly layupRevisionId: number;
  readonly layupName: string;
  readonly layupRevision: number;
  readonly format: SectionFormat;
  readonly units: SectionUnitSystem;
  readonly fileName: string;
  readonly sha256: string;
  readonly bytes: number;
  readonly createdAt: string;
  readonly createdBy: { readonly id: number; readonly name: string };
  readonly impactCount: number;
}

export interface RecordedExport extends ExportSummary {
  readonly text: string;
}
