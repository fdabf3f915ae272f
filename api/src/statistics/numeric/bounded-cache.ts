/**
 * Memo for factors that depend only on the sample size (tolerance factors,
 * critical values, Hanson-Koopmans exponents): the decision flow asks for the
 * same few n over and over, so each is computed once. The cache forgets
 * everything when it passes `limit` entries, so a long-running server fed
 * every n from 2 to 100,000 does not grow without bound.
 */
export class BoundedCache<V> {
  private readonly entries = new Map<string, V>();

  constructor(private readonly limit = 20_000) {}

  /** The cached value for `key`, computing and storing it on the first request. */
  getOrCompute(key: string, compute: () => V): V {
    if (this.entries.has(key)) return this.entries.get(key) as V;
    const value = compute();
    if (this.entries.size >= this.limit) this.entries.clear();
    this.entries.set(key, value);
    return value;
  }
}
