/**
 * Section exports against the real stack: an export of a layup revision is
 * recorded with the allowables its ply data used, its file and SHA-256; the
 * file equals what `plyledger section` prints for the same laminate and
 * options; superseding one of those allowables puts the layup and the export
 * in the allowable's impact list and a banner entry on both.
 */
import { createHash } from 'node:crypto';
import { expect } from 'chai';
import { runCli } from '../../api/src/cli/main.ts';
import { testDb } from '../support/stack.ts';
import { approvedAllowable, codeDraft, getJson, laminaMaterial, layupName, postJson, session, type LaminaMaterial } from './layups-fixtures.ts';

async function cliText(laminate: unknown, args: string[]): Promise<string> {
  let stdout = '', stderr = '';
  const code = await runCli(['section', ...args], { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t), readStdin: async () => JSON.stringify(laminate) });
  if (code !== 0) throw new Error(`plyledger section exited ${code}: ${stderr}`);
  return stdout;
}

async function exportFile(login: string, json: Record<string, unknown>) {
  const res = await (await session(login)).api('/api/v1/exports', { method: 'POST', json });
  return { res, text: await res.text() };
}

describe('section exports: recorded, reproducible, and shown as impacted when an allowable is superseded', function () {
  this.timeout(90_000);
  let material: LaminaMaterial;
  let xtAllowable: number;
  let revision: { id: number; layupId: number; name: string; revision: number };
  const exportIds: number[] = [];

  before(async () => {
    material = await laminaMaterial();
    xtAllowable = await approvedAllowable(material.id, 'tension-0');
    const { status, body } = await postJson('designer', '/api/v1/layups', codeDraft(layupName('Skin'), '[45/-45/0/90]s', material, { source: 'ply-property-set', conditionId: material.conditionId, basis: 'B' }));
    if (status !== 201) throw new Error(JSON.stringify(body));
    revision = body;
  });

  it('saves the layup on the approved allowable and marks the other strengths as not approved', async () => {
    const detail = await getJson('designer', `/api/v1/layup-revisions/${revision.id}`);
    const lamina = detail.body.laminae[0];
    expect(lamina.fields.Xt).to.include({ origin: 'approved', allowableId: xtAllowable });
    expect(lamina.fields.Yt.origin).to.equal('typical'); // no allowable proposed for tension-90
    expect(lamina.approval).to.equal('partly-approved');
    expect(detail.body.allowables).to.deep.equal([{ allowableId: xtAllowable, laminaIndex: 0, fields: ['Xt'] }]);
    expect(detail.body.impact).to.deep.equal([]);
  });

  for (const [format, units] of [['calculix', 'N-mm-t'], ['nastran-pcomp', 'lbf-in']] as const) {
    it(`records a ${format} export (${units}) whose file equals the CLI's output for the same laminate and options`, async () => {
      const { res, text } = await exportFile('analyst', { layupRevisionId: revision.id, format, units, propertyId: 7, elset: 'SKIN_A' });
      expect(res.status, text).to.equal(201);
      expect(res.headers.get('content-disposition')).to.match(new RegExp(`^attachment; filename="[^"]*-r1-${format}-${units.toLowerCase()}\\.(inp|bdf)"`));
      const id = Number(res.headers.get('x-export-id'));
      exportIds.push(id);
      expect(res.headers.get('x-export-sha256')).to.equal(createHash('sha256').update(text, 'utf8').digest('hex'));

      const detail = await getJson('viewer', `/api/v1/exports/${id}`);
      expect(detail.status).to.equal(200);
      expect(detail.body).to.include({ layupRevisionId: revision.id, layupId: revision.layupId, format, units, layupRevision: 1, sha256: res.headers.get('x-export-sha256') });
      expect(detail.body.createdBy.name).to.equal('Ane Fossdal'); // the demo analyst (auth-fake/demo-accounts.ts)
      expect(detail.body.allowables).to.deep.equal([{ allowableId: xtAllowable, laminaIndex: 0, fields: ['Xt'] }]);
      expect(detail.body.allowablesText).to.include(`#${xtAllowable}`);
      expect(text).to.include(`#${xtAllowable}`);
      expect(text).to.include(detail.body.date);

      const cli = await cliText(detail.body.reproduce.laminate, detail.body.reproduce.cliArgs);
      expect(cli).to.equal(text);

      const stored = await (await session('viewer')).api(`/api/v1/exports/${id}/file`);
      expect(await stored.text()).to.equal(text);
      const audit = await testDb()('audit_log').where({ action: 'section.exported', entity_id: String(id) }).first();
      expect(audit.details).to.include({ layupRevisionId: revision.id, format, units });
      expect(audit.details.allowableIds).to.deep.equal([xtAllowable]);
    });
  }

  it('previews the same file without recording it, with the strip and plate checks', async () => {
    const before = Number((await testDb()('section_exports').count('* as n').first())!.n);
    const { status, body } = await postJson('viewer', '/api/v1/exports/preview', { layupRevisionId: revision.id, format: 'calculix', units: 'N-mm-t', propertyId: 7, elset: 'SKIN_A' });
    expect(status, JSON.stringify(body)).to.equal(200);
    const recorded = await (await session('viewer')).api(`/api/v1/exports/${exportIds[0]}/file`);
    const recordedText = await recorded.text();
    const recordedDate = (await getJson('viewer', `/api/v1/exports/${exportIds[0]}`)).body.date;
    if (body.header.date === recordedDate) expect(body.text).to.equal(recordedText);
    else expect(body.text.replace(body.header.date, recordedDate)).to.equal(recordedText); // the suite ran over midnight UTC
    // the checks compare two methods; the strip's finite elements agree with the closed form (sections engine)
    expect(body.checks.strip.tip.ratio).to.be.closeTo(1, 1e-6);
    expect(body.checks.plate).to.have.property('check', 'plate-simply-supported');
    expect(Number((await testDb()('section_exports').count('* as n').first())!.n)).to.equal(before);
  });

  it('names the field of a bad export request', async () => {
    const cases: Array<[Record<string, unknown>, string]> = [
      [{ layupRevisionId: revision.id, format: 'step' }, 'format'],
      [{ layupRevisionId: revision.id, format: 'calculix', elset: '1-SKIN' }, 'elset'],
      [{ layupRevisionId: revision.id, format: 'nastran-pcomp', propertyId: 123456789 }, 'propertyId'],
      [{ layupRevisionId: 99999999, format: 'calculix' }, 'layupRevisionId'],
      [{ format: 'calculix' }, 'layupRevisionId'],
    ];
    for (const [json, field] of cases) {
      const { res, text } = await exportFile('designer', json);
      expect(res.status, `${JSON.stringify(json)}: ${text}`).to.equal(400);
      expect(JSON.parse(text).error.details.problems.map((p: { field: string }) => p.field), JSON.stringify(json)).to.include(field);
    }
  });

  it('keeps exports as records: the database refuses changes and a checksum that does not match the text', async () => {
    const db = testDb();
    let refused: unknown = null;
    try { await db('section_exports').where({ id: exportIds[0] }).update({ text: 'edited' }); } catch (err) { refused = err; }
    expect((refused as { code?: string })?.code).to.equal('42501');
    const row = await db('section_exports').where({ id: exportIds[0] }).first();
    refused = null;
    try {
      const { id: _id, ...copy } = row;
      await db('section_exports').insert({ ...copy, text: `${row.text}x` });
    } catch (err) { refused = err; }
    expect((refused as { code?: string; constraint?: string })?.constraint).to.equal('section_exports_checksum_check');
  });

  it('lists the layup and the exports in the impact of the allowable once it is superseded, with a banner entry on each', async () => {
    const beforeImpact = await getJson('viewer', `/api/v1/allowables/${xtAllowable}/impact`);
    expect(beforeImpact.body).to.include({ status: 'approved', supersededBy: null });
    expect(beforeImpact.body.layups.map((l: { revisionId: number }) => l.revisionId)).to.deep.equal([revision.id]);

    const successor = await approvedAllowable(material.id, 'tension-0', 'quality2');
    const impact = await getJson('viewer', `/api/v1/allowables/${xtAllowable}/impact`);
    expect(impact.status).to.equal(200);
    expect(impact.body).to.include({ allowableId: xtAllowable, status: 'superseded', supersededBy: successor });
    expect(impact.body.layups).to.deep.equal([{ layupId: revision.layupId, name: revision.name, revisionId: revision.id, revision: 1, isLatest: true }]);
    expect(impact.body.exports.map((e: { id: number }) => e.id).sort()).to.deep.equal([...exportIds].sort());

    const entry = { allowableId: xtAllowable, status: 'superseded', supersededBy: successor, materialCode: material.code, conditionCode: 'RTD', basis: 'B', propertyCode: 'tension-0', quantity: 'strength', revision: 1, fields: ['Xt'] };
    expect((await getJson('designer', `/api/v1/layup-revisions/${revision.id}`)).body.impact).to.deep.equal([entry]);
    expect((await getJson('analyst', `/api/v1/exports/${exportIds[0]}`)).body.impact).to.deep.equal([entry]);
    const layups = await getJson('viewer', '/api/v1/layups');
    expect(layups.body.items.find((l: { id: number }) => l.id === revision.layupId).impactCount).to.equal(1);
    const exports = await getJson('viewer', `/api/v1/exports?allowableId=${xtAllowable}`);
    expect(exports.body.items.map((e: { impactCount: number }) => e.impactCount)).to.deep.equal([1, 1]);

    // a new save computes on the successor: no banner, and the old allowable keeps its history
    const revised = await postJson('designer', `/api/v1/layups/${revision.layupId}/revisions`, { ...codeDraft(undefined as never, '[45/-45/0/90]s', material, { source: 'ply-property-set', conditionId: material.conditionId, basis: 'B' }), basedOnRevision: 1 });
    expect(revised.status, JSON.stringify(revised.body)).to.equal(201);
    expect(revised.body.laminae[0].fields.Xt.allowableId).to.equal(successor);
    expect(revised.body.impact).to.deep.equal([]);
    const after = await getJson('viewer', `/api/v1/allowables/${xtAllowable}/impact`);
    expect(after.body.layups).to.deep.equal([{ layupId: revision.layupId, name: revision.name, revisionId: revision.id, revision: 1, isLatest: false }]);
  });
});
