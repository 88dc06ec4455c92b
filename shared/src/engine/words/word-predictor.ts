// The word-aware suggestion list: only words of a vocabulary are offered.
//
// Each candidate word w (given the text before it, h) is scored in two steps:
//
// 1. A linear mixture (Jelinek & Mercer 1980) of four word components:
//      P_w(w | h) = λp·P_KN,personal(w | u v) + λb·P_KN,base(w | u v) + λl·P_lex(w) + λc·P_cache(w)
//    - P_KN: interpolated Kneser–Ney trigram models (word-ngram-model.ts) of the client's own
//      words and of the base corpus; u v are the two tokens before, within the sentence (a comma,
//      colon, semicolon, quote or bracket counts as a token).
//    - P_lex: the base word list's frequency (SUBTLEX-US), so every word of the base vocabulary
//      has a probability even where the base corpus never had it.
//    - P_cache: the recency cache (recency-cache.ts).
//    The λ are tuned on held-out training text by EM (mixture-weights.ts), never on test text.
// 2. A log-linear combination with the character model:
//      score(w) = P_w(w | h)^(1−β) · P_char(w | h)^β
//    where P_char(w | h) is the character model's probability of the word's letters followed by
//    any boundary (space, punctuation, line break), given the whole text before it: the spelling
//    model's view of the context, across word and sentence boundaries. β = CHAR_EXPONENT.
//
// With letters already typed, the candidates are the vocabulary's words that begin with them
// (compared by key: lower case, ’ as '). Candidates come from each component's best words for the
// prefix; the character model scores the best few by P_w (it costs a model call per letter), which
// it may reorder but not add to. `p` is the score renormalised over the words it scored.
import type { NextSymbolModel } from '../model-types';
import { Distribution } from '../model-types';
import * as wordChars from '../search/word-chars';
import { PrefixIndex, TopList } from './prefix-index';
import { RecencyCache } from './recency-cache';
import type { WordLexicon } from './word-lexicon';
import type { WordNgramModel } from './word-ngram-model';
import * as tokens from './word-tokens';

// Local copies: under CommonJS interop every access to an imported binding goes through a getter,
// which showed up in the keystroke simulation's profile.
const { CharClass, charClass, toCodePoints, wordStart } = wordChars;
const {
  atSentenceStart,
  caseForOffer,
  isContextMark,
  isOfferable,
  precedingKeys,
  UNKNOWN_WORD,
  wordEndAt,
  wordKey,
} = tokens;

/** One suggested word and its share of the mixture among the candidates considered (0 < p ≤ 1). */
export type WordSuggestion = { word: string; p: number };

/** Weights of the word mixture's components (each 0..1, summing to 1). */
export type { WordWeights } from '../../schemas/profile-report.schema';
import type { WordWeights } from '../../schemas/profile-report.schema';
export const WORD_COMPONENTS = ['personal', 'base', 'lexicon', 'cache'] as const;

/**
 * β, the character model's exponent in the combination. Fixed, not tuned: on Brown (13 categories
 * for training, a slice of the other two for the list) keystroke savings with 5 slots moved by less
 * than 0.001 between β = 0.2 and 0.4 (measured; `npm run bench` prints the list's figures).
 */
export const CHAR_EXPONENT = 0.3;
export type WordComponent = (typeof WORD_COMPONENTS)[number];

/** The base vocabulary: the base corpus's word model and the base word list. Frozen, shared. */
export type BaseWords = { ngram: WordNgramModel; lexicon: WordLexicon | null };

export type WordPredictorParts = {
  /** The client's word model; it learns finished words when `adaptive` (give each predictor its own copy). */
  personal: WordNgramModel | null;
  base: BaseWords | null;
  /** The character model (blended); it learns every character when adaptive. */
  char: NextSymbolModel | null;
  /** β of the combination (0..1, default CHAR_EXPONENT); 0 leaves the character model out. */
  charExponent?: number;
  weights: WordWeights;
  /** Capitalise at sentence starts and after a typed capital (false for case-folded profiles). */
  capitalize: boolean;
  /** Learn what is typed: finished words enter the client's model and the cache. */
  adaptive: boolean;
  /** Words never offered (keys), from any component. */
  blocked?: ReadonlySet<string>;
  /**
   * Per blocked key, the written form offered in its place: the blocked word is ranked as usual
   * and the replacement shown where it ranked (once: a replacement already in the list is not
   * repeated). A key here must also be in `blocked`.
   */
  replacements?: ReadonlyMap<string, string>;
};

/** A list source: what the keystroke simulator, the CLI and the test keyboard ask. */
export interface ListPredictor {
  /** The `slots` best words at the end of `history[0..end)` (completions, or next words at a boundary). */
  suggest(history: ArrayLike<number>, end: number, slots: number): WordSuggestion[];
  /** 1-based position of the completion `target` in the list of `maxRank` words, 0 when absent. */
  completionRank(history: ArrayLike<number>, end: number, target: ArrayLike<number>, maxRank: number): number;
  /** Learns `history[end]` after `history[0..end)` (adaptive predictors only). */
  learn(history: ArrayLike<number>, end: number): void;
}

type BaseIndex = { index: PrefixIndex; kn: Float64Array; lex: Float64Array; keys: string[] };
const baseIndexes = new WeakMap<BaseWords, BaseIndex>();

/** The base vocabulary's prefix index (built once per base, shared by every predictor). */
function baseIndexOf(base: BaseWords): BaseIndex {
  const known = baseIndexes.get(base);
  if (known) return known;
  const keys: string[] = [];
  const seen = new Set<string>();
  for (let id = 2; id < base.ngram.keys.length; id++) {
    const k = base.ngram.keys[id];
    if (isOfferable(k)) {
      keys.push(k);
      seen.add(k);
    }
  }
  if (base.lexicon) for (const k of base.lexicon.keys) if (!seen.has(k) && isOfferable(k)) keys.push(k);
  const kn = new Float64Array(keys.length);
  const lex = new Float64Array(keys.length);
  keys.forEach((k, i) => {
    const id = base.ngram.idOf(k);
    kn[i] = id >= 0 ? base.ngram.unigram(id) : 0;
    lex[i] = base.lexicon ? base.lexicon.probability(k) : 0;
  });
  const built = { index: new PrefixIndex(keys.map((k, i) => [k, i] as const)), kn, lex, keys };
  baseIndexes.set(base, built);
  return built;
}

/** Candidates each source contributes (common practice, no source: enough to fill any list twice). */
const PER_SOURCE = 24;
/** Extra candidates the character component scores beyond the list length. */
const CHAR_EXTRA = 6;
/** Prefixes this short have their base candidates kept (the base never changes). */
const MEMO_PREFIX = 2;
/** Placeholder brackets of a redaction (⟪person-name⟫): what is inside is never learned as a word. */
const PLACEHOLDER_OPEN = 0x27ea;
const PLACEHOLDER_CLOSE = 0x27eb;

const scratch = new Distribution(512);
let contextBuffer = new Int32Array(256);

type Scored = { key: string; s: number; word?: string };
type KeyInfo = { pid: number; bid: number; lex: number };
/** Keys whose lookups are kept (bounds memory; common practice, no source). */
const KEY_INFO_LIMIT = 100_000;

function byScore(x: Scored, y: Scored): number {
  return y.s - x.s || (x.key < y.key ? -1 : x.key > y.key ? 1 : 0);
}

function compareCodePoints(a: Int32Array, b: Int32Array): number {
  const n = Math.min(a.length, b.length);
  for (let i = 0; i < n; i++) if (a[i] !== b[i]) return a[i] - b[i];
  return a.length - b.length;
}

export class WordPredictor implements ListPredictor {
  readonly personal: WordNgramModel | null;
  readonly base: BaseWords | null;
  readonly char: NextSymbolModel | null;
  readonly weights: WordWeights;
  readonly charExponent: number;
  readonly capitalize: boolean;
  readonly adaptive: boolean;
  readonly cache = new RecencyCache();
  private readonly blocked: ReadonlySet<string>;
  private readonly replacements: ReadonlyMap<string, string>;
  private readonly personalIndex: PrefixIndex;
  private readonly baseIndex: BaseIndex | null;
  private readonly baseMemo = new Map<string, string[]>();
  private readonly keyInfos = new Map<string, KeyInfo>();
  /**
   * The client's commonest words per short prefix (up to MEMO_PREFIX letters), kept up to date as
   * words are learned (counts only grow, so a learned word can only move up or enter a list).
   */
  private readonly personalMemo = new Map<string, TopList>();

  constructor(parts: WordPredictorParts) {
    this.personal = parts.personal;
    this.base = parts.base;
    this.char = parts.char;
    this.capitalize = parts.capitalize;
    this.adaptive = parts.adaptive;
    this.blocked = parts.blocked ?? new Set();
    this.replacements = parts.replacements ?? new Map();
    for (const [k, r] of this.replacements) {
      if (!this.blocked.has(k))
        throw new RangeError(`word predictor: "${k}" has a replacement but is not blocked`);
      if (this.blocked.has(wordKey(r)))
        throw new RangeError(`word predictor: the replacement "${r}" is blocked`);
    }
    this.weights = effectiveWeights(parts);
    const beta = parts.char ? (parts.charExponent ?? CHAR_EXPONENT) : 0;
    if (!(beta >= 0 && beta <= 1)) throw new RangeError(`charExponent must be 0..1, got ${beta}`);
    this.charExponent = beta;
    const personalKeys: [string, number][] = [];
    if (this.personal)
      this.personal.keys.forEach((k, id) => {
        if (id > 1 && isOfferable(k)) personalKeys.push([k, id]);
      });
    this.personalIndex = new PrefixIndex(personalKeys);
    this.baseIndex = this.base ? baseIndexOf(this.base) : null;
  }

  /**
   * True when a word (as typed or offered) is in the vocabulary: the client's words, the base's, or
   * a word learned while typing (held by the cache when there is no client word model).
   */
  inVocabulary(word: string): boolean {
    const key = wordKey(word);
    if (!isOfferable(key)) return false;
    return (
      (this.personal?.has(key) ?? false) ||
      this.cache.probability(key) > 0 ||
      (this.base?.ngram.has(key) ?? false) ||
      (this.base?.lexicon ? this.base.lexicon.idOf(key) >= 0 : false)
    );
  }

  /** The form to show for a key: the client's own mid-sentence form, the base's, the word list's, else as first seen. */
  displayForm(key: string): string {
    const p = this.personal;
    const pid = p ? p.idOf(key) : -1;
    if (p && pid > 1) {
      const f = p.midForm(pid);
      if (f !== undefined) return f;
    }
    const b = this.base?.ngram;
    const bid = b ? b.idOf(key) : -1;
    if (b && bid > 1) {
      const f = b.midForm(bid);
      if (f !== undefined) return f;
    }
    const lex = this.base?.lexicon;
    const lid = lex ? lex.idOf(key) : -1;
    if (lex && lid >= 0) return lex.form(lid);
    if (p && pid > 1) return p.startForm(pid);
    if (b && bid > 1) return b.startForm(bid);
    return key;
  }

  /** After `key` was learned: its count grew, so it may move up in, or enter, the memoised lists of its prefixes. */
  private refreshPersonalMemo(key: string): void {
    const p = this.personal as WordNgramModel;
    const id = p.idOf(key);
    for (let n = 0; n <= Math.min(MEMO_PREFIX, key.length); n++) {
      const top = this.personalMemo.get(key.slice(0, n));
      if (!top) continue;
      top.remove(id);
      top.offer(id, p.counts[id]);
    }
  }

  /** The four word components' mixture for one key in context. */
  /**
   * What never changes about a key in this predictor, looked up once: its base id and word-list
   * probability (the base is frozen), and its client id once it has one (ids never change).
   */
  private keyInfo(key: string): KeyInfo {
    let info = this.keyInfos.get(key);
    if (!info) {
      const b = this.base;
      info = {
        pid: this.personal ? this.personal.idOf(key) : -1,
        bid: b ? b.ngram.idOf(key) : -1,
        lex: b?.lexicon ? b.lexicon.probability(key) : 0,
      };
      if (this.keyInfos.size >= KEY_INFO_LIMIT) this.keyInfos.clear();
      this.keyInfos.set(key, info);
    } else if (info.pid < 0 && this.personal) {
      info.pid = this.personal.idOf(key); // learned since
    }
    return info;
  }

  private wordScore(key: string, pu: number, pv: number, bu: number, bv: number): number {
    const w = this.weights;
    const info = this.keyInfo(key);
    let s = 0;
    if (w.personal > 0 && info.pid > 1)
      s += w.personal * (this.personal as WordNgramModel).probabilityOfIds(pu, pv, info.pid);
    if (w.base > 0 && info.bid > 1)
      s += w.base * (this.base as BaseWords).ngram.probabilityOfIds(bu, bv, info.bid);
    s += w.lexicon * info.lex;
    if (w.cache > 0) s += w.cache * this.cache.probability(key);
    return s;
  }

  private baseCandidates(prefixKey: string): string[] {
    const memo = prefixKey.length <= MEMO_PREFIX ? this.baseMemo.get(prefixKey) : undefined;
    if (memo) return memo;
    const b = this.baseIndex as BaseIndex;
    const wb = this.weights.base;
    const wl = this.weights.lexicon;
    const top = b.index.top(prefixKey, PER_SOURCE, (i) => wb * b.kn[i] + wl * b.lex[i]);
    const keys = top.ids.map((i) => b.keys[i]);
    if (prefixKey.length <= MEMO_PREFIX) this.baseMemo.set(prefixKey, keys);
    return keys;
  }

  /** The best `limit` offers at the end of `history[0..end)`, best first. */
  private ranked(history: ArrayLike<number>, end: number, limit: number): WordSuggestion[] {
    const begin = wordStart(history, end);
    let prefix = '';
    for (let i = begin; i < end; i++) prefix += String.fromCodePoint(history[i]);
    const prefixKey = wordKey(prefix);
    const [u, v] = precedingKeys(history, begin);
    const p = this.personal;
    const b = this.base?.ngram;
    const pu = p ? p.idOf(u) : -1;
    const pv = p ? p.idOf(v) : -1;
    const bu = b ? b.idOf(u) : -1;
    const bv = b ? b.idOf(v) : -1;

    const candidates = new Set<string>();
    const fromTables = (model: WordNgramModel, cu: number, cv: number): void => {
      for (const t of model.followerTables(cu, cv)) {
        const top = new TopList(PER_SOURCE);
        for (let i = 0; i < t.size; i++) {
          if (t.counts[i] <= top.floor) continue;
          if (model.keys[t.ids[i]].startsWith(prefixKey)) top.offer(t.ids[i], t.counts[i]);
        }
        for (const id of top.ids) candidates.add(model.keys[id]);
      }
    };
    if (p && this.weights.personal > 0) {
      fromTables(p, pu, pv);
      const counts = p.counts;
      let top = prefixKey.length <= MEMO_PREFIX ? this.personalMemo.get(prefixKey) : undefined;
      if (!top) {
        top = this.personalIndex.top(prefixKey, PER_SOURCE, (id) => counts[id]);
        if (prefixKey.length <= MEMO_PREFIX) this.personalMemo.set(prefixKey, top);
      }
      for (const id of top.ids) candidates.add(p.keys[id]);
    }
    if (this.base && (this.weights.base > 0 || this.weights.lexicon > 0)) {
      if (b && this.weights.base > 0) fromTables(b, bu, bv);
      for (const k of this.baseCandidates(prefixKey)) candidates.add(k);
    }
    if (this.weights.cache > 0)
      for (const [k] of this.cache.entries()) if (k.startsWith(prefixKey)) candidates.add(k);

    const scored: Scored[] = [];
    for (const key of candidates) {
      // A blocked word with a replacement keeps its place; the replacement is shown there.
      if (!isOfferable(key) || (this.blocked.has(key) && !this.replacements.has(key))) continue;
      const s = this.wordScore(key, pu, pv, bu, bv);
      if (s > 0) scored.push({ key, s });
    }
    scored.sort(byScore);

    const sentenceStart = atSentenceStart(history, begin);
    const offer = (key: string): string =>
      caseForOffer(this.displayForm(key), prefix, sentenceStart, this.capitalize);
    if (this.char && this.charExponent > 0 && scored.length > 0) {
      // Only the words the character model scored stay: their scores are on another scale.
      scored.length = Math.min(scored.length, limit + CHAR_EXTRA);
      const rests = scored.map((c) => toCodePoints((c.word = offer(c.key))).slice(end - begin));
      const probs = this.charWordProbabilities(history, begin, end, rests);
      const beta = this.charExponent;
      for (let i = 0; i < scored.length; i++)
        scored[i].s = Math.exp(
          (1 - beta) * Math.log(scored[i].s) + beta * Math.log(Math.max(probs[i], 1e-300)),
        );
      scored.sort(byScore);
    }
    let total = 0;
    for (const c of scored) total += c.s;
    const out: WordSuggestion[] = [];
    const seen = new Set<string>();
    for (const c of scored) {
      if (out.length >= limit) break;
      const replacement = this.replacements.get(c.key);
      const word =
        replacement !== undefined
          ? this.replacementOffer(replacement, prefix, sentenceStart)
          : (c.word ?? offer(c.key));
      const key = wordKey(word); // a replacement is deduplicated by its own key
      // The letters already typed, offered as they are, would add nothing a space does not.
      if (seen.has(key) || word === prefix || this.blocked.has(key)) continue;
      seen.add(key);
      out.push({ word, p: c.s / total });
    }
    return out;
  }

  /** A replacement as offered: its written form, cased for the typed letters when it extends them. */
  private replacementOffer(form: string, prefix: string, sentenceStart: boolean): string {
    const typed = wordKey(form).startsWith(wordKey(prefix)) ? prefix : '';
    return caseForOffer(form, typed, sentenceStart && prefix === '', this.capitalize);
  }

  /**
   * P_char(w | h) for each candidate: the typed prefix's letters from the word start, then the
   * candidate's remaining letters (`rests`, as it would be offered), then any boundary. Candidates
   * sharing letters share the model calls (they are walked in sorted order).
   */
  private charWordProbabilities(
    history: ArrayLike<number>,
    begin: number,
    end: number,
    rests: Int32Array[],
  ): number[] {
    const model = this.char as NextSymbolModel;
    const keep = Math.min(model.order + 1, end);
    let prefixP = 1;
    for (let i = begin; i < end; i++) prefixP *= model.probability(history, i, history[i]);
    const order = rests.map((rest, i) => ({ rest, i }));
    order.sort((a, b) => compareCodePoints(a.rest, b.rest));
    let maxLen = 0;
    for (const r of rests) maxLen = Math.max(maxLen, r.length);
    if (contextBuffer.length < keep + maxLen + 1) contextBuffer = new Int32Array(keep + maxLen + 64);
    for (let i = 0; i < keep; i++) contextBuffer[i] = history[end - keep + i];
    // cum[d] = probability of the typed prefix and the first d letters of the current path.
    const cum = [prefixP];
    let path: Int32Array = new Int32Array(0);
    const out = new Array<number>(rests.length).fill(0);
    for (const { rest, i } of order) {
      let common = 0;
      while (common < path.length && common < rest.length && path[common] === rest[common]) common++;
      cum.length = common + 1;
      for (let d = common; d < rest.length; d++) {
        contextBuffer[keep + d] = rest[d];
        cum.push(cum[d] * model.probability(contextBuffer, keep + d, rest[d]));
      }
      path = rest;
      scratch.clear();
      model.distribution(contextBuffer, keep + rest.length, scratch);
      let boundary = 0;
      for (let k = 0; k < scratch.size; k++)
        if (charClass(scratch.symbols[k]) === CharClass.Boundary) boundary += scratch.probs[k];
      out[i] = cum[rest.length] * boundary;
    }
    return out;
  }

  suggest(history: ArrayLike<number>, end: number, slots: number): WordSuggestion[] {
    if (!Number.isInteger(slots) || slots < 1 || slots > 100)
      throw new RangeError(`slots must be 1..100, got ${slots}`);
    return this.ranked(history, end, slots);
  }

  completionRank(
    history: ArrayLike<number>,
    end: number,
    target: ArrayLike<number>,
    maxRank: number,
  ): number {
    const begin = wordStart(history, end);
    if (target.length === 0 && begin === end) return 0;
    let word = '';
    for (let i = begin; i < end; i++) word += String.fromCodePoint(history[i]);
    for (let i = 0; i < target.length; i++) word += String.fromCodePoint(target[i]);
    const list = this.ranked(history, end, maxRank);
    for (let r = 0; r < list.length; r++) if (list[r].word === word) return r + 1;
    return 0;
  }

  /**
   * Learns `history[end]`: the character model learns it; when it ends a word (a boundary after
   * word characters), the word enters the client's word model (so it can be offered from the next
   * list on) and the recency cache; a context mark (comma, colon, semicolon, quote, bracket)
   * enters the word model as a token, as training counts it. Only when adaptive.
   */
  learn(history: ArrayLike<number>, end: number): void {
    if (!this.adaptive) return;
    this.char?.learn(history, end);
    if (end >= history.length || charClass(history[end]) !== CharClass.Boundary) return;
    const begin = wordStart(history, end);
    if (begin < end) this.learnWordBefore(history, begin, end);
    // A comma, colon, semicolon, quote or bracket is a token of the word model, as in sentencesOf
    // (a run of the same mark is one token).
    if (this.personal && isContextMark(history[end])) {
      const [u, v] = precedingKeys(history, end);
      const mark = String.fromCodePoint(history[end]);
      if (v !== mark) this.personal.learnWord(u, v, mark, mark, false);
    }
  }

  /** Learns the word history[begin..end), ended by the boundary at `end`. */
  private learnWordBefore(history: ArrayLike<number>, begin: number, end: number): void {
    // A joiner typed after the word (a closing quote: 'no') is not part of it, as in sentencesOf.
    const last = wordEndAt(history, begin, end);
    let form = '';
    for (let i = begin; i < last; i++) form += String.fromCodePoint(history[i]);
    const [u, v] = precedingKeys(history, begin);
    const placeholder =
      begin > 0 && history[begin - 1] === PLACEHOLDER_OPEN && history[end] === PLACEHOLDER_CLOSE;
    const key = placeholder ? UNKNOWN_WORD : wordKey(form);
    if (this.personal) {
      const known = this.personal.has(key);
      this.personal.learnWord(u, v, key, form, atSentenceStart(history, begin));
      if (!known && isOfferable(key)) this.personalIndex.insert(key, this.personal.idOf(key));
      if (isOfferable(key)) this.refreshPersonalMemo(key);
    }
    if (isOfferable(key)) this.cache.add(key);
  }
}

/** The weights as used: absent components get 0, the rest are scaled to sum to 1. */
export function effectiveWeights(
  parts: Pick<WordPredictorParts, 'personal' | 'base' | 'adaptive' | 'weights'>,
): WordWeights {
  const w = { ...parts.weights };
  if (!parts.personal) w.personal = 0;
  if (!parts.base) w.base = 0;
  if (!parts.base?.lexicon) w.lexicon = 0;
  if (!parts.adaptive) w.cache = 0;
  const sum = WORD_COMPONENTS.reduce((s, c) => s + w[c], 0);
  if (!(sum > 0)) throw new RangeError('word predictor: every component has weight 0');
  for (const c of WORD_COMPONENTS) w[c] /= sum;
  return w;
}
