/** OpenAPI fragment of the catalogue routes (materials.routes.ts). */
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { idParam, json, nullable, operation, ref } from '../shared/openapi-parts.ts';
import { CATALOGUE_EDITORS, REFERENCE_EDITORS } from './materials.routes.ts';
import { DOMINANCES, MATERIAL_FORMS, MOISTURE_STATES } from './vocabulary.ts';

const tags = ['catalogue'];
const list = (name: string) => ({ type: 'object', required: ['items'], properties: { items: { type: 'array', items: ref(name) } } });

const materialFields = {
  code: { type: 'string', description: 'designation used in CSV files, e.g. FR-UC300' },
  name: { type: 'string' },
  form: { type: 'string', enum: [...MATERIAL_FORMS] },
  fibre: { type: 'string' },
  resin: { type: 'string' },
  nominalCuredPlyThicknessMm: nullable('number', { description: 'mm; required unless form is core (then the core thickness)' }),
  fibreArealWeightGm2: nullable('number', { description: 'g/m²' }),
  resinContentPct: nullable('number', { description: '% by mass' }),
  densityKgM3: nullable('number', { description: 'kg/m³' }),
  specificationRef: nullable('string'),
  notes: nullable('string'),
};

export const materialsOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/materials': {
      get: operation({ summary: 'Material systems', tags, responses: { 200: json(list('Material')) } }),
      post: operation({
        summary: 'Register a material system', tags, roles: CATALOGUE_EDITORS, body: ref('MaterialInput'),
        responses: { 201: json(ref('Material'), 'Created') }, errors: [400, 409],
      }),
    },
    '/api/v1/materials/{id}': {
      get: operation({ summary: 'A material system with its batches and panels', tags, parameters: [idParam()], responses: { 200: json(ref('MaterialDetail')) }, errors: [404] }),
      patch: operation({
        summary: 'Change fields of a material system (audited with before and after)', tags, roles: CATALOGUE_EDITORS, parameters: [idParam()],
        body: { type: 'object', properties: materialFields }, responses: { 200: json(ref('Material')) }, errors: [400, 404, 409],
      }),
    },
    '/api/v1/materials/{id}/batches': {
      get: operation({ summary: 'Batches of a material, each with its panels', tags, parameters: [idParam()], responses: { 200: json(list('Batch')) }, errors: [404] }),
      post: operation({
        summary: 'Register a batch (lot) of a material', tags, roles: CATALOGUE_EDITORS, parameters: [idParam()],
        body: { type: 'object', required: ['code'], properties: { code: { type: 'string' }, manufacturedOn: { type: 'string', format: 'date' }, notes: { type: 'string' } } },
        responses: { 201: json(ref('Batch'), 'Created') }, errors: [400, 404, 409],
      }),
    },
    '/api/v1/batches/{id}/panels': {
      post: operation({
        summary: 'Register a panel of a batch', tags, roles: CATALOGUE_EDITORS, parameters: [idParam('id', 'batch id')],
        body: { type: 'object', required: ['code'], properties: { code: { type: 'string' }, curedOn: { type: 'string', format: 'date' }, notes: { type: 'string' } } },
        responses: { 201: json(ref('Panel'), 'Created') }, errors: [400, 404, 409],
      }),
    },
    '/api/v1/test-properties': {
      get: operation({
        summary: 'Test properties: what a coupon is loaded for (the CSV column property)', tags,
        responses: { 200: json({ type: 'object', properties: { items: { type: 'array', items: { type: 'object', properties: { code: { type: 'string' }, label: { type: 'string' } } } } } }) },
      }),
    },
    '/api/v1/test-methods': {
      get: operation({ summary: 'Test methods and the properties each yields', tags, responses: { 200: json(list('TestMethod')) } }),
      post: operation({
        summary: 'Add a test method (reference list)', tags, roles: REFERENCE_EDITORS,
        body: {
          type: 'object', required: ['code', 'standardRef', 'title', 'properties'],
          properties: { code: { type: 'string' }, standardRef: { type: 'string' }, title: { type: 'string' }, properties: { type: 'array', items: ref('TestMethodProperty') } },
        },
        responses: { 201: json(ref('TestMethod'), 'Created') }, errors: [400, 409],
      }),
    },
    '/api/v1/conditions': {
      get: operation({ summary: 'Environmental conditions (CTD, RTD, ETD, ETW, ...)', tags, responses: { 200: json(list('Condition')) } }),
      post: operation({
        summary: 'Add a condition (reference list)', tags, roles: REFERENCE_EDITORS,
        body: {
          type: 'object', required: ['code', 'label', 'temperatureC', 'moistureState'],
          properties: { code: { type: 'string' }, label: { type: 'string' }, temperatureC: { type: 'number', description: '°C' }, moistureState: { type: 'string', enum: [...MOISTURE_STATES] } },
        },
        responses: { 201: json(ref('Condition'), 'Created') }, errors: [400, 409],
      }),
    },
  },
  schemas: {
    MaterialInput: { type: 'object', required: ['code', 'name', 'form', 'fibre', 'resin'], properties: materialFields },
    Material: {
      type: 'object',
      properties: { id: { type: 'integer' }, ...materialFields, invented: { type: 'boolean', description: 'true for the invented demo scenario' }, createdAt: { type: 'string', format: 'date-time' }, updatedAt: { type: 'string', format: 'date-time' } },
    },
    MaterialDetail: { allOf: [ref('Material'), { type: 'object', properties: { batches: { type: 'array', items: ref('Batch') } } }] },
    Batch: {
      type: 'object',
      properties: { id: { type: 'integer' }, materialId: { type: 'integer' }, code: { type: 'string' }, manufacturedOn: nullable('string', { format: 'date' }), notes: nullable('string'), panels: { type: 'array', items: ref('Panel') } },
    },
    Panel: { type: 'object', properties: { id: { type: 'integer' }, batchId: { type: 'integer' }, code: { type: 'string' }, curedOn: nullable('string', { format: 'date' }), notes: nullable('string') } },
    TestMethodProperty: { type: 'object', required: ['property', 'dominance'], properties: { property: { type: 'string', description: 'a test property code' }, dominance: { type: 'string', enum: [...DOMINANCES] } } },
    TestMethod: {
      type: 'object',
      properties: { id: { type: 'integer' }, code: { type: 'string', description: 'as written in CSV files, e.g. ASTM D3039' }, standardRef: { type: 'string' }, title: { type: 'string' }, properties: { type: 'array', items: ref('TestMethodProperty') } },
    },
    Condition: {
      type: 'object',
      properties: { id: { type: 'integer' }, code: { type: 'string' }, label: { type: 'string' }, temperatureC: { type: 'number', description: '°C' }, moistureState: { type: 'string', enum: [...MOISTURE_STATES] } },
    },
  },
};
