import type { CriterionName, LoadCase } from '../../../../shared/laminate/laminate-wire';
import type { LayupSettings } from '../../data/layup-wire';

/** The loads panel's state, in internal units (N/mm, N·mm/mm, K). */
export interface LoadSettings {
  readonly N: readonly [number, number, number];
  readonly M: readonly [number, number, number];
  readonly deltaT: number;
  readonly factorOfSafety: number;
  readonly criteria: readonly CriterionName[];
}

/** A first look: 100 N/mm of tension along x, factor of safety 1.5, three criteria of different kinds. */
export const DEFAULT_LOAD_SETTINGS: LoadSettings = {
  N: [100, 0, 0],
  M: [0, 0, 0],
  deltaT: 0,
  factorOfSafety: 1.5,
  criteria: ['max-stress', 'tsai-wu', 'hashin'],
};

/** The settings stored with a revision and sent with a preview; no loads at all when every load is zero. */
export function layupSettingsOf(settings: LoadSettings): LayupSettings {
  const loaded = [...settings.N, ...settings.M, settings.deltaT].some((value) => value !== 0);
  if (!loaded) return {};
  const loads: LoadCase = { N: [...settings.N], M: [...settings.M], ...(settings.deltaT !== 0 ? { deltaT: settings.deltaT } : {}) };
  return {
    loads,
    ...(settings.criteria.length > 0 ? { criteria: [...settings.criteria] } : {}),
    factorOfSafety: settings.factorOfSafety,
  };
}

/** The loads panel of a saved revision (its settings), or the defaults where it has none. */
export function loadSettingsOf(settings: LayupSettings | undefined): LoadSettings {
  const loads = settings?.loads;
  if (!loads) return DEFAULT_LOAD_SETTINGS;
  const triple = (v: readonly (number | null)[] | undefined): [number, number, number] => [v?.[0] ?? 0, v?.[1] ?? 0, v?.[2] ?? 0];
  return {
    N: triple(loads.N),
    M: triple(loads.M),
    deltaT: loads.deltaT ?? 0,
    factorOfSafety: settings.factorOfSafety ?? 1,
    criteria: settings.criteria ?? DEFAULT_LOAD_SETTINGS.criteria,
  };
}

/**
 * Margin of safety of a ply, MS = R / FS - 1 (ENGINEERING.md section 3 item 5;
 * the engine gives the same for first-ply failure): R is the strength ratio on
 * the mechanical load, FS the factor of safety. No margin when R does not exist.
 */
export function marginOfSafety(strengthRatio: number | null, factorOfSafety: number): number | null {
  return strengthRatio === null || !(factorOfSafety > 0) ? null : strengthRatio / factorOfSafety - 1;
}
