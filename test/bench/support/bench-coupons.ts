/**
 * Invented coupon rows for the import bench, in two forms from one generator:
 *  - the CSV file a laboratory would upload (the SI template's headers and
 *    units: modulus in GPa, failure strain in microstrain);
 *  - the same coupons as the upload route stores them (internal units, ids
 *    instead of codes), as CSV for `psql \copy` into the specimens table.
 * Values are converted with the import's own factors (toInternalFactor of the
 * template field's dimension), so both forms store identical numbers.
 */
import { TEMPLATE_FIELDS, templateHeader } from '../../../api/src/coupons/csv-template.ts';
import { SI_UNITS, toInternalFactor } from '../../../api/src/coupons/csv-units.ts';
import { csvCell } from '../../../api/src/shared/csv-cell.ts';

/** (test method, property) pairs the reference lists have (api/src/materials/vocabulary.ts). */
export const BENCH_TESTS = [
  { testMethod: 'ASTM D3039', property: 'tension-0' },
  { testMethod: 'ASTM D3039', property: 'tension-90' },
  { testMethod: 'ASTM D6641', property: 'compression-0' },
  { testMethod: 'ASTM D3518', property: 'in-plane-shear' },
  { testMethod: 'ASTM D2344', property: 'short-beam-shear' },
] as const;
export const BENCH_CONDITIONS = ['CTD', 'RTD', 'ETD', 'ETW'] as const;

export interface CouponFileSpec {
  materialCode: string;
  /** Specimen ids are `<prefix>-000001`...; one prefix per file keeps them unique. */
  prefix: string;
  rows: number;
  batches: number;
  panelsPerBatch: number;
}

const DAY_MS = 86_400_000;
const FIRST_TEST_DAY = Date.UTC(2025, 0, 6);

/** Coupon i of a file, by template field, as the file's cells (SI template units). */
function couponCells(spec: CouponFileSpec, i: number): Record<string, string> {
  const test = BENCH_TESTS[i % BENCH_TESTS.length];
  return {
    specimen_id: `${spec.prefix}-${String(i + 1).padStart(6, '0')}`,
    material: spec.materialCode,
    batch: `B${1 + (i % spec.batches)}`,
    panel: `P${1 + (Math.floor(i / spec.batches) % spec.panelsPerBatch)}`,
    test_method: test.testMethod,
    property: test.property,
    condition: BENCH_CONDITIONS[Math.floor(i / BENCH_TESTS.length) % BENCH_CONDITIONS.length],
    width: i % 2 ? '25.0' : '12.7',
    thickness: (1 + (i % 40) / 1000).toFixed(3),
    ply_count: '8',
    failure_load: String(20_000 + ((i * 7919) % 10_000)),
    strength: (600 + ((i * 104_729) % 4000) / 10).toFixed(1),
    modulus: (130 + (i % 50) / 10).toFixed(1),
    poisson_ratio: '0.31',
    failure_strain: String(14_000 + ((i * 31) % 3000)),
    failure_mode: 'LGM',
    test_date: new Date(FIRST_TEST_DAY + (i % 365) * DAY_MS).toISOString().slice(0, 10),
    laboratory: 'Bench laboratory (invented)',
  };
}

/** The upload file: header line in the SI template spelling, then one line per coupon. */
export function couponCsv(spec: CouponFileSpec): Buffer {
  const lines = [TEMPLATE_FIELDS.map((f) => templateHeader(f, SI_UNITS)).join(',')];
  for (let i = 0; i < spec.rows; i++) {
    const cells = couponCells(spec, i);
    lines.push(TEMPLATE_FIELDS.map((f) => csvCell(cells[f.field])).join(','));
  }
  return Buffer.from(lines.join('\r\n') + '\r\n', 'utf8');
}

/** Ids the stored rows refer to, read from the bench database after the catalogue is registered. */
export interface StoredCatalogue {
  materialId: number;
  /** batch code -> id */
  batchIds: Map<string, number>;
  /** `${batchCode}|${panelCode}` -> id */
  panelIds: Map<string, number>;
  /** test method code -> id */
  testMethodIds: Map<string, number>;
  /** condition code -> id */
  conditionIds: Map<string, number>;
}

/** Columns of specimens that an import fills (the rest take their defaults), in the order of storedCouponCsv. */
export const STORED_COLUMNS = [
  'specimen_code', 'material_id', 'batch_id', 'panel_id', 'test_method_id', 'property_code', 'condition_id', 'width_mm', 'thickness_mm', 'ply_count',
  'failure_load_n', 'strength_mpa', 'modulus_mpa', 'poisson_ratio', 'failure_strain', 'failure_mode', 'test_date', 'laboratory', 'upload_row', 'upload_id',
] as const;

const FACTOR = Object.fromEntries(TEMPLATE_FIELDS.map((f) => [f.field, toInternalFactor(f.dimension, SI_UNITS)]));
const internal = (cells: Record<string, string>, field: string) => String(Number(cells[field]) * FACTOR[field]);

function lookUp<K, V>(map: Map<K, V>, key: K, what: string): V {
  const value = map.get(key);
  if (value === undefined) throw new Error(`bench catalogue has no ${what} ${String(key)}`);
  return value;
}

/** The same coupons as the route would store them, as CSV rows in STORED_COLUMNS order (no header). */
export function storedCouponCsv(spec: CouponFileSpec, catalogue: StoredCatalogue, uploadId: number): Buffer {
  const lines: string[] = [];
  for (let i = 0; i < spec.rows; i++) {
    const c = couponCells(spec, i);
    lines.push([
      c.specimen_id, catalogue.materialId, lookUp(catalogue.batchIds, c.batch, 'batch'), lookUp(catalogue.panelIds, `${c.batch}|${c.panel}`, 'panel'),
      lookUp(catalogue.testMethodIds, c.test_method, 'test method'), c.property, lookUp(catalogue.conditionIds, c.condition, 'condition'),
      internal(c, 'width'), internal(c, 'thickness'), c.ply_count, internal(c, 'failure_load'), internal(c, 'strength'), internal(c, 'modulus'),
      internal(c, 'poisson_ratio'), internal(c, 'failure_strain'), c.failure_mode, c.test_date, c.laboratory,
      i + 2, // the spreadsheet row: the header is row 1
      uploadId,
    ].map((v) => csvCell(v)).join(','));
  }
  return Buffer.from(lines.join('\n') + '\n', 'utf8');
}
