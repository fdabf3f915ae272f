/**
 * The catalogue as the API sends it (api/src/materials/materials.wire.ts):
 * material systems with their batches and panels, and the reference lists of
 * test properties, test methods and conditions. Internal units (mm, kg/m³).
 */

export type MaterialForm = 'unidirectional-tape' | 'woven-fabric' | 'non-crimp-fabric' | 'core';

export const MATERIAL_FORMS: readonly { readonly value: MaterialForm; readonly label: string }[] = [
  { value: 'unidirectional-tape', label: 'Unidirectional tape' },
  { value: 'woven-fabric', label: 'Woven fabric' },
  { value: 'non-crimp-fabric', label: 'Non-crimp fabric' },
  { value: 'core', label: 'Core' },
];

export interface Material {
  readonly id: number;
  readonly code: string;
  readonly name: string;
  readonly form: MaterialForm;
  readonly fibre: string;
  readonly resin: string;
  readonly nominalCuredPlyThicknessMm: number | null;
  readonly fibreArealWeightGm2: number | null;
  readonly resinContentPct: number | null;
  readonly densityKgM3: number | null;
  readonly specificationRef: string | null;
  readonly notes: string | null;
  readonly invented: boolean;
  readonly createdAt: string;
  readonly updatedAt: string;
}

/** POST /materials: what a materials engineer registers. */
export interface NewMaterial {
  readonly code: string;
  readonly name: string;
  readonly form: MaterialForm;
  readonly fibre: string;
  readonly resin: string;
  readonly nominalCuredPlyThicknessMm?: number;
  readonly fibreArealWeightGm2?: number;
  readonly resinContentPct?: number;
  readonly densityKgM3?: number;
  readonly specificationRef?: string;
  readonly notes?: string;
}

export interface Panel {
  readonly id: number;
  readonly batchId: number;
  readonly code: string;
  readonly curedOn: string | null;
  readonly notes: string | null;
}

export interface Batch {
  readonly id: number;
  readonly materialId: number;
  readonly code: string;
  readonly manufacturedOn: string | null;
  readonly notes: string | null;
  readonly panels: readonly Panel[];
}

export interface MaterialDetail extends Material {
  readonly batches: readonly Batch[];
}

export interface TestProperty {
  readonly code: string;
  readonly label: string;
}

export type Dominance = 'fibre-dominated' | 'matrix-dominated' | 'not-applicable';

export interface TestMethod {
  readonly id: number;
  readonly code: string;
  readonly standardRef: string;
  readonly title: string;
  readonly properties: readonly { readonly property: string; readonly dominance: Dominance }[];
}

export interface Condition {
  readonly id: number;
  readonly code: string;
  readonly label: string;
  readonly temperatureC: number;
  readonly moistureState: 'dry' | 'wet' | 'ambient';
}

/** A reference by id with its code, as specimens, analyses and allowables carry them. */
export interface IdCode {
  readonly id: number;
  readonly code: string | null;
}

export interface PersonRef {
  readonly id: number;
  readonly name: string;
}

/** GET /data-groups: coupon counts of one property in one condition. */
export interface DataGroup {
  readonly property: string;
  readonly condition: IdCode;
  readonly valid: number;
  readonly excluded: number;
  readonly batches: number;
}
