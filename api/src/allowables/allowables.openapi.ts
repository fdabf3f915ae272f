/** OpenAPI fragment of allowables and reviews (allowables.routes.ts). */
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { idParam, json, nullable, operation, queryParam, ref } from '../shared/openapi-parts.ts';
import { PROPOSERS, REVIEWERS, STATUSES } from './allowables.routes.ts';
import { SIGNATURE_MEANINGS } from './allowables.wire.ts';

const tags = ['allowables'];
const person = { type: 'object', properties: { id: { type: 'integer' }, name: { type: 'string' } } };
const idCode = { type: 'object', properties: { id: { type: 'integer' }, code: { type: 'string' } } };
const filters = [
  queryParam('material', { type: 'integer' }), queryParam('property', { type: 'string' }), queryParam('quantity', { type: 'string', enum: ['strength', 'failure-strain'] }),
  queryParam('condition', { type: 'string' }, 'condition code'), queryParam('basis', { type: 'string', enum: ['A', 'B'] }), queryParam('analysis', { type: 'integer' }),
];
const decisionBody = (meaning: string) => ({
  type: 'object', required: ['comment', 'signatureMeaning'],
  properties: { comment: { type: 'string' }, signatureMeaning: { type: 'string', description: `the statement signed, sent back unchanged: "${meaning}"` } },
});

export const allowablesOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/allowables': {
      get: operation({
        summary: 'Allowables by material, property, condition and basis (all revisions; filter status=approved for the current values)', tags,
        parameters: [...filters, queryParam('status', { type: 'string' }, `comma-separated: ${STATUSES.join(', ')}`)],
        responses: { 200: json({ type: 'object', properties: { items: { type: 'array', items: ref('Allowable') }, caution: { type: 'string' } } }) }, errors: [400],
      }),
      post: operation({
        summary: 'Propose an allowable from an analysis (or keep it as a draft); a proposal e-mails every quality reviewer', tags, roles: PROPOSERS,
        body: {
          type: 'object', required: ['analysisId', 'basis'],
          properties: {
            analysisId: { type: 'integer' }, basis: { type: 'string', enum: ['A', 'B'] },
            condition: { type: 'string', description: 'required when the analysis pooled several conditions' },
            comment: { type: 'string' }, submit: { type: 'boolean', default: true, description: 'false: a draft, proposed later' },
          },
        },
        responses: { 201: json(ref('AllowableDetail'), 'Created') }, errors: [400, 404, 409],
      }),
    },
    '/api/v1/allowables/approved.csv': {
      get: operation({
        summary: 'Approved allowables as CSV (first line: the engineering caution, as a # comment)', tags, parameters: filters,
        responses: { 200: { description: 'CSV', content: { 'text/csv': { schema: { type: 'string' } } } } }, errors: [400],
      }),
    },
    '/api/v1/allowables/{id}': {
      get: operation({ summary: 'An allowable with its revision history, the chain to analysis, coupons and uploads, and its e-mail', tags, parameters: [idParam()], responses: { 200: json(ref('AllowableDetail')) }, errors: [404] }),
      delete: operation({ summary: 'Withdraw a draft (its author only)', tags, roles: PROPOSERS, parameters: [idParam()], responses: { 204: { description: 'Withdrawn' } }, errors: [404, 409] }),
    },
    '/api/v1/allowables/{id}/propose': {
      post: operation({ summary: 'Send a draft to review (its author only)', tags, roles: PROPOSERS, parameters: [idParam()], responses: { 200: json(ref('AllowableDetail')) }, errors: [404, 409] }),
    },
    '/api/v1/allowables/{id}/approve': {
      post: operation({
        summary: 'Approve a proposed allowable (not your own); supersedes the approved revision before it; e-mails the proposer', tags, roles: REVIEWERS, parameters: [idParam()],
        description: 'Errors: 403 own_proposal, 409 already_decided (someone decided first) or conflict.', body: decisionBody(SIGNATURE_MEANINGS.approve),
        responses: { 200: json(ref('AllowableDetail')) }, errors: [400, 404, 409],
      }),
    },
    '/api/v1/allowables/{id}/reject': {
      post: operation({
        summary: 'Reject a proposed allowable (not your own); e-mails the proposer', tags, roles: REVIEWERS, parameters: [idParam()],
        body: decisionBody(SIGNATURE_MEANINGS.reject), responses: { 200: json(ref('AllowableDetail')) }, errors: [400, 404, 409],
      }),
    },
    '/api/v1/reviews': {
      get: operation({
        summary: 'The review queue: proposed allowables, oldest first (ownProposal: the caller proposed it and may not decide it)', tags,
        responses: { 200: json({ type: 'object', properties: { items: { type: 'array', items: { allOf: [ref('Allowable'), { type: 'object', properties: { ownProposal: { type: 'boolean' } } }] } } } }) },
      }),
    },
  },
  schemas: {
    Allowable: {
      type: 'object',
      properties: {
        id: { type: 'integer' }, material: idCode, property: { type: 'string' }, quantity: { type: 'string', enum: ['strength', 'failure-strain'] }, condition: idCode,
        basis: { type: 'string', enum: ['A', 'B'] }, value: { type: 'number', description: 'in unit' }, unit: { type: 'string', enum: ['MPa', '1'] },
        analysisId: { type: 'integer' }, method: { type: 'string' }, provisional: { type: 'boolean' }, revision: { type: 'integer' },
        status: { type: 'string', enum: [...STATUSES] }, proposer: person, proposalComment: nullable('string'), proposedAt: nullable('string', { format: 'date-time' }),
        reviewer: { oneOf: [person, { type: 'null' }] }, decidedAt: nullable('string', { format: 'date-time' }), decisionComment: nullable('string'),
        signatureMeaning: nullable('string', { description: 'the statement the reviewer signed' }), supersedesId: nullable('integer'), createdAt: { type: 'string', format: 'date-time' },
      },
    },
    AllowableDetail: {
      allOf: [ref('Allowable'), {
        type: 'object',
        properties: {
          supersededById: nullable('integer'),
          history: { type: 'array', items: ref('Allowable'), description: 'every revision of the key, newest first' },
          chain: { type: 'object', properties: { analysis: ref('AnalysisDetail'), coupons: { type: 'array', items: { type: 'object' }, description: 'coupons of this condition the analysis used, with their status now' }, uploads: { type: 'array', items: ref('Upload') } } },
          notifications: { type: 'array', items: ref('OutboxMessage') },
          signatureMeanings: { type: 'object', properties: { approve: { type: 'string' }, reject: { type: 'string' } } },
          caution: { type: 'string' },
        },
      }],
    },
  },
};
