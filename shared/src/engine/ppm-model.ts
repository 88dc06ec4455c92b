// Prediction by Partial Matching over Unicode code points.
//
// Coding a symbol x after a context (docs/references.md §1): start at the longest
// context of order <= k that has been seen; if x has a positive weight there,
// code it; otherwise code an escape and drop one order. Unseen (or empty)
// contexts are skipped at no cost. Below order 0 sits order -1: a uniform
// choice among the base alphabet 0..alphabetSize-1 plus, when `literals` is
// on, one literal index that leads to a uniform choice among the code points
// >= alphabetSize. With full exclusion, every symbol that had a positive
// weight in a context escaped from is removed from all lower orders,
// including order -1 and the literal range.
//
// Integer weights per context (c = count, n = sum of counts, q = distinct
// symbols in the context, counted before exclusion: "q retained"):
//   A: symbol c,      escape 1      (total n + 1)
//   B: symbol c - 1,  escape q      (total n; reduced-count definition)
//   C: symbol c,      escape q      (total n + q)
//   D: symbol 2c - 1, escape q      (total 2n; Howard's halves, doubled)
// With exclusion the excluded symbols' weights are left out of the total.
//
// Counts are halved (rounding up, so none reaches 0) when a context's sum
// would exceed CONTEXT_TOTAL_LIMIT or one count reaches MAX_COUNT (1023, the
// most a packed entry holds). Totals therefore stay far below the coder's
// limit of 2^24, and the halving slightly favours recent text.
import { type Distribution, type NextSymbolModel } from './model-types';
import { ContextTrie } from './context-trie';
import { CumulativeTable, UniformTable } from './frequency-table';
import { type RangeDecoder, type RangeEncoder } from './range-coder';
import {
  type EscapeMethod,
  type PpmSettings,
  type ResolvedPpmSettings,
  resolvePpmSettings,
} from './ppm-settings';
import { markArray, nextToken } from './symbol-marks';

// Local copies of constants: imported bindings compile to getter calls under
// some loaders, which hot loops should not pay for.
const NONE = -1; // same as context-trie NONE
const MAX_COUNT = 1023; // same as context-trie MAX_COUNT
const CODE_POINT_LIMIT = 0x110000;

/** Counts of a context are halved when their sum would exceed this (keeps the coder's totals far below 2^24). */
export const CONTEXT_TOTAL_LIMIT = 0xffff;

const METHOD_CODE: Record<EscapeMethod, number> = { A: 0, B: 1, C: 2, D: 3 };

/** Weight of a symbol with count c under method m (see the table above). */
function symbolWeight(m: number, c: number): number {
  return m === 3 ? 2 * c - 1 : m === 1 ? c - 1 : c;
}

/** Escape weight for a context with q distinct symbols. */
function escapeWeight(m: number, q: number): number {
  return m === 0 ? 1 : q;
}

/** Total weight of a context with no exclusion (n = count sum, q = distinct symbols). */
function plainTotal(m: number, n: number, q: number): number {
  return m === 0 ? n + 1 : m === 1 ? n : m === 2 ? n + q : 2 * n;
}

/** Reused tables and lists for one coding step (not re-entrant). */
const table = new CumulativeTable(256);
const uniform = new UniformTable();
let tableSymbols = new Int32Array(256);
let excludedList = new Int32Array(256);

export class PpmModel implements NextSymbolModel {
  readonly order: number;
  readonly settings: Readonly<ResolvedPpmSettings>;
  /** When false (frozen), learn() does nothing; learnText() always learns. */
  adaptive: boolean;

  private trie: ContextTrie;
  private readonly method: number;
  private readonly alphabetSize: number;
  private readonly literals: boolean;
  private readonly exclusion: boolean;

  // ---- context cache: the nodes for the last context resolved ----
  /** cur[o] = node of the order-o context (NONE if unseen), o = 0..curLen. */
  private readonly cur: Int32Array;
  /** The last curLen symbols of that context, oldest first. */
  private readonly curSymbols: Int32Array;
  /** Number of symbols in the cached context (min(k, end)); -1 when the cache is empty. */
  private curLen = -1;
  private readonly nextNodes: Int32Array;
  /** Entry of the symbol being learnt at each order (valid where entryKnown[o] is set). */
  private readonly entryAt: Int32Array;
  private readonly entryKnown: Uint8Array;
  private readonly updateExclusion: boolean;
  /** Order -1 bookkeeping of the current step: excluded symbols below / at or above alphabetSize. */
  private excludedBelow = 0;
  private excludedAbove = 0;
  private excludedCount = 0;
  /**
   * The order-k entry where the last coded/predicted symbol was found in the
   * current context (its child link leads to the next order-k context), and
   * that symbol; -1 when unknown. Cleared whenever the cache moves.
   */
  private lastTopEntry = -1;
  private lastTopSymbol = -1;

  /** An empty model. `settings` may leave optional members out; they take their defaults. */
  constructor(settings: Partial<PpmSettings> = {}) {
    this.settings = Object.freeze(resolvePpmSettings(settings));
    const s = this.settings;
    this.order = s.order;
    this.adaptive = s.adaptive;
    this.method = METHOD_CODE[s.escape];
    this.alphabetSize = s.alphabetSize;
    this.literals = s.literals && s.alphabetSize < CODE_POINT_LIMIT;
    this.exclusion = s.exclusion;
    this.trie = new ContextTrie();
    this.cur = new Int32Array(s.order + 1);
    this.curSymbols = new Int32Array(s.order);
    this.nextNodes = new Int32Array(s.order + 1);
    this.entryAt = new Int32Array(s.order + 1);
    this.entryKnown = new Uint8Array(s.order + 1);
    this.updateExclusion = s.updateExclusion;
  }

  /** A model trained on `text` (code points); adaptive afterwards iff settings.adaptive. */
  static train(text: ArrayLike<number>, settings: Partial<PpmSettings> = {}): PpmModel {
    const model = new PpmModel(settings);
    model.learnText(text);
    return model;
  }

  /** Learns every symbol of `text` in turn (its own history: no context crosses from earlier texts). Ignores the adaptive flag. */
  learnText(text: ArrayLike<number>): void {
    if (text.length > 0) this.update(text, 0, false);
    // Each update leaves the cache at the next position of this same text,
    // so the context check can be skipped.
    for (let i = 1; i < text.length; i++) this.update(text, i, true);
  }

  /** Stops learning through learn(); same as setting adaptive = false. */
  freeze(): this {
    this.adaptive = false;
    return this;
  }

  /** An independent deep copy (same settings, counts and adaptive flag). */
  clone(): PpmModel {
    const copy = new PpmModel(this.settings);
    copy.adaptive = this.adaptive;
    copy.trie = this.trie.clone();
    return copy;
  }

  /** Number of context nodes (strings of length 0..k seen as contexts). */
  get contextCount(): number {
    return this.trie.contextCount;
  }

  /** Number of (context, symbol) entries with a count. */
  get entryCount(): number {
    let n = 0;
    for (let c = 0; c < this.trie.contextCount; c++) n += this.trie.sizeOf(c);
    return n;
  }

  /** Bytes held by the model's typed arrays. */
  get byteSize(): number {
    return this.trie.byteSize;
  }

  /**
   * The counts of the context `context` (its symbols, oldest first, length
   * 0..k) as symbol -> count, in the model's order; undefined if the context
   * was never seen. For inspection and tests.
   */
  countsAfter(context: ArrayLike<number>): Map<number, number> | undefined {
    if (context.length > this.order) return undefined;
    const trie = this.trie;
    let node = 0;
    for (let i = 0; i < context.length && node !== NONE; i++) node = trie.childOf(node, context[i]);
    if (node === NONE) return undefined;
    const counts = new Map<number, number>();
    const start = trie.blockOf(node);
    for (let e = start; e < start + trie.sizeOf(node); e++) counts.set(trie.symbolAt(e), trie.countAt(e));
    return counts;
  }

  /** The storage, for serialisation (read-only use). */
  get storage(): ContextTrie {
    return this.trie;
  }

  /** Replaces the storage (used by deserialisation). */
  adoptStorage(trie: ContextTrie): void {
    this.trie = trie;
    this.curLen = -1;
  }

  learn(history: ArrayLike<number>, end: number): void {
    if (this.adaptive) this.update(history, end, false);
  }

  probability(history: ArrayLike<number>, end: number, symbol: number): number {
    this.resolve(history, end);
    const trie = this.trie;
    const m = this.method;
    const mark = markArray();
    const token = nextToken();
    let excluding = false; // true once something has been excluded
    let p = 1;
    this.excludedBelow = 0;
    this.excludedAbove = 0;
    this.excludedCount = 0;
    for (let o = this.curLen; o >= 0; o--) {
      const ctx = this.cur[o];
      if (ctx === NONE) continue;
      const q = trie.sizeOf(ctx);
      if (q === 0) continue;
      const start = trie.blockOf(ctx);
      const end2 = start + q;
      const esc = escapeWeight(m, q);
      if (!excluding) {
        const e = trie.find(ctx, symbol);
        const total = plainTotal(m, trie.totalOf(ctx), q);
        if (o === this.order && e !== NONE) {
          this.lastTopEntry = e;
          this.lastTopSymbol = symbol;
        }
        if (e !== NONE) {
          const w = symbolWeight(m, trie.countAt(e));
          if (w > 0) return (p * w) / total;
        }
        p *= esc / total;
        if (this.exclusion) {
          for (let i = start; i < end2; i++) {
            if (symbolWeight(m, trie.countAt(i)) > 0) this.exclude(mark, token, trie.symbolAt(i));
          }
          excluding = true;
        }
      } else {
        let sum = 0;
        let wx = 0;
        for (let i = start; i < end2; i++) {
          const s = trie.symbolAt(i);
          if (mark[s] === token) continue;
          const w = symbolWeight(m, trie.countAt(i));
          if (w <= 0) continue;
          sum += w;
          if (s === symbol) wx = w;
          this.exclude(mark, token, s);
        }
        const total = sum + esc;
        if (wx > 0) return (p * wx) / total;
        p *= esc / total;
      }
    }
    return p * this.orderMinusOneProbability(symbol);
  }

  distribution(history: ArrayLike<number>, end: number, out: Distribution): void {
    this.resolve(history, end);
    out.clear();
    const trie = this.trie;
    const m = this.method;
    const mark = markArray();
    const token = nextToken();
    const exclusion = this.exclusion;
    let p = 1;
    let namedBelow = 0;
    for (let o = this.curLen; o >= 0; o--) {
      const ctx = this.cur[o];
      if (ctx === NONE) continue;
      const q = trie.sizeOf(ctx);
      if (q === 0) continue;
      const start = trie.blockOf(ctx);
      const end2 = start + q;
      let total = escapeWeight(m, q);
      for (let i = start; i < end2; i++) {
        if (exclusion && mark[trie.symbolAt(i)] === token) continue;
        const w = symbolWeight(m, trie.countAt(i));
        if (w > 0) total += w;
      }
      for (let i = start; i < end2; i++) {
        const s = trie.symbolAt(i);
        // A symbol named by a longer context is coded there; without
        // exclusion its share here is wasted (docs/references.md §1).
        if (mark[s] === token) continue;
        const w = symbolWeight(m, trie.countAt(i));
        if (w <= 0) continue;
        mark[s] = token;
        out.push(s, (p * w) / total);
        if (s < this.alphabetSize) namedBelow++;
      }
      p *= escapeWeight(m, q) / total;
    }
    // Order -1.
    const a = this.alphabetSize;
    const namedAbove = out.size - namedBelow;
    const aboveRange = CODE_POINT_LIMIT - a;
    let perBelow: number;
    let perAbove: number;
    if (exclusion) {
      const nBase = a - namedBelow;
      const nAbove = aboveRange - namedAbove;
      const lit = this.literals && nAbove > 0 ? 1 : 0;
      perBelow = nBase + lit > 0 ? p / (nBase + lit) : 0;
      perAbove = lit ? perBelow / nAbove : 0;
      out.rest = perBelow * nBase + perAbove * nAbove;
    } else {
      const lit = this.literals ? 1 : 0;
      perBelow = p / (a + lit);
      perAbove = lit ? perBelow / aboveRange : 0;
      out.rest = perBelow * (a - namedBelow) + perAbove * (aboveRange - namedAbove);
    }
    out.unnamedBelow = perBelow;
    out.unnamedAbove = perAbove;
    out.split = a;
  }

  /**
   * Arithmetic-codes history[end] after context history[0..end) through
   * `encoder` (one table per context visited, then order -1). Does not learn.
   */
  encodeNext(encoder: RangeEncoder, history: ArrayLike<number>, end: number): void {
    const symbol = history[end];
    this.resolve(history, end);
    const token = nextToken();
    this.excludedBelow = 0;
    this.excludedAbove = 0;
    this.excludedCount = 0;
    let first = true;
    for (let o = this.curLen; o >= 0; o--) {
      const ctx = this.cur[o];
      if (ctx === NONE || this.trie.sizeOf(ctx) === 0) continue;
      if (first) {
        // Nothing is excluded yet: code straight from the block (same
        // layout as fillTable: symbols in block order, escape last).
        first = false;
        if (this.encodeFirst(encoder, ctx, o, token, symbol)) return;
        continue;
      }
      const found = this.fillTable(ctx, token, symbol);
      if (found >= 0) {
        encoder.encode(table, found);
        return;
      }
      encoder.encode(table, table.symbolLimit - 1);
    }
    const a = this.alphabetSize;
    const nBase = a - this.excludedBelow;
    const nAbove = CODE_POINT_LIMIT - a - this.excludedAbove;
    const lit = this.literals && nAbove > 0 ? 1 : 0;
    if (symbol < a) {
      encoder.encode(uniform.setSize(nBase + lit), symbol - this.countExcludedBetween(0, symbol));
    } else {
      if (!lit)
        throw new RangeError(`code point ${symbol} is outside the alphabet 0..${a - 1} and literals are off`);
      encoder.encode(uniform.setSize(nBase + 1), nBase);
      encoder.encode(uniform.setSize(nAbove), symbol - a - this.countExcludedBetween(a, symbol));
    }
  }

  /** Decodes the symbol at history[end] (to be stored there by the caller) after context history[0..end). Does not learn. */
  decodeNext(decoder: RangeDecoder, history: ArrayLike<number>, end: number): number {
    this.resolve(history, end);
    const token = nextToken();
    this.excludedBelow = 0;
    this.excludedAbove = 0;
    this.excludedCount = 0;
    let first = true;
    for (let o = this.curLen; o >= 0; o--) {
      const ctx = this.cur[o];
      if (ctx === NONE || this.trie.sizeOf(ctx) === 0) continue;
      if (first) {
        first = false;
        const s = this.decodeFirst(decoder, ctx, o, token);
        if (s >= 0) return s;
        continue;
      }
      this.fillTable(ctx, token, -1);
      const i = decoder.decode(table);
      if (i < table.symbolLimit - 1) return tableSymbols[i];
    }
    const a = this.alphabetSize;
    const nBase = a - this.excludedBelow;
    const nAbove = CODE_POINT_LIMIT - a - this.excludedAbove;
    const lit = this.literals && nAbove > 0 ? 1 : 0;
    const sorted = excludedList.subarray(0, this.excludedCount).sort();
    const i = decoder.decode(uniform.setSize(nBase + lit));
    if (i < nBase) return nthIncluded(sorted, 0, i);
    return nthIncluded(sorted, a, decoder.decode(uniform.setSize(nAbove)));
  }

  /** Codes symbol (or an escape) in the first context visited; true when the symbol was coded. */
  private encodeFirst(encoder: RangeEncoder, ctx: number, o: number, token: number, symbol: number): boolean {
    const trie = this.trie;
    const m = this.method;
    const q = trie.sizeOf(ctx);
    const start = trie.blockOf(ctx);
    const end = start + q;
    const total = plainTotal(m, trie.totalOf(ctx), q);
    let cum = 0;
    for (let i = start; i < end; i++) {
      const w = symbolWeight(m, trie.countAt(i));
      if (trie.symbolAt(i) === symbol) {
        if (o === this.order) {
          this.lastTopEntry = i;
          this.lastTopSymbol = symbol;
        }
        if (w > 0) {
          encoder.encodeRange(cum, cum + w, total);
          return true;
        }
        break;
      }
      if (w > 0) cum += w;
    }
    encoder.encodeRange(total - escapeWeight(m, q), total, total);
    this.excludeBlock(ctx, token);
    return false;
  }

  /** Decodes in the first context visited: the symbol, or -1 after an escape. */
  private decodeFirst(decoder: RangeDecoder, ctx: number, o: number, token: number): number {
    const trie = this.trie;
    const m = this.method;
    const q = trie.sizeOf(ctx);
    const start = trie.blockOf(ctx);
    const end = start + q;
    const total = plainTotal(m, trie.totalOf(ctx), q);
    const escapeLow = total - escapeWeight(m, q);
    const value = decoder.target(total);
    if (value < escapeLow) {
      let cum = 0;
      for (let i = start; i < end; i++) {
        const w = symbolWeight(m, trie.countAt(i));
        if (w <= 0) continue;
        if (value < cum + w) {
          decoder.consume(cum, cum + w);
          const s = trie.symbolAt(i);
          if (o === this.order) {
            this.lastTopEntry = i;
            this.lastTopSymbol = s;
          }
          return s;
        }
        cum += w;
      }
    }
    decoder.consume(escapeLow, total);
    this.excludeBlock(ctx, token);
    return -1;
  }

  /** With exclusion on, excludes every symbol of ctx with a positive weight. */
  private excludeBlock(ctx: number, token: number): void {
    if (!this.exclusion) return;
    const trie = this.trie;
    const mark = markArray();
    const start = trie.blockOf(ctx);
    const end = start + trie.sizeOf(ctx);
    for (let i = start; i < end; i++)
      if (symbolWeight(this.method, trie.countAt(i)) > 0) this.exclude(mark, token, trie.symbolAt(i));
  }

  /**
   * Fills the shared table for context ctx: one index per symbol with a
   * positive weight that is not excluded (in block order), then the escape.
   * Marks those symbols excluded (with exclusion on). Returns the index of
   * `symbol`, or -1 when it is not in the table.
   */
  private fillTable(ctx: number, token: number, symbol: number): number {
    const trie = this.trie;
    const m = this.method;
    const mark = markArray();
    const q = trie.sizeOf(ctx);
    const start = trie.blockOf(ctx);
    if (tableSymbols.length < q + 1) tableSymbols = new Int32Array(2 * q + 2);
    table.reset();
    let found = -1;
    for (let i = start; i < start + q; i++) {
      const s = trie.symbolAt(i);
      if (this.exclusion && mark[s] === token) continue;
      const w = symbolWeight(m, trie.countAt(i));
      if (w <= 0) continue;
      const index = table.add(w);
      tableSymbols[index] = s;
      if (s === symbol) found = index;
      if (this.exclusion) this.exclude(mark, token, s);
    }
    table.add(escapeWeight(m, q));
    return found;
  }

  /** Marks s excluded for the current step and keeps order -1's tallies. */
  private exclude(mark: Int32Array, token: number, s: number): void {
    mark[s] = token;
    if (s < this.alphabetSize) this.excludedBelow++;
    else this.excludedAbove++;
    if (this.excludedCount === excludedList.length) {
      const grown = new Int32Array(excludedList.length * 2);
      grown.set(excludedList);
      excludedList = grown;
    }
    excludedList[this.excludedCount++] = s;
  }

  /** Number of excluded symbols in [from, to) during the current step. */
  private countExcludedBetween(from: number, to: number): number {
    let n = 0;
    for (let i = 0; i < this.excludedCount; i++) {
      const s = excludedList[i];
      if (s >= from && s < to) n++;
    }
    return n;
  }

  /** Order -1 probability of a symbol not excluded (uses the current step's tallies). */
  private orderMinusOneProbability(symbol: number): number {
    const a = this.alphabetSize;
    const nBase = a - this.excludedBelow;
    const nAbove = CODE_POINT_LIMIT - a - this.excludedAbove;
    const lit = this.literals && nAbove > 0 ? 1 : 0;
    if (symbol < a) return 1 / (nBase + lit);
    return lit ? 1 / (nBase + lit) / nAbove : 0;
  }

  /**
   * Learns history[end] after history[0..end): bumps its count in the
   * contexts (all orders, or with update exclusion only those down to the
   * one that would have coded it), then moves the cache to position end + 1,
   * creating the child contexts needed there.
   */
  private update(history: ArrayLike<number>, end: number, sequential: boolean): void {
    const x = history[end];
    if (!sequential) this.resolve(history, end);
    this.lastTopSymbol = -1;
    const trie = this.trie;
    const m = this.method;
    const len = this.curLen;
    const cur = this.cur;
    const entryAt = this.entryAt;
    const known = this.entryKnown;
    known.fill(0);
    // 1. Counts, from the longest context down.
    for (let o = len; o >= 0; o--) {
      const ctx = cur[o];
      if (ctx === NONE) continue;
      let e = trie.find(ctx, x);
      if (e === NONE) {
        e = trie.append(ctx, x, 1);
        if (trie.totalOf(ctx) > CONTEXT_TOTAL_LIMIT) trie.halve(ctx);
      } else {
        const codable = symbolWeight(m, trie.countAt(e)) > 0;
        e = this.increment(ctx, e);
        if (codable && this.updateExclusion) {
          entryAt[o] = e;
          known[o] = 1;
          break; // lower orders already hold x (suffix closure) and are not updated
        }
      }
      entryAt[o] = e;
      known[o] = 1;
    }
    // 2. Contexts for position end + 1: next[o + 1] is the child of x in
    // cur[o]. Find the longest one that exists, take the shorter ones from
    // suffix links, then create the missing longer ones upwards.
    const k = this.order;
    const nextLen = Math.min(k, end + 1);
    const next = this.nextNodes;
    next[0] = 0;
    // Shortcut: an order-k entry's child link holds the order-k context
    // that follows it (there are no order k+1 nodes to point to).
    const topEntry = len === k && k > 0 && known[k] ? entryAt[k] : NONE;
    if (topEntry !== NONE) {
      const target = trie.childAt(topEntry);
      if (target !== NONE) {
        next[k] = target;
        for (let j = k - 1; j >= 1; j--) next[j] = trie.suffixOf(next[j + 1]);
        for (let o = 0; o <= k; o++) cur[o] = next[o];
        this.shiftIn(x, k);
        return;
      }
    }
    let lowest = -1;
    for (let o = nextLen - 1; o >= 0; o--) {
      const ctx = cur[o];
      if (ctx === NONE) {
        next[o + 1] = NONE;
        continue;
      }
      let e = known[o] ? entryAt[o] : trie.find(ctx, x);
      if (e === NONE) e = trie.append(ctx, x, 1); // not reached while the trie is suffix-closed
      entryAt[o] = e;
      const child = trie.childAt(e);
      if (child !== NONE) {
        next[o + 1] = child;
        for (let j = o; j >= 1; j--) next[j] = trie.suffixOf(next[j + 1]);
        lowest = o;
        break;
      }
    }
    for (let o = lowest + 1; o < nextLen; o++) {
      if (cur[o] === NONE) continue;
      const child = trie.newContext(next[o]);
      trie.setChild(entryAt[o], child);
      next[o + 1] = child;
    }
    if (topEntry !== NONE) trie.setChild(topEntry, next[k]);
    for (let o = 0; o <= nextLen; o++) cur[o] = next[o];
    this.shiftIn(x, nextLen);
  }

  /** count + 1 with halving at the limit; keeps the block roughly sorted by count. Returns the entry's (possibly moved) id. */
  private increment(ctx: number, e: number): number {
    const trie = this.trie;
    trie.bump(ctx, e);
    if (trie.totalOf(ctx) > CONTEXT_TOTAL_LIMIT || trie.countAt(e) >= MAX_COUNT) trie.halve(ctx);
    if (e > trie.blockOf(ctx) && trie.countAt(e) > trie.countAt(e - 1)) e = trie.swapWithPrevious(e);
    return e;
  }

  /** Appends x to the cached context symbols, keeping at most k. */
  private shiftIn(x: number, newLen: number): void {
    const syms = this.curSymbols;
    if (newLen === 0) {
      this.curLen = 0;
      return;
    }
    if (this.curLen === newLen) for (let i = 1; i < newLen; i++) syms[i - 1] = syms[i];
    syms[newLen - 1] = x;
    this.curLen = newLen;
  }

  /** Makes cur[] hold the nodes for the context history[0..end). */
  private resolve(history: ArrayLike<number>, end: number): void {
    const len = Math.min(this.order, end);
    const syms = this.curSymbols;
    const cached = this.curLen;
    if (cached === len) {
      let same = true;
      for (let i = 0; i < len; i++) {
        if (syms[i] !== history[end - len + i]) {
          same = false;
          break;
        }
      }
      if (same) return;
    }
    // One symbol further along the cached context?
    if (len > 0 && cached >= len - 1) {
      let shifted = true;
      const offset = cached - (len - 1);
      for (let i = 0; i < len - 1; i++) {
        if (syms[offset + i] !== history[end - len + i]) {
          shifted = false;
          break;
        }
      }
      if (shifted) {
        const y = history[end - 1];
        const next = this.nextNodes;
        const trie = this.trie;
        next[0] = 0;
        const k = this.order;
        const shortcut =
          len === k && cached === k && this.lastTopSymbol === y ? trie.childAt(this.lastTopEntry) : NONE;
        this.lastTopSymbol = -1;
        if (shortcut !== NONE) {
          next[k] = shortcut;
          for (let j = k - 1; j >= 1; j--) next[j] = trie.suffixOf(next[j + 1]);
          for (let o = 0; o <= k; o++) this.cur[o] = next[o];
          for (let i = 1; i < k; i++) syms[i - 1] = syms[i];
          syms[k - 1] = y;
          return;
        }
        for (let o = len - 1; o >= 0; o--) {
          const ctx = this.cur[o];
          const child = ctx === NONE ? NONE : trie.childOf(ctx, y);
          next[o + 1] = child;
          if (child !== NONE) {
            for (let j = o; j >= 1; j--) next[j] = trie.suffixOf(next[j + 1]);
            break;
          }
        }
        for (let o = 0; o <= len; o++) this.cur[o] = next[o];
        if (offset > 0) syms.copyWithin(0, offset, cached);
        syms[len - 1] = y;
        this.curLen = len;
        return;
      }
    }
    this.resolveFromScratch(history, end, len);
  }

  /** Finds the longest seen context by walking from the root, then the shorter ones through suffix links. */
  private resolveFromScratch(history: ArrayLike<number>, end: number, len: number): void {
    this.lastTopSymbol = -1;
    const trie = this.trie;
    const cur = this.cur;
    cur.fill(NONE);
    cur[0] = 0;
    for (let m = len; m >= 1; m--) {
      let node = 0;
      for (let j = end - m; j < end && node !== NONE; j++) node = trie.childOf(node, history[j]);
      if (node !== NONE) {
        cur[m] = node;
        for (let o = m - 1; o >= 1; o--) cur[o] = trie.suffixOf(cur[o + 1]);
        break;
      }
    }
    for (let i = 0; i < len; i++) this.curSymbols[i] = history[end - len + i];
    this.curLen = len;
  }
}

/** The n-th code point >= from that is not in `sortedExcluded` (n >= 0). */
function nthIncluded(sortedExcluded: Int32Array, from: number, n: number): number {
  let x = from + n;
  for (let i = 0; i < sortedExcluded.length; i++) {
    const e = sortedExcluded[i];
    if (e < from) continue;
    if (e <= x) x++;
    else break;
  }
  return x;
}
