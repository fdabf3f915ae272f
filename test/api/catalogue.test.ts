/**
 * The material catalogue (material systems, batches, panels, test methods,
 * conditions), and the OpenAPI document of the issue-6 routes: every route of
 * the routers is documented, with the roles its guard enforces as x-roles.
 */
import { expect } from 'chai';
import knexFactory from 'knex';
import type { Router } from 'express';
import { allowablesRouter } from '../../api/src/allowables/allowables.routes.ts';
import { analysesRouter } from '../../api/src/analyses/analyses.routes.ts';
import { couponsRouter } from '../../api/src/coupons/coupons.routes.ts';
import { mailRouter } from '../../api/src/mail/mail.routes.ts';
import { materialsRouter } from '../../api/src/materials/materials.routes.ts';
import { plyPropertiesRouter } from '../../api/src/ply-properties/ply-properties.routes.ts';
import { readJson } from '../support/sign-in.ts';
import { apiUrl, testDb } from '../support/stack.ts';
import { getJson, postJson, uniqueCode } from './coupon-chain-helpers.ts';

describe('catalogue: material systems, batches, panels, reference lists', function () {
  it('registers a material system, audited, and refuses a duplicate code', async () => {
    const code = uniqueCode('CAT');
    const created = await postJson('materials', '/api/v1/materials', { code, name: 'Catalogue test tape', form: 'woven-fabric', fibre: 'carbon', resin: 'epoxy', nominalCuredPlyThicknessMm: 0.22, fibreArealWeightGm2: 200, resinContentPct: 40, densityKgM3: 1550 });
    expect(created.status, JSON.stringify(created.body)).to.equal(201);
    expect(created.body).to.include({ code, form: 'woven-fabric', nominalCuredPlyThicknessMm: 0.22, invented: false });
    expect((await testDb()('audit_log').where({ action: 'material.created', entity_id: String(created.body.id) })).length).to.equal(1);
    const again = await postJson('materials', '/api/v1/materials', { code, name: 'x', form: 'woven-fabric', fibre: 'c', resin: 'e', nominalCuredPlyThicknessMm: 0.2 });
    expect(again.status).to.equal(409);
    const patched = await postJson('materials', `/api/v1/materials/${created.body.id}`, { resinContentPct: 38 }, 'PATCH');
    expect(patched.body.resinContentPct).to.equal(38);
    const audit = await testDb()('audit_log').where({ action: 'material.updated', entity_id: String(created.body.id) }).first();
    expect(audit.details.changed.resin_content_pct).to.deep.equal({ from: 40, to: 38 });
  });

  it('names every bad field at once', async () => {
    const res = await postJson('materials', '/api/v1/materials', { code: 'has space', form: 'sheet', nominalCuredPlyThicknessMm: -1 });
    expect(res.status).to.equal(400);
    const fields = res.body.error.details.problems.map((p: { field: string }) => p.field);
    expect(fields).to.include.members(['code', 'name', 'form', 'fibre', 'resin', 'nominalCuredPlyThicknessMm']);
  });

  it('registers batches and panels, shown on the material', async () => {
    const material = (await postJson('materials', '/api/v1/materials', { code: uniqueCode('CAT'), name: 'x', form: 'unidirectional-tape', fibre: 'c', resin: 'e', nominalCuredPlyThicknessMm: 0.2 })).body;
    const batch = await postJson('materials', `/api/v1/materials/${material.id}/batches`, { code: 'L-001', manufacturedOn: '2026-02-01' });
    expect(batch.status).to.equal(201);
    expect((await postJson('materials', `/api/v1/materials/${material.id}/batches`, { code: 'L-001' })).status).to.equal(409);
    expect((await postJson('materials', `/api/v1/batches/${batch.body.id}/panels`, { code: 'PN-1', curedOn: '2026-02-30' })).status, 'no 30 February').to.equal(400);
    expect((await postJson('materials', `/api/v1/batches/${batch.body.id}/panels`, { code: 'PN-1', curedOn: '2026-02-03' })).status).to.equal(201);
    const detail = await getJson('viewer', `/api/v1/materials/${material.id}`);
    expect(detail.body.batches[0]).to.deep.include({ code: 'L-001', manufacturedOn: '2026-02-01' });
    expect(detail.body.batches[0].panels[0]).to.include({ code: 'PN-1', curedOn: '2026-02-03' });
    expect((await getJson('viewer', '/api/v1/materials/999999')).status).to.equal(404);
  });

  it('lists the reference test methods and conditions, and lets an administrator add one', async () => {
    const methods = await getJson('viewer', '/api/v1/test-methods');
    const d3039 = methods.body.items.find((m: { code: string }) => m.code === 'ASTM D3039');
    expect(d3039.properties).to.deep.include({ property: 'tension-0', dominance: 'fibre-dominated' });
    expect(d3039.properties).to.deep.include({ property: 'tension-90', dominance: 'matrix-dominated' });
    const conditions = await getJson('viewer', '/api/v1/conditions');
    expect(conditions.body.items.map((c: { code: string }) => c.code)).to.include.members(['CTD', 'RTD', 'ETD', 'ETW']);
    const code = uniqueCode('HW').slice(0, 18);
    const added = await postJson('admin', '/api/v1/conditions', { code, label: 'Hot wet, test', temperatureC: 100, moistureState: 'wet' });
    expect(added.status, JSON.stringify(added.body)).to.equal(201);
    const method = await postJson('admin', '/api/v1/test-methods', { code: uniqueCode('ISO'), standardRef: 'ISO 527-5', title: 'Tensile properties of unidirectional composites', properties: [{ property: 'tension-0', dominance: 'fibre-dominated' }] });
    expect(method.status, JSON.stringify(method.body)).to.equal(201);
    const unknown = await postJson('admin', '/api/v1/test-methods', { code: uniqueCode('ISO'), standardRef: 'x', title: 'x', properties: [{ property: 'torsion', dominance: 'fibre-dominated' }] });
    expect(unknown.status).to.equal(400);
  });
});

describe('OpenAPI: the issue-6 routes are all documented with the roles their guards enforce', function () {
  it('lists every route of the routers, with x-roles equal to the guard', async () => {
    const doc = await readJson(await fetch(`${apiUrl()}/api/v1/openapi.json`));
    const db = knexFactory({ client: 'pg' });
    const mailer = { appUrl: '', send: async () => undefined };
    const routers: Router[] = [materialsRouter(db), couponsRouter(db), analysesRouter(db), allowablesRouter(db, mailer), plyPropertiesRouter(db), mailRouter(db, mailer)];
    const missing: string[] = [];
    let routes = 0;
    for (const router of routers) {
      for (const layer of router.stack as Array<{ route?: { path: string; methods: Record<string, boolean>; stack: Array<{ handle: { roles?: string[] } }> } }>) {
        if (!layer.route) continue;
        const path = `/api/v1${layer.route.path.replace(/:(\w+)/g, '{$1}')}`;
        for (const method of Object.keys(layer.route.methods)) {
          routes++;
          const op = doc.paths[path]?.[method];
          const guard = layer.route.stack.find((l) => l.handle.roles)?.handle.roles;
          if (!op) missing.push(`${method.toUpperCase()} ${path}: not in the document`);
          else if (JSON.stringify(op['x-roles'] ?? null) !== JSON.stringify(guard ?? null)) missing.push(`${method.toUpperCase()} ${path}: x-roles ${JSON.stringify(op['x-roles'])}, guard ${JSON.stringify(guard)}`);
          else if (!op.summary || !op.responses) missing.push(`${method.toUpperCase()} ${path}: no summary or responses`);
        }
      }
    }
    await db.destroy();
    expect(missing, missing.join('\n')).to.deep.equal([]);
    expect(routes).to.be.greaterThan(35);
    for (const schema of ['Material', 'Upload', 'Specimen', 'AnalysisDetail', 'Allowable', 'AllowableDetail', 'OutboxMessage']) expect(doc.components.schemas, schema).to.have.property(schema);
  });
});
