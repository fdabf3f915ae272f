/**
 * Which header of the file feeds each template field, and what unit the
 * headers' suffixes state. Pure functions over the header row.
 */
import { FieldDimension, ForceUnit, LengthUnit, StressUnit, TEMPLATE_FIELDS, TemplateField, UNIT_SUFFIXES } from './template-fields';

/** template field -> header of the file (null: not in the file). */
export type ColumnMapping = Readonly<Record<string, string | null>>;

function suffixesOf(dimension: FieldDimension): readonly string[] {
  if (dimension === 'microstrain') return ['microstrain'];
  if (dimension === 'none') return [];
  return Object.keys(UNIT_SUFFIXES[dimension]);
}

/** The headers the server finds a field under without a mapping: the bare name and each unit spelling. */
function knownHeaders(field: TemplateField): string[] {
  return [field.field, ...suffixesOf(field.dimension).map((suffix) => `${field.field}_${suffix}`)];
}

/** The mapping the server would use by itself: each field found under a template spelling (any case). */
export function guessMapping(headers: readonly string[]): ColumnMapping {
  const byLower = new Map(headers.map((h) => [h.trim().toLowerCase(), h]));
  return Object.fromEntries(
    TEMPLATE_FIELDS.map((field) => [field.field, knownHeaders(field).map((h) => byLower.get(h)).find((h) => h !== undefined) ?? null]),
  );
}

export interface StatedUnits {
  readonly stressUnit?: StressUnit;
  readonly lengthUnit?: LengthUnit;
  readonly forceUnit?: ForceUnit;
  /** Headers whose suffixes disagree with each other, e.g. strength_mpa beside modulus_msi. */
  readonly conflicts: readonly string[];
}

/** The unit a header's suffix states for a field, if any (strength_ksi -> ksi). */
export function unitStatedBy(field: TemplateField, header: string): string | null {
  if (field.dimension === 'none' || field.dimension === 'microstrain') return null;
  const lower = header.trim().toLowerCase();
  if (!lower.startsWith(`${field.field}_`)) return null;
  const suffixes: Readonly<Record<string, string>> = UNIT_SUFFIXES[field.dimension];
  return suffixes[lower.slice(field.field.length + 1)] ?? null;
}

/** The unit choices the mapped headers state by their suffixes, and where they disagree. */
export function unitsStatedByHeaders(mapping: ColumnMapping): StatedUnits {
  const found: { stressUnit?: string; lengthUnit?: string; forceUnit?: string } = {};
  const conflicts: string[] = [];
  for (const field of TEMPLATE_FIELDS) {
    const header = mapping[field.field];
    if (!header) continue;
    const unit = unitStatedBy(field, header);
    if (!unit) continue;
    const key = field.dimension === 'length' ? 'lengthUnit' : field.dimension === 'force' ? 'forceUnit' : 'stressUnit';
    if (found[key] && found[key] !== unit) conflicts.push(header);
    else found[key] = unit;
  }
  return { ...(found as Omit<StatedUnits, 'conflicts'>), conflicts };
}

/** Required fields that no header feeds. */
export function missingRequired(mapping: ColumnMapping): readonly TemplateField[] {
  return TEMPLATE_FIELDS.filter((f) => f.required && !mapping[f.field]);
}

/** Headers mapped to two fields or more (each header can feed one field only). */
export function doubleMapped(mapping: ColumnMapping): readonly string[] {
  const seen = new Map<string, number>();
  for (const header of Object.values(mapping)) if (header) seen.set(header, (seen.get(header) ?? 0) + 1);
  return [...seen].filter(([, n]) => n > 1).map(([h]) => h);
}

/** What is sent as `columns`: only the mapped fields. */
export function mappingForServer(mapping: ColumnMapping): Record<string, string> {
  return Object.fromEntries(Object.entries(mapping).filter((entry): entry is [string, string] => entry[1] !== null));
}
