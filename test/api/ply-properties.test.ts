/**
 * Ply property sets: each lamina field with its value and where it came from
 * (approved allowable, unapproved proposal, typical mean of coupons, or
 * missing), and the per-material mapping from test method and property.
 */
import { expect } from 'chai';
import { couponRows, createMaterial, csvOf, getJson, postJson, upload } from './coupon-chain-helpers.ts';

type Field = { field: string; value: number | null; status: string; allowable: { id: number; revision: number } | null; n: number | null; source: { testMethod: string; mapping: string } };

describe('ply property sets', function () {
  this.timeout(30_000);
  let material: { id: number; code: string };
  let approvedId: number;
  let proposedId: number;
  let rows: ReturnType<typeof couponRows>;

  before(async () => {
    material = await createMaterial({ nominalCuredPlyThicknessMm: 0.25 });
    rows = couponRows(material.code, { property: 'tension-0' });
    const transverse = couponRows(material.code, { property: 'tension-90', strength: 50 });
    const shear = couponRows(material.code, { property: 'in-plane-shear', testMethod: 'ASTM D3518', strength: 90 });
    expect((await upload(csvOf([...rows, ...transverse, ...shear]))).status).to.equal(201);
    const run = await postJson('materials', '/api/v1/analyses', { materialId: material.id, property: 'tension-0', conditions: ['RTD'] });
    const proposal = await postJson('materials', '/api/v1/allowables', { analysisId: run.body.id, basis: 'B' });
    approvedId = proposal.body.id;
    expect((await postJson('quality', `/api/v1/allowables/${approvedId}/approve`, { comment: 'ok', signatureMeaning: proposal.body.signatureMeanings.approve })).status).to.equal(200);
    const run90 = await postJson('materials', '/api/v1/analyses', { materialId: material.id, property: 'tension-90', conditions: ['RTD'] });
    proposedId = (await postJson('materials', '/api/v1/allowables', { analysisId: run90.body.id, basis: 'B' })).body.id;
  });

  async function set(query: string) {
    const res = await getJson('designer', `/api/v1/materials/${material.id}/ply-properties?${query}`);
    expect(res.status, JSON.stringify(res.body).slice(0, 300)).to.equal(200);
    return { ...res.body.sets[0], byField: Object.fromEntries(res.body.sets[0].fields.map((f: Field) => [f.field, f])) as Record<string, Field> };
  }

  it('cites the approved allowable for Xt, marks Yt unapproved, and gives moduli as typical means', async () => {
    const s = await set('condition=RTD&basis=B');
    const approved = await getJson('designer', `/api/v1/allowables/${approvedId}`);
    expect(s.byField.Xt).to.include({ status: 'approved', value: approved.body.value });
    expect(s.byField.Xt.allowable).to.include({ id: approvedId, revision: 1 });
    expect(s.byField.Yt).to.include({ status: 'unapproved' });
    expect(s.byField.Yt.allowable!.id).to.equal(proposedId);
    // E1: mean of the moduli normalised to 0.25 mm per ply (ENGINEERING.md 2.2), in MPa
    const e1 = rows.reduce((sum, r) => sum + (Number(r.modulus_gpa) * 1000 * (Number(r.thickness_mm) / Number(r.ply_count))) / 0.25, 0) / rows.length;
    expect(s.byField.E1.status).to.equal('typical');
    expect(s.byField.E1.value).to.be.closeTo(e1, 1e-6);
    expect(s.byField.E1.n).to.equal(rows.length);
    expect(s.byField.nu12).to.include({ status: 'typical', value: 0.3 });
    expect(s.byField.S12.status, 'no shear allowable: the mean strength, marked typical').to.equal('typical');
    expect(s.byField.Xc).to.include({ status: 'missing', value: null });
    expect(s.byField.e1t.status).to.equal('typical');
    expect(s.complete).to.equal(false);
    expect(s.allStrengthsApproved).to.equal(false);
  });

  it('gives mean strengths when asked for the mean basis, and lists every condition with coupons', async () => {
    const s = await set('condition=RTD&basis=mean');
    expect(s.byField.Xt.status).to.equal('typical');
    const all = await getJson('designer', `/api/v1/materials/${material.id}/ply-properties`);
    expect(all.body.sets.map((x: { condition: { code: string } }) => x.condition.code)).to.deep.equal(['RTD']);
  });

  it('states the mapping per material, shown with its source, and refuses a method that does not yield the property', async () => {
    const initial = await getJson('designer', `/api/v1/materials/${material.id}/ply-mapping`);
    expect(initial.body.fields.find((f: { field: string }) => f.field === 'G12')).to.include({ source: 'default', property: 'in-plane-shear' });
    const stated = await postJson('materials', `/api/v1/materials/${material.id}/ply-mapping`, { fields: [{ field: 'G12', testMethod: 'ASTM D7078', property: 'in-plane-shear' }] }, 'PUT');
    expect(stated.status, JSON.stringify(stated.body)).to.equal(200);
    const g12 = stated.body.fields.find((f: { field: string }) => f.field === 'G12');
    expect(g12.source).to.equal('stated');
    expect(g12.testMethod.code).to.equal('ASTM D7078');
    expect((await set('condition=RTD&basis=B')).byField.G12.status, 'no D7078 coupons').to.equal('missing');
    const wrong = await postJson('materials', `/api/v1/materials/${material.id}/ply-mapping`, { fields: [{ field: 'Xt', testMethod: 'ASTM D6641', property: 'tension-0' }] }, 'PUT');
    expect(wrong.status).to.equal(400);
    expect(wrong.body.error.details.problems[0].field).to.equal('fields[0].property');
    expect((await postJson('designer', `/api/v1/materials/${material.id}/ply-mapping`, { fields: [] }, 'PUT')).status).to.equal(403);
  });

  it('says a core has no lamina set', async () => {
    const core = await createMaterial({ form: 'core', nominalCuredPlyThicknessMm: 20 });
    const mapping = await getJson('designer', `/api/v1/materials/${core.id}/ply-mapping`);
    expect(mapping.body.applicable).to.equal(false);
  });
});
