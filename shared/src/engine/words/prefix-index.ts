// Words sorted by key, so the words that begin with a typed prefix form one
// contiguous range (binary search), and the best few of a range by a score.

/** Keeps the `limit` entries with the highest scores (ties: first come first). */
export class TopList {
  readonly ids: number[] = [];
  readonly scores: number[] = [];
  constructor(readonly limit: number) {}

  get floor(): number {
    return this.ids.length < this.limit ? -Infinity : this.scores[this.scores.length - 1];
  }

  /** Takes `id` out of the list (no-op when absent). */
  remove(id: number): void {
    const at = this.ids.indexOf(id);
    if (at < 0) return;
    this.ids.splice(at, 1);
    this.scores.splice(at, 1);
  }

  offer(id: number, score: number): void {
    if (this.ids.length === this.limit && !(score > this.scores[this.scores.length - 1])) return;
    let i = this.ids.length;
    if (i === this.limit) i--;
    while (i > 0 && this.scores[i - 1] < score) {
      if (i < this.limit) {
        this.ids[i] = this.ids[i - 1];
        this.scores[i] = this.scores[i - 1];
      }
      i--;
    }
    this.ids[i] = id;
    this.scores[i] = score;
  }
}

export class PrefixIndex {
  /** Keys in code-unit order, and the caller's id of each. */
  private keys: string[] = [];
  private ids: number[] = [];

  constructor(entries: Iterable<readonly [string, number]> = []) {
    const all = [...entries].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
    this.keys = all.map((e) => e[0]);
    this.ids = all.map((e) => e[1]);
  }

  get size(): number {
    return this.keys.length;
  }

  private lowerBound(key: string): number {
    let lo = 0;
    let hi = this.keys.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (this.keys[mid] < key) lo = mid + 1;
      else hi = mid;
    }
    return lo;
  }

  /** Adds a key (no-op when present). */
  insert(key: string, id: number): void {
    const at = this.lowerBound(key);
    if (this.keys[at] === key) return;
    this.keys.splice(at, 0, key);
    this.ids.splice(at, 0, id);
  }

  /** [from, to) of the keys that start with `prefix`. */
  range(prefix: string): [number, number] {
    const from = this.lowerBound(prefix);
    if (prefix === '') return [0, this.keys.length];
    // Keys starting with the prefix are contiguous; the range ends before the first that does not.
    let lo = from;
    let hi = this.keys.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (this.keys[mid].startsWith(prefix)) lo = mid + 1;
      else hi = mid;
    }
    return [from, lo];
  }

  /** The `limit` best ids among keys starting with `prefix`, by `score(id)`. */
  top(prefix: string, limit: number, score: (id: number) => number): TopList {
    const [from, to] = this.range(prefix);
    const top = new TopList(limit);
    for (let i = from; i < to; i++) {
      const id = this.ids[i];
      top.offer(id, score(id));
    }
    return top;
  }
}
