/** OpenAPI fragment of the section export routes and of an allowable's impact (exports.routes.ts). */
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { SECTION_CAUTION, SECTION_FORMATS, UNIT_SYSTEM_NAMES } from '../sections/index.ts';
import { idParam, json, nullable, operation, queryParam, ref } from '../shared/openapi-parts.ts';
import { DEFAULT_CHECKS } from './exports.service.ts';
import { EXPORTERS } from './exports.routes.ts';

const tags = ['section exports'];
const person = { type: 'object', properties: { id: { type: 'integer' }, name: { type: 'string' } } };

const requestProperties = {
  layupRevisionId: { type: 'integer' },
  format: { type: 'string', enum: [...SECTION_FORMATS] },
  units: { type: 'string', enum: [...UNIT_SYSTEM_NAMES], description: 'unit system of the file, default N-mm-t' },
  propertyId: { type: 'integer', minimum: 1, maximum: 99999999, description: 'Nastran PID, default 1' },
  materialId: { type: 'integer', minimum: 1, maximum: 99999999, description: 'first Nastran MID, default 1' },
  elset: { type: 'string', description: 'element set of keyword sections, default LAMINATE' },
  referenceOffset: { type: 'number', description: 'reference surface from the mid-plane in thicknesses: -0.5 bottom, 0 mid-plane, 0.5 top' },
  freeField: { type: 'boolean', description: 'Nastran free field' },
};

const fileReply = (description: string) => ({
  description,
  headers: {
    'Content-Disposition': { schema: { type: 'string' }, description: 'attachment; filename="..."' },
    'X-Export-Id': { schema: { type: 'integer' } }, 'X-Export-Sha256': { schema: { type: 'string' } },
  },
  content: { 'text/plain': { schema: { type: 'string' } }, 'application/json': { schema: { type: 'object' } }, 'text/csv': { schema: { type: 'string' } } },
});

export const exportsOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/exports/preview': {
      post: operation({
        summary: 'The section file of a layup revision as it would be exported now, with the strip and plate checks; nothing recorded', tags,
        description: `Checks default to strip ${JSON.stringify(DEFAULT_CHECKS.strip)} and plate ${JSON.stringify(DEFAULT_CHECKS.plate)} (mm, N, MPa).`,
        body: { type: 'object', required: ['layupRevisionId', 'format'], properties: { ...requestProperties, checks: { type: 'object', properties: { strip: { type: 'object' }, plate: { type: 'object' } } } } },
        responses: {
          200: json({
            type: 'object',
            properties: {
              format: { type: 'string' }, units: { type: 'string' }, fileName: { type: 'string' }, contentType: { type: 'string' }, text: { type: 'string' },
              header: { type: 'object', properties: { layupName: { type: 'string' }, layupRevision: { type: 'string' }, allowables: { type: 'string' }, date: { type: 'string' } } },
              checks: { type: 'object', properties: { strip: { type: 'object' }, plate: { type: 'object' } } },
              impact: { type: 'array', items: ref('LayupImpact') },
            },
          }),
        },
        errors: [400],
      }),
    },
    '/api/v1/exports': {
      post: operation({
        summary: 'Export and record a layup revision\'s shell section (file stored with its SHA-256 and the allowables used; audited)', tags, roles: EXPORTERS,
        description: `The reply is the file (Location names the record); with ?reply=json the record with its text. Every file starts with the caution: "${SECTION_CAUTION}"`,
        parameters: [queryParam('reply', { type: 'string', enum: ['file', 'json'] }, 'file (default) or json')],
        body: { type: 'object', required: ['layupRevisionId', 'format'], properties: requestProperties },
        responses: { 201: fileReply('Recorded; the file') }, errors: [400],
      }),
      get: operation({
        summary: 'Recorded section exports, newest first', tags,
        parameters: [queryParam('layupId', { type: 'integer' }), queryParam('layupRevisionId', { type: 'integer' }), queryParam('allowableId', { type: 'integer' }, 'exports whose ply data used this allowable')],
        responses: { 200: json({ type: 'object', properties: { items: { type: 'array', items: ref('SectionExportSummary') } } }) }, errors: [400, 404],
      }),
    },
    '/api/v1/exports/{id}': {
      get: operation({ summary: 'A recorded export: options, allowables used, impact, and how to reproduce it with the CLI', tags, parameters: [idParam()], responses: { 200: json(ref('SectionExportDetail')) }, errors: [400, 404] }),
    },
    '/api/v1/exports/{id}/file': {
      get: operation({ summary: 'The stored file of a recorded export', tags, parameters: [idParam()], responses: { 200: fileReply('The file as recorded') }, errors: [400, 404] }),
    },
    '/api/v1/allowables/{id}/impact': {
      get: operation({
        summary: 'Layup revisions and section exports that used an allowable (for its page when it is superseded)', tags: ['allowables', ...tags], parameters: [idParam()],
        responses: {
          200: json({
            type: 'object',
            properties: {
              allowableId: { type: 'integer' }, status: { type: 'string' }, supersededBy: nullable('integer'),
              layups: { type: 'array', items: { type: 'object', properties: { layupId: { type: 'integer' }, name: { type: 'string' }, revisionId: { type: 'integer' }, revision: { type: 'integer' }, isLatest: { type: 'boolean' } } } },
              exports: { type: 'array', items: ref('SectionExportSummary') },
            },
          }),
        },
        errors: [400, 404],
      }),
    },
  },
  schemas: {
    SectionExportSummary: {
      type: 'object',
      properties: {
        id: { type: 'integer' }, layupId: { type: 'integer' }, layupRevisionId: { type: 'integer' }, layupName: { type: 'string' }, layupRevision: { type: 'integer' },
        format: { type: 'string' }, units: { type: 'string' }, fileName: { type: 'string' }, sha256: { type: 'string' }, bytes: { type: 'integer' },
        createdAt: { type: 'string', format: 'date-time' }, createdBy: person, impactCount: { type: 'integer' },
      },
    },
    SectionExportDetail: {
      allOf: [ref('SectionExportSummary'), {
        type: 'object',
        properties: {
          options: { type: 'object' }, date: { type: 'string', description: 'the header date (UTC day of the export)' }, allowablesText: { type: 'string' },
          allowables: { type: 'array', items: { type: 'object' } }, engineVersion: { type: 'string' }, sectionWriterVersion: { type: 'string' }, contentType: { type: 'string' },
          impact: { type: 'array', items: ref('LayupImpact') },
          reproduce: { type: 'object', description: 'plyledger section <cliArgs> FILE, with laminate written to FILE, prints the recorded text', properties: { laminate: { type: 'object' }, cliArgs: { type: 'array', items: { type: 'string' } } } },
        },
      }],
    },
  },
};
