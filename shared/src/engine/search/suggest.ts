// Word suggestions and next-letter probabilities, written against
// NextSymbolModel only (PPM or blended model alike).
import { Distribution, type NextSymbolModel } from '../model-types';
import { defaultSearchLimits, searchCompletions, type SearchLimits } from './best-first-search';
import { charClass, CharClass, wordStart } from './word-chars';

/** One suggested word and its probability given the context (0 < p ≤ 1). */
export type Suggestion = { word: string; p: number };

/** Options of `suggest`; every field has a default. */
export type SuggestOptions = Partial<SearchLimits>;

/**
 * The `slots` most probable words at the end of `history[0..end)`: completions
 * of the word being typed, or the next word at a word boundary. Each word is
 * the whole word (typed prefix included); `p` is the probability that the
 * model writes exactly this word and then a boundary (space, punctuation,
 * newline). Ranked by p, highest first; no word appears twice.
 * @param history code points of the text so far
 * @param end number of code points of `history` that are typed (0..history.length)
 * @param slots list length (1..100)
 */
export function suggest(
  model: NextSymbolModel,
  history: ArrayLike<number>,
  end: number,
  slots: number,
  options: SuggestOptions = {},
): Suggestion[] {
  if (!Number.isInteger(slots) || slots < 1 || slots > 100)
    throw new RangeError(`slots must be 1..100, got ${slots}`);
  const limits = { ...defaultSearchLimits, ...options };
  const begin = wordStart(history, end);
  let prefix = '';
  for (let i = begin; i < end; i++) prefix += String.fromCodePoint(history[i]);
  const found = searchCompletions(model, history, end, begin, slots, 0, limits);
  // The search tree yields each completion once; the set guards the contract anyway.
  const seen = new Set<string>();
  const out: Suggestion[] = [];
  for (const c of found) {
    const word = prefix + String.fromCodePoint(...c.symbols);
    if (seen.has(word)) continue;
    seen.add(word);
    out.push({ word, p: c.p });
  }
  return out;
}

/** A key and the probability that it is typed next. */
export type LetterProbability = { char: string; p: number };

const scratch = new Distribution(512);

/**
 * Probability of each next character the model names after
 * `history[0..end)`, highest first, for highlighting keys. With
 * `foldCase`, upper- and lower-case forms are merged under the lower-case key.
 * Only word characters are returned unless `includeBoundaries` is set.
 */
export function nextLetterProbabilities(
  model: NextSymbolModel,
  history: ArrayLike<number>,
  end: number,
  options: { foldCase?: boolean; includeBoundaries?: boolean } = {},
): LetterProbability[] {
  scratch.clear();
  model.distribution(history, end, scratch);
  const merged = new Map<string, number>();
  for (let k = 0; k < scratch.size; k++) {
    const s = scratch.symbols[k];
    if (!options.includeBoundaries && charClass(s) !== CharClass.Word) continue;
    let ch = String.fromCodePoint(s);
    if (options.foldCase) ch = ch.toLowerCase();
    merged.set(ch, (merged.get(ch) ?? 0) + scratch.probs[k]);
  }
  return [...merged]
    .map(([char, p]) => ({ char, p }))
    .sort((a, b) => b.p - a.p || (a.char < b.char ? -1 : a.char > b.char ? 1 : 0));
}

/**
 * Position (1-based) of one completion in the list `suggest` would show with
 * `maxRank` slots, or 0 when it is not in that list. The same search as
 * `suggest`, stopped as soon as the target word leaves the queue (the
 * keystroke simulator calls it before every letter).
 * @param target code points that complete the word being typed (may be empty
 *   when the typed prefix is already the whole word)
 * @param maxRank longest list considered (1..100)
 */
export function completionRank(
  model: NextSymbolModel,
  history: ArrayLike<number>,
  end: number,
  target: ArrayLike<number>,
  maxRank: number,
  options: SuggestOptions = {},
): number {
  const limits =
    options.nodeBudget === undefined && options.maxCompletionLength === undefined
      ? defaultSearchLimits
      : { ...defaultSearchLimits, ...options };
  const begin = wordStart(history, end);
  if (target.length > limits.maxCompletionLength) return 0;
  if (target.length === 0 && begin === end) return 0;
  const found = searchCompletions(model, history, end, begin, maxRank, 0, limits, target);
  const last = found[found.length - 1];
  if (!last || last.symbols.length !== target.length) return 0;
  for (let i = 0; i < target.length; i++) if (last.symbols[i] !== target[i]) return 0;
  return found.length;
}
