/** `plyledger section` and `plyledger check` through runCli with buffer io. */
import { expect } from 'chai';
import { runCli } from '../../api/src/cli/main.ts';
import { laminateStiffness } from '../../api/src/laminate/index.ts';
import { readBackToInternal, readSection, SECTION_CAUTION, SECTION_FORMATS } from '../../api/src/sections/index.ts';
import { scaledErrors } from './support/compare.ts';

function bufferIo(stdin = '') {
  const out = { stdout: '', stderr: '' };
  return { out, io: { stdout: (t: string) => (out.stdout += t), stderr: (t: string) => (out.stderr += t), readStdin: async () => stdin } };
}

const MATERIAL = { name: 'FR-UC300', E1: 135000, E2: 9000, G12: 5000, nu12: 0.3, G23: 3200, density: 1550, Xt: 2000, Xc: 1200, Yt: 50, Yc: 200, S12: 80 };
const LAMINATE = { code: '[0/45/-45/90]s', material: MATERIAL, plyThickness: 0.25 };
const ANGLES = [0, 45, -45, 90, 90, -45, 45, 0];

describe('plyledger section', () => {
  for (const format of SECTION_FORMATS) {
    it(`--format ${format} writes the export with its header, and it reads back to the engine's A, B, D`, async () => {
      const { out, io } = bufferIo(JSON.stringify(LAMINATE));
      const code = await runCli(['section', '--format', format, '--units', 'N-m-kg', '--elset', 'SKIN', '--pid', '12', '--name', 'Fjordvik blade root', '--revision', 'C', '--date', '2026-12-03'], io);
      expect(code, out.stderr).to.equal(0);
      expect(out.stdout).to.include('Plyledger');
      expect(out.stdout).to.include('Fjordvik blade root');
      expect(out.stdout).to.include('N-m-kg');
      expect(out.stdout).to.include('2026-12-03');
      expect(out.stdout.replace(/\s+(\$|\*\*|#)\s+/g, ' ').replace(/\s+/g, ' ')).to.include(SECTION_CAUTION.slice(0, 60));
      const engine = laminateStiffness(ANGLES.map((thetaDeg) => ({ material: MATERIAL, thetaDeg, thickness: 0.25 })));
      const read = readBackToInternal(readSection(format, out.stdout));
      const errors = scaledErrors(read, engine);
      expect(Math.max(errors.A, errors.B, errors.D)).to.be.below(1e-3);
    });
  }

  it('uses the property id and element set given', async () => {
    const pcomp = bufferIo(JSON.stringify(LAMINATE));
    await runCli(['section', '--format', 'nastran-pcomp', '--pid', '12'], pcomp.io);
    expect(pcomp.out.stdout).to.match(/^PCOMP\s+12/m);
    const ccx = bufferIo(JSON.stringify(LAMINATE));
    await runCli(['section', '--format', 'calculix', '--elset', 'SKIN'], ccx.io);
    expect(ccx.out.stdout).to.match(/^\*SHELL SECTION, ELSET=SKIN, COMPOSITE$/m);
  });

  it('exits 2 with one line naming the problem for a missing or unknown format, bad units and bad laminate input', async () => {
    for (const [args, pattern] of [
      [['section'], /--format is required/],
      [['section', '--format', 'stl'], /--format stl is not one of/],
      [['section', '--format', 'json', '--units', 'kip-ft'], /units.*not a unit system/],
      [['section', '--format', 'json', '--pid', '0'], /propertyId/],
    ] as [string[], RegExp][]) {
      const { out, io } = bufferIo(JSON.stringify(LAMINATE));
      expect(await runCli(args, io), args.join(' ')).to.equal(2);
      expect(out.stderr).to.match(pattern);
      expect(out.stderr.trim().split('\n')).to.have.length(1);
    }
    const bad = bufferIo(JSON.stringify({ code: '[0/90]s', material: { ...MATERIAL, E2: -1 }, plyThickness: 0.25 }));
    expect(await runCli(['section', '--format', 'calculix'], bad.io)).to.equal(2);
    expect(bad.out.stderr).to.match(/material\.E2/);
  });
});

describe('plyledger check', () => {
  it('strip: JSON with the finite-element and closed-form tip deflections, ratio 1 to 1e-9', async () => {
    const { out, io } = bufferIo(JSON.stringify(LAMINATE));
    expect(await runCli(['check', 'strip', '--width', '20', '--length', '150', '--load', '5', '--elements', '40'], io)).to.equal(0);
    const result = JSON.parse(out.stdout);
    expect(result.check).to.equal('strip-cantilever');
    expect(result.nodes).to.have.length(41);
    expect(Math.abs(result.tip.ratio - 1)).to.be.below(1e-9);
  });

  it('plate: JSON with Navier and Ritz centre deflections, their ratio and the D16/D26 warning of a quasi-isotropic laminate', async () => {
    const { out, io } = bufferIo(JSON.stringify(LAMINATE));
    expect(await runCli(['check', 'plate', '--a', '400', '--b', '300', '--pressure', '0.005'], io)).to.equal(0);
    const result = JSON.parse(out.stdout);
    expect(result.navier.converged).to.equal(true);
    expect(result.navier.ratioToRitz).to.be.closeTo(result.navier.centreDeflectionMm / result.ritz.centreDeflectionMm, 1e-12);
    expect(result.warnings.join(' ')).to.match(/D16 or D26/);
  });

  it('exits 2 for an unknown check or a bad number', async () => {
    const a = bufferIo(JSON.stringify(LAMINATE));
    expect(await runCli(['check', 'beam'], a.io)).to.equal(2);
    expect(a.out.stderr).to.match(/strip or plate/);
    const b = bufferIo(JSON.stringify(LAMINATE));
    expect(await runCli(['check', 'strip', '--elements', 'many'], b.io)).to.equal(2);
    const c = bufferIo(JSON.stringify(LAMINATE));
    expect(await runCli(['check', 'strip', '--elements', '0'], c.io)).to.equal(2);
    expect(c.out.stderr).to.match(/strip\.elements/);
  });
});
