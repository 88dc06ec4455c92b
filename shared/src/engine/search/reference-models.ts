// Small exact NextSymbolModels for tests of search and evaluation: simple
// enough to check by hand, independent of the PPM implementation.
import { Distribution, type NextSymbolModel } from '../model-types';

/**
 * Order-k model with add-one (Laplace) smoothing over a fixed alphabet:
 * P(x | last k symbols) = (c(ctx, x) + 1) / (n(ctx) + |A|). Every alphabet
 * symbol is named; `rest` is 0 (symbols outside the alphabet get p = 0).
 */
export class AddOneModel implements NextSymbolModel {
  readonly order: number;
  private readonly alphabet: number[];
  private readonly counts = new Map<string, Map<number, number>>();
  adaptive = true;

  constructor(order: number, alphabet: string) {
    this.order = order;
    this.alphabet = [...new Set([...alphabet].map((c) => c.codePointAt(0) as number))];
  }

  private key(history: ArrayLike<number>, end: number): string {
    const parts: number[] = [];
    for (let i = Math.max(0, end - this.order); i < end; i++) parts.push(history[i]);
    return parts.join(',');
  }

  distribution(history: ArrayLike<number>, end: number, out: Distribution): void {
    const table = this.counts.get(this.key(history, end));
    let n = 0;
    if (table) for (const c of table.values()) n += c;
    out.clear();
    for (const s of this.alphabet) out.push(s, ((table?.get(s) ?? 0) + 1) / (n + this.alphabet.length));
  }

  probability(history: ArrayLike<number>, end: number, symbol: number): number {
    if (!this.alphabet.includes(symbol)) return 0;
    const table = this.counts.get(this.key(history, end));
    let n = 0;
    if (table) for (const c of table.values()) n += c;
    return ((table?.get(symbol) ?? 0) + 1) / (n + this.alphabet.length);
  }

  learn(history: ArrayLike<number>, end: number): void {
    if (!this.adaptive) return;
    const k = this.key(history, end);
    let table = this.counts.get(k);
    if (!table) this.counts.set(k, (table = new Map()));
    table.set(history[end], (table.get(history[end]) ?? 0) + 1);
  }

  /** Learns every symbol of a text (code points), from an empty history. */
  train(text: ArrayLike<number>): void {
    for (let i = 0; i < text.length; i++) this.learn(text, i);
  }
}

const SPACE = 0x20;

/**
 * A word-lexicon model: text is words from `lexicon` separated by single
 * spaces. After the prefix w of the current word (everything since the last
 * space), P(c) = F(w c …) / F(w …) and P(space) = f(w) / F(w …), where f is a
 * word's frequency and F(w …) sums the frequencies of words starting with w.
 * Outside the lexicon it puts all mass on the space. Static (never learns).
 */
export class LexiconModel implements NextSymbolModel {
  readonly order = 32;
  private readonly words: [number[], number][];

  constructor(lexicon: ReadonlyMap<string, number>) {
    this.words = [...lexicon].map(([w, f]) => [[...w].map((c) => c.codePointAt(0) as number), f]);
  }

  distribution(history: ArrayLike<number>, end: number, out: Distribution): void {
    let start = end;
    while (start > 0 && history[start - 1] !== SPACE) start--;
    const next = new Map<number, number>();
    let total = 0;
    for (const [w, f] of this.words) {
      if (w.length < end - start) continue;
      let match = true;
      for (let i = start; i < end && match; i++) match = w[i - start] === history[i];
      if (!match) continue;
      total += f;
      const s = w.length === end - start ? SPACE : w[end - start];
      next.set(s, (next.get(s) ?? 0) + f);
    }
    out.clear();
    if (total === 0) {
      out.push(SPACE, 1);
      return;
    }
    for (const [s, f] of [...next].sort((a, b) => a[0] - b[0])) out.push(s, f / total);
  }

  probability(history: ArrayLike<number>, end: number, symbol: number): number {
    const d = new Distribution();
    this.distribution(history, end, d);
    for (let k = 0; k < d.size; k++) if (d.symbols[k] === symbol) return d.probs[k];
    return 0;
  }

  learn(): void {
    // Static model.
  }
}

// Seeded PRNG shared with the engine's own tests.
export { seededRandom } from '../seeded-random';
