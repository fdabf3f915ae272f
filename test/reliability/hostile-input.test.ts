/**
 * Hostile input: mutated CSV files to the upload route and mutated JSON bodies
 * to the engine routes. Every reply is a success or a 4xx in the error shape
 * (never a 5xx); a rejected import leaves every row count as it was, and an
 * accepted one adds exactly the rows it reports. The seed is printed; set
 * PLYLEDGER_FUZZ_SEED to replay a run.
 */
import { expect } from 'chai';
import { couponRows, createMaterial, csvOf, importTableCounts, postJson, session, upload } from '../api/coupon-chain-helpers.ts';
import { readJson } from '../support/sign-in.ts';
import { runSeed, seededRandom } from '../support/seeded-random.ts';

const CSV_CASES = 500;
const JSON_CASES = 500;
const SQL_METACHARACTERS = `Lab'; DROP TABLE specimens; -- "quoted" \\ back\\slash %_ $1 ;`;

function mutateText(text: string, rnd: ReturnType<typeof seededRandom>): string {
  const ops = [
    () => text.slice(0, rnd.int(0, text.length)), // truncated
    () => { const i = rnd.int(0, text.length); return text.slice(0, i) + text.slice(i + rnd.int(1, 20)); }, // bytes dropped
    () => { const i = rnd.int(0, text.length); return text.slice(0, i) + rnd.pick([',', ';', '"', '\n', '\r', '\t', '\u0000', '\uFEFF', 'é', '💥', '-1e309', 'NaN', '""', "'", '\\']) + text.slice(i); },
    () => text.replace(/,/g, rnd.pick([';', '\t', '|', ',,'])), // delimiter changed
    () => { const lines = text.split('\r\n'); const i = rnd.int(1, Math.max(1, lines.length - 2)); lines.splice(i, 0, lines[i]); return lines.join('\r\n'); }, // duplicated row
    () => { const lines = text.split('\r\n'); const cols = lines[0].split(','); const a = rnd.int(0, cols.length - 1); const b = rnd.int(0, cols.length - 1); [cols[a], cols[b]] = [cols[b], cols[a]]; lines[0] = cols.join(','); return lines.join('\r\n'); }, // columns swapped in the header
    () => text.replace(/\d+(\.\d+)?/, rnd.pick(['-5', '0', '1e400', 'abc', '', '99999999999999999999'])), // a number broken
    () => '\uFEFF' + text, // byte order mark
    () => text.split('\r\n').map((l) => (rnd.next() < 0.3 ? l + ',extra' : l)).join('\r\n'), // ragged rows
    () => Buffer.from(text, 'utf8').toString('latin1'), // mis-decoded encoding
  ];
  let out = text;
  for (let k = rnd.int(1, 3); k > 0; k--) out = rnd.pick(ops)();
  return out;
}

function mutateJson(value: unknown, rnd: ReturnType<typeof seededRandom>, depth = 0): unknown {
  const junk = () => rnd.pick<unknown>([null, -1, 0, 1e308, -1e-308, '', 'x', "'; drop table users; --", true, [], {}, [1, 2], { nested: { deep: [null] } }, 'NaN', Number.MAX_SAFE_INTEGER]);
  if (Array.isArray(value)) {
    const copy = value.map((v) => (rnd.next() < 0.15 ? mutateJson(v, rnd, depth + 1) : v));
    if (rnd.next() < 0.1) copy.push(junk());
    if (rnd.next() < 0.1) copy.splice(rnd.int(0, copy.length), 1);
    return rnd.next() < 0.03 ? junk() : copy;
  }
  if (value && typeof value === 'object') {
    const copy: Record<string, unknown> = { ...(value as Record<string, unknown>) };
    for (const key of Object.keys(copy)) {
      const r = rnd.next();
      if (r < 0.12) copy[key] = depth > 3 ? junk() : mutateJson(copy[key], rnd, depth + 1);
      else if (r < 0.17) delete copy[key];
      else if (r < 0.22) copy[key] = junk();
    }
    if (rnd.next() < 0.1) copy[rnd.pick(['extra', '__proto__', 'constructor', 'plies', 'values'])] = junk();
    return copy;
  }
  return rnd.next() < 0.5 ? junk() : value;
}

/** Numbers a successful reply must carry as finite numbers (JSON turns NaN into null silently, so look). */
function expectFiniteResult(path: string, parsed: unknown, label: string) {
  const body = parsed as Record<string, unknown>;
  const finite = (v: unknown) => typeof v === 'number' && Number.isFinite(v);
  if (path.endsWith('/statistics/basis')) {
    expect(finite(body.mean) && finite(body.sd) && finite(body.n), `${label}: mean, sd, n finite`).to.equal(true);
  } else if (path.endsWith('/laminates/analyze')) {
    expect((body.ABD as number[][]).flat().every(finite), `${label}: ABD finite`).to.equal(true);
    expect((body.abd as number[][]).flat().every(finite), `${label}: abd finite`).to.equal(true);
  } else if (typeof parsed === 'string') {
    // A number field that is NaN or Infinity (names the user chose, such as an element set called NaN, are not numbers).
    expect(parsed, `${label}: no NaN or Infinity in a number field of the file`).not.to.match(/(^|[,\s])[-+]?(NaN|Infinity)(?=[,\s]|$)/m);
  }
}

function expectHandled(status: number, body: unknown, label: string) {
  expect(status, `${label}: never a 5xx`).to.be.below(500);
  if (status >= 400) expect(body, `${label}: error shape`).to.have.nested.property('error.code');
}

describe('hostile input', function () {
  this.timeout(300_000);
  const seed = runSeed();
  before(() => console.log(`      fuzz seed ${seed} (replay with PLYLEDGER_FUZZ_SEED=${seed})`));

  it(`answers ${CSV_CASES} mutated CSV files without a 5xx and without a partial import`, async () => {
    const rnd = seededRandom(seed);
    const material = await createMaterial();
    const base = csvOf(couponRows(material.code, { batches: 2, perBatch: 3 }));
    let accepted = 0;
    for (let i = 0; i < CSV_CASES; i++) {
      const before = await importTableCounts();
      // Unique specimen ids per case, so an accepted file does not make the next ones duplicates.
      const text = mutateText(base.replace(/(^|\n)(S-[A-Z0-9-]+?)-RTD/g, `$1$2-C${i}-RTD`), rnd);
      const { status, body } = await upload(text, { fileName: `fuzz-${seed}-${i}.csv` });
      expectHandled(status, body, `CSV case ${i} (seed ${seed})`);
      const after = await importTableCounts();
      if (status >= 400) {
        expect(after, `CSV case ${i} (seed ${seed}): rejected, nothing stored`).to.deep.equal(before);
      } else {
        accepted++;
        expect(after.specimens - before.specimens, `CSV case ${i}: accepted whole`).to.equal(body.rowCount ?? body.upload?.rowCount);
        expect(after.uploads - before.uploads).to.equal(1);
      }
    }
    console.log(`      ${accepted} of ${CSV_CASES} mutated files were still valid and imported whole`);
  });

  it(`answers ${JSON_CASES} mutated JSON bodies to the engine routes without a 5xx`, async () => {
    const rnd = seededRandom(seed + 1);
    const s = await session('viewer');
    const material = { E1: 135000, E2: 9000, G12: 5000, nu12: 0.3, G13: 5000, G23: 3000, density: 1600, Xt: 2000, Xc: 1200, Yt: 50, Yc: 200, S12: 80, e1t: 0.015, e1c: 0.01, e2t: 0.005, e2c: 0.02, g12: 0.03 };
    const bases: Array<[string, unknown]> = [
      ['/api/v1/statistics/basis', { values: [101, 99, 102, 98, 100, 97, 103, 100, 99, 101, 98, 100], batches: ['A', 'A', 'A', 'A', 'B', 'B', 'B', 'B', 'C', 'C', 'C', 'C'], basis: 'both' }],
      ['/api/v1/laminates/analyze', { plies: [{ material, thetaDeg: 0, thickness: 0.125 }, { material, thetaDeg: 45, thickness: 0.125 }, { material, thetaDeg: -45, thickness: 0.125 }, { material, thetaDeg: 90, thickness: 0.125 }], loads: { N: [100, 10, 5], M: [1, 0, 0], deltaT: -100 }, criteria: ['max-stress', 'tsai-wu', 'hashin', 'puck'], factorOfSafety: 1.5 }],
      ['/api/v1/laminates/envelope', { code: '[0/±45/90]s', material, plyThickness: 0.125, criterion: 'tsai-wu', plane: 'Nx-Ny', points: 36 }],
      ['/api/v1/sections/calculix', { laminate: { code: '[0/90]s', material, plyThickness: 0.2 }, options: { units: 'N-mm-t', elset: 'SKIN' } }],
    ];
    const statuses: Record<number, number> = {};
    for (let i = 0; i < JSON_CASES; i++) {
      const [path, base] = bases[i % bases.length];
      const body = mutateJson(base, rnd);
      const res = await s.api(path, { method: 'POST', json: body });
      const text = await res.text();
      statuses[res.status] = (statuses[res.status] ?? 0) + 1;
      const parsed = res.headers.get('content-type')?.includes('json') ? JSON.parse(text) : text;
      expectHandled(res.status, parsed, `JSON case ${i} to ${path} (seed ${seed})`);
      if (res.status < 400) expectFiniteResult(path, parsed, `JSON case ${i} to ${path} (seed ${seed}) with ${JSON.stringify(body).slice(0, 600)}`);
    }
    console.log(`      statuses: ${JSON.stringify(statuses)}`);
  });

  it('stores and returns SQL metacharacters in text fields verbatim', async () => {
    const material = await createMaterial({ name: SQL_METACHARACTERS, notes: SQL_METACHARACTERS, specificationRef: SQL_METACHARACTERS });
    const read = await readJson(await (await session('viewer')).api(`/api/v1/materials/${material.id}`));
    expect(read.name).to.equal(SQL_METACHARACTERS);
    expect(read.notes).to.equal(SQL_METACHARACTERS);
    const rows = couponRows(material.code, { batches: 1, perBatch: 2 }).map((r) => ({ ...r, laboratory: SQL_METACHARACTERS }));
    const { status, body } = await upload(csvOf(rows));
    expect(status, JSON.stringify(body)).to.equal(201);
    const list = await readJson(await (await session('viewer')).api(`/api/v1/specimens?material=${material.id}`));
    expect(list.items.map((s: { laboratory: string }) => s.laboratory)).to.deep.equal([SQL_METACHARACTERS, SQL_METACHARACTERS]);
  });

  it('refuses a CSV with a NUL byte in a cell, naming the row, and stores nothing (found by this fuzz test)', async () => {
    const material = await createMaterial();
    const lines = csvOf(couponRows(material.code, { batches: 1, perBatch: 3 })).split('\r\n');
    lines[2] = lines[2].replace('Test laboratory', 'Test\u0000laboratory');
    const before = await importTableCounts();
    const { status, body } = await upload(lines.join('\r\n'));
    expect(status).to.equal(400);
    expect(body.error.details.problems[0]).to.include({ row: 3, code: 'nul_byte' });
    expect(await importTableCounts()).to.deep.equal(before);
  });

  it('refuses an oversize JSON body with 413 before reading it whole', async () => {
    const s = await session('viewer');
    const huge = JSON.stringify({ values: new Array(400_000).fill(123.456), batches: [] });
    const res = await s.api('/api/v1/statistics/basis', { method: 'POST', body: huge, headers: { 'content-type': 'application/json' } });
    expect(res.status).to.equal(413);
    expect((await readJson(res)).error.code).to.equal('too_large');
  });

  it('refuses a mutating catalogue request with SQL in a number field, naming the field', async () => {
    const { status, body } = await postJson('materials', '/api/v1/materials', { code: 'SQL-X', name: 'x', form: 'unidirectional-tape', fibre: 'c', resin: 'e', nominalCuredPlyThicknessMm: '0.2; drop table users' });
    expect(status).to.equal(400);
    expect(JSON.stringify(body)).to.match(/nominalCuredPlyThicknessMm/);
  });
});
