/** OpenAPI fragment of the coupon routes (coupons.routes.ts). */
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { idParam, json, nullable, operation, queryParam, ref } from '../shared/openapi-parts.ts';
import { COUPON_EDITORS } from './coupons.routes.ts';
import { MAX_UPLOAD_BYTES, MAX_UPLOAD_ROWS } from './import.service.ts';
import { TEMPLATE_FIELDS, templateHeader } from './csv-template.ts';
import { FORCE_UNITS, LENGTH_UNITS, STRESS_UNITS, US_UNITS } from './csv-units.ts';
import { SORTABLE } from './specimens.queries.ts';

const tags = ['coupons'];
const idName = { type: 'object', properties: { id: { type: 'integer' }, code: nullable('string') } };

const templateDescription = TEMPLATE_FIELDS.map((f) => `- \`${templateHeader(f)}\` / \`${templateHeader(f, US_UNITS)}\`${f.required ? ' (required)' : ''}: ${f.description}`).join('\n');

export const couponsOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/uploads/template.csv': {
      get: {
        ...operation({
          summary: 'The coupon upload template (header and one example row)', tags,
          description: `Columns, SI / US spelling:\n${templateDescription}\nAt least one of strength, modulus, failure_strain, poisson_ratio per row.`,
          parameters: [queryParam('units', { type: 'string', enum: ['SI', 'US'], default: 'SI' }, 'SI: mm, N, MPa, GPa; US: in, lbf, ksi, Msi')],
          responses: { 200: { description: 'CSV file', content: { 'text/csv': { schema: { type: 'string' } } } } },
        }),
      },
    },
    '/api/v1/uploads': {
      get: operation({
        summary: 'Uploads, newest first', tags,
        parameters: [queryParam('limit', { type: 'integer', minimum: 1, maximum: 200, default: 50 }), queryParam('beforeId', { type: 'integer' }, 'paging: uploads older than this id')],
        responses: { 200: json({ type: 'object', properties: { items: { type: 'array', items: ref('Upload') }, next: nullable('object') } }) },
      }),
      post: operation({
        summary: 'Upload a CSV of coupon results: validated row by row, stored in one transaction (all or nothing)', tags, roles: COUPON_EDITORS,
        description:
          `Multipart form. Limits: ${MAX_UPLOAD_BYTES / 1024 / 1024} MB and ${MAX_UPLOAD_ROWS} rows (413 csv_too_large / csv_too_many_rows). ` +
          'Refusals: 400 csv_empty, csv_encoding (not UTF-8; a UTF-8 BOM is fine), csv_delimiter (not commas), csv_wrong_header, csv_missing_columns, ' +
          'csv_invalid_mapping, csv_invalid_rows (details.problems: every problem with row, column, field, code, message, fix; details.problemCount); ' +
          '409 csv_duplicate_file (same SHA-256 imported before; details.upload). Batches and panels the file names that are not registered yet are registered with it.',
        bodyContentType: 'multipart/form-data',
        body: {
          type: 'object', required: ['file'],
          properties: {
            file: { type: 'string', format: 'binary', description: 'the CSV file, UTF-8, comma-delimited, header on the first line' },
            columns: { type: 'string', description: 'JSON object: template field -> column header of the file (fields not given are found by the template names)' },
            stressUnit: { type: 'string', enum: [...STRESS_UNITS], description: 'strength in MPa or ksi; modulus then in GPa or Msi' },
            lengthUnit: { type: 'string', enum: [...LENGTH_UNITS] },
            forceUnit: { type: 'string', enum: [...FORCE_UNITS] },
          },
        },
        responses: { 201: json(ref('UploadResult'), 'Imported') },
        errors: [400, 409, 413],
      }),
    },
    '/api/v1/uploads/{id}': {
      get: operation({ summary: 'One upload', tags, parameters: [idParam()], responses: { 200: json(ref('Upload')) }, errors: [404] }),
    },
    '/api/v1/uploads/{id}/file': {
      get: operation({
        summary: 'The stored file, byte for byte as uploaded', tags, parameters: [idParam()],
        responses: { 200: { description: 'the file', content: { 'text/csv': { schema: { type: 'string' } } } } }, errors: [404],
      }),
    },
    '/api/v1/specimens': {
      get: operation({
        summary: 'Coupons, paged, sorted and filtered on the server', tags,
        parameters: [
          queryParam('material', { type: 'integer' }, 'material id'),
          queryParam('property', { type: 'string' }, 'test property code'),
          queryParam('condition', { type: 'string' }, 'condition code, e.g. RTD'),
          queryParam('batch', { type: 'integer' }, 'batch id'),
          queryParam('upload', { type: 'integer' }, 'upload id'),
          queryParam('status', { type: 'string', enum: ['valid', 'excluded'] }),
          queryParam('q', { type: 'string' }, 'specimen id starts with'),
          queryParam('sort', { type: 'string', enum: Object.keys(SORTABLE), default: 'specimenCode' }),
          queryParam('order', { type: 'string', enum: ['asc', 'desc'], default: 'asc' }),
          queryParam('page', { type: 'integer', minimum: 1, default: 1 }),
          queryParam('pageSize', { type: 'integer', minimum: 1, maximum: 200, default: 50 }),
        ],
        responses: { 200: json({ type: 'object', properties: { items: { type: 'array', items: ref('Specimen') }, total: { type: 'integer' }, page: { type: 'integer' }, pageSize: { type: 'integer' }, pageCount: { type: 'integer' } } }) },
        errors: [400],
      }),
    },
    '/api/v1/data-groups': {
      get: operation({
        summary: 'Data groups of a material: per test property and condition, valid and excluded coupon counts and batches', tags,
        parameters: [{ ...queryParam('material', { type: 'integer' }, 'material id'), required: true }],
        responses: { 200: json({ type: 'object', properties: { items: { type: 'array', items: { type: 'object', properties: { property: { type: 'string' }, condition: idName, valid: { type: 'integer' }, excluded: { type: 'integer' }, batches: { type: 'integer' } } } } } }) },
        errors: [400],
      }),
    },
    '/api/v1/specimens/{id}': {
      get: operation({ summary: 'One coupon', tags, parameters: [idParam()], responses: { 200: json(ref('Specimen')) }, errors: [404] }),
    },
    '/api/v1/specimens/{id}/exclude': {
      post: operation({
        summary: 'Exclude a coupon from analyses, with the reason (audited)', tags, roles: COUPON_EDITORS, parameters: [idParam()],
        body: { type: 'object', required: ['reason'], properties: { reason: { type: 'string' } } },
        responses: { 200: json(ref('Specimen')) }, errors: [400, 404, 409],
      }),
    },
    '/api/v1/specimens/{id}/restore': {
      post: operation({
        summary: 'Restore an excluded coupon, with the reason (audited)', tags, roles: COUPON_EDITORS, parameters: [idParam()],
        body: { type: 'object', required: ['reason'], properties: { reason: { type: 'string' } } },
        responses: { 200: json(ref('Specimen')) }, errors: [400, 404, 409],
      }),
    },
  },
  schemas: {
    Upload: {
      type: 'object',
      properties: {
        id: { type: 'integer' }, fileName: { type: 'string' }, sha256: { type: 'string' }, sizeBytes: { type: 'integer' }, rowCount: { type: 'integer' },
        contentType: { type: 'string' },
        columnMapping: { type: 'object', additionalProperties: { type: 'string' }, description: 'template field -> header used' },
        units: { type: 'object', additionalProperties: { type: 'string' }, description: 'template field -> unit the file was read in' },
        createdBatches: { type: 'array', items: { type: 'string' } }, createdPanels: { type: 'array', items: { type: 'string' } },
        invented: { type: 'boolean' }, uploadedBy: { type: 'object', properties: { id: { type: 'integer' }, name: { type: 'string' } } },
        uploadedAt: { type: 'string', format: 'date-time' },
      },
    },
    UploadResult: {
      type: 'object',
      properties: {
        upload: ref('Upload'),
        columns: { type: 'array', items: { type: 'object', properties: { field: { type: 'string' }, header: { type: 'string' }, unit: nullable('string') } } },
        ignoredColumns: { type: 'array', items: { type: 'string' }, description: 'headers of the file that no template field reads' },
      },
    },
    Specimen: {
      type: 'object',
      properties: {
        id: { type: 'integer' }, specimenCode: { type: 'string' }, material: idName, batch: idName, panel: { oneOf: [idName, { type: 'null' }] },
        testMethod: idName, property: { type: 'string' }, condition: idName,
        widthMm: { type: 'number' }, thicknessMm: { type: 'number' }, plyCount: { type: 'integer' }, failureLoadN: nullable('number'),
        strengthMpa: nullable('number'), modulusMpa: nullable('number', { description: 'MPa (internal unit)' }), poissonRatio: nullable('number'),
        failureStrain: nullable('number', { description: 'dimensionless' }), failureMode: nullable('string'), testDate: { type: 'string', format: 'date' },
        laboratory: { type: 'string' }, status: { type: 'string', enum: ['valid', 'excluded'] }, statusReason: nullable('string'),
        statusChangedBy: { oneOf: [{ type: 'object', properties: { id: { type: 'integer' }, name: { type: 'string' } } }, { type: 'null' }] },
        statusChangedAt: nullable('string', { format: 'date-time' }), uploadId: { type: 'integer' }, uploadRow: { type: 'integer', description: 'row in the file, header = 1' },
      },
    },
  },
};
