// A client's vocabulary edits, as the engine uses them: words and short phrases a clinician adds
// (learned into the client's word model as if written `weight` times), and words blocked from the
// list (never offered; a block may name a replacement offered in the blocked word's place).
import { prepareText } from '../text-preparation';
import { isOfferable, sentencesOf, wordKey, type WordToken } from './word-tokens';

// The types come from the one schema (schemas/vocabulary.schema.ts), which runs checkClientVocabulary.
import type { ClientVocabulary, VocabularyAddition, VocabularyBlock } from '../../schemas/vocabulary.schema';

export type { ClientVocabulary, VocabularyAddition, VocabularyBlock };

export const EMPTY_VOCABULARY: ClientVocabulary = { additions: [], blocks: [] };

/**
 * Pseudo-count of an addition without a weight: learned as if written 3 times. Modified Kneser–Ney
 * (Chen & Goodman 1998) takes its largest discounts from counts of 1 and 2; a count of 3 is the first
 * that keeps most of its mass under D3+, so an added word competes with words the client really
 * wrote a few times (common practice, no source, for the choice of 3 itself).
 */
export const DEFAULT_ADDITION_WEIGHT = 3;
/** Largest pseudo-count (an addition must not swamp the client's own words; common practice, no source). */
export const MAX_ADDITION_WEIGHT = 100;
/** Longest addition in words (a short phrase, not a text; common practice, no source). */
export const MAX_ADDITION_WORDS = 6;

/** An addition or block the engine cannot use; the message is for a person. */
export class VocabularyError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'VocabularyError';
  }
}

/** The offerable words of a short text, as training cuts them (one sentence, no punctuation tokens). */
function wordsOf(text: string, caseFold: boolean): WordToken[] {
  return sentencesOf(prepareText(text, { caseFold }))
    .flat()
    .filter((t) => isOfferable(t.key));
}

/** Throws VocabularyError naming the first addition or block the engine cannot use. */
export function checkClientVocabulary(vocabulary: ClientVocabulary): void {
  for (const a of vocabulary.additions) {
    const words = wordsOf(a.text, false);
    if (words.length === 0)
      throw new VocabularyError(`The addition "${a.text}" holds no word that can be offered.`);
    if (words.length > MAX_ADDITION_WORDS)
      throw new VocabularyError(`The addition "${a.text}" has more than ${MAX_ADDITION_WORDS} words.`);
    const w = a.weight ?? DEFAULT_ADDITION_WEIGHT;
    if (!(Number.isInteger(w) && w >= 1 && w <= MAX_ADDITION_WEIGHT))
      throw new VocabularyError(
        `The weight of "${a.text}" must be a whole number 1..${MAX_ADDITION_WEIGHT}, not ${w}.`,
      );
  }
  const blocked = new Set(vocabulary.blocks.map((b) => wordKey(b.word.trim())));
  for (const b of vocabulary.blocks) {
    const key = wordKey(b.word.trim());
    const words = wordsOf(b.word, false);
    if (words.length !== 1 || words[0].key !== key)
      throw new VocabularyError(`The blocked word "${b.word}" must be one word.`);
    if (b.replacement === undefined) continue;
    const r = wordsOf(b.replacement, false);
    if (r.length !== 1 || r[0].form !== b.replacement.trim())
      throw new VocabularyError(`The replacement "${b.replacement}" must be one word.`);
    if (blocked.has(r[0].key))
      throw new VocabularyError(`The replacement "${b.replacement}" is blocked itself.`);
  }
}

/**
 * The additions as training sentences: each addition's words once per unit of weight, in order, so
 * a phrase's second word follows its first. The forms count as mid-sentence forms: the clinician's
 * capitals ("Okafor") are the word's own. Prepared as samples are (`caseFold` as the profile).
 */
export function additionSentences(
  additions: readonly VocabularyAddition[],
  options: { caseFold: boolean },
): WordToken[][] {
  const out: WordToken[][] = [];
  for (const a of additions) {
    const words = wordsOf(a.text, options.caseFold).map((t) => ({ ...t, sentenceStart: false }));
    if (words.length === 0) continue;
    const times = a.weight ?? DEFAULT_ADDITION_WEIGHT;
    for (let i = 0; i < times; i++) out.push(words);
  }
  return out;
}

/** What a WordPredictor takes from the blocks: the blocked keys and, per key, the replacement's form. */
export type BlockParts = { blocked: ReadonlySet<string>; replacements: ReadonlyMap<string, string> };

/** The blocks as WordPredictor parts (`caseFold`: replacements offered in lower case, as the profile's words). */
export function blockPartsOf(blocks: readonly VocabularyBlock[], options: { caseFold: boolean }): BlockParts {
  const blocked = new Set<string>();
  const replacements = new Map<string, string>();
  for (const b of blocks) {
    const key = wordKey(b.word.trim());
    blocked.add(key);
    const r = b.replacement?.trim();
    if (r) replacements.set(key, options.caseFold ? r.toLowerCase() : r);
  }
  return { blocked, replacements };
}
