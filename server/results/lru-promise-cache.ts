/**
 * Values computed asynchronously and kept for the most recent keys: concurrent callers share one computation, a
 * failed one is forgotten so the next caller tries again. For data that never changes once made (a ready revision's
 * members, a finished run's facets) or that is dropped explicitly when it does.
 */
export class LruPromiseCache<K, V> {
  private readonly entries = new Map<K, Promise<V>>();

  constructor(private readonly capacity: number) {}

  get(key: K, compute: () => Promise<V>): Promise<V> {
    const cached = this.entries.get(key);
    if (cached) {
      // Re-inserted so the least recently used key stays first.
      this.entries.delete(key);
      this.entries.set(key, cached);
      return cached;
    }
    const value = compute();
    this.entries.set(key, value);
    value.catch(() => {
      if (this.entries.get(key) === value) this.entries.delete(key);
    });
    while (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value as K);
    return value;
  }

  /** Drops the keys the test picks (e.g. every matching of a project after a manual match changed). */
  deleteWhere(test: (key: K) => boolean): void {
    for (const key of [...this.entries.keys()]) if (test(key)) this.entries.delete(key);
  }
}
