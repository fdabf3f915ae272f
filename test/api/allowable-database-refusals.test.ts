/**
 * The database itself refuses, even for direct SQL (not through the API):
 * changing an approved allowable (trigger; only approved -> superseded with
 * nothing else changed passes), a reviewer deciding their own proposal (check
 * constraint), two approved revisions of one key (partial unique index), and
 * changing a stored analysis (trigger).
 */
import { expect } from 'chai';
import type { Knex } from 'knex';
import { testDb } from '../support/stack.ts';
import { couponRows, createMaterial, csvOf, getJson, postJson, upload } from './coupon-chain-helpers.ts';

async function refusal(work: (db: Knex) => Promise<unknown>): Promise<{ message: string; code?: string; constraint?: string }> {
  try {
    await testDb().transaction(async (trx) => {
      await work(trx);
    });
  } catch (err) {
    const e = err as { message: string; code?: string; constraint?: string };
    return { message: e.message, code: e.code, constraint: e.constraint };
  }
  throw new Error('the database accepted it');
}

class Rollback extends Error {}

describe('allowables: refusals in the database, for direct SQL', function () {
  this.timeout(30_000);
  let approved: { id: number; proposer_id: string; value: number; material_id: number };
  let proposed: { id: number; proposer_id: string };
  let analysisId: number;
  let reviewerIds: { quality: number; quality2: number };

  before(async () => {
    const material = await createMaterial();
    expect((await upload(csvOf(couponRows(material.code)))).status).to.equal(201);
    const run = await postJson('materials', '/api/v1/analyses', { materialId: material.id, property: 'tension-0', conditions: ['RTD'] });
    analysisId = run.body.id;
    const first = await postJson('materials', '/api/v1/allowables', { analysisId, basis: 'B' });
    const meaning = first.body.signatureMeanings.approve;
    expect((await postJson('quality', `/api/v1/allowables/${first.body.id}/approve`, { comment: 'approved for the refusal tests', signatureMeaning: meaning })).status).to.equal(200);
    const second = await postJson('materials', '/api/v1/allowables', { analysisId, basis: 'B' });
    expect(second.status).to.equal(201);
    approved = await testDb()('allowables').where({ id: first.body.id }).first();
    proposed = await testDb()('allowables').where({ id: second.body.id }).first();
    const users = await testDb()('users').whereIn('subject', ['quality', 'quality2']).select('id', 'subject');
    reviewerIds = Object.fromEntries(users.map((u) => [u.subject, Number(u.id)])) as typeof reviewerIds;
  });

  it('refuses changing the value of an approved allowable', async () => {
    const { message } = await refusal((db) => db('allowables').where({ id: approved.id }).update({ value: approved.value * 1.1 }));
    expect(message).to.match(/is approved and cannot be changed/);
    expect((await testDb()('allowables').where({ id: approved.id }).first()).value).to.equal(approved.value);
  });

  it('refuses any other transition of an approved allowable, and supersession that changes anything else', async () => {
    expect((await refusal((db) => db('allowables').where({ id: approved.id }).update({ status: 'rejected' }))).message).to.match(/cannot be changed/);
    expect((await refusal((db) => db('allowables').where({ id: approved.id }).update({ status: 'proposed' }))).message).to.match(/cannot be changed/);
    expect((await refusal((db) => db('allowables').where({ id: approved.id }).update({ status: 'superseded', decision_comment: 'rewritten' }))).message).to.match(/cannot be changed/);
    expect((await refusal((db) => db('allowables').where({ id: approved.id }).delete())).message).to.match(/cannot be deleted/);
  });

  it('lets the one transition approved -> superseded through (rolled back here)', async () => {
    let updated = 0;
    await testDb().transaction(async (trx) => {
      updated = await trx('allowables').where({ id: approved.id }).update({ status: 'superseded' });
      throw new Rollback();
    }).catch((err) => {
      if (!(err instanceof Rollback)) throw err;
    });
    expect(updated).to.equal(1);
    expect((await testDb()('allowables').where({ id: approved.id }).first()).status).to.equal('approved');
  });

  it('refuses a new row that starts approved', async () => {
    const { id: _id, created_at: _c, ...row } = await testDb()('allowables').where({ id: proposed.id }).first();
    const { message } = await refusal((db) => db('allowables').insert({ ...row, revision: 99, status: 'approved' }));
    expect(message).to.match(/starts as draft or proposed/);
  });

  it('refuses a reviewer deciding their own proposal', async () => {
    const own = {
      status: 'approved', reviewer_id: proposed.proposer_id, reviewer_name: 'Mira Solheim', decided_at: new Date(),
      decision_comment: 'my own', signature_meaning: 'I approve',
    };
    const { constraint, code } = await refusal(async (db) => {
      await db('allowables').where({ id: approved.id }).update({ status: 'superseded' });
      await db('allowables').where({ id: proposed.id }).update(own);
    });
    expect(code).to.equal('23514');
    expect(constraint).to.equal('allowables_reviewer_is_not_proposer');
    expect((await refusal((db) => db('allowables').where({ id: proposed.id }).update({ ...own, status: 'rejected' }))).constraint).to.equal('allowables_reviewer_is_not_proposer');
  });

  it('refuses two approved revisions of one key', async () => {
    const { constraint, code } = await refusal((db) => db('allowables').where({ id: proposed.id }).update({
      status: 'approved', reviewer_id: reviewerIds.quality2, reviewer_name: 'Tor Brekkevik', decided_at: new Date(), decision_comment: 'second', signature_meaning: 'I approve',
    }));
    expect(code).to.equal('23505');
    expect(constraint).to.equal('allowables_one_approved_per_key');
    const { material_id } = await testDb()('allowables').where({ id: approved.id }).first();
    expect(await testDb()('allowables').where({ material_id, status: 'approved' })).to.have.length(1);
  });

  it('refuses changing or deleting a stored analysis', async () => {
    expect((await refusal((db) => db('analyses').where({ id: analysisId }).update({ b_basis: 1 }))).message).to.match(/analyses are records/);
    expect((await refusal((db) => db('analyses').where({ id: analysisId }).delete())).message).to.match(/analyses are records/);
  });

  it('still lets the API approve the proposal by another reviewer, superseding the approved revision', async () => {
    const detail = await getJson('quality2', `/api/v1/allowables/${proposed.id}`);
    const res = await postJson('quality2', `/api/v1/allowables/${proposed.id}/approve`, { comment: 'revision 2', signatureMeaning: detail.body.signatureMeanings.approve });
    expect(res.status, JSON.stringify(res.body)).to.equal(200);
    expect((await testDb()('allowables').where({ id: approved.id }).first()).status).to.equal('superseded');
    expect(reviewerIds.quality).to.be.a('number');
  });
});
