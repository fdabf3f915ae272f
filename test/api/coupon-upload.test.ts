/**
 * CSV upload of coupon results against the real stack: the template, a good
 * file in SI and in US units, column mapping, and every bad file of the
 * acceptance list, each with its own error and the tables left as they were.
 */
import { expect } from 'chai';
import Papa from 'papaparse';
import { TEMPLATE_FIELDS, templateHeader } from '../../api/src/coupons/csv-template.ts';
import { MAX_UPLOAD_BYTES, MAX_UPLOAD_ROWS } from '../../api/src/coupons/import.service.ts';
import { readJson } from '../support/sign-in.ts';
import { testDb } from '../support/stack.ts';
import { couponRows, createMaterial, csvOf, getJson, importTableCounts, session, upload, uniqueCode, type CouponRow } from './coupon-chain-helpers.ts';

const SI_HEADER = TEMPLATE_FIELDS.map((f) => templateHeader(f));

describe('coupon upload: template and good files', function () {
  let material: { id: number; code: string };
  before(async () => {
    material = await createMaterial();
  });

  it('serves the template in SI and US spelling, parseable by papaparse', async () => {
    const s = await session('designer');
    const si = await s.api('/api/v1/uploads/template.csv');
    expect(si.status).to.equal(200);
    expect(si.headers.get('content-type')).to.match(/text\/csv/);
    const parsed = Papa.parse<string[]>((await si.text()).trim());
    expect(parsed.data[0]).to.deep.equal(SI_HEADER);
    expect(parsed.data[0]).to.include.members(['specimen_id', 'width_mm', 'failure_load_n', 'strength_mpa', 'modulus_gpa']);
    expect(parsed.data).to.have.length(2);
    const us = await (await s.api('/api/v1/uploads/template.csv?units=US')).text();
    expect(us.split('\r\n')[0]).to.include('width_in').and.include('failure_load_lbf').and.include('strength_ksi').and.include('modulus_msi');
  });

  it('imports a good file in one transaction with its checksum, size, row count, registering new batches and panels', async () => {
    const before = await importTableCounts();
    const rows = couponRows(material.code, { batches: 3, perBatch: 4 });
    const csv = csvOf(rows);
    const { status, body } = await upload(csv, { fileName: 'good-résultats.csv' });
    expect(status, JSON.stringify(body)).to.equal(201);
    expect(body.upload.rowCount).to.equal(12);
    expect(body.upload.fileName).to.equal('good-résultats.csv');
    expect(body.upload.sha256).to.match(/^[0-9a-f]{64}$/);
    expect(body.upload.sizeBytes).to.equal(Buffer.byteLength(csv));
    expect(body.upload.createdBatches).to.have.length(3);
    const after = await importTableCounts();
    expect(after.specimens - before.specimens).to.equal(12);
    expect(after.uploads - before.uploads).to.equal(1);
    expect(after.uploadChunks - before.uploadChunks, 'a small file is one stored piece').to.equal(1);
    expect(after.batches - before.batches).to.equal(3);
    expect(after.panels - before.panels).to.equal(3);
    const stored = await testDb()('specimens').where({ upload_id: body.upload.id }).orderBy('upload_row').first();
    expect(stored.upload_row).to.equal(2);
    expect(stored.modulus_mpa).to.equal(130_000); // 130 GPa in the file -> MPa inside
    expect(stored.failure_strain).to.be.closeTo(0.015, 1e-12); // 15 000 microstrain
    const file = await (await session('designer')).api(`/api/v1/uploads/${body.upload.id}/file`);
    expect(await file.text(), 'the stored file is the file sent').to.equal(csv);
    const audit = await testDb()('audit_log').where({ action: 'upload.imported', entity_id: String(body.upload.id) }).first();
    expect(audit.details.rowCount).to.equal(12);
  });

  it('reads US units (in, lbf, ksi, Msi) by the form fields and converts them to mm, N, MPa (NIST SP 811 factors)', async () => {
    const usHeader = TEMPLATE_FIELDS.map((f) => templateHeader(f, { stress: 'ksi', length: 'in', force: 'lbf' }));
    const row = { ...couponRows(material.code, { batches: 1, perBatch: 1 })[0], width_in: 0.5, thickness_in: 0.08, failure_load_lbf: 10000, strength_ksi: 300, modulus_msi: 20 };
    const { status, body } = await upload(csvOf([row], usHeader), { fields: { stressUnit: 'ksi', lengthUnit: 'in', forceUnit: 'lbf' } });
    expect(status, JSON.stringify(body)).to.equal(201);
    const stored = await testDb()('specimens').where({ upload_id: body.upload.id }).first();
    // 1 in = 25.4 mm exactly; 1 lbf = 4.448 221 615 N; 1 ksi = 6.894 757 MPa (NIST SP 811, Appendix B)
    expect(stored.width_mm).to.be.closeTo(12.7, 1e-9);
    expect(stored.thickness_mm).to.be.closeTo(2.032, 1e-9);
    expect(stored.failure_load_n).to.be.closeTo(44482.21615, 1e-4);
    expect(stored.strength_mpa).to.be.closeTo(2068.427, 1e-3);
    expect(stored.modulus_mpa).to.be.closeTo(137895.1, 0.1);
    expect(body.upload.units).to.include({ width: 'in', strength: 'ksi', modulus: 'Msi', failure_load: 'lbf' });
  });

  it('applies the client column mapping to a file with its own headers', async () => {
    const rows = couponRows(material.code, { batches: 1, perBatch: 2 });
    const own: Record<string, string> = { specimen_id: 'Specimen', strength: 'Fmax over A', test_method: 'Standard' };
    const header = SI_HEADER.map((h) => (h === 'specimen_id' ? 'Specimen' : h === 'strength_mpa' ? 'Fmax over A' : h === 'test_method' ? 'Standard' : h));
    const renamed = rows.map((r) => ({ ...r, Specimen: r.specimen_id, 'Fmax over A': r.strength_mpa, Standard: r.test_method })) as CouponRow[];
    const { status, body } = await upload(csvOf(renamed, [...header, 'operator']), { fields: { columns: JSON.stringify(own) } });
    expect(status, JSON.stringify(body)).to.equal(201);
    expect(body.upload.columnMapping).to.include({ specimen_id: 'Specimen', strength: 'Fmax over A' });
    expect(body.ignoredColumns).to.deep.equal(['operator']);
  });

  it('accepts the empty trailing cells a spreadsheet leaves, and a mapping that says a field is not in the file', async () => {
    const rows = couponRows(material.code, { batches: 1, perBatch: 2 });
    const csv = csvOf(rows).split('\r\n').map((line) => (line ? `${line},,` : line)).join('\r\n');
    const { status, body } = await upload(csv, { fields: { columns: JSON.stringify({ panel: '' }) } });
    expect(status, JSON.stringify(body)).to.equal(201);
    expect(body.columns.map((c: { field: string }) => c.field)).to.not.include('panel');
    expect((await testDb()('specimens').where({ upload_id: body.upload.id })).every((r) => r.panel_id === null)).to.equal(true);
  });

  it('refuses an upload from a role that may not upload, before reading the file', async () => {
    const res = await upload(csvOf(couponRows(material.code, { batches: 1, perBatch: 1 })), { login: 'quality' });
    expect(res.status).to.equal(403);
    expect(res.body.error.code).to.equal('forbidden');
  });
});

describe('coupon upload: bad files give their own error and change nothing', function () {
  this.timeout(60_000);
  let material: { id: number; code: string };
  let good: () => CouponRow[];
  before(async () => {
    material = await createMaterial();
    good = () => couponRows(material.code, { batches: 2, perBatch: 3 });
  });

  async function refused(content: string | Buffer, fields?: Record<string, string>) {
    const before = await importTableCounts();
    const result = await upload(content, { fields });
    expect(await importTableCounts(), 'row counts unchanged').to.deep.equal(before);
    expect(result.status, JSON.stringify(result.body).slice(0, 500)).to.be.within(400, 499);
    expect(result.body.error.message).to.be.a('string').and.not.empty;
    return result;
  }

  it('wrong header: the first line is not the template header', async () => {
    const rows = good();
    const csv = ['Probe,Werkstoff,Los,Bruchlast', ...rows.map((r) => `${r.specimen_id},${r.material},${r.batch},1000`)].join('\n');
    const { status, body } = await refused(csv);
    expect(status).to.equal(400);
    expect(body.error.code).to.equal('csv_wrong_header');
    expect(body.error.details.problems[0]).to.include({ row: 1, code: 'wrong_header' });
  });

  it('missing column: a required column is absent', async () => {
    const header = SI_HEADER.filter((h) => h !== 'thickness_mm');
    const { status, body } = await refused(csvOf(good(), header));
    expect(status).to.equal(400);
    expect(body.error.code).to.equal('csv_missing_columns');
    expect(body.error.details.problems).to.have.length(1);
    expect(body.error.details.problems[0]).to.include({ field: 'thickness', code: 'missing_column' });
  });

  it('text in a number column: reported with row, column and reason', async () => {
    const rows = good();
    rows[2].strength_mpa = 'about 2000';
    rows[4].width_mm = '15,2';
    const { status, body } = await refused(csvOf(rows));
    expect(status).to.equal(400);
    expect(body.error.code).to.equal('csv_invalid_rows');
    const problems = body.error.details.problems;
    expect(problems).to.deep.include({ row: 4, column: 'strength_mpa', field: 'strength', code: 'not_a_number', message: "'about 2000' is not a number", fix: 'write strength as a number in MPa' });
    expect(problems.find((p: { row: number }) => p.row === 6)).to.include({ column: 'width_mm', code: 'decimal_comma' });
    expect(body.error.details.problemCount).to.equal(2);
  });

  it('negative thickness', async () => {
    const rows = good();
    rows[0].thickness_mm = -1.9;
    const { body } = await refused(csvOf(rows));
    expect(body.error.code).to.equal('csv_invalid_rows');
    expect(body.error.details.problems).to.have.length(1);
    expect(body.error.details.problems[0]).to.include({ row: 2, column: 'thickness_mm', code: 'not_positive' });
    expect(body.error.details.problems[0].message).to.match(/greater than zero, got -1\.9/);
  });

  it('duplicate specimen ids, in the file and already stored', async () => {
    const stored = couponRows(material.code, { batches: 1, perBatch: 2 });
    expect((await upload(csvOf(stored))).status).to.equal(201);
    const rows = good();
    rows[3].specimen_id = rows[1].specimen_id;
    rows[5].specimen_id = stored[0].specimen_id;
    const { body } = await refused(csvOf(rows));
    expect(body.error.code).to.equal('csv_invalid_rows');
    const codes = body.error.details.problems.map((p: { row: number; code: string }) => `${p.row}:${p.code}`);
    expect(codes).to.have.members(['5:duplicate_in_file', '7:already_stored']);
  });

  it('a UTF-8 byte-order mark is accepted; UTF-16 with its BOM is refused as wrong encoding', async () => {
    const withBom = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(csvOf(couponRows(material.code, { batches: 1, perBatch: 1 })), 'utf8')]);
    expect((await upload(withBom)).status, 'UTF-8 with BOM').to.equal(201);
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(csvOf(good()), 'utf16le')]);
    const { status, body } = await refused(utf16);
    expect(status).to.equal(400);
    expect(body.error.code).to.equal('csv_encoding');
    expect(body.error.message).to.match(/UTF-16/);
  });

  it('a legacy code page (bytes that are not UTF-8) is refused with the row of the first bad byte', async () => {
    const rows = good();
    rows[1].laboratory = 'Laboratoire Besançon';
    const latin1 = Buffer.from(csvOf(rows), 'latin1');
    const { body } = await refused(latin1);
    expect(body.error.code).to.equal('csv_encoding');
    expect(body.error.details.problems[0].row).to.equal(3);
  });

  it('semicolon delimiter', async () => {
    const { body } = await refused(csvOf(good()).replace(/,/g, ';'));
    expect(body.error.code).to.equal('csv_delimiter');
    expect(body.error.message).to.match(/semicolon/);
  });

  it('empty file, and a header without rows', async () => {
    expect((await refused('')).body.error.code).to.equal('csv_empty');
    expect((await refused(' \r\n\r\n')).body.error.code).to.equal('csv_empty');
    const headerOnly = await refused(`${SI_HEADER.join(',')}\r\n`);
    expect(headerOnly.body.error.code).to.equal('csv_empty');
    expect(headerOnly.body.error.message).to.match(/header but no coupon rows/);
  });

  it('a 50 MB file is refused by the size limit (413) before it is parsed', async () => {
    const line = Buffer.from(`${'x'.repeat(199)}\n`);
    const big = Buffer.alloc(50 * 1024 * 1024, line);
    expect(big.length).to.be.greaterThan(MAX_UPLOAD_BYTES);
    const { status, body } = await refused(big);
    expect(status).to.equal(413);
    expect(body.error.code).to.equal('csv_too_large');
    expect(body.error.message).to.match(/25 MB/);
  });

  it(`more than ${MAX_UPLOAD_ROWS} rows is refused with the row limit (413)`, async () => {
    const rows = [SI_HEADER.join(','), ...Array.from({ length: MAX_UPLOAD_ROWS + 1 }, (_, i) => `R${i}`)].join('\n');
    const { status, body } = await refused(rows);
    expect(status).to.equal(413);
    expect(body.error.code).to.equal('csv_too_many_rows');
  });

  it('the same file a second time is recognised by its checksum (409) and not imported again', async () => {
    const csv = csvOf(couponRows(material.code, { batches: 1, perBatch: 2 }));
    const first = await upload(csv, { fileName: 'first-name.csv' });
    expect(first.status).to.equal(201);
    const { status, body } = await refused(csv);
    expect(status).to.equal(409);
    expect(body.error.code).to.equal('csv_duplicate_file');
    expect(body.error.details.upload.id).to.equal(first.body.upload.id);
  });

  it('names every problem of every row, with unknown catalogue entries and no result', async () => {
    const rows = good();
    rows[0].material = 'NO-SUCH-MATERIAL';
    rows[1].test_method = 'ASTM D9999';
    rows[2].property = 'compression-0'; // D3039 does not yield it
    rows[3].condition = 'HOT';
    Object.assign(rows[4], { strength_mpa: '', modulus_gpa: '', poisson_ratio: '', failure_strain_microstrain: '' });
    rows[5].test_date = '2026-02-30';
    const { body } = await refused(csvOf(rows));
    const byRow = Object.fromEntries(body.error.details.problems.map((p: { row: number; code: string }) => [p.row, p.code]));
    expect(byRow).to.deep.equal({ 2: 'unknown_material', 3: 'unknown_test_method', 4: 'property_not_of_method', 5: 'unknown_condition', 6: 'no_result', 7: 'not_a_date' });
  });

  it('refuses a unit choice that contradicts the header', async () => {
    const { body } = await refused(csvOf(good()), { stressUnit: 'ksi' });
    expect(body.error.code).to.equal('csv_invalid_mapping');
    expect(body.error.details.problems[0]).to.include({ column: 'strength_mpa', code: 'unit_mismatch' });
  });

  it('reports a row with the wrong number of cells', async () => {
    const csv = csvOf(good()).replace(/\r\n([^\r\n]*)\r\n$/, '\r\n$1,extra\r\n');
    const { body } = await refused(csv);
    expect(body.error.details.problems[0]).to.include({ row: 7, code: 'wrong_field_count' });
  });

  it('sends no file: a clear 400', async () => {
    const s = await session('materials');
    const res = await s.api('/api/v1/uploads', { method: 'POST', json: { file: 'x' } });
    expect(res.status).to.equal(400);
    expect((await readJson(res)).error.message).to.match(/multipart/);
  });

  it('lists uploads newest first and reads one', async () => {
    const code = uniqueCode('L');
    const { body } = await upload(csvOf(couponRows(material.code, { prefix: code, batches: 1, perBatch: 1 })));
    const list = await getJson('viewer', '/api/v1/uploads?limit=5');
    expect(list.status).to.equal(200);
    expect(list.body.items[0].id).to.equal(body.upload.id);
    expect((await getJson('viewer', `/api/v1/uploads/${body.upload.id}`)).body.rowCount).to.equal(1);
  });
});
