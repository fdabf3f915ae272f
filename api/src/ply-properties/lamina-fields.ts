/**
 * The lamina data the laminate engine needs per material and condition, and
 * the usual mapping from (test method, property, quantity) to each field.
 * Directions: 1 = fibre (warp for fabrics), 2 = transverse (fill). Strengths
 * and strains are magnitudes (compression positive), in MPa and dimensionless.
 */
import type { Quantity } from '../materials/vocabulary.ts';

export type LaminaFieldKind = 'modulus' | 'poisson' | 'strength' | 'strain';

export interface LaminaField {
  field: string;
  kind: LaminaFieldKind;
  unit: string;
  label: string;
}

export const LAMINA_FIELDS: readonly LaminaField[] = [
  { field: 'E1', kind: 'modulus', unit: 'MPa', label: 'modulus, fibre direction' },
  { field: 'E2', kind: 'modulus', unit: 'MPa', label: 'modulus, transverse' },
  { field: 'G12', kind: 'modulus', unit: 'MPa', label: 'in-plane shear modulus' },
  { field: 'nu12', kind: 'poisson', unit: '1', label: "major Poisson's ratio" },
  { field: 'Xt', kind: 'strength', unit: 'MPa', label: 'tensile strength, fibre direction' },
  { field: 'Xc', kind: 'strength', unit: 'MPa', label: 'compressive strength, fibre direction' },
  { field: 'Yt', kind: 'strength', unit: 'MPa', label: 'tensile strength, transverse' },
  { field: 'Yc', kind: 'strength', unit: 'MPa', label: 'compressive strength, transverse' },
  { field: 'S12', kind: 'strength', unit: 'MPa', label: 'in-plane shear strength' },
  { field: 'e1t', kind: 'strain', unit: '1', label: 'tensile failure strain, fibre direction' },
  { field: 'e1c', kind: 'strain', unit: '1', label: 'compressive failure strain, fibre direction' },
  { field: 'e2t', kind: 'strain', unit: '1', label: 'tensile failure strain, transverse' },
  { field: 'e2c', kind: 'strain', unit: '1', label: 'compressive failure strain, transverse' },
  { field: 'g12u', kind: 'strain', unit: '1', label: 'in-plane shear failure strain (engineering)' },
];

export const LAMINA_FIELD_NAMES = LAMINA_FIELDS.map((f) => f.field);

/** The quantity a field of each kind reads from coupons. */
export const KIND_QUANTITY: Record<LaminaFieldKind, Quantity> = { modulus: 'modulus', poisson: 'poisson-ratio', strength: 'strength', strain: 'failure-strain' };

export interface FieldSource {
  testMethod: string;
  property: string;
}

/**
 * The usual mapping for ply materials (common practice): tension by
 * ASTM D3039, compression by ASTM D6641, in-plane shear by ASTM D3518 (±45°
 * tension, which gives G12, S12 and the shear strain). Cores have none.
 */
export const DEFAULT_SOURCES: Record<string, FieldSource> = {
  E1: { testMethod: 'ASTM D3039', property: 'tension-0' },
  E2: { testMethod: 'ASTM D3039', property: 'tension-90' },
  G12: { testMethod: 'ASTM D3518', property: 'in-plane-shear' },
  nu12: { testMethod: 'ASTM D3039', property: 'tension-0' },
  Xt: { testMethod: 'ASTM D3039', property: 'tension-0' },
  Xc: { testMethod: 'ASTM D6641', property: 'compression-0' },
  Yt: { testMethod: 'ASTM D3039', property: 'tension-90' },
  Yc: { testMethod: 'ASTM D6641', property: 'compression-90' },
  S12: { testMethod: 'ASTM D3518', property: 'in-plane-shear' },
  e1t: { testMethod: 'ASTM D3039', property: 'tension-0' },
  e1c: { testMethod: 'ASTM D6641', property: 'compression-0' },
  e2t: { testMethod: 'ASTM D3039', property: 'tension-90' },
  e2c: { testMethod: 'ASTM D6641', property: 'compression-90' },
  g12u: { testMethod: 'ASTM D3518', property: 'in-plane-shear' },
};
