/**
 * Saving and revising layups through the API against the real stack: a save
 * is a revision computed on the catalogue's lamina data, recorded with its
 * audit entry; a revision never changes; a stale revise is refused; errors
 * name the ply and the field.
 */
import { expect } from 'chai';
import { analyseLaminate, parseLaminateInput } from '../../api/src/laminate/index.ts';
import { testDb } from '../support/stack.ts';
import { codeDraft, getJson, laminaMaterial, layupName, postJson, type LaminaMaterial } from './layups-fixtures.ts';

type Ply = { materialId: number; thetaDeg: number; lamina: Record<string, unknown>; thicknessMm?: number };

describe('layups: save and revise', function () {
  this.timeout(60_000);
  let material: LaminaMaterial;
  let layupId: number;
  let firstName: string;
  let first: { id: number; plies: Ply[]; analysis: { A: number[][]; B: number[][] }; laminate: unknown; laminae: Array<Record<string, unknown>> };

  before(async () => {
    material = await laminaMaterial();
  });

  it('creates revision 1 from a laminate code with the material\'s typical values, and records it in the audit log', async () => {
    const name = layupName('Spar cap');
    const { status, body } = await postJson('designer', '/api/v1/layups', codeDraft(name, '[45/-45/0/90]s', material, undefined, { description: 'test layup', comment: 'first cut' }));
    expect(status, JSON.stringify(body)).to.equal(201);
    expect(body).to.include({ revision: 1, isLatest: true, name, plyCount: 8 });
    expect(body.plies.map((p: Ply) => p.thetaDeg)).to.deep.equal([45, -45, 0, 90, 90, 0, -45, 45]);
    // thickness: 8 plies of the material's nominal cured ply thickness, 0.25 mm (set by the fixture)
    expect(body.thicknessMm).to.be.closeTo(2.0, 1e-12);
    expect(body.laminae).to.have.length(1);
    expect(body.laminae[0]).to.include({ source: 'typical', approval: 'typical', conditionCode: 'RTD', materialCode: material.code });
    expect(body.laminae[0].fields.E1.origin).to.equal('typical');
    expect(body.allowables).to.deep.equal([]);
    expect(body.impact).to.deep.equal([]);
    // a symmetric laminate has B = 0 (ENGINEERING.md section 3, identities of theory)
    for (const row of body.analysis.B) for (const v of row) expect(Math.abs(v)).to.be.below(1e-6 * body.analysis.A[0][0]);
    layupId = body.layupId;
    first = body;
    firstName = name;

    const entries = await testDb()('audit_log').where({ action: 'layup.created', entity_type: 'layup', entity_id: String(layupId) });
    expect(entries).to.have.length(1);
    expect(entries[0].details).to.include({ revisionId: body.id, revision: 1, plyCount: 8 });
  });

  it('returns the laminate engine\'s own numbers for the stored input', async () => {
    const direct = analyseLaminate(parseLaminateInput(first.laminate));
    expect(first.analysis.A).to.deep.equal(direct.A);
    // [45/-45/0/90]s is quasi-isotropic: A11 = A22 and A66 = (A11 - A12)/2 (ENGINEERING.md section 3, identities of theory)
    const [A11, A12, A22, A66] = [first.analysis.A[0][0], first.analysis.A[0][1], first.analysis.A[1][1], first.analysis.A[2][2]];
    expect(A22).to.be.closeTo(A11, 1e-9 * A11);
    expect(A66).to.be.closeTo((A11 - A12) / 2, 1e-9 * A11);
    const again = await getJson('viewer', `/api/v1/layup-revisions/${first.id}`);
    expect(again.status).to.equal(200);
    expect(again.body.analysis.A).to.deep.equal(direct.A);
  });

  it('saves a revised ply table as revision 2, keeps revision 1 unchanged, and audits it', async () => {
    const plies: Ply[] = first.plies.map((p) => ({ materialId: p.materialId, thetaDeg: p.thetaDeg, lamina: { source: 'typical', conditionId: material.conditionId } }));
    [plies[0], plies[2]] = [plies[2], plies[0]]; // 0 and 45 swapped on one side only: no longer symmetric
    plies[3].thicknessMm = 0.3;
    const { status, body } = await postJson('designer', `/api/v1/layups/${layupId}/revisions`, { basedOnRevision: 1, plies, comment: 'plies reordered', name: `${firstName} v2` });
    expect(status, JSON.stringify(body)).to.equal(201);
    expect(body).to.include({ revision: 2, isLatest: true, layupId });
    expect(body.plies[3]).to.include({ thicknessMm: 0.3, thicknessOverrideMm: 0.3 });
    const maxB = Math.max(...body.analysis.B.flat().map(Math.abs));
    expect(maxB).to.be.above(1); // N: an unsymmetric stack couples stretching and bending

    const layup = await getJson('viewer', `/api/v1/layups/${layupId}`);
    expect(layup.body.revisions.map((r: { revision: number }) => r.revision)).to.deep.equal([2, 1]);
    expect(layup.body.latest.id).to.equal(body.id);
    expect(layup.body.name).to.equal(body.name);
    const old = await getJson('viewer', `/api/v1/layup-revisions/${first.id}`);
    expect(old.body).to.include({ revision: 1, isLatest: false, code: (first as unknown as { code: string }).code });
    expect(old.body.analysis.B).to.deep.equal(first.analysis.B);
    const entries = await testDb()('audit_log').where({ action: 'layup.revised', entity_id: String(layupId) });
    expect(entries.map((e: { details: { revision: number; basedOnRevision: number } }) => [e.details.revision, e.details.basedOnRevision])).to.deep.equal([[2, 1]]);
  });

  it('refuses a revise based on a revision that is no longer the latest (409 with the latest revision)', async () => {
    const { status, body } = await postJson('designer', `/api/v1/layups/${layupId}/revisions`, codeDraft(undefined as never, '[0/90]s', material, undefined, { basedOnRevision: 1 }));
    expect(status, JSON.stringify(body)).to.equal(409);
    expect(body.error.details).to.include({ latestRevision: 2 });
    const count = await testDb()('layup_revisions').where({ layup_id: layupId }).count('* as n').first();
    expect(Number(count!.n)).to.equal(2);
  });

  it('names the ply and field of every problem, and the fix', async () => {
    const good = { materialId: material.id, thetaDeg: 0, lamina: { source: 'typical', conditionId: material.conditionId } };
    const { status, body } = await postJson('designer', '/api/v1/layups', {
      name: layupName('Bad'),
      plies: [good, { ...good, thetaDeg: 'forty-five' }, { ...good, materialId: 999999 }, { ...good, lamina: { source: 'ply-property-set', conditionId: material.conditionId } }, { ...good, thicknessMm: -1 }],
    });
    expect(status).to.equal(400);
    const fields = body.error.details.problems.map((p: { field: string }) => p.field);
    expect(fields).to.include.members(['plies[1].thetaDeg', 'plies[3].lamina.basis', 'plies[4].thicknessMm']);
    expect(body.error.details.problems.every((p: { fix?: string }) => typeof p.fix === 'string' && p.fix.length > 0)).to.equal(true);

    const unknown = await postJson('designer', '/api/v1/layups', { name: layupName('Bad'), plies: [good, { ...good, materialId: 999999 }] });
    expect(unknown.status).to.equal(400);
    expect(unknown.body.error.details.problems[0]).to.include({ field: 'plies[1].materialId' });

    const code = await postJson('designer', '/api/v1/layups', codeDraft(layupName('Bad code'), '[45/-45/0/90', material));
    expect(code.status).to.equal(400);
    expect(code.body.error.details.problems[0].field).to.equal('code');

    const loads = await postJson('designer', '/api/v1/layups', codeDraft(layupName('Bad loads'), '[0/90]s', material, undefined, { settings: { loads: { N: [1, 2] } } }));
    expect(loads.status).to.equal(400);
    expect(loads.body.error.details.problems[0].field).to.equal('settings.loads.N');
  });

  it('refuses a second layup of the same name (409), whatever the case', async () => {
    const name = layupName('Twin');
    expect((await postJson('designer', '/api/v1/layups', codeDraft(name, '[0/90]s', material))).status).to.equal(201);
    const again = await postJson('designer', '/api/v1/layups', codeDraft(name.toUpperCase(), '[0/90]s', material));
    expect(again.status).to.equal(409);
    expect(again.body.error.details).to.include({ field: 'name' });
  });

  it('keeps revisions as records: the database refuses to change or delete one', async () => {
    const db = testDb();
    let refused: unknown = null;
    try { await db('layup_revisions').where({ id: first.id }).update({ name: 'changed' }); } catch (err) { refused = err; }
    expect((refused as { code?: string })?.code).to.equal('42501');
    refused = null;
    try { await db('layup_plies').where({ revision_id: first.id }).delete(); } catch (err) { refused = err; }
    expect((refused as { code?: string })?.code).to.equal('42501');
  });

  it('previews a draft without storing anything', async () => {
    const before = Number((await testDb()('layup_revisions').count('* as n').first())!.n);
    const { status, body } = await postJson('analyst', '/api/v1/layups/preview', codeDraft(undefined as never, '[0/±45/90]2s', material));
    expect(status, JSON.stringify(body)).to.equal(200);
    expect(body.plyCount).to.equal(16);
    expect(body.plies).to.have.length(16);
    expect(Number((await testDb()('layup_revisions').count('* as n').first())!.n)).to.equal(before);
  });

  it('lists layups with their latest revision, filtered by text', async () => {
    const { body } = await getJson('viewer', `/api/v1/layups?q=${encodeURIComponent('v2')}`);
    const found = body.items.find((l: { id: number }) => l.id === layupId);
    expect(found).to.include({ revisionCount: 2, impactCount: 0 });
    expect(found.latest).to.include({ revision: 2, plyCount: 8 });
    expect(body.items.every((l: { name: string; description: string | null }) => /v2/i.test(l.name) || /v2/i.test(l.description ?? ''))).to.equal(true);
  });
});
