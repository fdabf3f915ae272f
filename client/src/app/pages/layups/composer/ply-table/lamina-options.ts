import type { Condition } from '../../../../shared/catalogue/catalogue-wire';

/** One entry of a lamina select: where a ply's properties come from. */
export interface LaminaOption {
  readonly key: string;
  readonly label: string;
}

/** For each condition: its B- and A-basis ply property sets and its typical values. */
export function laminaOptions(conditions: readonly Condition[]): LaminaOption[] {
  return conditions.flatMap((condition) => [
    { key: `${condition.id}:B`, label: `${condition.code} B-basis` },
    { key: `${condition.id}:A`, label: `${condition.code} A-basis` },
    { key: `${condition.id}:typical`, label: `${condition.code} typical` },
  ]);
}
