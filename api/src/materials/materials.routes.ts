/**
 * HTTP face of the catalogue: material systems, batches, panels and the
 * reference lists. Reads are open to everyone signed in; the catalogue is
 * changed by materials engineers; reference lists also by administrators.
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { requireRole } from '../auth/require-role.ts';
import { FieldReader, readId } from '../shared/read-fields.ts';
import { createBatch, createMaterial, createPanel, getMaterial, listBatches, listMaterials, updateMaterial, type MaterialInput } from './materials.service.ts';
import { createCondition, createTestMethod, listConditions, listTestMethods, listTestProperties } from './reference.service.ts';
import { DOMINANCES, MATERIAL_FORMS, MOISTURE_STATES } from './vocabulary.ts';

export const CATALOGUE_EDITORS = ['materials-engineer'] as const;
export const REFERENCE_EDITORS = ['materials-engineer', 'admin'] as const;

const CODE = /^[A-Za-z0-9][A-Za-z0-9._/-]*$/;
const CODE_FIX = 'use letters, digits and . _ / - (no spaces), starting with a letter or digit';

function readMaterial(body: unknown, partial: boolean): Partial<MaterialInput> {
  const f = new FieldReader(body);
  const required = !partial;
  const input: Partial<MaterialInput> = {
    code: f.text('code', required as true, { maxLength: 60, pattern: CODE, patternFix: CODE_FIX }),
    name: f.text('name', required as true, { maxLength: 200 }),
    form: f.oneOf('form', MATERIAL_FORMS, required as true),
    fibre: f.text('fibre', required as true, { maxLength: 200 }),
    resin: f.text('resin', required as true, { maxLength: 200 }),
    nominalCuredPlyThicknessMm: f.number('nominalCuredPlyThicknessMm', false, { exclusiveMin: 0, max: 99 }),
    fibreArealWeightGm2: f.number('fibreArealWeightGm2', false, { exclusiveMin: 0 }),
    resinContentPct: f.number('resinContentPct', false, { exclusiveMin: 0, max: 99.9 }),
    densityKgM3: f.number('densityKgM3', false, { exclusiveMin: 0, max: 24999 }),
    specificationRef: f.text('specificationRef', false, { maxLength: 200 }),
    notes: f.text('notes', false, { maxLength: 4000 }),
  };
  if (!partial && input.form && input.form !== 'core' && input.nominalCuredPlyThicknessMm === undefined && !f.has('nominalCuredPlyThicknessMm')) {
    f.problem('nominalCuredPlyThicknessMm', 'is required for a ply material (fibre-dominated values are normalised to it)', 'give the nominal cured ply thickness in mm');
  }
  if (partial && Object.values(input).every((v) => v === undefined) && !f.problems.length) f.problem('body', 'changes nothing', 'send at least one field to change');
  f.done();
  return Object.fromEntries(Object.entries(input).filter(([, v]) => v !== undefined));
}

export function materialsRouter(db: Knex): Router {
  const router = Router();

  router.get('/materials', async (_req, res) => {
    res.json({ items: await listMaterials(db) });
  });
  router.post('/materials', requireRole(...CATALOGUE_EDITORS), async (req, res) => {
    res.status(201).json(await createMaterial(db, req, readMaterial(req.body, false) as MaterialInput));
  });
  router.get('/materials/:id', async (req, res) => {
    res.json(await getMaterial(db, readId(req.params.id)));
  });
  router.patch('/materials/:id', requireRole(...CATALOGUE_EDITORS), async (req, res) => {
    const id = readId(req.params.id);
    res.json(await updateMaterial(db, req, id, readMaterial(req.body, true)));
  });

  router.get('/materials/:id/batches', async (req, res) => {
    const id = readId(req.params.id);
    await getMaterial(db, id);
    res.json({ items: await listBatches(db, id) });
  });
  router.post('/materials/:id/batches', requireRole(...CATALOGUE_EDITORS), async (req, res) => {
    const id = readId(req.params.id);
    const f = new FieldReader(req.body);
    const input = { code: f.text('code', true, { maxLength: 60 }), manufacturedOn: f.date('manufacturedOn'), notes: f.text('notes', false, { maxLength: 4000 }) };
    f.done();
    res.status(201).json(await createBatch(db, req, id, input));
  });
  router.post('/batches/:id/panels', requireRole(...CATALOGUE_EDITORS), async (req, res) => {
    const id = readId(req.params.id);
    const f = new FieldReader(req.body);
    const input = { code: f.text('code', true, { maxLength: 60 }), curedOn: f.date('curedOn'), notes: f.text('notes', false, { maxLength: 4000 }) };
    f.done();
    res.status(201).json(await createPanel(db, req, id, input));
  });

  router.get('/test-properties', async (_req, res) => {
    res.json({ items: await listTestProperties(db) });
  });
  router.get('/test-methods', async (_req, res) => {
    res.json({ items: await listTestMethods(db) });
  });
  router.post('/test-methods', requireRole(...REFERENCE_EDITORS), async (req, res) => {
    const f = new FieldReader(req.body);
    const code = f.text('code', true, { maxLength: 60 });
    const standardRef = f.text('standardRef', true, { maxLength: 200 });
    const title = f.text('title', true, { maxLength: 400 });
    const raw = (req.body as { properties?: unknown })?.properties;
    const properties: Array<{ property: string; dominance: (typeof DOMINANCES)[number] }> = [];
    if (!Array.isArray(raw) || raw.length === 0) f.problem('properties', 'must list at least one property the method yields', 'send [{ "property": "tension-0", "dominance": "fibre-dominated" }]');
    else {
      raw.forEach((item, i) => {
        const p = new FieldReader(item, `properties[${i}]`);
        const entry = { property: p.text('property', true), dominance: p.oneOf('dominance', DOMINANCES, true) };
        f.problems.push(...p.problems);
        if (entry.property && entry.dominance) properties.push(entry as never);
      });
    }
    f.done();
    res.status(201).json(await createTestMethod(db, req, { code, standardRef, title, properties }));
  });

  router.get('/conditions', async (_req, res) => {
    res.json({ items: await listConditions(db) });
  });
  router.post('/conditions', requireRole(...REFERENCE_EDITORS), async (req, res) => {
    const f = new FieldReader(req.body);
    const input = {
      code: f.text('code', true, { maxLength: 20, pattern: /^[A-Za-z0-9][A-Za-z0-9_-]*$/, patternFix: 'use letters, digits, _ and -' }),
      label: f.text('label', true, { maxLength: 200 }),
      temperatureC: f.number('temperatureC', true, { min: -273.15, max: 1000 }),
      moistureState: f.oneOf('moistureState', MOISTURE_STATES, true),
    };
    f.done();
    res.status(201).json(await createCondition(db, req, input));
  });

  return router;
}
