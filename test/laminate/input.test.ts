import { expect } from 'chai';
import { InputError } from '../../api/src/shared/input-error.ts';
import { analyseLaminate, laminateStiffness, parseEnvelopeInput, parseLaminateInput, parsePolarInput, type PlyInput } from '../../api/src/laminate/index.ts';
import { DEMO_CARBON, randomStack, seededRandom } from './support/generators.ts';

function problemsOf(fn: () => unknown): { field: string; message: string; fix?: string }[] {
  try {
    fn();
  } catch (err) {
    expect(err).to.be.instanceOf(InputError);
    return (err as InputError).problems;
  }
  throw new Error('no InputError');
}

const ply = (over: Record<string, unknown> = {}, material: Record<string, unknown> = {}) => ({ material: { ...DEMO_CARBON, ...material }, thetaDeg: 0, thickness: 0.2, ...over });

/** Every number in a reply is finite (JSON.stringify would quietly turn NaN into null, so walk the object). */
function expectAllFinite(value: unknown, path = 'reply'): void {
  if (typeof value === 'number') expect(Number.isFinite(value), path).to.equal(true);
  else if (Array.isArray(value)) value.forEach((v, i) => expectAllFinite(v, `${path}[${i}]`));
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) expectAllFinite(v, `${path}.${k}`);
}

describe('laminate engine: bad input', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  it('names the ply and field of a missing or non-positive modulus or thickness', () => {
    const p = problemsOf(() => parseLaminateInput({ plies: [ply(), ply({}, { E2: undefined }), ply({ thickness: 0 }), ply({}, { G12: -5 })] }));
    const fields = p.map((x) => x.field);
    expect(fields).to.include.members(['plies[1].material.E2', 'plies[2].thickness', 'plies[3].material.G12']);
    expect(p.find((x) => x.field === 'plies[2].thickness')!.message).to.match(/positive/);
    expect(p.every((x) => typeof x.fix === 'string' && x.fix.length > 0)).to.equal(true);
  });

  it('refuses nu12 that makes the ply compliance not positive definite (1 - nu12 nu21 <= 0)', () => {
    const [problem] = problemsOf(() => parseLaminateInput({ plies: [ply({}, { E1: 10000, E2: 10000, nu12: 1.2 })] }));
    expect(problem.field).to.equal('plies[0].material.nu12');
    expect(problem.message).to.match(/not positive definite/);
    expect(problem.fix).to.match(/sqrt\(E1\/E2\) = 1\.000/);
  });

  it('names the strength a chosen criterion needs and lacks', () => {
    const p = problemsOf(() => parseLaminateInput({ plies: [ply(), ply({}, { Yc: undefined, name: 'other' })], loads: { N: [1, 0, 0] }, criteria: ['puck'] }));
    expect(p[0].field).to.equal('plies[1].material.Yc');
    expect(p[0].message).to.match(/puck/);
    const q = problemsOf(() => parseLaminateInput({ code: '[0/90]s', material: { ...DEMO_CARBON, S12: undefined }, plyThickness: 0.1, loads: { N: [1, 0, 0] }, criteria: ['tsai-wu'] }));
    expect(q[0].field).to.equal('material.S12');
    const strain = problemsOf(() => parseLaminateInput({ code: '[0]T', material: { E1: 1e5, E2: 1e4, G12: 5e3, nu12: 0.3 }, plyThickness: 1, loads: { N: [1, 0, 0] }, criteria: ['max-strain'] }));
    expect(strain.map((x) => x.field)).to.deep.equal(['material.e1t', 'material.e1c', 'material.e2t', 'material.e2c', 'material.g12']);
    // with criteria left out only the criteria the strengths support are run, and the output says so
    const a = analyseLaminate(parseLaminateInput({ code: '[0]T', material: { E1: 1e5, E2: 1e4, G12: 5e3, nu12: 0.3 }, plyThickness: 1, loads: { N: [1, 0, 0] } }));
    expect(a.firstPlyFailure).to.equal(undefined);
    expect(a.notes.join(' ')).to.match(/no failure analysis/);
  });

  it('names the position of an unparseable code', () => {
    const [p] = problemsOf(() => parseLaminateInput({ code: '[0/±45/9O]s', material: DEMO_CARBON, plyThickness: 0.1 }));
    expect(p.field).to.equal('code');
    expect(p.message).to.match(/position 9/);
  });

  it('refuses more than 2,000 plies', () => {
    const plies = Array.from({ length: 2001 }, () => ply());
    const [p] = problemsOf(() => parseLaminateInput({ plies }));
    expect(p.field).to.equal('plies');
    expect(p.message).to.match(/2001 plies; at most 2000/);
    expect(() => laminateStiffness(plies as PlyInput[])).to.throw(InputError, /at most 2000/);
  });

  it('needs alpha1 and alpha2 when deltaT is given, beta1 and beta2 when deltaMoisture is', () => {
    const material = { E1: 1e5, E2: 1e4, G12: 5e3, nu12: 0.3 };
    const p = problemsOf(() => parseLaminateInput({ code: '[0/90]T', material, plyThickness: 0.1, loads: { deltaT: -100, deltaMoisture: 0.01 } }));
    expect(p.map((x) => x.field)).to.deep.equal(['material.alpha1', 'material.alpha2', 'material.beta1', 'material.beta2']);
  });

  it('checks loads, criteria, settings and stray fields', () => {
    const base = { code: '[0/90]s', material: DEMO_CARBON, plyThickness: 0.1 };
    const fieldsOf = (extra: Record<string, unknown>) => problemsOf(() => parseLaminateInput({ ...base, ...extra })).map((x) => x.field);
    expect(fieldsOf({ loads: { N: [1, 2] } })).to.deep.equal(['loads.N']);
    expect(fieldsOf({ loads: { N: [1, 0, 0], midplaneStrain: [0.001, null, null] } })).to.deep.equal(['loads.N[0]']);
    expect(fieldsOf({ loads: { N: [null, 0, 0] } })).to.deep.equal(['loads.N[0]']);
    expect(fieldsOf({ loads: { N: [1, 0, 0], Nx: 3 } })).to.deep.equal(['loads.Nx']);
    expect(fieldsOf({ loads: { N: [1, 0, 0] }, criteria: ['von-mises'] })).to.deep.equal(['criteria[0]']);
    expect(fieldsOf({ tsaiWu: { F12Star: -1 } })).to.deep.equal(['tsaiWu.F12Star']);
    expect(fieldsOf({ puck: { pPerpParTension: 1.5 } })).to.deep.equal(['puck.pPerpParTension']);
    expect(fieldsOf({ factorOfSafety: 0 })).to.deep.equal(['factorOfSafety']);
    expect(fieldsOf({ progressive: true })).to.deep.equal(['progressive']);
    expect(fieldsOf({ lods: {} })).to.deep.equal(['lods']);
    expect(fieldsOf({ plies: [] })).to.include('code');
    expect(problemsOf(() => parseLaminateInput([1, 2]))[0].field).to.equal('input');
    expect(problemsOf(() => parseLaminateInput({ code: '[0]T', material: DEMO_CARBON }))[0].field).to.equal('plyThickness');
    expect(problemsOf(() => parseLaminateInput({ plies: [ply({ thetaDeg: 'zero' })] }))[0].field).to.equal('plies[0].thetaDeg');
  });

  it('checks envelope and polar inputs the same way', () => {
    const base = { code: '[0/90]s', material: DEMO_CARBON, plyThickness: 0.1 };
    expect(problemsOf(() => parseEnvelopeInput({ ...base, criterion: 'nope' }))[0].field).to.equal('criterion');
    expect(problemsOf(() => parseEnvelopeInput({ ...base, axes: 'Ny-Nxy' }))[0].field).to.equal('axes');
    expect(problemsOf(() => parseEnvelopeInput({ ...base, points: 2.5 }))[0].field).to.equal('points');
    expect(problemsOf(() => parseEnvelopeInput({ ...base, material: { ...DEMO_CARBON, Xt: undefined } }))[0].field).to.equal('material.Xt');
    expect(problemsOf(() => parsePolarInput({ ...base, stepDeg: 0 }))[0].field).to.equal('stepDeg');
  });

  it('refuses values outside plausibility bounds that could overflow (moduli, thickness, strengths, loads)', () => {
    expect(problemsOf(() => parseLaminateInput({ plies: [ply({}, { E1: 1e300 })] }))[0].field).to.equal('plies[0].material.E1');
    expect(problemsOf(() => parseLaminateInput({ plies: [ply({ thickness: 1e-9 })] }))[0].field).to.equal('plies[0].thickness');
    expect(problemsOf(() => parseLaminateInput({ plies: [ply({}, { Yt: 1e-12 })] }))[0].field).to.equal('plies[0].material.Yt');
    expect(problemsOf(() => parseLaminateInput({ plies: [ply()], loads: { N: [1e300, 0, 0] } }))[0].field).to.equal('loads.N');
    expect(problemsOf(() => parseLaminateInput({ plies: [ply()], loads: { deltaT: 1e6 } }))[0].field).to.equal('loads.deltaT');
  });

  it('keeps every number finite at the edges of the bounds', () => {
    const soft = { E1: 1e-3, E2: 1e-3, G12: 1e-3, nu12: 0.3, Xt: 1e-6, Xc: 1e-6, Yt: 1e-6, Yc: 1e-6, S12: 1e-6, alpha1: 1, alpha2: -1 };
    const a = analyseLaminate(parseLaminateInput({ plies: [{ material: soft, thetaDeg: 30, thickness: 1e-6 }, { material: soft, thetaDeg: -60, thickness: 1e-6 }], loads: { N: [1e9, -1e9, 1e9], M: [1e9, 1e9, -1e9], deltaT: 1e4 }, criteria: ['max-stress', 'max-strain', 'tsai-hill', 'tsai-wu', 'hashin', 'puck'] }));
    expectAllFinite(a);
  });

  it('never puts NaN or Infinity in a reply (zero loads, loads that never fail a ply, prescribed strains, 100 random stacks)', () => {
    const base = { code: '[0/±45/90]s', material: DEMO_CARBON, plyThickness: 0.125 };
    expectAllFinite(analyseLaminate(parseLaminateInput({ ...base, loads: { N: [0, 0, 0] }, criteria: ['tsai-wu', 'puck'] })));
    expectAllFinite(analyseLaminate(parseLaminateInput({ ...base, loads: { midplaneStrain: [0.001, null, null], deltaT: -100 }, criteria: ['hashin'], progressive: false })));
    expectAllFinite(analyseLaminate(parseLaminateInput({ ...base, loads: { N: [100, 0, 0] }, progressive: true })));
    const rnd = seededRandom(901);
    for (let k = 0; k < 100; k++) {
      const plies = randomStack(rnd);
      expectAllFinite(analyseLaminate(parseLaminateInput({ plies, loads: { N: [100 * rnd(), -50, 10], M: [0, 1, 0], deltaT: -50 }, criteria: ['max-stress', 'max-strain', 'tsai-hill', 'tsai-wu', 'hashin', 'puck'] })));
    }
  });
});
