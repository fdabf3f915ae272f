import { mulberry32 } from '../../api/src/shared/seeded-random.ts';

/**
 * A small seeded pseudo-random generator (mulberry32) for tests whose inputs
 * are generated: the seed is printed, so a failure can be replayed exactly.
 */
export function seededRandom(seed: number) {
  const next = mulberry32(seed);
  return {
    next,
    int: (lo: number, hi: number) => lo + Math.floor(next() * (hi - lo + 1)),
    pick: <T>(items: readonly T[]): T => items[Math.floor(next() * items.length)],
  };
}

/** The seed CI uses, so that a submission's result does not depend on the luck of the draw. */
export const CI_FUZZ_SEED = 20261202;

/**
 * The seed of this run: PLYLEDGER_FUZZ_SEED replays one; CI uses CI_FUZZ_SEED;
 * a developer's run draws a fresh one each time, to keep exploring.
 */
export function runSeed(): number {
  const fromEnv = Number(process.env.PLYLEDGER_FUZZ_SEED);
  if (Number.isInteger(fromEnv) && fromEnv > 0) return fromEnv;
  if (process.env.CI) return CI_FUZZ_SEED;
  return Math.floor(Math.random() * 2 ** 31) + 1;
}
