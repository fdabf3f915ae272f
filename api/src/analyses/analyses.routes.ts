/**
 * HTTP face of analyses: run one on a data group (materials engineers),
 * override its method with a reason (a new analysis), and read them.
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { requireRole } from '../auth/require-role.ts';
import { conditionIndex } from '../materials/reference.service.ts';
import { FieldReader, readId } from '../shared/read-fields.ts';
import { BASIS_METHODS, type MethodRequest } from '../statistics/index.ts';
import { getAnalysis, listAnalyses, overrideMethod, runAnalysis } from './analyses.service.ts';
import { ANALYSIS_QUANTITIES } from './data-group.ts';

export const ANALYSTS_OF_COUPONS = ['materials-engineer'] as const;
const METHODS: readonly MethodRequest[] = ['auto', ...BASIS_METHODS];

export function analysesRouter(db: Knex): Router {
  const router = Router();

  router.post('/analyses', requireRole(...ANALYSTS_OF_COUPONS), async (req, res) => {
    const f = new FieldReader(req.body);
    const request = {
      materialId: f.integer('materialId', true, { min: 1 }),
      property: f.text('property', true),
      quantity: f.oneOf('quantity', ANALYSIS_QUANTITIES) ?? 'strength',
      conditions: f.textList('conditions', true) ?? [],
      basis: f.oneOf('basis', ['A', 'B', 'both'] as const) ?? 'both',
      method: f.oneOf('method', METHODS) ?? 'auto',
      methodOverrideReason: f.text('methodOverrideReason', false, { maxLength: 2000 }),
      modifiedCv: f.boolean('modifiedCv') ?? false,
    };
    if (request.method !== 'auto' && !request.methodOverrideReason) {
      f.problem('methodOverrideReason', `is required when the method is chosen (${request.method}) instead of the decision flow`, 'say why this method is chosen');
    }
    f.done();
    res.status(201).json(await runAnalysis(db, req, request));
  });

  router.post('/analyses/:id/override', requireRole(...ANALYSTS_OF_COUPONS), async (req, res) => {
    const id = readId(req.params.id);
    const f = new FieldReader(req.body);
    const method = f.oneOf('method', BASIS_METHODS, true);
    const reason = f.text('reason', true, { maxLength: 2000 });
    f.done();
    res.status(201).json(await overrideMethod(db, req, id, method, reason));
  });

  router.get('/analyses', async (req, res) => {
    const f = new FieldReader(req.query);
    const filter = { materialId: f.integer('material', false, { min: 1 }), propertyCode: f.text('property'), quantity: f.oneOf('quantity', ANALYSIS_QUANTITIES) };
    const conditionCode = f.text('condition');
    const limit = f.integer('limit', false, { min: 1, max: 200 }) ?? 50;
    const beforeId = f.integer('beforeId', false, { min: 1 });
    f.done();
    const conditionId = conditionCode ? (await conditionIndex(db)).byCode.get(conditionCode.toUpperCase())?.id ?? -1 : undefined;
    res.json(await listAnalyses(db, { ...filter, conditionId }, limit, beforeId));
  });

  router.get('/analyses/:id', async (req, res) => {
    res.json(await getAnalysis(db, readId(req.params.id)));
  });

  return router;
}
