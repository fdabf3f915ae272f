/** POST /sections/:format and /sections/checks/:check (mounted under /api/v1 by the app; here bare). */
import { expect } from 'chai';
import express from 'express';
import request from 'supertest';
import { sectionsOpenApi, sectionsRouter } from '../../api/src/calculations/sections.routes.ts';
import { errorHandler } from '../../api/src/http/errors.ts';
import { readSection, SECTION_FORMATS } from '../../api/src/sections/index.ts';

const app = express().use(express.json()).use(sectionsRouter).use(errorHandler);

const MATERIAL = { name: 'FR-UC300', E1: 135000, E2: 9000, G12: 5000, nu12: 0.3, density: 1550 };
const LAMINATE = { code: '[0/90]s', material: MATERIAL, plyThickness: 0.25 };

describe('POST /sections/:format', () => {
  for (const format of SECTION_FORMATS) {
    it(`${format}: 200 with the file, its content type and a Content-Disposition naming it`, async () => {
      const res = await request(app).post(`/sections/${format}`)
        .send({ laminate: LAMINATE, options: { units: 'lbf-in', layupName: 'Nacelle door', layupRevision: '2', date: '2026-12-03' } })
        .buffer(true).parse((r, done) => { let t = ''; r.setEncoding('utf8'); r.on('data', (c: string) => (t += c)); r.on('end', () => done(null, t)); });
      expect(res.status).to.equal(200);
      expect(res.headers['content-disposition']).to.match(/^attachment; filename="nacelle-door-r2-[a-z-]+-lbf-in\.(bdf|inp|json|csv)"/);
      expect(res.headers['content-type']).to.match(format === 'json' ? /application\/json/ : format === 'csv' ? /text\/csv/ : /text\/plain/);
      const text = res.body as string;
      expect(text).to.include('Plyledger');
      expect(readSection(format, text).unitSystem).to.equal('lbf-in');
    });
  }

  it('400 naming a misspelt option rather than exporting with the default', async () => {
    const res = await request(app).post('/sections/calculix').send({ laminate: LAMINATE, options: { unit: 'lbf-in' } });
    expect(res.status).to.equal(400);
    expect(res.body.error.details.problems[0].field).to.equal('options.unit');
  });

  it('400 in the API error shape for an unknown format', async () => {
    const res = await request(app).post('/sections/step').send({ laminate: LAMINATE });
    expect(res.status).to.equal(400);
    expect(res.body.error.code).to.equal('invalid_input');
    expect(res.body.error.details.problems[0].field).to.equal('format');
  });

  it('400 naming the field for bad laminate input, bad options and unknown body fields', async () => {
    const bad = await request(app).post('/sections/calculix').send({ laminate: { ...LAMINATE, plyThickness: -1 } });
    expect(bad.status).to.equal(400);
    expect(bad.body.error.details.problems.map((p: { field: string }) => p.field)).to.include('plyThickness');
    const options = await request(app).post('/sections/calculix').send({ laminate: LAMINATE, options: { elset: '1 bad name' } });
    expect(options.status).to.equal(400);
    expect(options.body.error.details.problems[0].field).to.equal('options.elset');
    const extra = await request(app).post('/sections/calculix').send({ laminate: LAMINATE, colour: 'red' });
    expect(extra.status).to.equal(400);
    expect(extra.body.error.details.problems[0].field).to.equal('colour');
    const missing = await request(app).post('/sections/calculix').send({});
    expect(missing.status).to.equal(400);
    expect(missing.body.error.details.problems[0].field).to.equal('laminate');
  });
});

describe('POST /sections/checks/:check', () => {
  it('strip and plate: 200 with the check as JSON', async () => {
    const strip = await request(app).post('/sections/checks/strip').send({ laminate: LAMINATE, strip: { widthMm: 20, lengthMm: 100, tipLoadN: 2, elements: 4 } });
    expect(strip.status).to.equal(200);
    expect(Math.abs(strip.body.tip.ratio - 1)).to.be.below(1e-9);
    const plate = await request(app).post('/sections/checks/plate').send({ laminate: LAMINATE, plate: { aMm: 200, bMm: 200, pressureMPa: 0.001 } });
    expect(plate.status).to.equal(200);
    expect(plate.body.navier.converged).to.equal(true);
  });

  it('400 naming the field for missing check parameters', async () => {
    const res = await request(app).post('/sections/checks/strip').send({ laminate: LAMINATE });
    expect(res.status).to.equal(400);
    expect(res.body.error.details.problems.map((p: { field: string }) => p.field)).to.include('strip.widthMm');
  });
});

describe('sections OpenAPI fragment', () => {
  it('documents both paths, every format and the options', () => {
    expect(Object.keys(sectionsOpenApi.paths)).to.deep.equal(['/api/v1/sections/{format}', '/api/v1/sections/checks/{check}']);
    const parameters = (sectionsOpenApi.paths['/api/v1/sections/{format}'].post as { parameters: { schema: { enum: string[] } }[] }).parameters;
    expect(parameters[0].schema.enum).to.deep.equal([...SECTION_FORMATS]);
    expect(Object.keys(sectionsOpenApi.schemas ?? {})).to.include.members(['SectionExportInput', 'SectionExportOptions', 'SectionCheckInput']);
  });
});
