// The cache component (Kuhn & De Mori 1990, docs/references.md §4): the last N
// words typed, and P_cache(w) = (times w is among them) / (words held).
// It is what lets a list learn within one session: a word just used is
// likely again soon.

/** Words held by default (common practice, no source: a few hundred words, about a page of text). */
export const DEFAULT_CACHE_WORDS = 500;

export class RecencyCache {
  private readonly ring: string[] = [];
  private next = 0;
  private readonly counts = new Map<string, number>();

  constructor(readonly capacity = DEFAULT_CACHE_WORDS) {
    if (!Number.isInteger(capacity) || capacity < 1) throw new RangeError('cache capacity must be ≥ 1');
  }

  get size(): number {
    return this.ring.length;
  }

  add(key: string): void {
    if (this.ring.length < this.capacity) this.ring.push(key);
    else {
      const old = this.ring[this.next];
      const c = (this.counts.get(old) ?? 0) - 1;
      if (c <= 0) this.counts.delete(old);
      else this.counts.set(old, c);
      this.ring[this.next] = key;
      this.next = (this.next + 1) % this.capacity;
    }
    this.counts.set(key, (this.counts.get(key) ?? 0) + 1);
  }

  probability(key: string): number {
    return this.ring.length === 0 ? 0 : (this.counts.get(key) ?? 0) / this.ring.length;
  }

  /** Distinct keys held, with their counts. */
  entries(): IterableIterator<[string, number]> {
    return this.counts.entries();
  }

  clear(): void {
    this.ring.length = 0;
    this.next = 0;
    this.counts.clear();
  }
}
