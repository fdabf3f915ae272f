/** OpenAPI fragment of the analysis routes (analyses.routes.ts). */
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { idParam, json, nullable, operation, queryParam, ref } from '../shared/openapi-parts.ts';
import { BASIS_METHODS } from '../statistics/index.ts';
import { ANALYSTS_OF_COUPONS } from './analyses.routes.ts';
import { ANALYSIS_QUANTITIES } from './data-group.ts';

const tags = ['analyses'];
const methods = ['auto', ...BASIS_METHODS];

export const analysesOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/analyses': {
      get: operation({
        summary: 'Analyses, newest first', tags,
        parameters: [
          queryParam('material', { type: 'integer' }), queryParam('property', { type: 'string' }), queryParam('quantity', { type: 'string', enum: [...ANALYSIS_QUANTITIES] }),
          queryParam('condition', { type: 'string' }, 'condition code'), queryParam('limit', { type: 'integer', minimum: 1, maximum: 200 }), queryParam('beforeId', { type: 'integer' }),
        ],
        responses: { 200: json({ type: 'object', properties: { items: { type: 'array', items: ref('AnalysisSummary') }, next: nullable('object') } }) },
        errors: [400],
      }),
      post: operation({
        summary: 'Run the statistics engine on the valid coupons of a data group and store the analysis', tags, roles: ANALYSTS_OF_COUPONS,
        description: 'Fibre-dominated strengths and moduli are normalised to the nominal cured ply thickness first. Several conditions pool them (Levene, pooled SD / CV methods, one basis value per condition in result.byCondition). A method other than auto needs methodOverrideReason.',
        body: {
          type: 'object', required: ['materialId', 'property', 'conditions'],
          properties: {
            materialId: { type: 'integer' }, property: { type: 'string', description: 'test property code, e.g. tension-0' },
            quantity: { type: 'string', enum: [...ANALYSIS_QUANTITIES], default: 'strength' },
            conditions: { type: 'array', items: { type: 'string' }, minItems: 1, description: 'condition codes' },
            basis: { type: 'string', enum: ['A', 'B', 'both'], default: 'both' },
            method: { type: 'string', enum: methods, default: 'auto' },
            methodOverrideReason: { type: 'string' },
            modifiedCv: { type: 'boolean', default: false },
          },
        },
        responses: { 201: json(ref('AnalysisDetail'), 'Stored') }, errors: [400, 404],
      }),
    },
    '/api/v1/analyses/{id}': {
      get: operation({ summary: 'One analysis with the engine result, its input and the coupons', tags, parameters: [idParam()], responses: { 200: json(ref('AnalysisDetail')) }, errors: [404] }),
    },
    '/api/v1/analyses/{id}/override': {
      post: operation({
        summary: 'Run the same input again with a chosen method (a new analysis with the reason)', tags, roles: ANALYSTS_OF_COUPONS, parameters: [idParam()],
        body: { type: 'object', required: ['method', 'reason'], properties: { method: { type: 'string', enum: [...BASIS_METHODS] }, reason: { type: 'string' } } },
        responses: { 201: json(ref('AnalysisDetail'), 'Stored') }, errors: [400, 404],
      }),
    },
  },
  schemas: {
    AnalysisSummary: {
      type: 'object',
      properties: {
        id: { type: 'integer' }, material: { type: 'object', properties: { id: { type: 'integer' }, code: { type: 'string' } } }, property: { type: 'string' },
        quantity: { type: 'string', enum: [...ANALYSIS_QUANTITIES] }, unit: { type: 'string', description: 'MPa for strength and modulus, 1 for strain' },
        conditions: { type: 'array', items: { type: 'object', properties: { id: { type: 'integer' }, code: { type: 'string' } } } },
        basis: { type: 'string' }, modifiedCv: { type: 'boolean' }, normalised: { type: 'boolean' },
        methodRequested: { type: 'string', enum: methods }, methodUsed: { type: 'string' }, methodOverrideReason: nullable('string'), overrideOf: nullable('integer'),
        n: { type: 'integer' }, bBasis: nullable('number', { description: 'single condition only; pooled: see result.byCondition' }), aBasis: nullable('number'),
        provisional: { type: 'boolean' }, engineVersion: { type: 'string' },
        createdBy: { type: 'object', properties: { id: { type: 'integer' }, name: { type: 'string' } } }, createdAt: { type: 'string', format: 'date-time' },
      },
    },
    AnalysisDetail: {
      allOf: [ref('AnalysisSummary'), {
        type: 'object',
        properties: {
          nominalCuredPlyThicknessMm: nullable('number'),
          engineInput: { type: 'object', description: 'exactly what the engine was given (values, batches, conditions?, basis, method, modifiedCv); `plyledger basis` on it reproduces result' },
          coupons: { type: 'array', items: { type: 'object', properties: { specimenId: { type: 'integer' }, specimenCode: { type: 'string' }, batch: { type: 'string' }, condition: { type: 'string' }, uploadId: { type: 'integer' }, thicknessMm: { type: 'number' }, plyCount: { type: 'integer' }, rawValue: { type: 'number' }, value: { type: 'number', description: 'as analysed (normalised where that applies)' }, normalised: { type: 'boolean' } } } },
          result: { type: 'object', description: 'the statistics engine result: n, mean, sd, cv, method, bBasis, aBasis, provisional, warnings, outliers, batchEquivalence, fits, nonparametric, anova?, levene?, byBatch, byCondition?, decision, engineVersion' },
        },
      }],
    },
  },
};
