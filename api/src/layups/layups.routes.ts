/**
 * HTTP face of layups: designers save (create, revise, duplicate); everyone
 * signed in reads, previews and compares. Routes validate and call the
 * service; the numbers come from the laminate engine through it.
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { requireRole } from '../auth/require-role.ts';
import { InputError } from '../shared/input-error.ts';
import { FieldReader, readId } from '../shared/read-fields.ts';
import { compareRevisions } from './compare.service.ts';
import { readLayupDraft, NAME_MAX } from './layup-draft.ts';
import { createLayup, duplicateLayup, getLayup, getRevision, listLayups, previewLayup, reviseLayup } from './layups.service.ts';

export const LAYUP_EDITORS = ['designer'] as const;

export function layupsRouter(db: Knex): Router {
  const router = Router();

  router.get('/layups', async (req, res) => {
    const f = new FieldReader(req.query);
    const q = f.text('q', false, { maxLength: 200 });
    f.done();
    res.json(await listLayups(db, q));
  });

  router.post('/layups', requireRole(...LAYUP_EDITORS), async (req, res) => {
    const draft = readLayupDraft(req.body, { nameRequired: true });
    const created = await createLayup(db, req, draft as typeof draft & { name: string });
    res.status(201).location(`/api/v1/layup-revisions/${created.id}`).json(created);
  });

  router.post('/layups/preview', async (req, res) => {
    res.json(await previewLayup(db, readLayupDraft(req.body, { nameRequired: false })));
  });

  router.post('/layups/compare', async (req, res) => {
    const f = new FieldReader(req.body);
    const a = f.integer('a', true, { min: 1 });
    const b = f.integer('b', true, { min: 1 });
    const body = (req.body ?? {}) as Record<string, unknown>;
    for (const key of Object.keys(body).filter((k) => !['a', 'b', 'loads', 'criteria', 'factorOfSafety'].includes(k))) {
      f.problem(key, 'is not a field of a comparison', 'use a, b (layup revision ids), loads, criteria, factorOfSafety');
    }
    f.done();
    res.json(await compareRevisions(db, { a, b, loads: body.loads, criteria: body.criteria, factorOfSafety: body.factorOfSafety }));
  });

  router.get('/layups/:id', async (req, res) => {
    res.json(await getLayup(db, readId(req.params.id)));
  });

  router.post('/layups/:id/revisions', requireRole(...LAYUP_EDITORS), async (req, res) => {
    const id = readId(req.params.id);
    const f = new FieldReader(req.body);
    const basedOnRevision = f.integer('basedOnRevision', true, { min: 1 });
    let draft;
    try {
      draft = readLayupDraft(req.body, { nameRequired: false, extraKeys: ['basedOnRevision'] });
    } catch (err) {
      // one error listing every problem: basedOnRevision's and the draft's
      if (err instanceof InputError && f.problems.length) throw new InputError([...f.problems, ...err.problems]);
      throw err;
    }
    f.done();
    const created = await reviseLayup(db, req, id, draft, basedOnRevision);
    res.status(201).location(`/api/v1/layup-revisions/${created.id}`).json(created);
  });

  router.post('/layups/:id/duplicate', requireRole(...LAYUP_EDITORS), async (req, res) => {
    const id = readId(req.params.id);
    const f = new FieldReader(req.body);
    const name = f.text('name', true, { maxLength: NAME_MAX });
    const description = f.text('description', false, { maxLength: 4000 });
    const revisionId = f.integer('revisionId', false, { min: 1 });
    f.done();
    const created = await duplicateLayup(db, req, id, { name, ...(description !== undefined ? { description } : {}), revisionId });
    res.status(201).location(`/api/v1/layup-revisions/${created.id}`).json(created);
  });

  router.get('/layup-revisions/:id', async (req, res) => {
    res.json(await getRevision(db, readId(req.params.id)));
  });

  return router;
}
