/** OpenAPI fragment of the layup routes (layups.routes.ts). Internal units: mm, MPa, N/mm, N, N·mm. */
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { idParam, json, nullable, operation, queryParam, ref } from '../shared/openapi-parts.ts';
import { SETTINGS_KEYS } from './layup-draft.ts';
import { LAYUP_EDITORS } from './layups.routes.ts';

const tags = ['layups'];
const person = { type: 'object', properties: { id: { type: 'integer' }, name: { type: 'string' } } };
const matrix = (unit: string) => ({ type: 'array', items: { type: 'array', items: { type: 'number' } }, description: unit });

const laminaChoice = {
  type: 'object', required: ['source', 'conditionId'],
  description: 'where the ply\'s lamina data come from: the catalogue\'s ply property set for a condition and basis (approved allowables where they exist), or the material\'s typical values (coupon means) in a condition',
  properties: {
    source: { type: 'string', enum: ['ply-property-set', 'typical'] },
    conditionId: { type: 'integer', description: 'id from GET /api/v1/conditions' },
    basis: { type: 'string', enum: ['A', 'B'], description: 'only with ply-property-set' },
  },
};

const draftProperties = {
  name: { type: 'string', maxLength: 120, description: 'unique among layups' },
  description: nullable('string'),
  comment: nullable('string', { description: 'what changed and why (kept with the revision)' }),
  plies: {
    type: 'array', minItems: 1, maxItems: 2000, description: 'stacking order, first ply at the bottom (z = -h/2)',
    items: {
      type: 'object', required: ['materialId', 'thetaDeg', 'lamina'],
      properties: {
        materialId: { type: 'integer' }, thetaDeg: { type: 'number', description: 'degrees, counter-clockwise from x to the fibre' },
        thicknessMm: nullable('number', { description: 'mm; absent: the material\'s nominal cured ply thickness' }), lamina: ref('LaminaChoice'),
      },
    },
  },
  code: { type: 'string', description: 'instead of plies: a laminate code such as [45/-45/0/90]s, with material' },
  material: { type: 'object', properties: { materialId: { type: 'integer' }, lamina: ref('LaminaChoice'), thicknessMm: { type: 'number', description: 'mm' } }, description: 'the material of every ply of code' },
  settings: { type: 'object', description: `analysis settings kept with the revision (${SETTINGS_KEYS.join(', ')}), as in POST /api/v1/laminates/analyze` },
};

const impact = {
  type: 'object',
  description: 'an allowable the record used that is now superseded (or was rejected): show a banner',
  properties: {
    allowableId: { type: 'integer' }, status: { type: 'string', enum: ['superseded', 'rejected'] }, supersededBy: nullable('integer'),
    materialCode: { type: 'string' }, propertyCode: nullable('string'), quantity: { type: 'string' }, conditionCode: { type: 'string' },
    basis: nullable('string'), revision: { type: 'integer' }, fields: { type: 'array', items: { type: 'string' }, description: 'lamina fields taken from it, e.g. Xt' },
  },
};

const computed = {
  code: { type: 'string', description: 'laminate code printed from the ply angles' },
  plyCount: { type: 'integer' }, thicknessMm: { type: 'number', description: 'mm' },
  plies: { type: 'array', items: { type: 'object', properties: { index: { type: 'integer' }, materialId: { type: 'integer' }, materialCode: { type: 'string' }, thetaDeg: { type: 'number' }, thicknessMm: { type: 'number' }, thicknessOverrideMm: nullable('number'), lamina: { type: 'object' }, laminaIndex: { type: 'integer' } } } },
  laminae: {
    type: 'array',
    items: {
      type: 'object',
      properties: {
        index: { type: 'integer' }, materialId: { type: 'integer' }, materialCode: { type: 'string' }, materialName: { type: 'string' },
        source: { type: 'string' }, conditionId: { type: 'integer' }, conditionCode: { type: 'string' }, basis: nullable('string'),
        approval: { type: 'string', enum: ['approved', 'partly-approved', 'unapproved', 'typical'], description: 'badge unless approved' },
        values: ref('LaminatePlyMaterial'),
        fields: { type: 'object', description: 'per lamina field: { value, origin: approved | unapproved | typical, allowableId?, allowableRevision?, allowableStatus?, property }' },
        missing: { type: 'array', items: { type: 'string' } }, allowableIds: { type: 'array', items: { type: 'integer' } },
      },
    },
  },
  settings: { type: 'object' }, engineVersion: { type: 'string' },
  laminate: { type: 'object', description: 'the laminate engine input computed on (the JSON plyledger laminate / section read)' },
  analysis: ref('LaminateAnalysis'),
  allowables: { type: 'array', items: { type: 'object', properties: { allowableId: { type: 'integer' }, laminaIndex: { type: 'integer' }, fields: { type: 'array', items: { type: 'string' } } } } },
  impact: { type: 'array', items: ref('LayupImpact') },
};

const side = {
  type: 'object',
  properties: {
    revisionId: { type: 'integer' }, layupId: { type: 'integer' }, name: { type: 'string' }, revision: { type: 'integer' }, code: { type: 'string' },
    plyCount: { type: 'integer' }, thicknessMm: { type: 'number' }, arealMass: { type: 'number', description: 'kg/m²' },
    A: matrix('N/mm'), B: matrix('N'), D: matrix('N·mm'), H: matrix('N/mm'), membrane: { type: 'object' }, flexural: { type: 'object' },
    firstPlyFailure: { type: ['object', 'null'], description: 'per criterion, as the laminate engine; null without loads' },
    impact: { type: 'array', items: ref('LayupImpact') },
  },
};

const created = { 201: json(ref('LayupRevision'), 'Saved: the new revision') };

export const layupsOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/layups': {
      get: operation({ summary: 'Layups with their latest revision', tags, parameters: [queryParam('q', { type: 'string' }, 'text in the name or description')], responses: { 200: json({ type: 'object', properties: { items: { type: 'array', items: ref('LayupSummary') } } }) }, errors: [400] }),
      post: operation({ summary: 'Create a layup (revision 1): lamina data resolved from the catalogue, laminate analysed, allowables used recorded; audited', tags, roles: LAYUP_EDITORS, body: ref('LayupDraft'), responses: created, errors: [400, 409] }),
    },
    '/api/v1/layups/preview': {
      post: operation({ summary: 'Resolve and analyse a draft without saving (live results of the composer)', tags, body: ref('LayupDraft'), responses: { 200: json({ type: 'object', properties: computed }) }, errors: [400] }),
    },
    '/api/v1/layups/compare': {
      post: operation({
        summary: 'Two layup revisions side by side: stiffness and first-ply failure under one load case', tags,
        description: 'loads, criteria and factorOfSafety default to those saved with revision a; without loads there is no failure part.',
        body: { type: 'object', required: ['a', 'b'], properties: { a: { type: 'integer', description: 'layup revision id' }, b: { type: 'integer' }, loads: { type: 'object' }, criteria: { type: 'array', items: { type: 'string' } }, factorOfSafety: { type: 'number' } } },
        responses: { 200: json({ type: 'object', properties: { loads: { type: ['object', 'null'] }, criteria: { type: 'array', items: { type: 'string' } }, factorOfSafety: { type: 'number' }, a: side, b: side } }) }, errors: [400, 404],
      }),
    },
    '/api/v1/layups/{id}': {
      get: operation({ summary: 'A layup with its revision history and its latest revision', tags, parameters: [idParam()], responses: { 200: json(ref('LayupDetail')) }, errors: [400, 404] }),
    },
    '/api/v1/layups/{id}/revisions': {
      post: operation({
        summary: 'Save a new revision of a layup', tags, roles: LAYUP_EDITORS, parameters: [idParam()],
        description: '409 when basedOnRevision is not the latest revision (someone saved in between).',
        body: { allOf: [ref('LayupDraft'), { type: 'object', required: ['basedOnRevision'], properties: { basedOnRevision: { type: 'integer' } } }] },
        responses: created, errors: [400, 404, 409],
      }),
    },
    '/api/v1/layups/{id}/duplicate': {
      post: operation({
        summary: 'A new layup from a revision of this one (lamina data read again)', tags, roles: LAYUP_EDITORS, parameters: [idParam()],
        body: { type: 'object', required: ['name'], properties: { name: { type: 'string' }, description: nullable('string'), revisionId: { type: 'integer', description: 'default: the latest' } } },
        responses: created, errors: [400, 404, 409],
      }),
    },
    '/api/v1/layup-revisions/{id}': {
      get: operation({ summary: 'A layup revision: plies, lamina data it was computed on, analysis, impact', tags, parameters: [idParam()], responses: { 200: json(ref('LayupRevision')) }, errors: [400, 404] }),
    },
  },
  schemas: {
    LaminaChoice: laminaChoice,
    LayupDraft: { type: 'object', description: 'plies, or code + material', properties: draftProperties },
    LayupImpact: impact,
    LayupRevision: {
      type: 'object',
      properties: {
        id: { type: 'integer' }, layupId: { type: 'integer' }, revision: { type: 'integer' }, isLatest: { type: 'boolean' },
        name: { type: 'string' }, description: nullable('string'), comment: nullable('string'), createdAt: { type: 'string', format: 'date-time' }, createdBy: person,
        ...computed,
      },
    },
    LayupSummary: {
      type: 'object',
      properties: {
        id: { type: 'integer' }, name: { type: 'string' }, description: nullable('string'), owner: person, createdAt: { type: 'string', format: 'date-time' },
        revisionCount: { type: 'integer' }, impactCount: { type: 'integer', description: 'impact entries of the latest revision' },
        latest: { type: 'object', properties: { id: { type: 'integer' }, revision: { type: 'integer' }, code: { type: 'string' }, plyCount: { type: 'integer' }, thicknessMm: { type: 'number' }, createdAt: { type: 'string' }, createdBy: person } },
      },
    },
    LayupDetail: {
      type: 'object',
      properties: {
        id: { type: 'integer' }, name: { type: 'string' }, description: nullable('string'), owner: person, createdAt: { type: 'string', format: 'date-time' },
        revisions: { type: 'array', items: { type: 'object', properties: { id: { type: 'integer' }, revision: { type: 'integer' }, name: { type: 'string' }, comment: nullable('string'), code: { type: 'string' }, plyCount: { type: 'integer' }, thicknessMm: { type: 'number' }, createdAt: { type: 'string' }, createdBy: person, impactCount: { type: 'integer' } } } },
        latest: ref('LayupRevision'),
      },
    },
  },
};
