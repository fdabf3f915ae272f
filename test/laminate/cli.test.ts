import { expect } from 'chai';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../api/src/cli/main.ts';
import { DEMO_CARBON } from './support/generators.ts';

async function cli(args: string[], stdin = ''): Promise<{ code: number; out: string; err: string }> {
  let out = '', err = '';
  const code = await runCli(args, { stdout: (t) => { out += t; }, stderr: (t) => { err += t; }, readStdin: async () => stdin });
  return { code, out, err };
}

const input = {
  code: '[0/±45/90]s', material: DEMO_CARBON, plyThickness: 0.125,
  loads: { N: [200, 50, 0], M: [0, 0, 0], deltaT: -120 },
  criteria: ['max-stress', 'max-strain', 'tsai-hill', 'tsai-wu', 'hashin', 'puck'], factorOfSafety: 1.5,
};

describe('laminate engine: CLI commands', function () {
  this.timeout(30000); // bulk checks; generous for a loaded CI machine, they take well under a second alone
  let dir = '';
  before(async () => { dir = await mkdtemp(join(tmpdir(), 'plyledger-laminate-')); });
  after(async () => { await rm(dir, { recursive: true, force: true }); });

  it('laminate FILE prints the analysis with the names of issue 4', async () => {
    const file = join(dir, 'lam.json');
    await writeFile(file, JSON.stringify(input));
    const { code, out, err } = await cli(['laminate', file]);
    expect(err).to.equal('');
    expect(code).to.equal(0);
    const r = JSON.parse(out);
    for (const key of ['thickness', 'arealMass', 'A', 'B', 'D', 'H', 'abd', 'ABD', 'membrane', 'flexural', 'midplane', 'plies', 'firstPlyFailure', 'rules']) expect(r, key).to.have.property(key);
    expect(Object.keys(r.membrane)).to.include.members(['Ex', 'Ey', 'Gxy', 'nuxy', 'nuyx', 'etaxs', 'etays']);
    expect(Object.keys(r.flexural)).to.include.members(['Ex', 'Ey', 'Gxy', 'nuxy']);
    expect(r.abd).to.have.length(6);
    expect(r.H[0][1]).to.equal(r.H[1][0]);
    expect(Math.abs(r.H[0][1])).to.be.below(1e-12 * r.H[0][0]); // ±45 pairs cancel A45 (theory)
    const ply = r.plies[3];
    expect(Object.keys(ply)).to.include.members(['index', 'thetaDeg', 'zBottom', 'zTop', 'bottom', 'top', 'failure']);
    expect(Object.keys(ply.bottom)).to.deep.equal(['strainLaminate', 'stressLaminate', 'strainPly', 'stressPly']);
    expect(Object.keys(ply.failure.puck)).to.include.members(['index', 'strengthRatio', 'mode']);
    expect(Object.keys(r.firstPlyFailure['tsai-wu'])).to.include.members(['ply', 'surface', 'strengthRatio', 'mode', 'marginOfSafety']);
    expect(r.firstPlyFailure['tsai-wu'].marginOfSafety).to.be.closeTo(r.firstPlyFailure['tsai-wu'].strengthRatio / 1.5 - 1, 1e-12);
    expect(r.rules.map((x: { rule: string }) => x.rule)).to.include('symmetric');
    expect(r.transverseShear.correctionFactor).to.equal(5 / 6);
  });

  it('reads standard input and runs the progression with --progressive', async () => {
    const { code, out } = await cli(['laminate', '--progressive'], JSON.stringify(input));
    expect(code).to.equal(0);
    const r = JSON.parse(out);
    expect(r.progressive['tsai-wu'].events.length).to.be.greaterThan(0);
    expect(r.progressive['tsai-wu'].lastPlyFailure.loadFactor).to.be.at.least(r.firstPlyFailure['tsai-wu'].strengthRatio);
  });

  it('exits 2 with one line naming the ply and field for bad input', async () => {
    const bad = { plies: [{ material: { ...DEMO_CARBON, E2: -1 }, thetaDeg: 0, thickness: 0.1 }] };
    const { code, out, err } = await cli(['laminate'], JSON.stringify(bad));
    expect(code).to.equal(2);
    expect(out).to.equal('');
    expect(err).to.match(/^plyledger laminate: plies\[0\]\.material\.E2: is -1; it must be positive/);
    expect(err.trim().split('\n')).to.have.length(1);
    const code2 = await cli(['laminate'], JSON.stringify({ code: '[0/45', material: DEMO_CARBON, plyThickness: 0.1 }));
    expect(code2.code).to.equal(2);
    expect(code2.err).to.match(/code: position 6/);
    expect((await cli(['laminate', '--nope'], '{}')).code).to.equal(2);
  });

  it('envelope takes its options and prints the points', async () => {
    const { code, out } = await cli(['envelope', '--criterion', 'hashin', '--axes', 'Nx-Nxy', '--points', '12'], JSON.stringify({ code: '[0/90]s', material: DEMO_CARBON, plyThickness: 0.2 }));
    expect(code).to.equal(0);
    const r = JSON.parse(out);
    expect(r.criterion).to.equal('hashin');
    expect(r.axes).to.equal('Nx-Nxy');
    expect(r.points).to.have.length(12);
    expect(r.points[0]).to.have.keys(['angleDeg', 'strengthRatio', 'N', 'stress', 'ply', 'surface', 'mode']);
    expect((await cli(['envelope', '--points', 'many'], '{}')).code).to.equal(2);
  });

  it('polar prints 0..180° at the step asked', async () => {
    const { code, out } = await cli(['polar', '--step', '30'], JSON.stringify({ code: '[0/90]s', material: DEMO_CARBON, plyThickness: 0.2 }));
    expect(code).to.equal(0);
    const r = JSON.parse(out);
    expect(r.points.map((p: { angleDeg: number }) => p.angleDeg)).to.deep.equal([0, 30, 60, 90, 120, 150, 180]);
    expect(r.points[3].Ex).to.be.closeTo(r.points[0].Ey, 1e-9 * r.points[0].Ey);
  });

  it('lists the commands and prints usage', async () => {
    const help = await cli(['--help']);
    expect(help.out).to.match(/laminate/).and.to.match(/envelope/).and.to.match(/polar/);
    const usage = await cli(['laminate', '--help']);
    expect(usage.code).to.equal(0);
    expect(usage.out).to.match(/Usage: plyledger laminate/);
  });
});
