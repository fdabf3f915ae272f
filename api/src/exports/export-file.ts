/**
 * The file of a section export, written by the sections engine from a layup
 * revision's stored laminate, exactly as `plyledger section` writes it from
 * the same JSON and options: the export's date, the layup's name and revision
 * and the allowables line are passed as options (the CLI's --date, --name,
 * --revision, --allowables), so the recorded text can be reproduced byte for byte.
 */
import { exportSection, type SectionFile, type SectionFormat, type SectionOptions, type SectionSource, type UnitSystemName } from '../sections/index.ts';
import { sectionSourceFromLaminateInput } from '../sections/source.ts';
import { InputError } from '../shared/input-error.ts';
import { sectionLaminateJson, type LaminateJson } from '../layups/layup-compose.ts';
import type { ResolvedLamina } from '../layups/lamina-sources.ts';

/** What a person chooses on the export page (everything but the format optional). */
export interface ExportChoice {
  format: SectionFormat;
  units?: UnitSystemName;
  propertyId?: number;
  materialId?: number;
  elset?: string;
  referenceOffset?: number;
  freeField?: boolean;
}

/** The header's `allowables` option is text of at most 200 characters (sections/options.ts). */
const ALLOWABLES_TEXT_MAX = 200;

function laminaLine(l: ResolvedLamina, compact: boolean): string {
  const head = l.source === 'typical' ? `${l.materialCode} ${l.conditionCode} typical values` : `${l.materialCode} ${l.conditionCode} ${l.basis}-basis`;
  if (l.source === 'typical') return `${head} (no allowables)`;
  const unapproved = Object.values(l.fields).filter((f) => f.origin === 'unapproved').length;
  const note = unapproved ? `, ${unapproved} unapproved` : '';
  if (!l.allowableIds.length) return `${head}: no allowables (typical values)`;
  return compact ? `${head}: ${l.allowableIds.length} allowables${note}` : `${head}: allowables ${l.allowableIds.map((id) => `#${id}`).join(', ')}${note}`;
}

/** The header line naming the allowables the ply data used (ids where they fit, counts where not). */
export function allowablesText(laminae: readonly ResolvedLamina[]): string {
  for (const compact of [false, true]) {
    const text = laminae.map((l) => laminaLine(l, compact)).join('; ');
    if (text.length <= ALLOWABLES_TEXT_MAX) return text;
  }
  const count = new Set(laminae.flatMap((l) => l.allowableIds)).size;
  return `${laminae.length} lamina sources with ${count} allowables; see the export record`;
}

/** The UTC calendar day of a moment, as the header writes it. */
export function headerDate(at: Date): string {
  return at.toISOString().slice(0, 10);
}

export interface HeaderText {
  layupName: string;
  layupRevision: string;
  allowables: string;
  date: string;
}

export function sectionOptions(choice: ExportChoice, header: HeaderText): SectionOptions {
  return {
    units: choice.units, propertyId: choice.propertyId, materialId: choice.materialId, elset: choice.elset,
    referenceOffset: choice.referenceOffset, freeField: choice.freeField === true,
    layupName: header.layupName, layupRevision: header.layupRevision, allowables: header.allowables, date: header.date,
  };
}

/** The engine's view of a layup revision's laminate (plies and shear model). */
export function sectionSourceOf(laminate: LaminateJson): SectionSource {
  return sectionSourceFromLaminateInput(sectionLaminateJson(laminate));
}

/** Writes the file; the engine's option problems (`options.elset`) are named as the request's fields (`elset`). */
export function writeSectionFile(source: SectionSource, choice: ExportChoice, header: HeaderText): SectionFile {
  try {
    return exportSection(choice.format, source, sectionOptions(choice, header));
  } catch (err) {
    if (err instanceof InputError) throw new InputError(err.problems.map((p) => ({ ...p, field: p.field.replace(/^options\./, '') })));
    throw err;
  }
}

/** The arguments of `plyledger section` that print the same text from `reproduce.laminate`. */
export function cliArguments(choice: ExportChoice, header: HeaderText, resolved: { units: string; propertyId: number; materialId: number; elset: string; referenceOffset: number; freeField: boolean }): string[] {
  return [
    `--format=${choice.format}`, `--units=${resolved.units}`, `--elset=${resolved.elset}`, `--pid=${resolved.propertyId}`, `--mid=${resolved.materialId}`,
    `--offset=${resolved.referenceOffset}`, ...(resolved.freeField ? ['--free-field'] : []),
    `--name=${header.layupName}`, `--revision=${header.layupRevision}`, `--allowables=${header.allowables}`, `--date=${header.date}`,
  ];
}
