/**
 * A small seeded pseudo-random generator (mulberry32) for tests whose inputs
 * are generated: the seed is printed, so a failure can be replayed exactly.
 */
export function seededRandom(seed: number) {
  let state = seed >>> 0;
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
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
