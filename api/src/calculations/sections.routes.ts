/**
 * HTTP face of the section export (api/src/sections): POST a laminate and the
 * export options, get the file back (Content-Type and Content-Disposition),
 * and the built-in checks as JSON. Validation and mathematics live in the
 * engines; mounted under /api/v1 behind sign-in and CSRF by the app factory;
 * any signed-in user.
 */
import { Router } from 'express';
import type { OpenApiFragment } from '../http/openapi-types.ts';
import { SECTION_CAUTION, SECTION_FORMATS, UNIT_SYSTEM_NAMES, type SectionFile } from '../sections/index.ts';
import { runEngine, runEngineJson, sendJsonText } from './engine-runner.ts';

/** Quotes a file name for Content-Disposition (RFC 6266): ASCII fallback and the UTF-8 form. */
function contentDisposition(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]|["\\]/g, '_');
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}

export const sectionsRouter = Router();

sectionsRouter.post('/sections/checks/:check', async (req, res) => {
  sendJsonText(res, await runEngineJson('sections.check', { check: req.params.check, body: req.body }));
});

sectionsRouter.post('/sections/:format', async (req, res) => {
  const file = await runEngine<SectionFile>('sections.export', { format: req.params.format, body: req.body });
  res.set('Content-Type', file.contentType);
  res.set('Content-Disposition', contentDisposition(file.fileName));
  res.send(file.text);
});

const num = (description: string) => ({ type: 'number', description });
const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });
const problemsResponse = { $ref: '#/components/responses/InvalidInput' };
const unauthenticated = { $ref: '#/components/responses/Unauthenticated' };

export const sectionsOpenApi: OpenApiFragment = {
  paths: {
    '/api/v1/sections/{format}': {
      post: {
        summary: 'Export a laminate\'s shell section for a solver',
        description: `The section file in the solver's own syntax, starting with a header (product, engine version, layup, allowables, units, date) and the caution: "${SECTION_CAUTION}" Input in internal units (MPa, mm); the file in the chosen unit system.`,
        tags: ['sections'],
        parameters: [{ name: 'format', in: 'path', required: true, schema: { type: 'string', enum: [...SECTION_FORMATS] } }],
        requestBody: { required: true, content: { 'application/json': { schema: ref('SectionExportInput') } } },
        responses: {
          200: {
            description: 'The file; Content-Disposition names it (e.g. wing-skin-r3-calculix-n-mm-t.inp)',
            headers: { 'Content-Disposition': { schema: { type: 'string' }, description: 'attachment; filename="..."' } },
            content: {
              'text/plain': { schema: { type: 'string' }, description: 'nastran-pcomp, nastran-pshell (bulk data), calculix, general-shell (keyword deck)' },
              'application/json': { schema: { type: 'object' }, description: 'json' },
              'text/csv': { schema: { type: 'string' }, description: 'csv: group, name, i, j, value, unit' },
            },
          },
          400: problemsResponse,
          401: unauthenticated,
        },
      },
    },
    '/api/v1/sections/checks/{check}': {
      post: {
        summary: 'Built-in check of a section before export',
        description: 'strip: a laminated strip cantilever by Euler-Bernoulli beam elements (cubic Hermite, EI = width / d11) against the closed form. plate: a simply supported plate under uniform pressure by the Navier series and by Rayleigh-Ritz with D16, D26 kept; warnings when D16, D26 or B are not negligible. Both report deflections and the ratio to the other method.',
        tags: ['sections'],
        parameters: [{ name: 'check', in: 'path', required: true, schema: { type: 'string', enum: ['strip', 'plate'] } }],
        requestBody: { required: true, content: { 'application/json': { schema: ref('SectionCheckInput') } } },
        responses: {
          200: { description: 'The check, mm, N, MPa', content: { 'application/json': { schema: { type: 'object' } } } },
          400: problemsResponse,
          401: unauthenticated,
        },
      },
    },
  },
  schemas: {
    SectionExportInput: {
      type: 'object', required: ['laminate'],
      properties: {
        laminate: { description: 'the laminate, as for POST /api/v1/laminates/analyze: plies, or code + material + plyThickness', $ref: '#/components/schemas/LaminateInput' },
        options: ref('SectionExportOptions'),
      },
    },
    SectionExportOptions: {
      type: 'object',
      properties: {
        units: { type: 'string', enum: [...UNIT_SYSTEM_NAMES], description: 'unit system of the file, default N-mm-t' },
        propertyId: { type: 'integer', minimum: 1, maximum: 99999999, description: 'Nastran PID, default 1' },
        materialId: { type: 'integer', minimum: 1, maximum: 99999999, description: 'first Nastran MID, default 1' },
        elset: { type: 'string', description: 'element set of keyword sections, default LAMINATE' },
        referenceOffset: num('reference surface (nodes) from the mid-plane along the normal, in thicknesses: -0.5 bottom, 0 mid-plane, 0.5 top'),
        layupName: { type: 'string' }, layupRevision: { type: 'string' },
        allowables: { type: 'string', description: 'which allowables the ply strengths are, for the header' },
        date: { type: 'string', description: 'ISO date for the header, default today' },
        freeField: { type: 'boolean', description: 'Nastran free field instead of small field' },
        failureTheory: { type: 'string', enum: ['HILL', 'HOFF', 'TSAI', 'STRN'], description: 'PCOMP FT' },
        xAxis: { type: 'array', items: { type: 'number' }, minItems: 3, maxItems: 3, description: 'laminate x axis in model coordinates (CalculiX orientations), default [1, 0, 0]' },
        normal: { type: 'array', items: { type: 'number' }, minItems: 3, maxItems: 3, description: 'element normal in model coordinates, default [0, 0, 1]' },
      },
    },
    SectionCheckInput: {
      type: 'object', required: ['laminate'],
      properties: {
        laminate: { $ref: '#/components/schemas/LaminateInput' },
        strip: { type: 'object', required: ['widthMm', 'lengthMm', 'tipLoadN', 'elements'], properties: { widthMm: num('mm'), lengthMm: num('mm, clamp to load'), tipLoadN: num('N'), elements: { type: 'integer', minimum: 1, maximum: 10000 } } },
        plate: { type: 'object', required: ['aMm', 'bMm', 'pressureMPa'], properties: { aMm: num('mm along x'), bMm: num('mm along y'), pressureMPa: num('MPa'), maxTerm: { type: 'integer', description: 'largest odd Navier term, default 199' }, ritzTerms: { type: 'integer', minimum: 3, maximum: 24, description: 'Ritz sine terms a direction, default 14' } } },
      },
    },
  },
};
