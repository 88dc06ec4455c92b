// The small integer interface between a model and the arithmetic coder.
// A model turns each coding step (one context, or the order -1 fallback)
// into a FrequencyTable; the coder narrows its interval with low/high/total
// and never learns what the indices mean.

/**
 * An integer frequency table over indices 0..symbolLimit-1.
 * Invariants: 0 <= low(i) <= high(i) <= total, high(i) === low(i+1),
 * low(0) === 0, high(symbolLimit-1) === total, 1 <= total <= MAX_TABLE_TOTAL.
 * An index with low === high has zero frequency and cannot be coded.
 */
export type FrequencyTable = {
  /** Number of indices, >= 1. */
  readonly symbolLimit: number;
  /** Sum of all frequencies, 1..MAX_TABLE_TOTAL. */
  readonly total: number;
  /** Cumulative frequency below index i (0 <= i < symbolLimit). */
  low(i: number): number;
  /** Cumulative frequency up to and including index i. */
  high(i: number): number;
  /** The index i with low(i) <= value < high(i), for 0 <= value < total. */
  find(value: number): number;
};

/** Largest table total the coder accepts (2^24; see range-coder.ts). */
export const MAX_TABLE_TOTAL = 1 << 24;

/**
 * A table built from a list of weights, reusable without allocation:
 * call reset(), then add() each weight, then use it. Lookup by find() is a
 * binary search over the cumulative array.
 */
export class CumulativeTable implements FrequencyTable {
  /** cum[i] = sum of weights of indices < i; cum has symbolLimit+1 used slots. */
  private cum: Float64Array;
  symbolLimit = 0;
  total = 0;

  constructor(capacity = 64) {
    this.cum = new Float64Array(capacity + 1);
  }

  reset(): void {
    this.symbolLimit = 0;
    this.total = 0;
  }

  /** Appends an index with the given weight (>= 0, integer); returns the index. */
  add(weight: number): number {
    if (this.symbolLimit + 1 >= this.cum.length) {
      const grown = new Float64Array(this.cum.length * 2);
      grown.set(this.cum);
      this.cum = grown;
    }
    const i = this.symbolLimit++;
    this.cum[i] = this.total;
    this.total += weight;
    this.cum[i + 1] = this.total;
    return i;
  }

  low(i: number): number {
    return this.cum[i];
  }

  high(i: number): number {
    return this.cum[i + 1];
  }

  find(value: number): number {
    // Largest i with cum[i] <= value; zero-width indices are skipped because
    // cum[i+1] must exceed value.
    let lo = 0;
    let hi = this.symbolLimit - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >>> 1;
      if (this.cum[mid] <= value) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  }
}

/** The uniform table over n indices (1 <= n <= MAX_TABLE_TOTAL), each with frequency 1. */
export class UniformTable implements FrequencyTable {
  symbolLimit = 1;
  total = 1;

  /** Re-targets the table to n indices. */
  setSize(n: number): this {
    this.symbolLimit = n;
    this.total = n;
    return this;
  }

  low(i: number): number {
    return i;
  }

  high(i: number): number {
    return i + 1;
  }

  find(value: number): number {
    return value;
  }
}

/**
 * Wraps any table and checks every invariant above on each call; for tests
 * and debugging (it is slower). Throws an Error naming the broken rule.
 */
export class CheckedFrequencyTable implements FrequencyTable {
  constructor(private readonly inner: FrequencyTable) {}

  get symbolLimit(): number {
    const n = this.inner.symbolLimit;
    if (!Number.isInteger(n) || n < 1) throw new Error(`symbolLimit ${n} is not a positive integer`);
    return n;
  }

  get total(): number {
    const t = this.inner.total;
    if (!Number.isInteger(t) || t < 1 || t > MAX_TABLE_TOTAL) throw new Error(`total ${t} outside 1..2^24`);
    const last = this.inner.high(this.inner.symbolLimit - 1);
    if (last !== t) throw new Error(`high(last) ${last} differs from total ${t}`);
    return t;
  }

  low(i: number): number {
    this.checkIndex(i);
    const lo = this.inner.low(i);
    if (i === 0 && lo !== 0) throw new Error(`low(0) is ${lo}, not 0`);
    if (i > 0 && this.inner.high(i - 1) !== lo) throw new Error(`low(${i}) differs from high(${i - 1})`);
    if (!Number.isInteger(lo) || lo < 0) throw new Error(`low(${i}) = ${lo} is not a non-negative integer`);
    return lo;
  }

  high(i: number): number {
    this.checkIndex(i);
    const hi = this.inner.high(i);
    const lo = this.inner.low(i);
    if (!Number.isInteger(hi) || hi < lo || hi > this.inner.total)
      throw new Error(`high(${i}) = ${hi} outside low..total`);
    return hi;
  }

  find(value: number): number {
    const total = this.total;
    if (!Number.isInteger(value) || value < 0 || value >= total)
      throw new Error(`find(${value}) outside 0..total-1`);
    const i = this.inner.find(value);
    this.checkIndex(i);
    if (!(this.inner.low(i) <= value && value < this.inner.high(i)))
      throw new Error(`find(${value}) returned ${i}, whose range excludes it`);
    return i;
  }

  private checkIndex(i: number): void {
    if (!Number.isInteger(i) || i < 0 || i >= this.inner.symbolLimit)
      throw new Error(`index ${i} outside 0..${this.inner.symbolLimit - 1}`);
  }
}
