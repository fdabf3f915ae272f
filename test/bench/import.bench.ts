/**
 * CSV import (issue 8, section 3): 100,000 coupon rows through the real upload
 * route, POST /api/v1/uploads (multipart to a temporary file, papaparse in
 * chunks, every cell validated and converted, catalogue lookups, batches of
 * unnested inserts in one transaction, the file stored in 1 MiB pieces with
 * its SHA-256, the audit row), against `psql \copy` of the same coupons, as
 * the route stores them, into the same table with the same columns. Also the
 * peak resident memory of the API process (its own node process; VmHWM from
 * /proc, reset before each import).
 *
 * Runs alternate (\copy, import, \copy, import, ...) so both meet the table at
 * about the same size; each run has its own specimen ids. One warm-up of each
 * (10,000 rows) first: it registers the file's batches and panels, so the timed
 * imports find them in the catalogue, as a laboratory's later files do.
 */
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { readJson, type SignedIn } from '../support/sign-in.ts';
import { type BenchSection } from './bench-types.ts';
import { couponCsv, STORED_COLUMNS, storedCouponCsv, type CouponFileSpec, type StoredCatalogue } from './support/bench-coupons.ts';
import { startBenchStack, type BenchStack } from './support/bench-stack.ts';
import { median } from './support/load.ts';
import { readProcessMemory, watchPeakMemory } from './support/process-memory.ts';
import { copyCsvInto } from './support/psql.ts';

const ROWS = 100_000;
const WARMUP_ROWS = 10_000;
const RUNS = 3;
const BATCHES = 10;
const PANELS_PER_BATCH = 10;
const TARGET_RATIO = 3;
const TARGET_PEAK_MB = 500;
const MATERIAL_CODE = 'BENCH-IMPORT-T300';

const spec = (prefix: string, rows = ROWS): CouponFileSpec => ({ materialCode: MATERIAL_CODE, prefix, rows, batches: BATCHES, panelsPerBatch: PANELS_PER_BATCH });

async function createMaterial(s: SignedIn): Promise<number> {
  const res = await s.api('/api/v1/materials', {
    method: 'POST',
    json: { code: MATERIAL_CODE, name: 'Bench carbon/epoxy tape (invented)', form: 'unidirectional-tape', fibre: 'carbon', resin: 'epoxy', nominalCuredPlyThicknessMm: 0.125 },
  });
  if (res.status !== 201) throw new Error(`bench material not created: ${res.status} ${await res.text()}`);
  return (await readJson(res)).id;
}

interface ImportRun {
  ms: number;
  peakMB: number;
  polledPeakMB: number;
  idleMB: number;
  hwmWasReset: boolean;
  uploadedById: number;
}

/** One upload through the route, with the API process's peak memory while it runs. */
async function importThroughRoute(stack: BenchStack, s: SignedIn, file: Buffer, fileName: string, rows: number): Promise<ImportRun> {
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(file)], { type: 'text/csv' }), fileName);
  const idleMB = readProcessMemory(stack.apiPid).rssMB;
  const watch = watchPeakMemory(stack.apiPid);
  const started = performance.now();
  const res = await s.api('/api/v1/uploads', { method: 'POST', body: form });
  const body = await readJson(res);
  const ms = performance.now() - started;
  const memory = watch.stop();
  if (res.status !== 201 || body.upload?.rowCount !== rows) throw new Error(`import of ${fileName} answered ${res.status}: ${JSON.stringify(body).slice(0, 500)}`);
  return { ms, idleMB, ...memory, uploadedById: body.upload.uploadedBy.id };
}

async function storedCatalogue(stack: BenchStack, materialId: number): Promise<StoredCatalogue> {
  const { db } = stack;
  const batches: Array<{ id: number; code: string }> = await db('batches').where({ material_id: materialId }).select('id', 'code');
  const panels: Array<{ id: number; code: string; batch_code: string }> = await db('panels')
    .join('batches', 'batches.id', 'panels.batch_id')
    .where('batches.material_id', materialId)
    .select('panels.id', 'panels.code', 'batches.code as batch_code');
  const methods: Array<{ id: number; code: string }> = await db('test_methods').select('id', 'code');
  const conditions: Array<{ id: number; code: string }> = await db('conditions').select('id', 'code');
  return {
    materialId,
    batchIds: new Map(batches.map((b) => [b.code, b.id])),
    panelIds: new Map(panels.map((p) => [`${p.batch_code}|${p.code}`, p.id])),
    testMethodIds: new Map(methods.map((m) => [m.code, m.id])),
    conditionIds: new Map(conditions.map((c) => [c.code, c.id])),
  };
}

/** The upload row the copied coupons point at (upload_id is required); written before any timing. */
async function referenceUpload(stack: BenchStack, uploadedById: number): Promise<number> {
  const content = Buffer.from('coupons loaded by psql \\copy for the import bench (invented)');
  return stack.db.transaction(async (trx) => {
    const [row] = await trx('uploads')
      .insert({
        file_name: 'bench-copy-reference.csv', sha256: createHash('sha256').update(content).digest('hex'), size_bytes: content.length, row_count: 1,
        column_mapping: '{}', units: '{}', created_catalogue: '{}', invented: true, uploaded_by: uploadedById, uploaded_by_name: 'bench',
      })
      .returning('id');
    // the stored file, one piece (the upload's size is checked against its pieces at commit)
    await trx('upload_chunks').insert({ upload_id: row.id, seq: 0, bytes: content });
    return row.id as number;
  });
}

async function copyRows(stack: BenchStack, dir: string, file: Buffer, name: string, rows: number) {
  const target = path.join(dir, name);
  writeFileSync(target, file);
  const copied = await copyCsvInto(stack.database, 'specimens', STORED_COLUMNS, target);
  rmSync(target);
  if (copied.rows !== rows) throw new Error(`\\copy of ${name} reported ${copied.rows} rows, expected ${rows}`);
  return copied.ms;
}

/** The reference must load the same rows: a few coupons stored by \copy and by the route, compared column by column. */
async function checkSameRows(stack: BenchStack, copyPrefix: string, uploadPrefix: string) {
  const compared = STORED_COLUMNS.filter((c) => c !== 'specimen_code' && c !== 'upload_id');
  for (const n of [1, 2, 777, 54_321, ROWS]) {
    const code = (prefix: string) => `${prefix}-${String(n).padStart(6, '0')}`;
    const [copied, imported] = await Promise.all([code(copyPrefix), code(uploadPrefix)].map((c) => stack.db('specimens').where({ specimen_code: c }).first(compared)));
    if (!copied || !imported || JSON.stringify(copied) !== JSON.stringify(imported)) {
      throw new Error(`coupon ${n} differs between \\copy and the route: ${JSON.stringify(copied)} vs ${JSON.stringify(imported)}`);
    }
  }
}

export async function run(): Promise<BenchSection> {
  const load = os.loadavg();
  const stack = await startBenchStack();
  const dir = mkdtempSync(path.join(os.tmpdir(), 'plyledger-bench-import-'));
  try {
    const s = await stack.session('materials');
    const materialId = await createMaterial(s);
    const warm = await importThroughRoute(stack, s, couponCsv(spec('WARM-U', WARMUP_ROWS)), 'bench-warm-up.csv', WARMUP_ROWS);
    const catalogue = await storedCatalogue(stack, materialId);
    const uploadId = await referenceUpload(stack, warm.uploadedById);
    await copyRows(stack, dir, storedCouponCsv(spec('WARM-C', WARMUP_ROWS), catalogue, uploadId), 'warm-up.csv', WARMUP_ROWS);

    const { rows: indexRows } = await stack.db.raw("select count(*)::int as n from pg_indexes where tablename = 'specimens'");
    const secondaryIndexes = indexRows[0].n - 2; // less the primary key and the unique specimen id
    const imports: ImportRun[] = [];
    const copies: number[] = [];
    let fileBytes = 0;
    for (let k = 1; k <= RUNS; k++) {
      copies.push(await copyRows(stack, dir, storedCouponCsv(spec(`COPY${k}`), catalogue, uploadId), `copy-${k}.csv`, ROWS));
      const file = couponCsv(spec(`UPLOAD${k}`));
      fileBytes = file.length;
      imports.push(await importThroughRoute(stack, s, file, `bench-coupons-${k}.csv`, ROWS));
    }
    await checkSameRows(stack, 'COPY1', 'UPLOAD1');
    const importS = median(imports.map((r) => r.ms)) / 1000;
    const copyS = median(copies) / 1000;
    const peakMB = median(imports.map((r) => r.peakMB));
    const idleMB = median(imports.map((r) => r.idleMB));
    const ratio = importS / copyS;
    return {
      name: 'CSV import (POST /api/v1/uploads, API in its own process)',
      figures: [
        {
          figure: `import of ${ROWS.toLocaleString('en')} coupon rows (parse, validate, insert in one transaction)`,
          median: importS, unit: 's', runs: RUNS,
          reference: { label: 'psql \\copy of the same rows into specimens', median: copyS, unit: 's' },
          ratio, target: `within ${TARGET_RATIO}x of \\copy`, met: ratio <= TARGET_RATIO,
        },
        {
          figure: 'import rate',
          median: ROWS / importS, unit: 'rows/s', runs: RUNS,
          reference: { label: '\\copy rate', median: ROWS / copyS, unit: 'rows/s' },
          ratio: copyS / importS,
        },
        {
          figure: 'peak resident memory of the API process during the import (VmHWM)',
          median: peakMB, unit: 'MB', runs: RUNS,
          reference: { label: 'its resident memory just before', median: idleMB, unit: 'MB' },
          ratio: peakMB / idleMB, target: `< ${TARGET_PEAK_MB} MB`, met: peakMB < TARGET_PEAK_MB,
        },
      ],
      notes: [
        `file: ${(fileBytes / 1e6).toFixed(1)} MB of CSV in the SI template layout, ${BATCHES} batches x ${PANELS_PER_BATCH} panels registered by the warm-up import, 5 test method/property pairs, 4 conditions; invented values`,
        `runs (import s / \\copy s): ${imports.map((r, i) => `${(r.ms / 1000).toFixed(2)}/${(copies[i] / 1000).toFixed(2)}`).join(', ')}; peaks ${imports.map((r) => r.peakMB.toFixed(0)).join(', ')} MB (largest VmRSS polled every 20 ms: ${imports.map((r) => r.polledPeakMB.toFixed(0)).join(', ')} MB${imports.every((r) => r.hwmWasReset) ? '' : '; VmHWM could not be reset, the polled peak is used'})`,
        'what \\copy skips that the route does: HTTP and the multipart body; UTF-8, delimiter and header checks; the column mapping and unit conversion (its rows carry internal units already); per-cell validation with row/column/fix problems (COPY only has the table CHECK constraints, which the route\'s inserts meet as well); looking codes up in the catalogue (material, test method, condition, batch, panel: \\copy is given the ids; the foreign keys are checked by PostgreSQL in both); the duplicate-in-file map; writing the file to a temporary file, reading it back (checks with SHA-256, rows, stored copy), storing it as bytea pieces and the upload row; the audit row',
        'the rows \\copy loads are the route\'s rows: five coupons of the first runs compared column by column (every column but id, specimen id, upload and time) before the figures are reported',
        `what both do: every row through the same unique, primary-key and ${secondaryIndexes} secondary indexes, the composite foreign-key checks and CHECK constraints; the route in batches of 2,000 rows (insert ... select from unnest), \\copy as one COPY stream; both in one transaction`,
        'the route streams the file: multer writes it to a temporary file, and the import reads that three times in chunks (checks and SHA-256 before the transaction; the rows, parsed chunk by chunk; the stored copy, as 1 MiB pieces in upload_chunks, in the same transaction), so its memory is bounded by a read chunk, a parsed chunk of rows, an insert batch of 2,000 coupons and one stored piece, not by the file',
        `\\copy time includes starting psql and its connection (a few ms); the import time is from sending the request to the parsed 201 answer; one-minute load average at the start ${load[0].toFixed(2)}, at the end ${os.loadavg()[0].toFixed(2)}, on ${os.cpus().length} cores shared with other people's test stacks`,
      ],
    };
  } finally {
    rmSync(dir, { recursive: true, force: true });
    await stack.stop();
  }
}
