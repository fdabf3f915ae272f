/**
 * HTTP face of ply property sets: the lamina data of a material per condition
 * (everyone signed in), and the mapping from test method and property to each
 * lamina field (stated by materials engineers).
 */
import { Router } from 'express';
import type { Knex } from 'knex';
import { requireRole } from '../auth/require-role.ts';
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { conditionIndex } from '../materials/reference.service.ts';
import { InputError } from '../shared/input-error.ts';
import { idParam, json, nullable, operation, queryParam } from '../shared/openapi-parts.ts';
import { FieldReader, readId } from '../shared/read-fields.ts';
import { mappingOf, plyPropertySet, plyPropertySets, stateMapping, type PlyBasis } from './ply-properties.service.ts';

export const MAPPING_EDITORS = ['materials-engineer'] as const;
const BASES: readonly PlyBasis[] = ['A', 'B', 'mean'];

export function plyPropertiesRouter(db: Knex): Router {
  const router = Router();
  router.get('/materials/:id/ply-mapping', async (req, res) => {
    res.json(await mappingOf(db, readId(req.params.id)));
  });
  router.put('/materials/:id/ply-mapping', requireRole(...MAPPING_EDITORS), async (req, res) => {
    const id = readId(req.params.id);
    const raw = (req.body as { fields?: unknown })?.fields;
    if (!Array.isArray(raw)) throw new InputError({ field: 'fields', message: 'must be a list', fix: 'send { "fields": [{ "field": "Xt", "testMethod": "ASTM D3039", "property": "tension-0" }] }' });
    const f = new FieldReader({});
    const entries = raw.map((item, i) => {
      const r = new FieldReader(item, `fields[${i}]`);
      const entry = { field: r.text('field', true), testMethod: r.text('testMethod', true), property: r.text('property', true) };
      f.problems.push(...r.problems);
      return entry;
    });
    f.done();
    res.json(await stateMapping(db, req, id, entries));
  });
  router.get('/materials/:id/ply-properties', async (req, res) => {
    const id = readId(req.params.id);
    const f = new FieldReader(req.query);
    const basis = f.oneOf('basis', BASES) ?? 'B';
    const code = f.text('condition');
    f.done();
    if (!code) return void res.json(await plyPropertySets(db, id, basis));
    const condition = (await conditionIndex(db)).byCode.get(code.toUpperCase());
    if (!condition) throw new InputError({ field: 'condition', message: `'${code}' is not a condition`, fix: 'use a code from GET /api/v1/conditions' });
    res.json({ sets: [await plyPropertySet(db, id, condition.id, basis)] });
  });
  return router;
}

const tags = ['ply properties'];
const mappingField = {
  type: 'object',
  properties: {
    field: { type: 'string' }, kind: { type: 'string', enum: ['modulus', 'poisson', 'strength', 'strain'] }, unit: { type: 'string' }, label: { type: 'string' },
    quantity: { type: 'string' }, testMethod: { oneOf: [{ type: 'object', properties: { id: { type: 'integer' }, code: { type: 'string' } } }, { type: 'null' }] },
    property: nullable('string'), source: { type: 'string', enum: ['stated', 'default', 'none'] },
  },
};
const mappingReply = json({ type: 'object', properties: { material: { type: 'object' }, applicable: { type: 'boolean', description: 'false for a core without a stated mapping' }, fields: { type: 'array', items: mappingField } } });

export const plyPropertiesOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/materials/{id}/ply-mapping': {
      get: operation({ summary: 'Which test method and property feeds each lamina field of the material', tags, parameters: [idParam()], responses: { 200: mappingReply }, errors: [404] }),
      put: operation({
        summary: 'State the mapping of some lamina fields (the others keep the default); replaces the stated ones', tags, roles: MAPPING_EDITORS, parameters: [idParam()],
        body: { type: 'object', required: ['fields'], properties: { fields: { type: 'array', items: { type: 'object', required: ['field', 'testMethod', 'property'], properties: { field: { type: 'string' }, testMethod: { type: 'string' }, property: { type: 'string' } } } } } },
        responses: { 200: mappingReply }, errors: [400, 404],
      }),
    },
    '/api/v1/materials/{id}/ply-properties': {
      get: operation({
        summary: 'Ply property sets (lamina data for the laminate engine) per condition, each field citing its source', tags,
        description: 'status: approved (approved allowable, cited), unapproved (draft or proposed allowable), typical (mean of valid coupons; always for moduli and nu12), missing. Moduli and strengths in MPa, strains and nu12 dimensionless; compression values are magnitudes.',
        parameters: [idParam(), queryParam('condition', { type: 'string' }, 'condition code; absent: every condition with coupons'), queryParam('basis', { type: 'string', enum: [...BASES], default: 'B' })],
        responses: {
          200: json({
            type: 'object',
            properties: {
              sets: {
                type: 'array',
                items: {
                  type: 'object',
                  properties: {
                    material: { type: 'object' }, condition: { type: 'object' }, basis: { type: 'string' }, applicable: { type: 'boolean' }, complete: { type: 'boolean' }, allStrengthsApproved: { type: 'boolean' },
                    fields: { type: 'array', items: { type: 'object', properties: { field: { type: 'string' }, label: { type: 'string' }, unit: { type: 'string' }, value: nullable('number'), status: { type: 'string', enum: ['approved', 'unapproved', 'typical', 'missing'] }, allowable: { type: ['object', 'null'] }, n: nullable('integer'), normalised: nullable('boolean'), source: { type: 'object' } } } },
                  },
                },
              },
            },
          }),
        },
        errors: [400, 404],
      }),
    },
  },
};
