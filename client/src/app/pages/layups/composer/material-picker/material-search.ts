import type { Material } from '../../../../shared/catalogue/catalogue-wire';
import type { PlyPropertySet } from '../../../../shared/catalogue/ply-property-wire';
import type { Approval, LaminaChoice } from '../../data/layup-wire';

/** Every word typed must appear in the material's code, name, fibre, resin or form. */
export function materialMatches(material: Material, search: string): boolean {
  const haystack = [material.code, material.name, material.fibre, material.resin, material.form].join(' ').toLowerCase();
  return search
    .toLowerCase()
    .split(/\s+/)
    .filter(Boolean)
    .every((word) => haystack.includes(word));
}

/** Lamina fields an allowable can give: strengths and strain allowables (catalogue names). */
const ALLOWABLE_FIELDS = new Set(['Xt', 'Xc', 'Yt', 'Yc', 'S12', 'e1t', 'e1c', 'e2t', 'e2c', 'g12u']);

/**
 * The approval a ply would be computed on, read from the catalogue's ply
 * property set the same way the layup service labels a saved lamina:
 * typical values are never allowables; otherwise every, some or none of the
 * allowable fields that have a number are approved.
 */
export function approvalOfSet(lamina: LaminaChoice, set: PlyPropertySet | null): Approval {
  if (lamina.source === 'typical') return 'typical';
  if (!set) return 'unapproved';
  const given = set.fields.filter((f) => ALLOWABLE_FIELDS.has(f.field) && f.status !== 'missing');
  if (given.length > 0 && given.every((f) => f.status === 'approved')) return 'approved';
  return given.some((f) => f.status === 'approved') ? 'partly-approved' : 'unapproved';
}
