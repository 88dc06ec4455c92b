// The contract between a character model and everything that reads it
// (arithmetic coder, suggestion search, keystroke simulator, scanning cost).
// Both the PPM model and the blend of a personal and a base model satisfy it,
// so search and evaluation never know which one they are driving.

/**
 * A next-symbol distribution, filled in place by a model (no allocation per
 * call). `symbols[0..size)` are code points the model names explicitly,
 * `probs[i]` their probabilities; `rest` is the probability mass the model
 * leaves for every other code point together (order -1 and the literal
 * escape). Invariant for a model with full exclusion:
 * sum(probs[0..size)) + rest === 1 (within floating-point rounding).
 */
export class Distribution {
  symbols: Int32Array;
  probs: Float64Array;
  size = 0;
  rest = 0;
  /**
   * Added for blending: the probability of each single code point the model
   * does not name, below `split` (unnamedBelow) and at or above it
   * (unnamedAbove). A PPM model sets split to its order -1 alphabet size;
   * rest equals the sum of these over all unnamed code points.
   */
  unnamedBelow = 0;
  unnamedAbove = 0;
  split = 0x110000;

  constructor(capacity = 256) {
    this.symbols = new Int32Array(capacity);
    this.probs = new Float64Array(capacity);
  }

  /** Empties the distribution, keeping its buffers. */
  clear(): void {
    this.size = 0;
    this.rest = 0;
    this.unnamedBelow = 0;
    this.unnamedAbove = 0;
    this.split = 0x110000;
  }

  /** Probability of a code point this distribution does not name. */
  unnamed(symbol: number): number {
    return symbol < this.split ? this.unnamedBelow : this.unnamedAbove;
  }

  /** Appends a symbol, growing the buffers when full. */
  push(symbol: number, p: number): void {
    if (this.size === this.symbols.length) {
      const symbols = new Int32Array(this.size * 2);
      symbols.set(this.symbols);
      this.symbols = symbols;
      const probs = new Float64Array(this.size * 2);
      probs.set(this.probs);
      this.probs = probs;
    }
    this.symbols[this.size] = symbol;
    this.probs[this.size] = p;
    this.size++;
  }
}

/**
 * A character model seen from outside. A context is `history[0..end)` (code
 * points, most recent last); a model looks only at its last `order` symbols.
 * Calls are pure with respect to the model unless `learn` is called.
 */
export type NextSymbolModel = {
  /** Maximum context order k (0..12). */
  readonly order: number;
  /** Fills `out` with P(next | context) over the symbols the model names. */
  distribution(history: ArrayLike<number>, end: number, out: Distribution): void;
  /** P(symbol | context), 0 < p <= 1 for every code point 0..0x10FFFF. */
  probability(history: ArrayLike<number>, end: number, symbol: number): number;
  /**
   * Adaptive models learn `history[end]` after context `history[0..end)`;
   * frozen (static) models ignore the call.
   */
  learn(history: ArrayLike<number>, end: number): void;
};
