// A word trigram model with interpolated Kneser–Ney smoothing (Kneser & Ney
// 1995, in the interpolated form of Chen & Goodman 1998, one discount per
// order; docs/references.md §4), over its own vocabulary with the written forms
// of each word. Used twice: the client's words (learning what is typed) and
// the base corpus's words (frozen, rare n-grams pruned).
//
// Counts kept (u, v, w are word ids; • is any word):
//   order 3: c(u v w) raw counts, per context (u v): total c(u v •)
//   order 2: N1+(• v w) = distinct u before (v w), per context v: total N1+(• v •)
//   order 1: N1+(• w) = distinct v before w, and N1+(• •)
// With c the count at an order (raw at order 3, continuation below), D(c) the
// discount for that count and γ the mass the discounts free:
//   P1(w)       = (max(N1+(• w) − D(·), 0) + γ1 / |V|) / N1+(• •)
//   P2(w | v)   = (max(N1+(• v w) − D(·), 0) + γ2(v) · P1(w)) / N1+(• v •)      (P1 when v unseen)
//   P3(w | u v) = (max(c(u v w) − D(·), 0) + γ3(u v) · P2(w | v)) / c(u v •)    (P2 when u v unseen)
//   γ(ctx)      = D1·N1(ctx •) + D2·N2(ctx •) + D3+·N3+(ctx •)
// where Nk(ctx •) counts the followers seen exactly k times (3 or more for N3+) and |V| is the
// vocabulary size. This is the "modified" Kneser–Ney of Chen & Goodman (1998): three discounts per
// order from the counts of counts n1..n4, Y = n1 / (n1 + 2 n2), D1 = 1 − 2Y·n2/n1,
// D2 = 2 − 3Y·n3/n2, D3+ = 3 − 4Y·n4/n3; fixed when training ends, what is learned afterwards is
// counted with the same discounts. Every sentence is padded with two sentence-start keys, so every
// word has a context.
import { FormatError, requireDeclaredFits } from '../byte-io';
import { FollowerTable } from './follower-table';
import {
  closeFrame,
  closeFrameReader,
  type FrameKind,
  openFrameReader,
  openFrameWriter,
  readText,
  writeText,
} from './framed-file';
import { SENTENCE_START, UNKNOWN_WORD, type WordToken } from './word-tokens';

/** Ids below 2^22, so a context of two ids is one safe integer. */
const ID_LIMIT = 1 << 22;
const SENTENCE_START_ID = 0;
const UNKNOWN_ID = 1;
/** 0x8B "KLW", layout 2 (layout 1, with discounts rounded to 1e-6, was never released). */
const FRAME: FrameKind = { magic: [0x8b, 0x4b, 0x4c, 0x57], version: 2, what: 'word model', minBytes: 84 };
/**
 * Share of mid-sentence uses in lower case that makes the lower-case form the one offered (common
 * practice, no source: a word that is also a name, like "park" or "bill", is offered as the word).
 */
export const LOWER_CASE_SHARE = 0.25;

/** The three discounts of one order: for a count of 1, of 2, of 3 or more. */
export type OrderDiscounts = [number, number, number];
/** Discounts of orders 1, 2 and 3. */
export type Discounts = [OrderDiscounts, OrderDiscounts, OrderDiscounts];

/** Discounts used where the counts of counts say nothing (too little text): common practice, no source. */
const FALLBACK_DISCOUNTS: OrderDiscounts = [0.5, 1, 1.5];

/**
 * Chen & Goodman's (1998) estimates from the counts of counts n1..n4 of one order. Each is kept
 * inside [0, k] for a count k (a discount may not exceed the count); too few counts give the
 * fallback.
 */
export function modifiedDiscounts(n: readonly number[]): OrderDiscounts {
  const [n1, n2, n3, n4] = n;
  if (n1 === 0 || n2 === 0 || n3 === 0 || n4 === 0) return [...FALLBACK_DISCOUNTS];
  const y = n1 / (n1 + 2 * n2);
  const clamp = (d: number, k: number): number => Math.min(k, Math.max(0, d));
  return [clamp(1 - (2 * y * n2) / n1, 1), clamp(2 - (3 * y * n3) / n2, 2), clamp(3 - (4 * y * n4) / n3, 3)];
}

function discountFor(d: OrderDiscounts, count: number): number {
  return count === 0 ? 0 : count === 1 ? d[0] : count === 2 ? d[1] : d[2];
}

/** γ of a table: the mass its discounts free for the order below. */
function freed(d: OrderDiscounts, t: FollowerTable): number {
  return d[0] * t.ones + d[1] * t.twos + d[2] * (t.size - t.ones - t.twos);
}

export class WordNgramModel {
  /** id → key; ids 0 and 1 are the sentence-start pad and the placeholder. */
  readonly keys: string[] = [SENTENCE_START, UNKNOWN_WORD];
  private readonly ids = new Map<string, number>([
    [SENTENCE_START, SENTENCE_START_ID],
    [UNKNOWN_WORD, UNKNOWN_ID],
  ]);
  /** Times each word was seen (raw, every position). */
  counts: number[] = [0, 0];
  /** Times each word was seen inside a sentence (where its capital means something). */
  midCounts: number[] = [0, 0];
  /** Mid-sentence forms other than the key, with counts. */
  private readonly otherForms = new Map<number, Map<string, number>>();
  /** A sentence-start form differing from the key (used only for words never seen mid-sentence). */
  private readonly startForms = new Map<number, string>();
  /** N1+(• w). */
  continuation: number[] = [0, 0];
  continuationTotal = 0;
  continuationDistinct = 0;
  readonly order2 = new Map<number, FollowerTable>();
  readonly order3 = new Map<number, FollowerTable>();
  discounts: Discounts = [[...FALLBACK_DISCOUNTS], [...FALLBACK_DISCOUNTS], [...FALLBACK_DISCOUNTS]];
  /** Words with a continuation count of exactly 1 and 2 (for γ of order 1). */
  private continuationOnes = 0;
  private continuationTwos = 0;
  /** Whether learn() changes the model (the base is frozen). */
  adaptive = true;

  /** Words in the vocabulary (pads excluded). */
  get vocabularySize(): number {
    return this.keys.length - 2;
  }

  idOf(key: string): number {
    return this.ids.get(key) ?? -1;
  }

  has(key: string): boolean {
    const id = this.ids.get(key);
    return id !== undefined && id > UNKNOWN_ID;
  }

  private intern(key: string): number {
    let id = this.ids.get(key);
    if (id === undefined) {
      id = this.keys.length;
      if (id >= ID_LIMIT) throw new RangeError('word model: too many distinct words');
      this.keys.push(key);
      this.ids.set(key, id);
      this.counts.push(0);
      this.midCounts.push(0);
      this.continuation.push(0);
    }
    return id;
  }

  private noteForm(id: number, form: string, sentenceStart: boolean): void {
    if (id <= UNKNOWN_ID) return;
    this.counts[id]++;
    const key = this.keys[id];
    if (sentenceStart) {
      if (form !== key && !this.startForms.has(id)) this.startForms.set(id, form);
      return;
    }
    this.midCounts[id]++;
    if (form === key) return;
    let forms = this.otherForms.get(id);
    if (!forms) this.otherForms.set(id, (forms = new Map()));
    forms.set(form, (forms.get(form) ?? 0) + 1);
  }

  /** Counts one trigram occurrence (ids), keeping the continuation counts exact. */
  private addTrigram(u: number, v: number, w: number): void {
    const ctx = u * ID_LIMIT + v;
    let t3 = this.order3.get(ctx);
    if (!t3) this.order3.set(ctx, (t3 = new FollowerTable()));
    if (!t3.add(w)) return;
    let t2 = this.order2.get(v);
    if (!t2) this.order2.set(v, (t2 = new FollowerTable()));
    if (!t2.add(w)) return;
    // The placeholder is outside the vocabulary: no unigram (its count is not in the file either).
    if (w === UNKNOWN_ID) return;
    this.noteContinuation(this.continuation[w], 1);
    if (this.continuation[w]++ === 0) this.continuationDistinct++;
    this.continuationTotal++;
  }

  /** Keeps the counts of continuation counts 1 and 2 as one word's count moves from `before` to before + 1. */
  private noteContinuation(before: number, by: number): void {
    if (before === 1) this.continuationOnes--;
    else if (before === 2) this.continuationTwos--;
    const after = before + by;
    if (after === 1) this.continuationOnes++;
    else if (after === 2) this.continuationTwos++;
  }

  /** Learns one sentence's words (training: always; afterwards only when adaptive). */
  learnSentence(tokens: readonly WordToken[]): void {
    let u = SENTENCE_START_ID;
    let v = SENTENCE_START_ID;
    for (const t of tokens) {
      const w = this.intern(t.key);
      this.noteForm(w, t.form, t.sentenceStart);
      this.addTrigram(u, v, w);
      u = v;
      v = w;
    }
  }

  /** Learns one word after the context keys (u, v), as typed (only when adaptive). */
  learnWord(u: string, v: string, key: string, form: string, sentenceStart: boolean): void {
    if (!this.adaptive) return;
    const w = this.intern(key);
    this.noteForm(w, form, sentenceStart);
    // A context word the model never learned as a word (a list that starts on text it did not
    // type) is context only: it reads as the placeholder and does not join the vocabulary.
    const ctx = (k: string): number => this.ids.get(k) ?? UNKNOWN_ID;
    this.addTrigram(ctx(u), ctx(v), w);
  }

  /** Sets the discounts from the counts of counts (call when training ends). */
  fixDiscounts(): void {
    const n = [
      [0, 0, 0, 0],
      [0, 0, 0, 0],
      [0, 0, 0, 0],
    ];
    const tally = (level: number, c: number): void => {
      if (c >= 1 && c <= 4) n[level][c - 1]++;
    };
    for (let w = 2; w < this.continuation.length; w++) tally(0, this.continuation[w]);
    for (const t of this.order2.values()) for (let i = 0; i < t.size; i++) tally(1, t.counts[i]);
    for (const t of this.order3.values()) for (let i = 0; i < t.size; i++) tally(2, t.counts[i]);
    this.discounts = [modifiedDiscounts(n[0]), modifiedDiscounts(n[1]), modifiedDiscounts(n[2])];
  }

  /** P1(w) for an id of this vocabulary. */
  unigram(w: number): number {
    const v = this.vocabularySize;
    if (v === 0) return 0;
    if (this.continuationTotal === 0) return 1 / v;
    const d = this.discounts[0];
    const c = this.continuation[w];
    const gamma =
      d[0] * this.continuationOnes +
      d[1] * this.continuationTwos +
      d[2] * (this.continuationDistinct - this.continuationOnes - this.continuationTwos);
    return (Math.max(c - discountFor(d, c), 0) + gamma / v) / this.continuationTotal;
  }

  /** P2(w | v). */
  bigram(v: number, w: number): number {
    const p1 = this.unigram(w);
    const t = v >= 0 ? this.order2.get(v) : undefined;
    if (!t || t.total === 0) return p1;
    const d = this.discounts[1];
    const c = t.get(w);
    return (Math.max(c - discountFor(d, c), 0) + freed(d, t) * p1) / t.total;
  }

  /** P3(w | u v) for ids (u or v −1 when unknown here); 0 for a word outside this vocabulary. */
  probabilityOfIds(u: number, v: number, w: number): number {
    if (w <= UNKNOWN_ID) return 0;
    const p2 = this.bigram(v, w);
    const t = u >= 0 && v >= 0 ? this.order3.get(u * ID_LIMIT + v) : undefined;
    if (!t || t.total === 0) return p2;
    const d = this.discounts[2];
    const c = t.get(w);
    return (Math.max(c - discountFor(d, c), 0) + freed(d, t) * p2) / t.total;
  }

  /** P3(key | u v) by keys. */
  probability(u: string, v: string, key: string): number {
    return this.probabilityOfIds(this.idOf(u), this.idOf(v), this.idOf(key));
  }

  /** The followers of the context (u v) and of v (ids may repeat between the two). */
  followerTables(u: number, v: number): FollowerTable[] {
    const out: FollowerTable[] = [];
    const t3 = u >= 0 && v >= 0 ? this.order3.get(u * ID_LIMIT + v) : undefined;
    if (t3) out.push(t3);
    const t2 = v >= 0 ? this.order2.get(v) : undefined;
    if (t2) out.push(t2);
    return out;
  }

  /**
   * The form to show for a word seen inside sentences: the lower-case key when at least
   * LOWER_CASE_SHARE of its mid-sentence uses were written that way ("park", though "Park" is a
   * name in some of them), else its commonest mid-sentence form ("Bertram", "I"); undefined for a
   * word never seen inside a sentence.
   */
  midForm(id: number): string | undefined {
    const mid = this.midCounts[id];
    if (mid === 0) return undefined;
    const key = this.keys[id];
    const others = this.otherForms.get(id);
    if (!others) return key;
    let keyCount = mid;
    for (const c of others.values()) keyCount -= c;
    if (keyCount >= LOWER_CASE_SHARE * mid) return key;
    let best = key;
    let bestCount = keyCount;
    for (const [form, c] of others) {
      if (c > bestCount) {
        best = form;
        bestCount = c;
      }
    }
    return best;
  }

  startForm(id: number): string {
    return this.startForms.get(id) ?? this.keys[id];
  }

  /**
   * A frozen copy keeping only n-grams seen at least `minCount` times (count cut-offs, common
   * practice, Chen & Goodman 1998 §5), with the tables' totals recomputed over what is kept;
   * the vocabulary, forms and unigram level stay whole.
   */
  pruned(minCount: number): WordNgramModel {
    const copy = WordNgramModel.fromBytes(this.toBytes());
    const keep = (tables: Map<number, FollowerTable>): void => {
      for (const [ctx, t] of tables) {
        const ids: number[] = [];
        const counts: number[] = [];
        for (let i = 0; i < t.size; i++) {
          if (t.counts[i] >= minCount) {
            ids.push(t.ids[i]);
            counts.push(t.counts[i]);
          }
        }
        if (ids.length === 0) tables.delete(ctx);
        else tables.set(ctx, FollowerTable.fromSorted(Int32Array.from(ids), Int32Array.from(counts)));
      }
    };
    keep(copy.order2);
    keep(copy.order3);
    copy.adaptive = false;
    return copy;
  }

  /** A deep copy (learning in one does not change the other). */
  clone(): WordNgramModel {
    const copy = WordNgramModel.fromBytes(this.toBytes());
    copy.adaptive = this.adaptive;
    return copy;
  }

  /**
   * Layout 2 (little-endian, varints as in model-serialization.ts): magic 8B 4B 4C 57, version,
   * discounts (9 × f64: orders 1..3, each for counts 1, 2, 3+), V words (varint), per word from id 2: key (varint length + UTF-8),
   * count, mid count, continuation count, n other forms × (form, count), start form (length 0 =
   * none); then order 2: tables (varint), per table v, size, size × (id delta, count); then order 3:
   * tables, per table u, v, size, size × (id delta, count); CRC-32 of all bytes before it.
   */
  toBytes(): Uint8Array {
    const w = openFrameWriter(FRAME);
    for (const order of this.discounts) for (const d of order) w.f64(d);
    const str = (s: string): void => writeText(w, s);
    w.varint(this.keys.length - 2);
    for (let id = 2; id < this.keys.length; id++) {
      str(this.keys[id]);
      w.varint(this.counts[id]);
      w.varint(this.midCounts[id]);
      w.varint(this.continuation[id]);
      const others = this.otherForms.get(id);
      w.varint(others ? others.size : 0);
      if (others)
        for (const [form, c] of others) {
          str(form);
          w.varint(c);
        }
      str(this.startForms.get(id) ?? '');
    }
    const tables = (map: Map<number, FollowerTable>, two: boolean): void => {
      const ctxs = [...map.keys()].sort((a, b) => a - b);
      w.varint(ctxs.length);
      for (const ctx of ctxs) {
        const t = map.get(ctx) as FollowerTable;
        if (two) {
          w.varint(Math.floor(ctx / ID_LIMIT));
          w.varint(ctx % ID_LIMIT);
        } else w.varint(ctx);
        w.varint(t.size);
        let prev = 0;
        for (let i = 0; i < t.size; i++) {
          w.varint(t.ids[i] - prev);
          prev = t.ids[i];
          w.varint(t.counts[i]);
        }
      }
    };
    tables(this.order2, false);
    tables(this.order3, true);
    return closeFrame(w);
  }

  /** Reads layout 2. @throws FormatError naming what is wrong */
  static fromBytes(bytes: Uint8Array): WordNgramModel {
    const r = openFrameReader(bytes, FRAME);
    const m = new WordNgramModel();
    const d = (): OrderDiscounts => {
      const read = [r.f64(), r.f64(), r.f64()];
      if (!read.every((x, k) => Number.isFinite(x) && x >= 0 && x <= k + 1))
        throw new FormatError('word model: damaged (a discount out of range)');
      return read as OrderDiscounts;
    };
    m.discounts = [d(), d(), d()];
    const str = (): string => readText(r);
    const words = r.varint();
    requireDeclaredFits(words, 'words', 5, r.remaining);
    for (let i = 0; i < words; i++) {
      const key = str();
      if (m.ids.has(key)) throw new FormatError(`word model: damaged (word "${key}" twice)`);
      const id = m.intern(key);
      m.counts[id] = r.varint();
      m.midCounts[id] = r.varint();
      const cont = r.varint();
      m.continuation[id] = cont;
      m.noteContinuation(0, cont);
      if (cont > 0) m.continuationDistinct++;
      m.continuationTotal += cont;
      const nForms = r.varint();
      requireDeclaredFits(nForms, 'forms', 2, r.remaining);
      if (nForms > 0) {
        const forms = new Map<string, number>();
        for (let k = 0; k < nForms; k++) forms.set(str(), r.varint());
        m.otherForms.set(id, forms);
      }
      const start = str();
      if (start !== '') m.startForms.set(id, start);
    }
    const limit = m.keys.length;
    const tables = (map: Map<number, FollowerTable>, two: boolean): void => {
      const n = r.varint();
      requireDeclaredFits(n, 'contexts', 2, r.remaining);
      for (let k = 0; k < n; k++) {
        const a = r.varint();
        const b = two ? r.varint() : 0;
        if (a >= limit || b >= limit)
          throw new FormatError('word model: damaged (context outside the vocabulary)');
        const size = r.varint();
        requireDeclaredFits(size, 'followers', 2, r.remaining);
        const ids = new Int32Array(size);
        const counts = new Int32Array(size);
        let prev = 0;
        for (let i = 0; i < size; i++) {
          prev += r.varint();
          if (prev >= limit || (i > 0 && prev <= ids[i - 1]))
            throw new FormatError('word model: damaged (follower outside the vocabulary)');
          ids[i] = prev;
          counts[i] = r.varint();
        }
        map.set(two ? a * ID_LIMIT + b : a, FollowerTable.fromSorted(ids, counts));
      }
    };
    tables(m.order2, false);
    tables(m.order3, true);
    closeFrameReader(r, FRAME);
    return m;
  }

  /** Trains on texts' sentences and fixes the discounts. */
  static train(sentences: Iterable<readonly WordToken[]>): WordNgramModel {
    const m = new WordNgramModel();
    for (const s of sentences) m.learnSentence(s);
    m.fixDiscounts();
    return m;
  }
}
