// Tuning the word mixture's weights (word-predictor.ts) on held-out text by
// expectation–maximisation, the standard way to fit the weights of a linear
// interpolation (Jelinek & Mercer 1980; docs/references.md §4): each step sets
// λ_i to the average share component i has in the probability of each word.
// The log-likelihood never decreases from one step to the next.
import { RecencyCache } from './recency-cache';
import type { WordNgramModel } from './word-ngram-model';
import { type BaseWords, WORD_COMPONENTS, type WordComponent, type WordWeights } from './word-predictor';
import { isOfferable, precedingKeys, sentencesOf } from './word-tokens';

/**
 * Weights when there is no held-out text to tune on (common practice, no source: the client's
 * words first, then the base corpus, the cache and the word list).
 */
export const DEFAULT_WORD_WEIGHTS: WordWeights = { personal: 0.5, base: 0.3, lexicon: 0.05, cache: 0.15 };
/** Smallest weight a present component keeps, so a tuning text without repeats cannot switch the cache off. */
export const MIN_COMPONENT_WEIGHT = 0.01;
/** Words of held-out text used at most (enough for five weights). */
const MAX_TUNING_WORDS = 20_000;
const EM_STEPS = 40;

/** Probability of each word of `texts` under each component (rows of four numbers). */
export type ComponentTable = { rows: Float64Array[]; present: WordComponent[] };

/**
 * Reads the held-out texts as a client would write them: for each word in order, the
 * probability each component gives it in context, then the word enters the cache.
 * The client's and base word models are held still.
 */
export function componentProbabilities(
  parts: { personal: WordNgramModel | null; base: BaseWords | null; cache: boolean },
  texts: readonly Uint32Array[],
): ComponentTable {
  const present: WordComponent[] = WORD_COMPONENTS.filter((c) =>
    c === 'personal'
      ? parts.personal !== null
      : c === 'base'
        ? parts.base !== null
        : c === 'lexicon'
          ? (parts.base?.lexicon ?? null) !== null
          : parts.cache,
  );
  const cache = new RecencyCache();
  const rows: Float64Array[] = [];
  for (const text of texts) {
    for (const sentence of sentencesOf(text)) {
      for (const token of sentence) {
        if (rows.length >= MAX_TUNING_WORDS) return { rows, present };
        if (!isOfferable(token.key)) continue;
        const [u, v] = precedingKeys(text, token.start);
        const row = new Float64Array(WORD_COMPONENTS.length);
        const p = parts.personal;
        if (p) row[0] = p.probability(u, v, token.key);
        if (parts.base) {
          row[1] = parts.base.ngram.probability(u, v, token.key);
          if (parts.base.lexicon) row[2] = parts.base.lexicon.probability(token.key);
        }
        if (parts.cache) row[3] = cache.probability(token.key);
        cache.add(token.key);
        if (row.some((x) => x > 0)) rows.push(row);
      }
    }
  }
  return { rows, present };
}

/**
 * EM for the weights of the present components (the others get 0). Rows where every present
 * component gives 0 carry no information and are skipped. Without rows: DEFAULT_WORD_WEIGHTS
 * restricted to the present components.
 */
export function fitMixtureWeights(table: ComponentTable, steps = EM_STEPS): WordWeights {
  const idx = table.present.map((c) => WORD_COMPONENTS.indexOf(c));
  const lambda = new Float64Array(WORD_COMPONENTS.length);
  const rows = table.rows.filter((r) => idx.some((i) => r[i] > 0));
  if (rows.length === 0 || idx.length === 0) return restricted(DEFAULT_WORD_WEIGHTS, table.present);
  for (const i of idx) lambda[i] = 1 / idx.length;
  const share = new Float64Array(WORD_COMPONENTS.length);
  for (let step = 0; step < steps; step++) {
    share.fill(0);
    for (const r of rows) {
      let mix = 0;
      for (const i of idx) mix += lambda[i] * r[i];
      if (!(mix > 0)) continue;
      for (const i of idx) share[i] += (lambda[i] * r[i]) / mix;
    }
    let sum = 0;
    for (const i of idx) sum += share[i];
    for (const i of idx) lambda[i] = Math.max(MIN_COMPONENT_WEIGHT, share[i] / sum);
    sum = 0;
    for (const i of idx) sum += lambda[i];
    for (const i of idx) lambda[i] /= sum;
  }
  const out = { personal: 0, base: 0, lexicon: 0, cache: 0 };
  WORD_COMPONENTS.forEach((c, i) => (out[c] = round(lambda[i])));
  return out;
}

/** Mean log2-probability per word of the rows under the weights (for checks and reports). */
export function mixtureBitsPerWord(table: ComponentTable, weights: WordWeights): number {
  let bits = 0;
  let n = 0;
  for (const r of table.rows) {
    let mix = 0;
    WORD_COMPONENTS.forEach((c, i) => (mix += weights[c] * r[i]));
    if (mix > 0) {
      bits -= Math.log2(mix);
      n++;
    }
  }
  return n === 0 ? 0 : bits / n;
}

function restricted(w: WordWeights, present: readonly WordComponent[]): WordWeights {
  const out = { personal: 0, base: 0, lexicon: 0, cache: 0 };
  let sum = 0;
  for (const c of present) sum += w[c];
  for (const c of present) out[c] = round(w[c] / sum);
  return out;
}

function round(x: number): number {
  return Math.round(x * 1e6) / 1e6;
}
