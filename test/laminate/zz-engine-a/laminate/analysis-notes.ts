/** The assumptions an analysis took from defaults, said in its output. */
import { STRAIN_FROM_STRENGTH, type StrainField } from './failure/strengths.ts';
import type { LaminateInput } from './input.ts';
import { describeIndices } from './ply-checks.ts';
import type { PlyMaterial } from './types.ts';

export function describeAssumptions(input: LaminateInput): string[] {
  const notes: string[] = [];
  const materials = new Map<PlyMaterial, number[]>();
  input.plies.forEach((p, i) => {
    const list = materials.get(p.material);
    if (list) list.push(i);
    else materials.set(p.material, [i]);
  });
  const withoutDensity = input.plies.flatMap((p, i) => (p.material.density === undefined ? [i] : []));
  if (withoutDensity.length) notes.push(`density not given for plies ${describeIndices(withoutDensity)}: they count as 0 in arealMass`);
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
