/**
 * The coupon table: server-side paging, sorting and filters, and excluding and
 * restoring a coupon with a reason (recorded on the coupon and in the audit log).
 */
import { expect } from 'chai';
import { testDb } from '../support/stack.ts';
import { couponRows, createMaterial, csvOf, getJson, postJson, uniqueCode, upload } from './coupon-chain-helpers.ts';

describe('coupon table: paging, sorting, filters, exclusion', function () {
  this.timeout(30_000);
  let material: { id: number; code: string };
  let uploadId: number;

  before(async () => {
    material = await createMaterial();
    const rows = [...couponRows(material.code, { batches: 3, perBatch: 5 }), ...couponRows(material.code, { batches: 2, perBatch: 5, condition: 'ETW', strength: 1700 })];
    const res = await upload(csvOf(rows));
    expect(res.status).to.equal(201);
    uploadId = res.body.upload.id;
  });

  it('pages on the server with the total', async () => {
    const first = await getJson('designer', `/api/v1/specimens?material=${material.id}&pageSize=10&page=1`);
    expect(first.status).to.equal(200);
    expect(first.body).to.include({ total: 25, page: 1, pageSize: 10, pageCount: 3 });
    expect(first.body.items).to.have.length(10);
    const last = await getJson('designer', `/api/v1/specimens?material=${material.id}&pageSize=10&page=3`);
    expect(last.body.items).to.have.length(5);
    const ids = new Set([...first.body.items, ...last.body.items].map((s: { id: number }) => s.id));
    expect(ids.size).to.equal(15);
  });

  it('sorts by test date both ways, with ties in id order', async () => {
    for (const order of ['asc', 'desc'] as const) {
      const sorted = await getJson('designer', `/api/v1/specimens?material=${material.id}&sort=testDate&order=${order}&pageSize=200`);
      expect(sorted.status).to.equal(200);
      const dates = sorted.body.items.map((s: { testDate: string }) => s.testDate);
      const expected = [...dates].sort();
      expect(dates, order).to.deep.equal(order === 'asc' ? expected : expected.reverse());
      expect(new Set(dates).size, 'the rows carry several dates').to.be.above(1);
    }
  });

  it('sorts by strength, descending, and filters by condition, batch, upload and property', async () => {
    const sorted = await getJson('designer', `/api/v1/specimens?material=${material.id}&sort=strengthMpa&order=desc&pageSize=200`);
    const strengths = sorted.body.items.map((s: { strengthMpa: number }) => s.strengthMpa);
    expect(strengths).to.deep.equal([...strengths].sort((a, b) => b - a));
    const etw = await getJson('designer', `/api/v1/specimens?material=${material.id}&condition=ETW&pageSize=200`);
    expect(etw.body.total).to.equal(10);
    expect(etw.body.items.every((s: { condition: { code: string } }) => s.condition.code === 'ETW')).to.equal(true);
    const batchId = etw.body.items[0].batch.id;
    const inBatch = await getJson('designer', `/api/v1/specimens?batch=${batchId}&pageSize=200`);
    expect(inBatch.body.items.every((s: { batch: { id: number } }) => s.batch.id === batchId)).to.equal(true);
    expect((await getJson('designer', `/api/v1/specimens?upload=${uploadId}`)).body.total).to.equal(25);
    expect((await getJson('designer', `/api/v1/specimens?material=${material.id}&property=tension-90`)).body.total).to.equal(0);
    const bad = await getJson('designer', '/api/v1/specimens?sort=colour');
    expect(bad.status).to.equal(400);
    expect(bad.body.error.details.problems[0].field).to.equal('sort');
  });

  it('excludes a coupon with a reason and who, restores it with a reason, both audited, and filters by status', async () => {
    const { body: page } = await getJson('designer', `/api/v1/specimens?material=${material.id}&pageSize=1`);
    const id = page.items[0].id;
    expect((await postJson('materials', `/api/v1/specimens/${id}/exclude`, {})).status, 'a reason is required').to.equal(400);
    const excluded = await postJson('materials', `/api/v1/specimens/${id}/exclude`, { reason: 'failed in the grip' });
    expect(excluded.status).to.equal(200);
    expect(excluded.body).to.include({ status: 'excluded', statusReason: 'failed in the grip' });
    expect(excluded.body.statusChangedBy.name).to.equal('Mira Solheim');
    expect((await postJson('materials', `/api/v1/specimens/${id}/exclude`, { reason: 'again' })).status).to.equal(409);
    expect((await getJson('designer', `/api/v1/specimens?material=${material.id}&status=excluded`)).body.total).to.equal(1);
    const restored = await postJson('materials', `/api/v1/specimens/${id}/restore`, { reason: 'grip failure was in a different coupon' });
    expect(restored.body.status).to.equal('valid');
    const audit = await testDb()('audit_log').where({ entity_type: 'specimen', entity_id: String(id) }).orderBy('id');
    expect(audit.map((a) => `${a.action}:${a.details.reason}`)).to.deep.equal(['specimen.excluded:failed in the grip', 'specimen.restored:grip failure was in a different coupon']);
    expect((await postJson('designer', `/api/v1/specimens/${id}/exclude`, { reason: 'x' })).status).to.equal(403);
  });

  it('names a condition and a test method added after the table was read (reference codes read again for an id not seen)', async () => {
    expect((await getJson('designer', `/api/v1/specimens?material=${material.id}&pageSize=5`)).status).to.equal(200);
    const condition = uniqueCode('HW').slice(0, 18);
    const method = uniqueCode('ISO').slice(0, 30);
    expect((await postJson('admin', '/api/v1/conditions', { code: condition, label: 'Hot wet, later', temperatureC: 90, moistureState: 'wet' })).status).to.equal(201);
    expect((await postJson('admin', '/api/v1/test-methods', { code: method, standardRef: 'ISO 527-5', title: 'Tension, added later', properties: [{ property: 'tension-0', dominance: 'fibre-dominated' }] })).status).to.equal(201);
    const res = await upload(csvOf(couponRows(material.code, { prefix: 'LATER', batches: 1, perBatch: 2, condition, testMethod: method })));
    expect(res.status, JSON.stringify(res.body)).to.equal(201);
    const page = await getJson('designer', `/api/v1/specimens?upload=${res.body.upload.id}`);
    expect(page.body.items.map((s: { condition: { code: string } }) => s.condition.code)).to.deep.equal([condition, condition]);
    expect(page.body.items.map((s: { testMethod: { code: string } }) => s.testMethod.code)).to.deep.equal([method, method]);
  });
});
