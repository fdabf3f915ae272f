/**
 * The whole chain against the real stack (real database, auth-fake sessions,
 * fake SMTP): upload -> analysis -> proposal (mail to every quality reviewer)
 * -> approval with a signed comment (mail to the proposer) -> approved value
 * with history and the chain back; a second revision superseding the first;
 * the reviewer's own proposal refused; two reviewers at once; SMTP down.
 */
import { expect } from 'chai';
import { allowableStates } from '../../api/src/allowables/allowables.service.ts';
import { startMailFake } from '../../api/src/local/mail-fake.ts';
import { signIn, readJson } from '../support/sign-in.ts';
import { apiUrl, stack, testDb } from '../support/stack.ts';
import { couponRows, createMaterial, csvOf, getJson, postJson, session, upload } from './coupon-chain-helpers.ts';

async function waitForMail(predicate: (m: { to: string[]; subject: string; text: string }) => boolean, count = 1, timeoutMs = 5000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = stack().mail.messages().filter(predicate);
    if (found.length >= count || Date.now() > until) return found;
    await new Promise((r) => setTimeout(r, 50));
  }
}

async function decide(login: string, id: number, decision: 'approve' | 'reject', comment: string) {
  const detail = await getJson(login, `/api/v1/allowables/${id}`);
  return postJson(login, `/api/v1/allowables/${id}/${decision}`, { comment, signatureMeaning: detail.body.signatureMeanings[decision] });
}

describe('allowables: the chain from upload to approved value', function () {
  this.timeout(60_000);
  let material: { id: number; code: string; nominalCuredPlyThicknessMm: number };
  let uploadId: number;
  let analysis: { id: number; bBasis: number; engineInput: { values: number[] }; coupons: Array<{ specimenId: number }> };
  let allowableId: number;

  before(async () => {
    material = await createMaterial({ nominalCuredPlyThicknessMm: 0.25 });
    const rows = [...couponRows(material.code, { condition: 'RTD' }), ...couponRows(material.code, { condition: 'ETW', strength: 1800 })];
    const res = await upload(csvOf(rows));
    expect(res.status, JSON.stringify(res.body)).to.equal(201);
    uploadId = res.body.upload.id;
  });

  it('runs an analysis on the stored coupons, normalised to cured ply thickness, and stores it with its input and engine version', async () => {
    const { status, body } = await postJson('materials', '/api/v1/analyses', { materialId: material.id, property: 'tension-0', conditions: ['RTD'] });
    expect(status, JSON.stringify(body)).to.equal(201);
    analysis = body;
    expect(body.n).to.equal(18);
    expect(body.normalised).to.equal(true);
    expect(body.engineVersion).to.match(/^plyledger-statistics /);
    expect(body.bBasis).to.be.a('number').and.lessThan(body.result.mean);
    expect(body.result.provisionalDetail.bBasis, '3 batches, 18 coupons').to.equal(false);
    // ENGINEERING.md 2.2: x_norm = x * (t_specimen / n_plies) / t_ply,nominal
    const c = body.coupons[0];
    expect(c.value).to.be.closeTo((c.rawValue * (c.thicknessMm / c.plyCount)) / 0.25, 1e-9);
    expect(body.engineInput.values).to.have.length(18);
    const audit = await testDb()('audit_log').where({ action: 'analysis.run', entity_id: String(body.id) }).first();
    expect(audit.details.n).to.equal(18);
  });

  it('does not normalise a matrix-dominated property, and pools several conditions', async () => {
    const own = await createMaterial();
    const rows = [...couponRows(own.code, { property: 'tension-90', strength: 60, condition: 'RTD' }), ...couponRows(own.code, { property: 'tension-90', strength: 45, condition: 'ETW' })];
    expect((await upload(csvOf(rows))).status).to.equal(201);
    const { status, body } = await postJson('materials', '/api/v1/analyses', { materialId: own.id, property: 'tension-90', conditions: ['RTD', 'ETW'] });
    expect(status, JSON.stringify(body)).to.equal(201);
    expect(body.normalised).to.equal(false);
    expect(body.coupons.every((c: { value: number; rawValue: number }) => c.value === c.rawValue)).to.equal(true);
    expect(body.engineInput.conditions).to.have.length(36);
    expect(Object.keys(body.result.byCondition)).to.have.members(['RTD', 'ETW']);
    const proposal = await postJson('materials', '/api/v1/allowables', { analysisId: body.id, basis: 'B' });
    expect(proposal.status, 'a pooled analysis needs the condition').to.equal(400);
    expect(proposal.body.error.details.problems[0].field).to.equal('condition');
  });

  it('overrides the method only with a reason, as a new analysis', async () => {
    const noReason = await postJson('materials', '/api/v1/analyses', { materialId: material.id, property: 'tension-0', conditions: ['RTD'], method: 'normal' });
    expect(noReason.status).to.equal(400);
    expect(noReason.body.error.details.problems[0].field).to.equal('methodOverrideReason');
    const { status, body } = await postJson('materials', `/api/v1/analyses/${analysis.id}/override`, { method: 'nonparametric', reason: 'distribution fits disputed by the programme plan' });
    expect(status, JSON.stringify(body)).to.equal(201);
    expect(body.id).to.not.equal(analysis.id);
    expect(body).to.include({ methodRequested: 'nonparametric', methodUsed: 'nonparametric', overrideOf: analysis.id, methodOverrideReason: 'distribution fits disputed by the programme plan' });
    expect(body.engineInput.values).to.deep.equal(analysis.engineInput.values);
  });

  it('proposes a B-basis allowable from the analysis and mails every quality reviewer a link to the review', async () => {
    const { status, body } = await postJson('materials', '/api/v1/allowables', { analysisId: analysis.id, basis: 'B', comment: 'first qualification lot' });
    expect(status, JSON.stringify(body)).to.equal(201);
    allowableId = body.id;
    expect(body).to.include({ status: 'proposed', basis: 'B', revision: 1, unit: 'MPa', analysisId: analysis.id });
    expect(body.value).to.equal(analysis.bBasis);
    expect(body.proposer.name).to.equal('Mira Solheim');
    const mail = await waitForMail((m) => m.subject.includes(material.code) && m.subject.startsWith('Allowable to review'), 2);
    expect(mail.flatMap((m) => m.to)).to.have.members(['quality@fjordvik-rotorworks.example', 'quality2@fjordvik-rotorworks.example']);
    expect(mail[0].text).to.include(`/reviews/${allowableId}`);
    const queue = await getJson('quality', '/api/v1/reviews');
    expect(queue.body.items.map((i: { id: number }) => i.id)).to.include(allowableId);
  });

  it('refuses a second open proposal of the same key', async () => {
    const { status, body } = await postJson('materials', '/api/v1/allowables', { analysisId: analysis.id, basis: 'B' });
    expect(status).to.equal(409);
    expect(body.error.details.allowableId).to.equal(allowableId);
  });

  it('approves with a signed comment (signer, time, meaning) and mails the proposer a link back', async () => {
    const wrongMeaning = await postJson('quality', `/api/v1/allowables/${allowableId}/approve`, { comment: 'ok', signatureMeaning: 'I agree' });
    expect(wrongMeaning.status).to.equal(400);
    const { status, body } = await decide('quality', allowableId, 'approve', 'Data and diagnostics reviewed; batches poolable.');
    expect(status, JSON.stringify(body)).to.equal(200);
    expect(body.status).to.equal('approved');
    expect(body.reviewer.name).to.equal('Kari Vollan');
    expect(body.signatureMeaning).to.equal(body.signatureMeanings.approve);
    expect(Date.parse(body.decidedAt)).to.be.closeTo(Date.now(), 60_000);
    const mail = await waitForMail((m) => m.subject.startsWith('Allowable approved') && m.subject.includes(material.code));
    expect(mail).to.have.length(1);
    expect(mail[0].to).to.deep.equal(['materials@fjordvik-rotorworks.example']);
    expect(mail[0].text).to.include(`/allowables/${allowableId}`);
    expect(body.notifications.map((n: { status: string }) => n.status)).to.deep.equal(['sent', 'sent', 'sent']);
    const again = await decide('quality2', allowableId, 'reject', 'late');
    expect(again.status).to.equal(409);
    expect(again.body.error.code).to.equal('already_decided');
  });

  it('shows the approved value with the caution and the chain back to analysis, coupons and upload', async () => {
    const list = await getJson('designer', `/api/v1/allowables?material=${material.id}&status=approved`);
    expect(list.body.items.map((a: { id: number }) => a.id)).to.deep.equal([allowableId]);
    expect(list.body.caution).to.match(/support engineering judgement/);
    const detail = await getJson('designer', `/api/v1/allowables/${allowableId}`);
    expect(detail.body.chain.analysis.id).to.equal(analysis.id);
    expect(detail.body.chain.coupons).to.have.length(18);
    expect(detail.body.chain.uploads.map((u: { id: number }) => u.id)).to.deep.equal([uploadId]);
  });

  it('supersedes the approved revision when a new one is approved, keeping the history', async () => {
    const coupon = analysis.coupons[0];
    const excluded = await postJson('materials', `/api/v1/specimens/${coupon.specimenId}/exclude`, { reason: 'grip failure, tab debond' });
    expect(excluded.status).to.equal(200);
    const second = await postJson('materials', '/api/v1/analyses', { materialId: material.id, property: 'tension-0', conditions: ['RTD'] });
    expect(second.body.n).to.equal(17);
    const proposal = await postJson('materials', '/api/v1/allowables', { analysisId: second.body.id, basis: 'B' });
    expect(proposal.body.revision).to.equal(2);
    const approved = await decide('quality2', proposal.body.id, 'approve', 'Revision 2 without the grip failure.');
    expect(approved.status, JSON.stringify(approved.body)).to.equal(200);
    expect(approved.body.supersedesId).to.equal(allowableId);
    expect(approved.body.history.map((h: { revision: number; status: string }) => `${h.revision}:${h.status}`)).to.deep.equal(['2:approved', '1:superseded']);
    const first = await getJson('designer', `/api/v1/allowables/${allowableId}`);
    expect(first.body.status).to.equal('superseded');
    expect(first.body.supersededById).to.equal(proposal.body.id);
    const states = await allowableStates(testDb(), [allowableId, proposal.body.id]);
    expect(states.get(allowableId)).to.deep.equal({ id: allowableId, status: 'superseded', revision: 1, supersededBy: proposal.body.id });
    expect(states.get(proposal.body.id)).to.include({ status: 'approved', supersededBy: null });
    const csv = await (await session('designer')).api(`/api/v1/allowables/approved.csv?material=${material.id}`);
    const lines = (await csv.text()).trim().split('\r\n');
    expect(lines[0]).to.match(/^# Allowables and laminate results support engineering judgement/);
    expect(lines).to.have.length(3);
    expect(lines[2]).to.include(`${material.code},tension-0,strength,RTD,B,${approved.body.value},MPa,2,`);
  });

  it('keeps a draft out of review (no mail) until its author proposes it; a draft can be withdrawn', async () => {
    const own = await createMaterial();
    expect((await upload(csvOf(couponRows(own.code)))).status).to.equal(201);
    const run = await postJson('materials', '/api/v1/analyses', { materialId: own.id, property: 'tension-0', conditions: ['RTD'] });
    const draft = await postJson('materials', '/api/v1/allowables', { analysisId: run.body.id, basis: 'A', submit: false });
    expect(draft.status, JSON.stringify(draft.body)).to.equal(201);
    expect(draft.body).to.include({ status: 'draft', basis: 'A', provisional: true });
    expect((await postJson('quality', `/api/v1/allowables/${draft.body.id}/approve`, { comment: 'x', signatureMeaning: draft.body.signatureMeanings.approve })).body.error.code).to.equal('already_decided');
    const proposed = await postJson('materials', `/api/v1/allowables/${draft.body.id}/propose`, {});
    expect(proposed.body.status).to.equal('proposed');
    expect(await waitForMail((m) => m.subject.includes(own.code), 2)).to.have.length(2);
    const second = await postJson('materials', '/api/v1/allowables', { analysisId: run.body.id, basis: 'B', submit: false });
    expect((await postJson('materials', `/api/v1/allowables/${second.body.id}`, {}, 'DELETE')).status).to.equal(204);
    expect((await getJson('designer', `/api/v1/allowables/${second.body.id}`)).status).to.equal(404);
    expect(stack().mail.messages().filter((m) => m.subject.includes(own.code))).to.have.length(2);
  });

  it('lets nobody decide their own proposal, with or without the reviewer role', async () => {
    const user = await testDb()('users').where({ subject: 'materials' }).first('id');
    await testDb()('user_roles').insert({ user_id: user.id, role_code: 'quality', source: 'local' });
    try {
      const both = await signIn(apiUrl(), 'materials');
      const own = await createMaterial();
      expect((await upload(csvOf(couponRows(own.code)))).status).to.equal(201);
      const run = await readJson(await both.api('/api/v1/analyses', { method: 'POST', json: { materialId: own.id, property: 'tension-0', conditions: ['RTD'] } }));
      const proposal = await readJson(await both.api('/api/v1/allowables', { method: 'POST', json: { analysisId: run.id, basis: 'B' } }));
      const res = await both.api(`/api/v1/allowables/${proposal.id}/approve`, { method: 'POST', json: { comment: 'mine', signatureMeaning: proposal.signatureMeanings.approve } });
      expect(res.status).to.equal(403);
      expect((await readJson(res)).error.code).to.equal('own_proposal');
      expect((await testDb()('allowables').where({ id: proposal.id }).first()).status).to.equal('proposed');
    } finally {
      await testDb()('user_roles').where({ user_id: user.id, role_code: 'quality', source: 'local' }).delete();
    }
  });

  it('records exactly one decision when two reviewers decide one proposal at once', async () => {
    const own = await createMaterial();
    expect((await upload(csvOf(couponRows(own.code)))).status).to.equal(201);
    const run = await postJson('materials', '/api/v1/analyses', { materialId: own.id, property: 'tension-0', conditions: ['RTD'] });
    const proposal = await postJson('materials', '/api/v1/allowables', { analysisId: run.body.id, basis: 'B' });
    const meaning = proposal.body.signatureMeanings;
    const [a, b] = await Promise.all([
      postJson('quality', `/api/v1/allowables/${proposal.body.id}/approve`, { comment: 'approve', signatureMeaning: meaning.approve }),
      postJson('quality2', `/api/v1/allowables/${proposal.body.id}/reject`, { comment: 'reject', signatureMeaning: meaning.reject }),
    ]);
    expect([a.status, b.status].sort()).to.deep.equal([200, 409]);
    const row = await testDb()('allowables').where({ id: proposal.body.id }).first();
    expect(row.status).to.equal(a.status === 200 ? 'approved' : 'rejected');
    const decisions = await testDb()('audit_log').where({ entity_type: 'allowable', entity_id: String(proposal.body.id) }).whereIn('action', ['allowable.approved', 'allowable.rejected']);
    expect(decisions).to.have.length(1);
  });

  it('decides even when the SMTP server is down: the mail is kept unsent and sent on retry', async () => {
    const own = await createMaterial();
    expect((await upload(csvOf(couponRows(own.code)))).status).to.equal(201);
    const run = await postJson('materials', '/api/v1/analyses', { materialId: own.id, property: 'tension-0', conditions: ['RTD'] });
    const proposal = await postJson('materials', '/api/v1/allowables', { analysisId: run.body.id, basis: 'B' });
    const { smtpPort } = stack().mail;
    const inboxPort = Number(new URL(stack().mail.inboxUrl).port);
    await stack().mail.close();
    try {
      const decided = await decide('quality', proposal.body.id, 'reject', 'Batch 2 scatter needs a retest.');
      expect(decided.status, JSON.stringify(decided.body)).to.equal(200);
      expect(decided.body.status).to.equal('rejected');
      const note = decided.body.notifications.find((n: { kind: string }) => n.kind === 'allowable.decided');
      expect(note).to.include({ status: 'unsent', attempts: 1 });
      expect(note.lastError).to.be.a('string').and.not.empty;
      const outbox = await getJson('admin', '/api/v1/mail/outbox?status=unsent');
      expect(outbox.body.items.map((m: { id: number }) => m.id)).to.include(note.id);
    } finally {
      // the stack's mail fake is replaced by a new one on the same ports (the suite keeps using stack().mail)
      stack().mail = await startMailFake({ smtpPort, inboxPort });
    }
    const retried = await postJson('admin', '/api/v1/mail/outbox/retry', {});
    expect(retried.status).to.equal(200);
    expect(retried.body.sent).to.be.at.least(1);
    const mail = await waitForMail((m) => m.subject.startsWith('Allowable rejected') && m.subject.includes(own.code));
    expect(mail).to.have.length(1);
    expect((await testDb()('mail_outbox').where({ entity_type: 'allowable', entity_id: String(proposal.body.id), kind: 'allowable.decided' }).first()).status).to.equal('sent');
  });
});
