/**
 * The `basis` CLI command (through runCli with buffer io) and
 * POST /statistics/basis (supertest on a minimal app), plus the OpenAPI
 * fragment. Both faces must return exactly what the engine returns.
 */
import { expect } from 'chai';
import express from 'express';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { statisticsOpenApi, statisticsRouter } from '../../api/src/calculations/statistics.routes.ts';
import { runCli } from '../../api/src/cli/main.ts';
import type { CliIo } from '../../api/src/cli/command.ts';
import { errorHandler } from '../../api/src/http/errors.ts';
import { analyseDataGroup } from '../../api/src/statistics/index.ts';
import { STAT17_18_VALUES } from './support/handbook-data.ts';
import { batchLabels } from './support/random.ts';

const input = { values: STAT17_18_VALUES, batches: batchLabels(18, 3) };

function bufferIo(stdin = ''): { io: CliIo; out: () => string; err: () => string } {
  let out = '';
  let err = '';
  return { io: { stdout: (t) => (out += t), stderr: (t) => (err += t), readStdin: async () => stdin }, out: () => out, err: () => err };
}

describe('CLI: plyledger basis', () => {
  it('reads standard input and prints the engine result as JSON', async () => {
    const b = bufferIo(JSON.stringify(input));
    expect(await runCli(['basis'], b.io)).to.equal(0);
    expect(JSON.parse(b.out())).to.deep.equal(JSON.parse(JSON.stringify(analyseDataGroup(input))));
  });

  it('reads a FILE argument', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'plyledger-basis-'));
    try {
      const file = join(dir, 'group.json');
      await writeFile(file, JSON.stringify({ ...input, basis: 'B' }));
      const b = bufferIo();
      expect(await runCli(['basis', file], b.io)).to.equal(0);
      const result = JSON.parse(b.out());
      expect(result.aBasis).to.equal(null);
      expect(result.bBasis).to.be.a('number');
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });

  it('exits 2 with one line naming the field for bad input', async () => {
    const b = bufferIo(JSON.stringify({ values: [1, 2, 3], batches: ['a'] }));
    expect(await runCli(['basis'], b.io)).to.equal(2);
    expect(b.err()).to.match(/^plyledger basis: batches: has 1 entries but values has 3/);
    expect(b.err().trim().split('\n')).to.have.length(1);
    const notJson = bufferIo('{ values: ');
    expect(await runCli(['basis'], notJson.io)).to.equal(2);
    expect(notJson.err()).to.match(/not valid JSON/);
  });

  it('prints usage for --help and refuses two files', async () => {
    const help = bufferIo();
    expect(await runCli(['basis', '--help'], help.io)).to.equal(0);
    expect(help.out()).to.match(/Usage: plyledger basis \[FILE\]/);
    const two = bufferIo();
    expect(await runCli(['basis', 'a.json', 'b.json'], two.io)).to.equal(2);
  });
});

describe('POST /statistics/basis', () => {
  const app = express().use(express.json({ limit: '5mb' })).use(statisticsRouter).use(errorHandler);

  it('returns the engine result', async () => {
    const response = await request(app).post('/statistics/basis').send(input).expect(200);
    expect(response.body).to.deep.equal(JSON.parse(JSON.stringify(analyseDataGroup(input))));
  });

  it('answers 400 with the problems for bad input, never 500', async () => {
    const response = await request(app).post('/statistics/basis').send({ values: [1, 'x'], batches: ['a', 'b'] }).expect(400);
    expect(response.body.error.code).to.equal('invalid_input');
    expect(response.body.error.details.problems[0].field).to.equal('values[1]');
    await request(app).post('/statistics/basis').expect(400);
    await request(app).post('/statistics/basis').set('content-type', 'application/json').send('{"values": [1,').expect(400);
    await request(app).post('/statistics/basis').send({ values: [3, 3, 3], batches: ['a', 'b', 'c'] }).expect(400);
  });

  it('is described in the OpenAPI fragment with its schemas', () => {
    const operation = statisticsOpenApi.paths['/api/v1/statistics/basis'].post as { requestBody: unknown; responses: Record<string, unknown> };
    expect(operation.responses).to.have.keys('200', '400', '401');
    const refs = JSON.stringify(statisticsOpenApi).match(/#\/components\/schemas\/[A-Za-z]+/g) ?? [];
    for (const ref of refs) expect(statisticsOpenApi.schemas, ref).to.have.property(ref.split('/').pop()!);
    const result = statisticsOpenApi.schemas!.BasisResult as { properties: Record<string, unknown> };
    for (const key of Object.keys(analyseDataGroup(input))) expect(result.properties, key).to.have.property(key);
  });
});
