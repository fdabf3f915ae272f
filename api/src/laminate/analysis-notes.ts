/** The assumptions an analysis took from defaults, said in its output. */
import { STRAIN_FROM_STRENGTH, type StrainField } from './failure/strengths.ts';
import type { LaminateInput } from './input.ts';
import { describeIndices } from './ply-checks.ts';
import type { PlyMaterial } from './types.ts';

export function describeAssumptions(input: LaminateInput): string[] {
  const notes: string[] = [];
  const materials = new Map<PlyMaterial, number[]>();
  let last: PlyMaterial | null = null, lastList: number[] = [];
  for (let i = 0; i < input.plies.length; i++) {
    const m = input.plies[i].material;
    if (m !== last) {
      last = m;
      lastList = materials.get(m) ?? [];
      if (!materials.has(m)) materials.set(m, lastList);
    }
    lastList.push(i);
  }
  const withoutDensity: number[] = [];
  for (const [m, plies] of materials) if (m.density === undefined) withoutDensity.push(...plies);
  if (withoutDensity.length) notes.push(`density not given for plies ${describeIndices(withoutDensity.sort((a, b) => a - b))}: they count as 0 in arealMass`);
  if (input.criteria.includes('hashin')) {
    for (const [m, plies] of materials) if (m.S23 === undefined) notes.push(`hashin: S23 not given for plies ${describeIndices(plies)}: S23 = Yc / 2 = ${m.Yc! / 2} MPa assumed`);
  }
  if (input.criteria.includes('max-strain')) {
    for (const [m, plies] of materials) {
      const derived = (Object.keys(STRAIN_FROM_STRENGTH) as StrainField[]).filter((f) => m[f] === undefined);
      if (derived.length) notes.push(`max-strain: ${derived.map((f) => `${f} = ${STRAIN_FROM_STRENGTH[f].strength}/${STRAIN_FROM_STRENGTH[f].modulus}`).join(', ')} for plies ${describeIndices(plies)}`);
    }
  }
  return notes;
}
