/**
 * The stack as flat typed arrays, built once per analysis: what stiffness,
 * response and failure read on their hot paths without allocating. Also where
 * ply-discount degrades a ply (progressive failure), so the same code computes
 * the intact and the damaged laminate.
 */
import { cosSinDeg } from './angles.ts';
import { qBarInto, reducedStiffnessInto } from './lamina.ts';
import type { PlyInput } from './types.ts';

export interface PlyTable {
  count: number;
  /** mm */
  thickness: number;
  plies: readonly PlyInput[];
  /* the arrays below hold `count` plies (they may be longer when a table is reused) */
  /** ply thickness and the z of its bottom and top surface, mm (z = 0 at mid-plane, first ply at -h/2) */
  t: Float64Array;
  zBottom: Float64Array;
  zTop: Float64Array;
  /** current Q of each ply: 11, 12, 22, 66 (4 per ply), MPa */
  q: Float64Array;
  /** current Q-bar of each ply: 11, 12, 22, 16, 26, 66 (6 per ply), MPa */
  qbar: Float64Array;
  /** thermal and moisture expansion in laminate axes, x, y, xy (3 per ply) */
  alpha: Float64Array;
  beta: Float64Array;
}

/**
 * Builds the table; the plies must already be valid (see ply-checks.ts).
 * `reuse` lends its arrays when they are large enough (the analysis keeps one
 * table for the next call; the arrays may then be longer than count needs).
 */
export function buildPlyTable(plies: readonly PlyInput[], reuse?: PlyTable): PlyTable {
  const n = plies.length;
  const fits = reuse !== undefined && reuse.t.length >= n;
  const table: PlyTable = fits ? reuse : {
    count: n,
    thickness: 0,
    plies,
    t: new Float64Array(n),
    zBottom: new Float64Array(n),
    zTop: new Float64Array(n),
    q: new Float64Array(4 * n),
    qbar: new Float64Array(6 * n),
    alpha: new Float64Array(3 * n),
    beta: new Float64Array(3 * n),
  };
  if (fits) {
    table.count = n;
    table.plies = plies;
    table.alpha.fill(0, 0, 3 * n);
    table.beta.fill(0, 0, 3 * n);
  }
  let h = 0;
  for (let i = 0; i < n; i++) h += plies[i].thickness;
  table.thickness = h;
  let z = -h / 2;
  let previous: PlyInput | null = null;
  for (let i = 0; i < n; i++) {
    const ply = plies[i];
    const m = ply.material;
    table.t[i] = ply.thickness;
    table.zBottom[i] = z;
    z += ply.thickness;
    table.zTop[i] = i === n - 1 ? h / 2 : z;
    if (previous && previous.material === m && previous.thetaDeg === ply.thetaDeg) {
      // same ply data as the one below (blocks of one angle are the rule): copy rather than transform again
      table.q.copyWithin(4 * i, 4 * (i - 1), 4 * i);
      table.qbar.copyWithin(6 * i, 6 * (i - 1), 6 * i);
      table.alpha.copyWithin(3 * i, 3 * (i - 1), 3 * i);
      table.beta.copyWithin(3 * i, 3 * (i - 1), 3 * i);
    } else {
      reducedStiffnessInto(m, table.q, 4 * i);
      updateQbar(table, i);
      const { c, s } = cosSinDeg(ply.thetaDeg);
      if (m.alpha1 !== undefined || m.alpha2 !== undefined) expansionInto(m.alpha1 ?? 0, m.alpha2 ?? 0, c, s, table.alpha, 3 * i);
      if (m.beta1 !== undefined || m.beta2 !== undefined) expansionInto(m.beta1 ?? 0, m.beta2 ?? 0, c, s, table.beta, 3 * i);
    }
    previous = ply;
  }
  return table;
}

/** The same transformation as expansionLaminateAxes (lamina.ts), written in place. */
function expansionInto(a1: number, a2: number, c: number, s: number, out: Float64Array, o: number): void {
  out[o] = a1 * c * c + a2 * s * s;
  out[o + 1] = a1 * s * s + a2 * c * c;
  out[o + 2] = 2 * (a1 - a2) * c * s;
}

function updateQbar(table: PlyTable, i: number): void {
  const q = table.q;
  qBarInto(q[4 * i], q[4 * i + 1], q[4 * i + 2], q[4 * i + 3], table.plies[i].thetaDeg, table.qbar, 6 * i);
}

/**
 * Ply-discount (common practice; Kaw chapter 4, ply-by-ply analysis): scales the
 * fibre-direction, transverse and shear moduli of ply i by the given factors and
 * rebuilds its Q and Q-bar. A factor of 1e-6 rather than 0 keeps the ABD matrix
 * invertible while the ply carries practically nothing.
 */
export function degradePly(table: PlyTable, i: number, fibreFactor: number, matrixFactor: number): void {
  const m = table.plies[i].material;
  reducedStiffnessInto({ E1: m.E1 * fibreFactor, E2: m.E2 * matrixFactor, G12: m.G12 * matrixFactor, nu12: m.nu12 }, table.q, 4 * i);
  updateQbar(table, i);
}

/** A copy of the table whose stiffness can be degraded without touching the original. */
export function clonePlyTable(table: PlyTable): PlyTable {
  const n = table.count;
  return {
    ...table,
    t: table.t.slice(0, n), zBottom: table.zBottom.slice(0, n), zTop: table.zTop.slice(0, n),
    q: table.q.slice(0, 4 * n), qbar: table.qbar.slice(0, 6 * n), alpha: table.alpha.slice(0, 3 * n), beta: table.beta.slice(0, 3 * n),
  };
}
