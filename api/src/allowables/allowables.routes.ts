/**
 * HTTP face of allowables and their review: propose from an analysis and send
 * drafts to review (materials engineers), decide (quality reviewers), read
 * (everyone signed in), and the CSV of approved values.
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { requireRole } from '../auth/require-role.ts';
import type { Mailer } from '../mail/mail.transport.ts';
import { conditionIndex } from '../materials/reference.service.ts';
import { FieldReader, readId } from '../shared/read-fields.ts';
import { approvedAllowablesCsv } from './allowables.csv.ts';
import { ALLOWABLE_QUANTITIES, getAllowable, listAllowables, proposeAllowable, reviewQueue, submitDraft, withdrawDraft } from './allowables.service.ts';
import { decideAllowable } from './review.service.ts';

export const PROPOSERS = ['materials-engineer'] as const;
export const REVIEWERS = ['quality'] as const;
export const STATUSES = ['draft', 'proposed', 'approved', 'rejected', 'superseded'] as const;

async function readFilter(db: Knex, query: unknown) {
  const f = new FieldReader(query);
  const filter = {
    materialId: f.integer('material', false, { min: 1 }),
    propertyCode: f.text('property'),
    quantity: f.oneOf('quantity', ALLOWABLE_QUANTITIES),
    basis: f.oneOf('basis', ['A', 'B'] as const),
    analysisId: f.integer('analysis', false, { min: 1 }),
    statuses: f.textList('status'),
  };
  const conditionCode = f.text('condition');
  for (const s of filter.statuses ?? []) if (!(STATUSES as readonly string[]).includes(s)) f.problem('status', `'${s}' is not a status`, `use ${STATUSES.join(', ')}`);
  f.done();
  const conditionId = conditionCode ? (await conditionIndex(db)).byCode.get(conditionCode.toUpperCase())?.id ?? -1 : undefined;
  return { ...filter, conditionId };
}

export function allowablesRouter(db: Knex, mailer: Mailer): Router {
  const router = Router();

  router.get('/allowables', async (req, res) => {
    res.json(await listAllowables(db, await readFilter(db, req.query)));
  });
  router.get('/allowables/approved.csv', async (req, res) => {
    const filter = await readFilter(db, { ...req.query, status: 'approved' });
    const { items } = await listAllowables(db, filter);
    res.type('text/csv; charset=utf-8').attachment('plyledger-approved-allowables.csv').send(approvedAllowablesCsv(items));
  });
  router.get('/allowables/:id', async (req, res) => {
    res.json(await getAllowable(db, readId(req.params.id)));
  });

  router.post('/allowables', requireRole(...PROPOSERS), async (req, res) => {
    const f = new FieldReader(req.body);
    const input = {
      analysisId: f.integer('analysisId', true, { min: 1 }),
      basis: f.oneOf('basis', ['A', 'B'] as const, true),
      condition: f.text('condition', false, { maxLength: 20 }),
      comment: f.text('comment', false, { maxLength: 4000 }),
      submit: f.boolean('submit') ?? true,
    };
    f.done();
    res.status(201).json(await proposeAllowable(db, req, mailer, input));
  });
  router.post('/allowables/:id/propose', requireRole(...PROPOSERS), async (req, res) => {
    res.json(await submitDraft(db, req, mailer, readId(req.params.id)));
  });
  router.delete('/allowables/:id', requireRole(...PROPOSERS), async (req, res) => {
    await withdrawDraft(db, req, readId(req.params.id));
    res.status(204).end();
  });

  router.get('/reviews', async (req, res) => {
    res.json(await reviewQueue(db, req));
  });
  for (const decision of ['approve', 'reject'] as const) {
    router.post(`/allowables/:id/${decision}`, requireRole(...REVIEWERS), async (req, res) => {
      const id = readId(req.params.id);
      const f = new FieldReader(req.body);
      const input = { comment: f.text('comment', true, { maxLength: 4000 }), signatureMeaning: f.text('signatureMeaning', true, { maxLength: 1000 }) };
      f.done();
      res.json(await decideAllowable(db, req, mailer, id, decision, input));
    });
  }
  return router;
}
