import { expect } from 'chai';
import express from 'express';
import request from 'supertest';
import { laminateOpenApi, laminateRouter } from '../../api/src/calculations/laminate.routes.ts';
import { errorHandler } from '../../api/src/http/errors.ts';
import { analyseLaminate, parseLaminateInput } from '../../api/src/laminate/index.ts';
import { DEMO_CARBON } from './support/generators.ts';

const app = express().use(express.json({ limit: '5mb' })).use(laminateRouter).use(errorHandler);
const body = { code: '[0/±45/90]s', material: DEMO_CARBON, plyThickness: 0.125, loads: { N: [100, 0, 0] }, criteria: ['tsai-wu'] };

describe('laminate routes', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  it('POST /laminates/analyze returns what the engine returns', async () => {
    const res = await request(app).post('/laminates/analyze').send(body).expect(200);
    expect(res.body).to.deep.equal(JSON.parse(JSON.stringify(analyseLaminate(parseLaminateInput(body)))));
  });

  it('bad input is a 400 in the API error shape naming the field', async () => {
    const res = await request(app).post('/laminates/analyze').send({ ...body, material: { ...DEMO_CARBON, nu12: 5 } }).expect(400);
    expect(res.body.error.code).to.equal('invalid_input');
    expect(res.body.error.details.problems[0].field).to.equal('material.nu12');
    const empty = await request(app).post('/laminates/analyze').expect(400);
    expect(empty.body.error.details.problems[0].field).to.equal('input');
  });

  it('POST /laminates/envelope and /laminates/polar', async () => {
    const env = await request(app).post('/laminates/envelope').send({ code: '[0/90]s', material: DEMO_CARBON, plyThickness: 0.2, points: 8 }).expect(200);
    expect(env.body.points).to.have.length(8);
    const polar = await request(app).post('/laminates/polar').send({ code: '[0/90]s', material: DEMO_CARBON, plyThickness: 0.2, stepDeg: 45 }).expect(200);
    expect(polar.body.points).to.have.length(5);
  });

  it('OpenAPI lists the three operations with their schemas and units', () => {
    expect(Object.keys(laminateOpenApi.paths)).to.deep.equal(['/api/v1/laminates/analyze', '/api/v1/laminates/envelope', '/api/v1/laminates/polar']);
    const refs = JSON.stringify(laminateOpenApi.paths).match(/#\/components\/schemas\/(\w+)/g)!.map((r) => r.split('/').pop()!);
    for (const name of refs) expect(laminateOpenApi.schemas, name).to.have.property(name);
    expect(JSON.stringify(laminateOpenApi.schemas)).to.match(/N\/mm/).and.to.match(/MPa/);
    for (const op of Object.values(laminateOpenApi.paths)) expect((op.post as Record<string, unknown>)['x-roles']).to.equal(undefined);
  });
});
