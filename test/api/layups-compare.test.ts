/**
 * Duplicate and compare layup revisions through the API: a duplicate is a new
 * layup with the same plies; a comparison puts both revisions under one load
 * case and reports stiffness and first-ply failure side by side.
 */
import { expect } from 'chai';
import { analyseLaminate, parseLaminateInput } from '../../api/src/laminate/index.ts';
import { codeDraft, getJson, laminaMaterial, layupName, postJson, type LaminaMaterial } from './layups-fixtures.ts';

describe('layups: duplicate and compare', function () {
  this.timeout(60_000);
  let material: LaminaMaterial;
  let crossPly: { id: number; layupId: number; laminate: unknown };
  let quasi: { id: number; layupId: number; laminate: unknown };
  const loads = { N: [200, 0, 0], M: [0, 0, 0] };

  before(async () => {
    material = await laminaMaterial();
    const a = await postJson('designer', '/api/v1/layups', codeDraft(layupName('Cross-ply'), '[0/90]2s', material, undefined, { settings: { loads, criteria: ['max-stress', 'tsai-wu'], factorOfSafety: 1.5 } }));
    const b = await postJson('designer', '/api/v1/layups', codeDraft(layupName('Quasi'), '[45/-45/0/90]s', material));
    if (a.status !== 201 || b.status !== 201) throw new Error(JSON.stringify([a.body, b.body]));
    crossPly = a.body;
    quasi = b.body;
  });

  it('duplicates a revision as revision 1 of a new layup with the same plies', async () => {
    const name = layupName('Cross-ply copy');
    const { status, body } = await postJson('designer', `/api/v1/layups/${crossPly.layupId}/duplicate`, { name, revisionId: crossPly.id });
    expect(status, JSON.stringify(body)).to.equal(201);
    expect(body).to.include({ revision: 1, name });
    expect(body.layupId).to.not.equal(crossPly.layupId);
    expect(body.laminate).to.deep.equal(crossPly.laminate);
    expect(body.comment).to.include('duplicated from');
    const wrong = await postJson('designer', `/api/v1/layups/${crossPly.layupId}/duplicate`, { name: layupName('x'), revisionId: quasi.id });
    expect(wrong.status).to.equal(400);
    expect(wrong.body.error.details.problems[0].field).to.equal('revisionId');
  });

  it('compares stiffness and first-ply failure under the first revision\'s saved load case', async () => {
    const { status, body } = await postJson('viewer', '/api/v1/layups/compare', { a: crossPly.id, b: quasi.id });
    expect(status, JSON.stringify(body)).to.equal(200);
    expect(body.loads).to.deep.equal(loads);
    expect(body.criteria).to.deep.equal(['max-stress', 'tsai-wu']);
    expect(body.factorOfSafety).to.equal(1.5);
    for (const [side, revision] of [[body.a, crossPly], [body.b, quasi]] as const) {
      // each side is the engine's answer for its own plies under the common load case
      const engine = analyseLaminate(parseLaminateInput({ ...(revision.laminate as object), loads, criteria: ['max-stress', 'tsai-wu'], factorOfSafety: 1.5 }));
      expect(side.A).to.deep.equal(engine.A);
      expect(side.D).to.deep.equal(engine.D);
      expect(side.firstPlyFailure['tsai-wu'].strengthRatio).to.equal(engine.firstPlyFailure!['tsai-wu']!.strengthRatio);
      expect(side.firstPlyFailure['max-stress'].marginOfSafety).to.equal(engine.firstPlyFailure!['max-stress']!.marginOfSafety);
    }
    // under Nx the cross-ply (half its plies at 0°) is stiffer along x than the quasi-isotropic stack (a quarter at 0°), same thickness
    expect(body.a.A[0][0]).to.be.above(body.b.A[0][0]);
  });

  it('takes a load case from the request, and has no failure part without loads', async () => {
    const shear = await postJson('viewer', '/api/v1/layups/compare', { a: quasi.id, b: crossPly.id, loads: { N: [0, 0, 50] }, criteria: ['max-stress'] });
    expect(shear.status, JSON.stringify(shear.body)).to.equal(200);
    expect(shear.body.criteria).to.deep.equal(['max-stress']);
    expect(shear.body.a.firstPlyFailure['max-stress'].strengthRatio).to.be.a('number');
    const none = await postJson('viewer', '/api/v1/layups/compare', { a: quasi.id, b: crossPly.id });
    expect(none.body.loads).to.equal(null);
    expect(none.body.a.firstPlyFailure).to.equal(null);
    const bad = await postJson('viewer', '/api/v1/layups/compare', { a: quasi.id });
    expect(bad.status).to.equal(400);
    expect(bad.body.error.details.problems[0].field).to.equal('b');
    const missing = await getJson('viewer', '/api/v1/layup-revisions/99999999');
    expect(missing.status).to.equal(404);
  });
});
