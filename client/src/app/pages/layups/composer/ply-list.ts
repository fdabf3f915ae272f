/**
 * The composer's ply list and the edits a designer makes to it. Pure
 * functions: each returns a new list, so a signal holding the list changes
 * by identity. `key` only tells Angular which row is which while plies move.
 */
import type { DraftPly, LaminaChoice, RevisionPly } from '../data/layup-wire';

export interface ComposerPly extends DraftPly {
  readonly key: number;
}

/** Where new plies and a typed laminate code take their material from. */
export interface MaterialChoice {
  readonly materialId: number;
  readonly lamina: LaminaChoice;
  /** null: the material's nominal cured ply thickness */
  readonly thicknessMm: number | null;
}

let lastKey = 0;
const nextKey = () => ++lastKey;

export function newPly(choice: MaterialChoice, thetaDeg: number): ComposerPly {
  return { key: nextKey(), materialId: choice.materialId, lamina: choice.lamina, thicknessMm: choice.thicknessMm, thetaDeg };
}

/**
 * The ply table of a saved revision or a preview, as the composer edits it.
 * Rows keep the keys of `previous` place by place, so a retyped code updates
 * the table's rows instead of building them anew.
 */
export function pliesFromRevision(plies: readonly RevisionPly[], previous: readonly ComposerPly[] = []): ComposerPly[] {
  return plies.map((ply, i) => ({
    key: previous[i]?.key ?? nextKey(),
    materialId: ply.materialId,
    thetaDeg: ply.thetaDeg,
    thicknessMm: ply.thicknessOverrideMm,
    lamina:
      ply.lamina.source === 'typical'
        ? { source: 'typical', conditionId: ply.lamina.conditionId }
        : { source: 'ply-property-set', conditionId: ply.lamina.conditionId, basis: ply.lamina.basis },
  }));
}

/** Moves the ply at `from` to `to` (drag and drop, or the up/down buttons). */
export function movePly(plies: readonly ComposerPly[], from: number, to: number): ComposerPly[] {
  const list = [...plies];
  if (from === to || from < 0 || from >= list.length) return list;
  const [moved] = list.splice(from, 1);
  list.splice(Math.max(0, Math.min(to, list.length)), 0, moved);
  return list;
}

/** A copy of ply `index`, placed right above it. */
export function duplicatePly(plies: readonly ComposerPly[], index: number): ComposerPly[] {
  const list = [...plies];
  const source = list[index];
  if (source) list.splice(index + 1, 0, { ...source, key: nextKey() });
  return list;
}

export function removePly(plies: readonly ComposerPly[], index: number): ComposerPly[] {
  return plies.filter((_, i) => i !== index);
}

export function updatePly(plies: readonly ComposerPly[], index: number, change: Partial<DraftPly>): ComposerPly[] {
  return plies.map((ply, i) => (i === index ? { ...ply, ...change } : ply));
}

/** What goes over the wire: the ply table without the row keys. */
export function draftPlies(plies: readonly ComposerPly[]): DraftPly[] {
  return plies.map(({ materialId, thetaDeg, thicknessMm, lamina }) => ({ materialId, thetaDeg, thicknessMm, lamina }));
}

/** A select's value for a lamina choice ("2:typical", "2:B"), and back. */
export function laminaKey(lamina: LaminaChoice): string {
  return `${lamina.conditionId}:${lamina.source === 'typical' ? 'typical' : lamina.basis}`;
}

export function laminaFromKey(key: string): LaminaChoice | null {
  const match = /^(\d+):(A|B|typical)$/.exec(key);
  if (!match) return null;
  const conditionId = Number(match[1]);
  return match[2] === 'typical'
    ? { source: 'typical', conditionId }
    : { source: 'ply-property-set', conditionId, basis: match[2] as 'A' | 'B' };
}
