/**
 * The coupon upload template: Plyledger's own column names, what each holds,
 * and the template file people download. A file's columns are matched to the
 * template fields by the client's column mapping, or else by these names
 * (SI or US spelling, or the bare field name).
 */
import { csvCell } from '../shared/csv-cell.ts';
import { SI_UNITS, UNIT_SUFFIX, type ColumnDimension, type UploadUnits } from './csv-units.ts';

export type FieldKind = 'text' | 'number' | 'integer' | 'date';

export interface TemplateField {
  /** The field name (the key of the client's column mapping). */
  field: string;
  kind: FieldKind;
  required: boolean;
  dimension: ColumnDimension;
  description: string;
  /** For a number: must the value be greater than zero? */
  positive?: boolean;
  maxLength?: number;
  example: string;
}

export const TEMPLATE_FIELDS: readonly TemplateField[] = [
  { field: 'specimen_id', kind: 'text', required: true, dimension: 'none', maxLength: 80, description: 'the laboratory specimen id, unique across all uploads', example: 'FR-UC300-RTD-T0-001' },
  { field: 'material', kind: 'text', required: true, dimension: 'none', description: 'material system code, as in the catalogue', example: 'FR-UC300' },
  { field: 'batch', kind: 'text', required: true, dimension: 'none', maxLength: 60, description: 'batch (lot) code; registered with the upload when new', example: 'B1' },
  { field: 'panel', kind: 'text', required: false, dimension: 'none', maxLength: 60, description: 'panel code within the batch; registered when new', example: 'P1' },
  { field: 'test_method', kind: 'text', required: true, dimension: 'none', description: 'test method code, e.g. ASTM D3039', example: 'ASTM D3039' },
  { field: 'property', kind: 'text', required: true, dimension: 'none', description: 'test property the coupon was loaded for, e.g. tension-0', example: 'tension-0' },
  { field: 'condition', kind: 'text', required: true, dimension: 'none', description: 'environmental condition code, e.g. RTD', example: 'RTD' },
  { field: 'width', kind: 'number', required: true, positive: true, dimension: 'length', description: 'specimen width', example: '12.7' },
  { field: 'thickness', kind: 'number', required: true, positive: true, dimension: 'length', description: 'measured specimen thickness', example: '1.52' },
  { field: 'ply_count', kind: 'integer', required: true, positive: true, dimension: 'none', description: 'number of plies', example: '8' },
  { field: 'failure_load', kind: 'number', required: false, positive: true, dimension: 'force', description: 'maximum load', example: '45300' },
  { field: 'strength', kind: 'number', required: false, positive: true, dimension: 'strength', description: 'strength', example: '2350' },
  { field: 'modulus', kind: 'number', required: false, positive: true, dimension: 'modulus', description: 'chord modulus (GPa or Msi)', example: '138.5' },
  { field: 'poisson_ratio', kind: 'number', required: false, dimension: 'none', description: "Poisson's ratio nu12, where measured", example: '0.31' },
  { field: 'failure_strain', kind: 'number', required: false, positive: true, dimension: 'microstrain', description: 'strain at failure in microstrain, where measured', example: '16200' },
  { field: 'failure_mode', kind: 'text', required: false, dimension: 'none', maxLength: 16, description: 'failure mode code of the test standard', example: 'LGM' },
  { field: 'test_date', kind: 'date', required: true, dimension: 'none', description: 'YYYY-MM-DD', example: '2026-03-14' },
  { field: 'laboratory', kind: 'text', required: true, dimension: 'none', maxLength: 200, description: 'laboratory that tested the coupon', example: 'Materials laboratory, site A' },
];

/** Fields of which a row must give at least one: what the coupon yielded. */
export const RESULT_FIELDS = ['strength', 'modulus', 'failure_strain', 'poisson_ratio'] as const;

/** The header a field has in the template for a choice of units (e.g. width_mm, strength_ksi). */
export function templateHeader(field: TemplateField, units: UploadUnits = SI_UNITS): string {
  if (field.dimension === 'microstrain') return `${field.field}_microstrain`;
  if (field.dimension === 'none') return field.field;
  const unitKey = field.dimension === 'length' ? units.length : field.dimension === 'force' ? units.force : units.stress;
  return `${field.field}_${UNIT_SUFFIX[field.dimension][unitKey]}`;
}

/** Every header the field is recognised under without a mapping: bare name and each unit spelling. */
export function knownHeaders(field: TemplateField): string[] {
  if (field.dimension === 'none') return [field.field];
  if (field.dimension === 'microstrain') return [`${field.field}_microstrain`, field.field];
  return [field.field, ...Object.values(UNIT_SUFFIX[field.dimension]).map((suffix) => `${field.field}_${suffix}`)];
}

/** The unit a header's suffix states, if any (e.g. strength_ksi -> ksi). */
export function unitStatedBy(field: TemplateField, header: string): string | undefined {
  if (field.dimension === 'none' || field.dimension === 'microstrain') return undefined;
  const suffix = header.toLowerCase().slice(field.field.length + 1);
  if (!header.toLowerCase().startsWith(`${field.field}_`)) return undefined;
  return Object.entries(UNIT_SUFFIX[field.dimension]).find(([, s]) => s === suffix)?.[0];
}

/** The downloadable template: header and one example row. */
export function templateCsv(units: UploadUnits): string {
  const header = TEMPLATE_FIELDS.map((f) => templateHeader(f, units));
  const example = TEMPLATE_FIELDS.map((f) => {
    if (units.length === 'in' && f.dimension === 'length') return f.field === 'width' ? '0.500' : '0.060';
    if (units.force === 'lbf' && f.dimension === 'force') return '10180';
    if (units.stress === 'ksi' && f.dimension === 'strength') return '340.8';
    if (units.stress === 'ksi' && f.dimension === 'modulus') return '20.09';
    return f.example;
  });
  return `${header.map(csvCell).join(',')}\r\n${example.map(csvCell).join(',')}\r\n`;
}
