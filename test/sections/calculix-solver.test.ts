/**
 * The CalculiX export run by the real solver: Debian's calculix-ccx (installed
 * when missing), on small S8R plate models of the test's own that pull the
 * exported section in with *INCLUDE. The expected values come from the
 * laminate engine (A⁻¹, abd) and from the Navier series of the plate check;
 * the solver is the independent party. Models stay small (at most 16 x 16
 * elements, one thread) so the suite runs in seconds.
 */
import { expect } from 'chai';
import { inv } from 'mathjs';
import { laminateStiffness } from '../../api/src/laminate/index.ts';
import type { PlyInput, PlyMaterial } from '../../api/src/laminate/types.ts';
import { exportSection, plateCheck } from '../../api/src/sections/index.ts';
import {
  calculixVersion, edgeNodes, edgeTensionLoads, modelHead, plateMesh, rigidBodySupports, runCalculix, type PlateMesh,
} from './support/calculix-plate.ts';

const CCX_VERSION = calculixVersion();

/** Invented carbon/epoxy tape in the range of the demo material FR-UC300 (not a real product). */
const TAPE: PlyMaterial = { name: 'FR-UC300', E1: 135000, E2: 9000, G12: 5000, nu12: 0.3, G13: 5000, G23: 3200, density: 1550 };

function stack(angles: number[], thickness: number): PlyInput[] {
  return angles.map((thetaDeg) => ({ material: TAPE, thetaDeg, thickness }));
}

function calculixSection(plies: PlyInput[], referenceOffset = 0): string {
  return exportSection('calculix', { stiffness: laminateStiffness(plies), plies, engineVersion: 'test' }, { elset: 'PLATE', referenceOffset, date: '2026-12-03' }).text;
}

/** Uniform pressure on a plate with w = 0 on every edge and in-plane rigid-body motion held. */
function simplySupportedModel(mesh: PlateMesh, pressureMPa: number): string[] {
  return [
    ...modelHead('simply supported plate under pressure', mesh, 'PLATE'),
    '*BOUNDARY',
    ...edgeNodes(mesh).map((n) => `${n}, 3, 3`),
    `${mesh.nodeAt(0, 0)}, 1, 2`,
    `${mesh.nodeAt(2 * mesh.nx, 0)}, 2, 2`,
    '*STEP', '*STATIC', '*DLOAD', `PLATE, P, ${pressureMPa}`, '*NODE PRINT, NSET=NALL', 'U', '*END STEP',
  ];
}

/** Edge tension Nx on x = 0 and x = a, supports against rigid-body motion only. */
function pulledModel(mesh: PlateMesh, nPerMm: number, output3d = false): string[] {
  return [
    ...modelHead('free plate pulled in x', mesh, 'PLATE'),
    '*BOUNDARY', ...rigidBodySupports(mesh),
    '*STEP', '*STATIC', '*CLOAD', ...edgeTensionLoads(mesh, nPerMm),
    ...(output3d ? ['*NODE FILE, OUTPUT=3D', 'U'] : []),
    '*NODE PRINT, NSET=NALL', 'U', '*END STEP',
  ];
}

/** Least-squares fit w = c0 + c1 x + c2 y + c3 x² + c4 y² + c5 xy over interior nodes; κ = -w'' (ENGINEERING.md sign: ε = ε0 + z κ). */
function fittedCurvatures(mesh: PlateMesh, displacements: Map<number, [number, number, number]>): [number, number, number] {
  const rows: number[][] = [];
  const rhs: number[] = [];
  for (const [id, [x, y]] of mesh.coordinates) {
    if (x < 0.1 * mesh.aMm || x > 0.9 * mesh.aMm || y < 0.1 * mesh.bMm || y > 0.9 * mesh.bMm) continue;
    rows.push([1, x, y, x * x, y * y, x * y]);
    rhs.push(displacements.get(id)![2]);
  }
  const n = 6;
  const ata = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => rows.reduce((s, r) => s + r[i] * r[j], 0)));
  const atb = Array.from({ length: n }, (_, i) => rows.reduce((s, r, k) => s + r[i] * rhs[k], 0));
  const c = (inv(ata) as number[][]).map((row) => row.reduce((s, v, j) => s + v * atb[j], 0));
  return [-2 * c[3], -2 * c[4], -c[5]];
}

/** Mid-plane strains between interior nodes at a/4, 3a/4 and b/4, 3b/4 of a uniform in-plane state. */
function interiorStrains(mesh: PlateMesh, displacements: Map<number, [number, number, number]>): [number, number, number] {
  const i1 = mesh.nx / 2, i2 = (3 * mesh.nx) / 2, j1 = mesh.ny / 2, j2 = (3 * mesh.ny) / 2;
  const u = (i: number, j: number) => displacements.get(mesh.nodeAt(i, j))!;
  const dx = ((i2 - i1) * mesh.aMm) / (2 * mesh.nx);
  const dy = ((j2 - j1) * mesh.bMm) / (2 * mesh.ny);
  const ex = (u(i2, j1)[0] - u(i1, j1)[0]) / dx;
  const ey = (u(i1, j2)[1] - u(i1, j1)[1]) / dy;
  const gxy = (u(i1, j2)[0] - u(i1, j1)[0]) / dy + (u(i2, j1)[1] - u(i1, j1)[1]) / dx;
  return [ex, ey, gxy];
}

describe(`CalculiX ${CCX_VERSION} (Debian calculix-ccx) reads the exported composite section`, function () {
  this.timeout(60_000);

  for (const [name, angles, plyThickness] of [
    ['[0/90]s', [0, 90, 90, 0], 0.25],
    ['[0/90]2s', [0, 90, 0, 90, 90, 0, 90, 0], 0.2],
  ] as const) {
    it(`thin simply supported ${name} plate under pressure: centre deflection within 2 % of the Navier series`, () => {
      const plies = stack([...angles], plyThickness);
      const k = laminateStiffness(plies);
      const [a, b, q] = [300, 200, 1e-4];
      expect(Math.min(a, b) / k.thickness).to.be.at.least(100);
      const mesh = plateMesh(a, b, 12, 8);
      const run = runCalculix(calculixSection(plies), simplySupportedModel(mesh, q));
      const wSolver = run.displacements.get(mesh.nodeAt(mesh.nx, mesh.ny))![2];
      // expected: Navier double series with the engine's D (Whitney 1987; Reddy 2004), converged to 1e-10
      const navier = plateCheck(k, { aMm: a, bMm: b, pressureMPa: q }).navier;
      expect(navier.converged).to.equal(true);
      // a positive P on CalculiX shells pushes along the element normal (+z here), as observed in this run
      expect(wSolver).to.be.above(0);
      expect(Math.abs(wSolver / navier.centreDeflectionMm - 1)).to.be.below(0.02);
    });
  }

  it('[30/-30/0/90]s plate under uniform edge tension: interior mid-plane strain within 1 % of the engine\'s A⁻¹ N', () => {
    const plies = stack([30, -30, 0, 90, 90, 0, -30, 30], 0.25);
    const k = laminateStiffness(plies);
    const N = 10;
    const mesh = plateMesh(200, 200, 8, 8);
    const run = runCalculix(calculixSection(plies), pulledModel(mesh, N));
    const [ex, ey, gxy] = interiorStrains(mesh, run.displacements);
    // expected: the engine's membrane compliance a = A⁻¹ times [N, 0, 0] (classical lamination theory, Jones 1999 ch. 4)
    const a = inv(k.A) as number[][];
    const expected = [a[0][0] * N, a[1][0] * N, a[2][0] * N];
    expect(Math.abs(ex / expected[0] - 1)).to.be.below(0.01);
    expect(Math.abs(ey / expected[1] - 1)).to.be.below(0.01);
    expect(Math.abs(gxy - expected[2])).to.be.below(0.01 * Math.abs(expected[0]));
  });

  it('unbalanced [45/0]s plate pulled in x shears with the sign and size of the engine\'s a16 N (the solver reads ply angles counter-clockwise)', () => {
    const plies = stack([45, 0, 0, 45], 0.25);
    const k = laminateStiffness(plies);
    const N = 10;
    const mesh = plateMesh(200, 200, 8, 8);
    const [ex, , gxy] = interiorStrains(mesh, runCalculix(calculixSection(plies), pulledModel(mesh, N)).displacements);
    const a = inv(k.A) as number[][];
    expect(a[2][0]).to.be.below(0); // classical lamination theory: +45 plies pulled in x shear negatively (Jones 1999 ch. 4)
    expect(Math.sign(gxy)).to.equal(Math.sign(a[2][0] * N));
    expect(Math.abs(gxy / (a[2][0] * N) - 1)).to.be.below(0.01);
    expect(Math.abs(ex / (a[0][0] * N) - 1)).to.be.below(0.01);
  });

  for (const [name, angles] of [['[0_2/90_2]T', [0, 0, 90, 90]], ['[90_2/0_2]T', [90, 90, 0, 0]]] as const) {
    it(`unsymmetric ${name} plate pulled in x, held only against rigid-body motion, warps with the sign and within 5 % of the engine's curvatures`, () => {
      const plies = stack([...angles], 0.25);
      const k = laminateStiffness(plies);
      const N = 1;
      const mesh = plateMesh(100, 100, 8, 8);
      const [kx, ky, kxy] = fittedCurvatures(mesh, runCalculix(calculixSection(plies), pulledModel(mesh, N)).displacements);
      // expected: engine's abd times [N, 0, 0, 0, 0, 0] (classical lamination theory; the first ply is the bottom one)
      const expected = [k.abd[3][0] * N, k.abd[4][0] * N, k.abd[5][0] * N];
      expect(Math.sign(kx)).to.equal(Math.sign(expected[0]));
      expect(Math.abs(kx / expected[0] - 1)).to.be.below(0.05);
      // the antisymmetric cross-ply has no κy or κxy under Nx in the engine; the solver agrees to 5 % of κx
      expect(Math.abs(ky - expected[1])).to.be.below(0.05 * Math.abs(expected[0]));
      expect(Math.abs(kxy - expected[2])).to.be.below(0.05 * Math.abs(expected[0]));
    });
  }

  it('places the layers by OFFSET as referenceOffset says: -0.5 puts the nodes on the bottom surface, 0.5 on the top', () => {
    const plies = stack([0, 90, 90, 0], 0.25);
    const mesh = plateMesh(100, 100, 4, 4);
    for (const [offset, range] of [[-0.5, [0, 1]], [0, [-0.5, 0.5]], [0.5, [-1, 0]]] as const) {
      const run = runCalculix(calculixSection(plies, offset), pulledModel(mesh, 1, true));
      // expanded brick nodes of the solver, read from the .frd (OUTPUT=3D): z of the layers' faces
      expect(run.expandedZ.length).to.be.greaterThan(0);
      expect(Math.min(...run.expandedZ)).to.be.closeTo(range[0], 1e-9);
      expect(Math.max(...run.expandedZ)).to.be.closeTo(range[1], 1e-9);
    }
  });

  it('ties nodal loads to the mid-surface whatever the OFFSET: an offset symmetric plate pulled at its nodes does not curve (what CONTEXT.md tells the analyst)', () => {
    const plies = stack([0, 90, 90, 0], 0.25);
    const k = laminateStiffness(plies);
    const mesh = plateMesh(100, 100, 8, 8);
    const [kx, ky] = fittedCurvatures(mesh, runCalculix(calculixSection(plies, 0.5), pulledModel(mesh, 1)).displacements);
    // were the force applied at the nodes (the top surface), the eccentricity h/2 would give about N (h/2) / D11 (classical plate theory)
    const eccentric = (1 * k.thickness) / 2 / k.D[0][0];
    expect(Math.abs(kx)).to.be.below(0.01 * eccentric);
    expect(Math.abs(ky)).to.be.below(0.01 * eccentric);
  });

  it('reads at most 20 characters of a field: an unsnapped cos 90° (21 characters) would turn the 90° plies, which is why the export prints 0', () => {
    const plies = stack([90, 90, 90, 90], 0.25);
    const k = laminateStiffness(plies);
    const mesh = plateMesh(200, 200, 4, 4);
    const exported = calculixSection(plies);
    const c = String(Math.cos(Math.PI / 2)); // 6.123233995736766e-17
    expect(c.length).to.equal(21);
    const unsnapped = exported.replace('\n0, 1, 0, -1, 0, 0\n', `\n${c}, 1, 0, -1, ${c}, 0\n`);
    expect(unsnapped).to.not.equal(exported);
    const a = inv(k.A) as number[][];
    const [good] = interiorStrains(mesh, runCalculix(exported, pulledModel(mesh, 10)).displacements);
    const [bad] = interiorStrains(mesh, runCalculix(unsnapped, pulledModel(mesh, 10)).displacements);
    expect(Math.abs(good / (a[0][0] * 10) - 1)).to.be.below(0.01);
    expect(Math.abs(bad / (a[0][0] * 10) - 1)).to.be.above(0.1);
  });

  it('the plate check\'s Ritz value (D16, D26 kept) is within 5 % of the solver for a [45/-45]s plate, where the Navier series is more than 10 % off', () => {
    const plies = stack([45, -45, -45, 45], 0.25);
    const k = laminateStiffness(plies);
    const [a, b, q] = [300, 300, 1e-4];
    const mesh = plateMesh(a, b, 12, 12);
    const wSolver = runCalculix(calculixSection(plies), simplySupportedModel(mesh, q)).displacements.get(mesh.nodeAt(mesh.nx, mesh.ny))![2];
    const check = plateCheck(k, { aMm: a, bMm: b, pressureMPa: q });
    expect(check.warnings.join(' ')).to.match(/D16 or D26 is not negligible/);
    expect(Math.abs(check.ritz.centreDeflectionMm / wSolver - 1)).to.be.below(0.05);
    expect(Math.abs(check.navier.centreDeflectionMm / wSolver - 1)).to.be.above(0.1);
  });
});
