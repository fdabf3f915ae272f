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

/** The seed of this run: PLYLEDGER_FUZZ_SEED replays one, otherwise a fresh one. */
export function runSeed(): number {
  const fromEnv = Number(process.env.PLYLEDGER_FUZZ_SEED);
  return Number.isInteger(fromEnv) && fromEnv > 0 ? fromEnv : Math.floor(Math.random() * 2 ** 31) + 1;
}
