/**
 * The demo seed and the statistics CLI: the seed is labelled invented, quick
 * and idempotent; and the basis value the API stores for a seeded data group
 * (FR-UC300, 0° tension strength, RTD) equals the answer of the command
 * `plyledger basis` for the same numbers, which this test gathers from the
 * database itself and normalises by ENGINEERING.md 2.2.
 */
import { expect } from 'chai';
import { execFile } from 'node:child_process';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { repoRoot } from '../../api/src/local/stack.ts';
import { seed as seedDemo, DEMO_FILE_NAME } from '../../database/seeds/04_demo_materials_coupons.ts';
import { testDb } from '../support/stack.ts';
import { getJson, importTableCounts, postJson } from './coupon-chain-helpers.ts';

/** Relative difference, for numbers that went through JSON and a second process. */
const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('demo seed: invented, quick, idempotent', function () {
  this.timeout(30_000);

  it('holds the invented scenario: three materials, four conditions, three to five batches, labelled invented', async () => {
    const { body } = await getJson('viewer', '/api/v1/materials');
    const demo = body.items.filter((m: { code: string }) => ['FR-UC300', 'FR-GX800', 'FR-C80'].includes(m.code));
    expect(demo.map((m: { form: string }) => m.form).sort()).to.deep.equal(['core', 'non-crimp-fabric', 'unidirectional-tape']);
    expect(demo.every((m: { invented: boolean; name: string }) => m.invented && /invented/.test(m.name))).to.equal(true);
    const upload = await testDb()('uploads').where({ file_name: DEMO_FILE_NAME }).first('id', 'invented', 'row_count');
    expect(upload.invented).to.equal(true);
    expect(upload.row_count).to.be.greaterThan(1000);
    const groups = await getJson('viewer', `/api/v1/data-groups?material=${demo.find((m: { code: string }) => m.code === 'FR-UC300').id}`);
    const properties = new Set(groups.body.items.map((g: { property: string }) => g.property));
    expect(properties.size).to.be.at.least(5);
    const conditions = new Set(groups.body.items.map((g: { condition: { code: string } }) => g.condition.code));
    expect([...conditions].sort()).to.deep.equal(['CTD', 'ETD', 'ETW', 'RTD']);
    for (const g of groups.body.items) expect(g.batches).to.be.within(3, 5);
  });

  it('runs again in well under a few seconds and adds nothing', async () => {
    const before = await importTableCounts();
    const started = Date.now();
    await seedDemo(testDb());
    expect(Date.now() - started).to.be.lessThan(5000);
    expect(await importTableCounts()).to.deep.equal(before);
  });
});

describe('seeded data group: stored basis value = the statistics CLI answer', function () {
  this.timeout(60_000);

  it('FR-UC300 0° tension strength, RTD: analysis, allowable and `plyledger basis` agree', async () => {
    const material = (await getJson('materials', '/api/v1/materials')).body.items.find((m: { code: string }) => m.code === 'FR-UC300');
    const run = await postJson('materials', '/api/v1/analyses', { materialId: material.id, property: 'tension-0', conditions: ['RTD'] });
    expect(run.status, JSON.stringify(run.body).slice(0, 300)).to.equal(201);
    const stored = await testDb()('analyses').where({ id: run.body.id }).first('b_basis', 'a_basis', 'n');

    // the same numbers, straight from the database: valid RTD coupons, normalised to 0.29 mm per ply
    const coupons = await testDb()('specimens as s')
      .join('batches as b', 'b.id', 's.batch_id')
      .join('conditions as c', 'c.id', 's.condition_id')
      .where({ 's.material_id': material.id, 's.property_code': 'tension-0', 'c.code': 'RTD', 's.status': 'valid' })
      .orderBy('s.specimen_code')
      .select('s.strength_mpa', 's.thickness_mm', 's.ply_count', 'b.code as batch');
    expect(coupons).to.have.length(stored.n);
    const values = coupons.map((c) => (c.strength_mpa * (c.thickness_mm / c.ply_count)) / material.nominalCuredPlyThicknessMm);
    const dir = await mkdtemp(path.join(os.tmpdir(), 'plyledger-basis-'));
    try {
      const file = path.join(dir, 'group.json');
      await writeFile(file, JSON.stringify({ values, batches: coupons.map((c) => c.batch), basis: 'both' }));
      const { stdout } = await promisify(execFile)(process.execPath, [path.join(repoRoot, 'api/bin/plyledger.js'), 'basis', file]);
      const cli = JSON.parse(stdout);
      expect(cli.n).to.equal(stored.n);
      expect(cli.method).to.equal(run.body.methodUsed);
      expect(relative(stored.b_basis, cli.bBasis)).to.be.lessThan(1e-9);
      expect(relative(stored.a_basis, cli.aBasis)).to.be.lessThan(1e-9);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }

    const proposal = await postJson('materials', '/api/v1/allowables', { analysisId: run.body.id, basis: 'B', comment: 'seeded group' });
    expect(proposal.status, JSON.stringify(proposal.body).slice(0, 300)).to.equal(201);
    expect(proposal.body.value).to.equal(stored.b_basis);
    expect(proposal.body.provisional).to.equal(false);
    // leave no open proposal on the demo key for later suites
    expect((await postJson('quality', `/api/v1/allowables/${proposal.body.id}/reject`, { comment: 'test only', signatureMeaning: proposal.body.signatureMeanings.reject })).status).to.equal(200);
  });
});
