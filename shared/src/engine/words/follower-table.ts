// The words that followed one context, with a count each: word ids sorted
// ascending in a typed array (binary search), counts beside them. Small,
// garbage-free and cheap to serialise; insertion moves the tail (contexts
// rarely have more than a few thousand followers).

export class FollowerTable {
  ids: Int32Array;
  counts: Int32Array;
  /** Distinct followers (entries in use). */
  size = 0;
  /** Sum of the counts. */
  total = 0;
  /** Followers with a count of exactly 1 and exactly 2 (the rest have 3 or more). */
  ones = 0;
  twos = 0;

  constructor(capacity = 2) {
    this.ids = new Int32Array(capacity);
    this.counts = new Int32Array(capacity);
  }

  /** Index of `id`, or −(insertion point) − 1 when absent. */
  private find(id: number): number {
    let lo = 0;
    let hi = this.size - 1;
    const ids = this.ids;
    while (lo <= hi) {
      const mid = (lo + hi) >>> 1;
      const v = ids[mid];
      if (v < id) lo = mid + 1;
      else if (v > id) hi = mid - 1;
      else return mid;
    }
    return -lo - 1;
  }

  /** Count of `id` (0 when it never followed). */
  get(id: number): number {
    const at = this.find(id);
    return at >= 0 ? this.counts[at] : 0;
  }

  /** Adds `by` (≥ 1) to the count of `id`; true when `id` is new here. */
  add(id: number, by = 1): boolean {
    this.total += by;
    const at = this.find(id);
    if (at >= 0) {
      const before = this.counts[at];
      this.counts[at] = before + by;
      this.tally(before, -1);
      this.tally(before + by, 1);
      return false;
    }
    const ins = -at - 1;
    if (this.size === this.ids.length) {
      const ids = new Int32Array(this.size * 2);
      ids.set(this.ids);
      const counts = new Int32Array(this.size * 2);
      counts.set(this.counts);
      this.ids = ids;
      this.counts = counts;
    }
    this.ids.copyWithin(ins + 1, ins, this.size);
    this.counts.copyWithin(ins + 1, ins, this.size);
    this.ids[ins] = id;
    this.counts[ins] = by;
    this.size++;
    this.tally(by, 1);
    return true;
  }

  private tally(count: number, change: number): void {
    if (count === 1) this.ones += change;
    else if (count === 2) this.twos += change;
  }

  /** A table from ids already sorted ascending (deserialisation). */
  static fromSorted(ids: Int32Array, counts: Int32Array): FollowerTable {
    const t = new FollowerTable(0);
    t.ids = ids;
    t.counts = counts;
    t.size = ids.length;
    let total = 0;
    for (let i = 0; i < counts.length; i++) {
      total += counts[i];
      t.tally(counts[i], 1);
    }
    t.total = total;
    return t;
  }
}
