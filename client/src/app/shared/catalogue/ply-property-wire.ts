/**
 * Ply property sets and the mapping behind them
 * (api/src/ply-properties/ply-properties.routes.ts): which test method and
 * property feeds each lamina field, and the value each field takes per
 * condition and basis, citing the allowable it came from. Moduli and
 * strengths in MPa, strains and nu12 dimensionless.
 */
import { AllowableStatus } from './allowable-wire';
import { IdCode } from './catalogue-wire';

export type LaminaFieldKind = 'modulus' | 'poisson' | 'strength' | 'strain';
export type PlyBasis = 'A' | 'B' | 'mean';

export interface MappingField {
  readonly field: string;
  readonly kind: LaminaFieldKind;
  readonly unit: string;
  readonly label: string;
  readonly quantity: string;
  readonly testMethod: IdCode | null;
  readonly property: string | null;
  /** stated by a materials engineer, the usual default, or none (a core) */
  readonly source: 'stated' | 'default' | 'none';
}

export interface PlyMapping {
  readonly material: { readonly id: number; readonly code: string; readonly form: string };
  readonly applicable: boolean;
  readonly fields: readonly MappingField[];
}

/** PUT /materials/:id/ply-mapping entry */
export interface StatedMapping {
  readonly field: string;
  readonly testMethod: string;
  readonly property: string;
}

export type PlyFieldStatus = 'approved' | 'unapproved' | 'typical' | 'missing';

export interface PlySetField {
  readonly field: string;
  readonly label: string;
  readonly unit: string;
  readonly value: number | null;
  readonly status: PlyFieldStatus;
  readonly allowable: {
    readonly id: number;
    readonly revision: number;
    readonly status: AllowableStatus;
    readonly basis: 'A' | 'B';
    readonly analysisId: number;
    readonly provisional: boolean;
  } | null;
  readonly n: number | null;
  readonly normalised: boolean | null;
  readonly source: { readonly testMethod: string | null; readonly property: string | null; readonly quantity: string; readonly mapping: string };
}

export interface PlyPropertySet {
  readonly material: { readonly id: number; readonly code: string };
  readonly condition: IdCode;
  readonly basis: PlyBasis;
  readonly applicable: boolean;
  readonly complete: boolean;
  readonly allStrengthsApproved: boolean;
  readonly fields: readonly PlySetField[];
}
