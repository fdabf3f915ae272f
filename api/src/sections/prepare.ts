/**
 * Turns the engine's result (internal units) into what every writer prints:
 * values in the chosen unit system, the distinct ply materials with their ids
 * and names, the stiffness about the reference surface. Writers stay simple
 * text layout on top of this.
 */
import type { Matrix2, PlyInput, PlyMaterial } from '../laminate/types.ts';
import { InputError } from '../shared/input-error.ts';
import { resolveSectionOptions } from './options.ts';
import { aboutReferenceSurface, type MembraneBending } from './reference-surface.ts';
import type { EngineeringConstants, ResolvedSectionOptions, SectionOptions, SectionSource } from './types.ts';
import { toUnitSystem, UNIT_SYSTEMS, type QuantityKind, type UnitSystem } from './units.ts';

export interface PreparedMaterial {
  /** 0-based, in order of first use from the bottom ply */
  index: number;
  nastranId: number;
  /** unique name for keyword decks: letters, digits and _ only */
  keywordName: string;
  /** the name a person gave it, or "material N" */
  label: string;
  /** the ply material in the export unit system */
  values: PlyMaterial;
  /** transverse shear moduli as the laminate engine takes them (G13 = G12, G23 = G13 when not given) */
  G13: number;
  G23: number;
  shearAssumed: boolean;
}

export interface PreparedPly {
  /** 1-based, bottom ply first */
  number: number;
  material: PreparedMaterial;
  thetaDeg: number;
  thickness: number;
}

export interface PreparedSection {
  options: ResolvedSectionOptions;
  system: UnitSystem;
  engineVersion: string;
  thickness: number;
  arealMass: number;
  referenceOffset: number;
  /** distance of the reference surface above the mid-plane, export length unit */
  offsetDistance: number;
  midPlane: MembraneBending;
  atReference: MembraneBending;
  H: Matrix2;
  materials: PreparedMaterial[];
  plies: PreparedPly[];
  engineeringConstants?: EngineeringConstants;
  transverseShearModel?: string;
}

/** Unit kind of each ply-material field (strengths in stress, strain allowables and ratios dimensionless). */
export const MATERIAL_FIELD_KIND: Record<string, QuantityKind> = {
  E1: 'stress', E2: 'stress', G12: 'stress', nu12: 'dimensionless', G13: 'stress', G23: 'stress',
  density: 'density', alpha1: 'perKelvin', alpha2: 'perKelvin', beta1: 'dimensionless', beta2: 'dimensionless',
  Xt: 'stress', Xc: 'stress', Yt: 'stress', Yc: 'stress', S12: 'stress', S23: 'stress',
  e1t: 'dimensionless', e1c: 'dimensionless', e2t: 'dimensionless', e2c: 'dimensionless', g12: 'dimensionless',
};

/** Converts every numeric field of a ply material; `direction` 1 internal → system, -1 back. */
export function convertPlyMaterial(material: PlyMaterial, system: UnitSystem, direction: 1 | -1 = 1): PlyMaterial {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(material)) {
    const kind = MATERIAL_FIELD_KIND[key];
    if (typeof value === 'number' && kind) {
      const factor = toUnitSystem(1, kind, system);
      out[key] = direction === 1 ? value * factor : value / factor;
    } else {
      out[key] = value;
    }
  }
  return out as unknown as PlyMaterial;
}

function scaleMatrix<T extends number[][]>(m: T, factor: number): T {
  return m.map((row) => row.map((v) => v * factor)) as T;
}

/** Moduli (keys starting with E or G) convert as stress, the rest are ratios. */
function convertConstants(constants: EngineeringConstants, system: UnitSystem): EngineeringConstants {
  const out: EngineeringConstants = {};
  for (const [group, values] of Object.entries(constants)) {
    out[group] = {};
    for (const [key, value] of Object.entries(values)) {
      out[group][key] = typeof value === 'number' && /^[EG]/.test(key) ? toUnitSystem(value, 'stress', system) : value;
    }
  }
  return out;
}

/** Same material if every property is equal (plies usually share one object, but JSON input gives copies). */
function materialKey(material: PlyMaterial): string {
  return JSON.stringify(Object.keys(material).sort().map((k) => [k, (material as unknown as Record<string, unknown>)[k]]));
}

function keywordSafe(label: string): string {
  const ascii = label.normalize('NFKD').replace(/[\u0300-\u036f]/g, '');
  const cleaned = ascii.toUpperCase().replace(/[^A-Z0-9_]+/g, '_').replace(/^_+|_+$/g, '');
  return cleaned.slice(0, 60);
}

function distinctMaterials(plies: PlyInput[], options: ResolvedSectionOptions, system: UnitSystem): Map<string, PreparedMaterial> {
  const byKey = new Map<string, PreparedMaterial>();
  const usedNames = new Set<string>();
  for (const ply of plies) {
    const key = materialKey(ply.material);
    if (byKey.has(key)) continue;
    const index = byKey.size;
    const label = ply.material.name?.trim() || `material ${index + 1}`;
    const base = `PL_${keywordSafe(label) || 'MATERIAL'}`;
    let keywordName = base;
    for (let k = index + 1; usedNames.has(keywordName); k++) keywordName = `${base}_${k}`;
    usedNames.add(keywordName);
    const values = convertPlyMaterial(ply.material, system);
    const G13 = values.G13 ?? values.G12;
    byKey.set(key, {
      index, label, keywordName, values,
      nastranId: options.materialId + index,
      G13, G23: values.G23 ?? G13,
      shearAssumed: values.G13 === undefined || values.G23 === undefined,
    });
  }
  return byKey;
}

/** Everything a writer needs, in the export unit system. Throws InputError for bad options or an empty laminate. */
export function prepareSection(source: SectionSource, options: SectionOptions = {}): PreparedSection {
  const resolved = resolveSectionOptions(options);
  if (!source.plies.length) throw new InputError({ field: 'plies', message: 'has no plies', fix: 'give at least one ply' });
  const system = UNIT_SYSTEMS[resolved.units];
  const length = toUnitSystem(1, 'length', system);
  const k = source.stiffness;
  const midPlane: MembraneBending = {
    A: scaleMatrix(k.A, toUnitSystem(1, 'forcePerLength', system)),
    B: scaleMatrix(k.B, toUnitSystem(1, 'force', system)),
    D: scaleMatrix(k.D, toUnitSystem(1, 'moment', system)),
  };
  const thickness = k.thickness * length;
  const offsetDistance = resolved.referenceOffset * thickness;
  const materials = distinctMaterials(source.plies, resolved, system);
  // PSHELL takes four MAT2 ids from materialId on, PCOMP one MAT8 per material: all must fit 8 columns.
  if (resolved.materialId + Math.max(materials.size, 4) - 1 > 99_999_999) {
    throw new InputError({ field: 'options.materialId', message: 'leaves no room for the material ids of this section below 100000000', fix: 'choose a smaller first material id' });
  }
  const plies = source.plies.map((ply, i) => ({
    number: i + 1,
    material: materials.get(materialKey(ply.material))!,
    thetaDeg: ply.thetaDeg,
    thickness: ply.thickness * length,
  }));
  return {
    options: resolved,
    system,
    engineVersion: source.engineVersion,
    thickness,
    arealMass: toUnitSystem(k.arealMass, 'arealMass', system),
    referenceOffset: resolved.referenceOffset,
    offsetDistance,
    midPlane,
    atReference: aboutReferenceSurface(midPlane, offsetDistance),
    H: scaleMatrix(k.H, toUnitSystem(1, 'forcePerLength', system)),
    materials: [...materials.values()],
    plies,
    engineeringConstants: source.engineeringConstants ? convertConstants(source.engineeringConstants, system) : undefined,
    transverseShearModel: k.transverseShear?.description,
  };
}
