// A memo of a model's distributions, keyed by the last `order` symbols of the
// context. Valid only while the model does not change: the keystroke
// simulator clears it whenever the model learns. Successive searches (one per
// typed letter, and the same contexts at many word starts) ask for the same
// contexts again and again; this answers them with a copy.
import { type Distribution, type NextSymbolModel } from '../model-types';

type Stored = {
  /** The context symbols (last `order`), to rule out hash collisions. */
  context: Int32Array;
  symbols: Int32Array;
  probs: Float64Array;
  rest: number;
  unnamedBelow: number;
  unnamedAbove: number;
  split: number;
};

export class DistributionMemo implements NextSymbolModel {
  readonly order: number;
  // Keyed by a 32-bit hash of the context (no string building in the hot
  // path); a colliding entry is simply replaced.
  private readonly memo = new Map<number, Stored>();
  /** Entries kept before the memo is emptied (bounds memory; 1..1e7). */
  readonly limit: number;
  hits = 0;
  misses = 0;

  constructor(
    private readonly model: NextSymbolModel,
    limit = 200_000,
  ) {
    this.order = model.order;
    this.limit = limit;
  }

  /** Forgets everything (call after the model learns). */
  clear(): void {
    this.memo.clear();
  }

  distribution(history: ArrayLike<number>, end: number, out: Distribution): void {
    const from = Math.max(0, end - this.order);
    let key = end - from;
    for (let i = from; i < end; i++) key = Math.imul(key ^ history[i], 0x9e3779b1) ^ (key >>> 15);
    const hit = this.memo.get(key);
    if (hit && sameContext(hit.context, history, from, end)) {
      this.hits++;
      const n = hit.symbols.length;
      if (out.symbols.length < n) {
        out.symbols = new Int32Array(n * 2);
        out.probs = new Float64Array(n * 2);
      }
      out.symbols.set(hit.symbols);
      out.probs.set(hit.probs);
      out.size = n;
      out.rest = hit.rest;
      out.unnamedBelow = hit.unnamedBelow;
      out.unnamedAbove = hit.unnamedAbove;
      out.split = hit.split;
      return;
    }
    this.misses++;
    this.model.distribution(history, end, out);
    if (this.memo.size >= this.limit) this.memo.clear();
    const context = new Int32Array(end - from);
    for (let i = from; i < end; i++) context[i - from] = history[i];
    this.memo.set(key, {
      context,
      symbols: out.symbols.slice(0, out.size),
      probs: out.probs.slice(0, out.size),
      rest: out.rest,
      unnamedBelow: out.unnamedBelow,
      unnamedAbove: out.unnamedAbove,
      split: out.split,
    });
  }

  probability(history: ArrayLike<number>, end: number, symbol: number): number {
    return this.model.probability(history, end, symbol);
  }

  learn(history: ArrayLike<number>, end: number): void {
    this.model.learn(history, end);
    this.memo.clear();
  }
}

function sameContext(stored: Int32Array, history: ArrayLike<number>, from: number, end: number): boolean {
  if (stored.length !== end - from) return false;
  for (let i = from; i < end; i++) if (stored[i - from] !== history[i]) return false;
  return true;
}
