/** The criterion plans of a material, built once per analysis and shared by all its plies. */
import type { PlyMaterial } from '../types.ts';
import { CRITERIA, type CriterionName, type CriterionPlan, type FailureOptions } from './criterion.ts';
import { hashinPlan } from './hashin.ts';
import { maxStrainPlan } from './max-strain.ts';
import { maxStressPlan } from './max-stress.ts';
import { puckPlan } from './puck.ts';
import { tsaiHillPlan } from './tsai-hill.ts';
import { tsaiWuPlan } from './tsai-wu.ts';

export function criterionPlan(criterion: CriterionName, material: PlyMaterial, options: FailureOptions): CriterionPlan {
  switch (criterion) {
    case 'max-stress': return maxStressPlan(material);
    case 'max-strain': return maxStrainPlan(material);
    case 'tsai-hill': return tsaiHillPlan(material);
    case 'tsai-wu': return tsaiWuPlan(material, options.tsaiWuF12Star);
    case 'hashin': return hashinPlan(material);
    case 'puck': return puckPlan(material, options.puck);
  }
}

/**
 * Plans per (material object, criterion, settings). Kept across analyses in a
 * WeakMap on the material object, so analysing the same parsed input again
 * (a load sweep, an envelope, a benchmark) builds no plan twice. Each entry
 * keeps the material values it was built from and is rebuilt if they changed.
 */
interface CachedPlan {
  plan: CriterionPlan;
  snapshot: number[];
}

const shared = new WeakMap<PlyMaterial, Map<string, CachedPlan>>();
const PLAN_FIELDS = ['E1', 'E2', 'G12', 'nu12', 'Xt', 'Xc', 'Yt', 'Yc', 'S12', 'S23', 'e1t', 'e1c', 'e2t', 'e2c', 'g12'] as const;

function snapshotOf(m: PlyMaterial): number[] {
  return PLAN_FIELDS.map((f) => m[f] ?? NaN);
}

function sameSnapshot(m: PlyMaterial, snapshot: number[]): boolean {
  for (let i = 0; i < PLAN_FIELDS.length; i++) {
    const v = m[PLAN_FIELDS[i]] ?? NaN;
    if (v !== snapshot[i] && !(Number.isNaN(v) && Number.isNaN(snapshot[i]))) return false;
  }
  return true;
}

export class PlanCache {
  private readonly keys: Record<string, string> = {};
  private lastMaterial: PlyMaterial | null = null;
  private lastCriterion: CriterionName | null = null;
  private lastPlan: CriterionPlan | null = null;

  constructor(private readonly options: FailureOptions) {
    const p = options.puck;
    const settings = `${options.tsaiWuF12Star}|${p.pPerpParTension}|${p.pPerpParCompression}|${p.pPerpPerpCompression}`;
    for (const c of CRITERIA) this.keys[c] = `${c}|${settings}`;
  }

  get(material: PlyMaterial, criterion: CriterionName): CriterionPlan {
    if (material === this.lastMaterial && criterion === this.lastCriterion) return this.lastPlan!;
    let byKey = shared.get(material);
    if (!byKey) shared.set(material, (byKey = new Map()));
    const key = this.keys[criterion];
    let entry = byKey.get(key);
    if (!entry || !sameSnapshot(material, entry.snapshot)) {
      entry = { plan: criterionPlan(criterion, material, this.options), snapshot: snapshotOf(material) };
      byKey.set(key, entry);
    }
    this.lastMaterial = material;
    this.lastCriterion = criterion;
    this.lastPlan = entry.plan;
    return entry.plan;
  }
}
