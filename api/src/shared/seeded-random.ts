/**
 * mulberry32, a small seeded pseudo-random generator (public-domain algorithm,
 * common practice for reproducible data): the same seed gives the same
 * sequence on every machine. Used where generated data must be repeatable: the
 * demo coupons (their file and SHA-256 stay the same) and the generated inputs
 * of tests (a failure can be replayed from its seed). Not for anything secret.
 */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
