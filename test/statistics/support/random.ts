/**
 * Seeded pseudo-random data for the statistics tests, so that every failure
 * replays: xorshift128+ (Vigna 2014) for uniforms, Box-Muller for normals,
 * inversion for Weibull values. Test-only; the engine has no randomness.
 */
export class SeededRandom {
  private s0: bigint;
  private s1: bigint;

  constructor(seed: number) {
    // splitmix64 spreads the seed over both state words.
    let z = BigInt.asUintN(64, BigInt(seed) * 0x9e3779b97f4a7c15n + 0x632be59bd9b4e019n);
    const next = () => {
      z = BigInt.asUintN(64, z + 0x9e3779b97f4a7c15n);
      let x = z;
      x = BigInt.asUintN(64, (x ^ (x >> 30n)) * 0xbf58476d1ce4e5b9n);
      x = BigInt.asUintN(64, (x ^ (x >> 27n)) * 0x94d049bb133111ebn);
      return x ^ (x >> 31n);
    };
    this.s0 = next();
    this.s1 = next();
  }

  /** Uniform on (0, 1), never exactly 0 or 1. */
  uniform(): number {
    let s1 = this.s0;
    const s0 = this.s1;
    this.s0 = s0;
    s1 = BigInt.asUintN(64, s1 ^ (s1 << 23n));
    this.s1 = s1 ^ s0 ^ (s1 >> 17n) ^ (s0 >> 26n);
    const bits = Number(BigInt.asUintN(64, this.s1 + s0) >> 11n);
    return (bits + 0.5) / 2 ** 53;
  }

  between(lo: number, hi: number): number {
    return lo + (hi - lo) * this.uniform();
  }

  integer(lo: number, hi: number): number {
    return Math.min(hi, Math.floor(this.between(lo, hi + 1)));
  }

  /** Log-uniform on [lo, hi]. */
  logBetween(lo: number, hi: number): number {
    return Math.exp(this.between(Math.log(lo), Math.log(hi)));
  }

  normal(mean = 0, sd = 1): number {
    return mean + sd * Math.sqrt(-2 * Math.log(this.uniform())) * Math.cos(2 * Math.PI * this.uniform());
  }

  weibull(shape: number, scale: number): number {
    return scale * Math.pow(-Math.log(this.uniform()), 1 / shape);
  }

  shuffle<T>(items: readonly T[]): T[] {
    const out = [...items];
    for (let i = out.length - 1; i > 0; i--) {
      const j = this.integer(0, i);
      [out[i], out[j]] = [out[j], out[i]];
    }
    return out;
  }
}

export interface GeneratedGroup {
  values: number[];
  batches: string[];
}

/** Batch labels for n values in `batchCount` batches of near-equal size. */
export function batchLabels(n: number, batchCount: number, prefix = 'B'): string[] {
  return Array.from({ length: n }, (_, i) => `${prefix}${(i % batchCount) + 1}`);
}

/** A data group of strengths around `mean` (MPa-like) with the given CV, optionally with a batch shift. */
export function normalGroup(random: SeededRandom, n: number, batchCount: number, mean = 100, cv = 0.05, batchShiftSd = 0): GeneratedGroup {
  const batches = batchLabels(n, batchCount);
  const shifts = new Map<string, number>();
  for (const b of new Set(batches)) shifts.set(b, random.normal(0, batchShiftSd * mean));
  return { values: batches.map((b) => random.normal(mean + shifts.get(b)!, cv * mean)), batches };
}
