/**
 * Helpers of the coupon -> analysis -> allowable API suites: cached sign-ins,
 * a material of one's own per suite (so suites never share data groups),
 * CSV files in the upload template, the upload request, and row counts.
 */
import { TEMPLATE_FIELDS, templateHeader } from '../../api/src/coupons/csv-template.ts';
import { csvCell } from '../../api/src/shared/csv-cell.ts';
import { readJson, signIn, type SignedIn } from '../support/sign-in.ts';
import { apiUrl, testDb } from '../support/stack.ts';

const sessions = new Map<string, Promise<SignedIn>>();

/** One signed-in session per demo login, reused across the suites. */
export function session(login: string): Promise<SignedIn> {
  if (!sessions.has(login)) sessions.set(login, signIn(apiUrl(), login));
  return sessions.get(login)!;
}

let counter = 0;
/** A code unique in this run (materials and specimen ids of one suite never meet another's). */
export function uniqueCode(prefix: string): string {
  counter += 1;
  return `${prefix}-${Date.now().toString(36)}-${counter}`.toUpperCase();
}

export async function createMaterial(fields: Record<string, unknown> = {}) {
  const s = await session('materials');
  const res = await s.api('/api/v1/materials', {
    method: 'POST',
    json: { code: uniqueCode('TM'), name: 'Test tape', form: 'unidirectional-tape', fibre: 'carbon', resin: 'epoxy', nominalCuredPlyThicknessMm: 0.25, ...fields },
  });
  if (res.status !== 201) throw new Error(`material not created: ${res.status} ${await res.text()}`);
  return readJson(res);
}

export type CouponRow = Record<string, string | number>;

/** Coupon rows of one data group: `perBatch` coupons in each batch, strengths spread deterministically. */
export function couponRows(material: string, options: { prefix?: string; batches?: number; perBatch?: number; property?: string; testMethod?: string; condition?: string; strength?: number; plies?: number; thickness?: number } = {}): CouponRow[] {
  const { batches = 3, perBatch = 6, property = 'tension-0', testMethod = 'ASTM D3039', condition = 'RTD', strength = 2000, plies = 8, thickness = 2.0 } = options;
  const prefix = options.prefix ?? uniqueCode('S');
  const rows: CouponRow[] = [];
  for (let b = 0; b < batches; b++) {
    for (let i = 0; i < perBatch; i++) {
      // a fixed, irregular pattern: about 3 % CV, batch means a little apart
      const wobble = [0.012, -0.031, 0.024, -0.008, 0.037, -0.022, 0.005, -0.041, 0.029, -0.015][(b * perBatch + i) % 10];
      rows.push({
        specimen_id: `${prefix}-${condition}-${b + 1}-${i + 1}`, material, batch: `B${b + 1}`, panel: `P${b + 1}`, test_method: testMethod, property, condition,
        width_mm: 15, thickness_mm: Number((thickness * (1 + wobble / 3)).toFixed(3)), ply_count: plies, failure_load_n: '',
        strength_mpa: Number((strength * (1 + wobble + 0.01 * b)).toFixed(1)), modulus_gpa: 130 + b, poisson_ratio: 0.3, failure_strain_microstrain: 15000 + 100 * i,
        failure_mode: 'LGM', test_date: '2026-03-0' + (1 + (i % 9)), laboratory: 'Test laboratory',
      });
    }
  }
  return rows;
}

/** CSV text in the SI template layout (or with the given header). */
export function csvOf(rows: CouponRow[], header = TEMPLATE_FIELDS.map((f) => templateHeader(f))): string {
  return [header.join(','), ...rows.map((r) => header.map((h) => csvCell(r[h])).join(','))].join('\r\n') + '\r\n';
}

export async function upload(content: string | Buffer, options: { login?: string; fileName?: string; fields?: Record<string, string> } = {}) {
  const s = await session(options.login ?? 'materials');
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(typeof content === 'string' ? Buffer.from(content, 'utf8') : content)], { type: 'text/csv' }), options.fileName ?? 'coupons.csv');
  for (const [k, v] of Object.entries(options.fields ?? {})) form.append(k, v);
  const res = await s.api('/api/v1/uploads', { method: 'POST', body: form });
  return { status: res.status, body: await readJson(res) };
}

/** Rows of the tables an import writes to. */
export async function importTableCounts() {
  const db = testDb();
  const count = async (table: string) => Number((await db(table).count('* as n').first())!.n);
  return { specimens: await count('specimens'), uploads: await count('uploads'), uploadChunks: await count('upload_chunks'), batches: await count('batches'), panels: await count('panels') };
}

export async function postJson(login: string, path: string, json: unknown, method = 'POST') {
  const s = await session(login);
  const res = await s.api(path, { method, json });
  return { status: res.status, body: res.status === 204 ? null : await readJson(res) };
}

export async function getJson(login: string, path: string) {
  const s = await session(login);
  const res = await s.api(path);
  return { status: res.status, body: await readJson(res) };
}
