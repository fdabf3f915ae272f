/**
 * The columns of Plyledger's coupon template, as the client needs them to map
 * a file's headers and to check its first rows before sending. The server's
 * list (api/src/coupons/csv-template.ts) is the rule; the server checks every
 * row again and its answer is what counts. test/api/upload-template-agreement.test.ts
 * fails when this copy and the server's list part.
 */

export type FieldKind = 'text' | 'number' | 'integer' | 'date';

/** Which unit choice a numeric column is read in. */
export type FieldDimension = 'none' | 'length' | 'force' | 'strength' | 'modulus' | 'microstrain';

export interface TemplateField {
  readonly field: string;
  readonly label: string;
  readonly kind: FieldKind;
  readonly required: boolean;
  readonly dimension: FieldDimension;
  readonly positive?: boolean;
}

export const TEMPLATE_FIELDS: readonly TemplateField[] = [
  { field: 'specimen_id', label: 'Specimen id', kind: 'text', required: true, dimension: 'none' },
  { field: 'material', label: 'Material code', kind: 'text', required: true, dimension: 'none' },
  { field: 'batch', label: 'Batch', kind: 'text', required: true, dimension: 'none' },
  { field: 'panel', label: 'Panel', kind: 'text', required: false, dimension: 'none' },
  { field: 'test_method', label: 'Test method', kind: 'text', required: true, dimension: 'none' },
  { field: 'property', label: 'Test property', kind: 'text', required: true, dimension: 'none' },
  { field: 'condition', label: 'Condition', kind: 'text', required: true, dimension: 'none' },
  { field: 'width', label: 'Width', kind: 'number', required: true, dimension: 'length', positive: true },
  { field: 'thickness', label: 'Thickness', kind: 'number', required: true, dimension: 'length', positive: true },
  { field: 'ply_count', label: 'Ply count', kind: 'integer', required: true, dimension: 'none', positive: true },
  { field: 'failure_load', label: 'Failure load', kind: 'number', required: false, dimension: 'force', positive: true },
  { field: 'strength', label: 'Strength', kind: 'number', required: false, dimension: 'strength', positive: true },
  { field: 'modulus', label: 'Modulus', kind: 'number', required: false, dimension: 'modulus', positive: true },
  { field: 'poisson_ratio', label: "Poisson's ratio", kind: 'number', required: false, dimension: 'none' },
  { field: 'failure_strain', label: 'Failure strain (µε)', kind: 'number', required: false, dimension: 'microstrain', positive: true },
  { field: 'failure_mode', label: 'Failure mode', kind: 'text', required: false, dimension: 'none' },
  { field: 'test_date', label: 'Test date', kind: 'date', required: true, dimension: 'none' },
  { field: 'laboratory', label: 'Laboratory', kind: 'text', required: true, dimension: 'none' },
];

/** A row must give at least one of these (what the coupon yielded). */
export const RESULT_FIELDS: readonly string[] = ['strength', 'modulus', 'failure_strain', 'poisson_ratio'];

export type StressUnit = 'MPa' | 'ksi';
export type LengthUnit = 'mm' | 'in';
export type ForceUnit = 'N' | 'lbf';

/** Header suffixes of the template (strength_mpa, modulus_msi, width_in, failure_load_lbf). */
export const UNIT_SUFFIXES = {
  strength: { mpa: 'MPa', ksi: 'ksi' },
  modulus: { gpa: 'MPa', msi: 'ksi' },
  length: { mm: 'mm', in: 'in' },
  force: { n: 'N', lbf: 'lbf' },
} as const satisfies Record<string, Record<string, string>>;

/** The unit a column is read in for a choice: modulus follows the stress choice (GPa or Msi). */
export function columnUnitLabel(field: TemplateField, units: { stressUnit: StressUnit; lengthUnit: LengthUnit; forceUnit: ForceUnit }): string {
  switch (field.dimension) {
    case 'strength':
      return units.stressUnit;
    case 'modulus':
      return units.stressUnit === 'ksi' ? 'Msi' : 'GPa';
    case 'length':
      return units.lengthUnit;
    case 'force':
      return units.forceUnit;
    case 'microstrain':
      return 'µε';
    default:
      return '';
  }
}
