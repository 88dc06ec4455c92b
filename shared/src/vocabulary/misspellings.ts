// Likely misspellings among the client's words: words the base word list does not know, or knows
// only as rare (subtitle lists hold typos too: SUBTLEX-US has "untill" 15 times), that are
// one or two edits (optimal string alignment: insertion, deletion, substitution, or swapping two
// neighbouring letters, Damerau 1964) from a common word of the list.
//
// Candidates are found with a deletion-neighbourhood index (symmetric delete, Garbe 2012): every
// common word is stored under itself and every string made by deleting up to 2 of its letters; a
// client's word looks up itself and its own deletions, and every hit is checked with the
// `damerau-levenshtein` package. Two strings within distance 2 always share such a string.
// Sources: docs/references.md §4.
//
// A correction keeps the word's first letter: misspellings rarely change it (Pollock & Zamora 1984
// report first-letter errors as rare in their corpus of errors; from memory), and allowing it
// paired names and rare words with unrelated common ones in tests ("nods" → "gods"). So the first
// letter is never deleted in the index, which also keeps its lists short.
import damerauLevenshtein from 'damerau-levenshtein';

/** A word of the client's vocabulary (VocabularyEntry fits). */
export type PersonalWord = { key: string; count: number; form?: string };

/** The base word list: membership and frequency in occurrences per million words (SUBTLEX-US's scale). */
export type KnownWords = {
  has(key: string): boolean;
  frequency(key: string): number;
  /** Every key of the list (the index is built from those frequent enough). */
  keys: Iterable<string>;
};

export type MisspellingOptions = {
  /**
   * Known words at least this frequent (per million words) are indexed as possible corrections
   * (default 1; a correction must also pass `ratio`, so the index may keep more than is used).
   */
  minFrequency?: number;
  /**
   * Words the list holds at this frequency or more (per million) are never flagged (default 0.5,
   * about 25 times in SUBTLEX-US's 50 million words; common practice, no source). A word the list
   * holds with frequency 0 (a base-corpus word missing from the word list) is trusted too.
   */
  rareBelow?: number;
  /**
   * A rare word the list holds is flagged only for a correction one edit away and at least this
   * many times as frequent (default 100; common practice, no source). A word the list does not
   * hold needs only `minFrequency`.
   */
  ratio?: number;
  /** Corrections kept per word (default 3). */
  perWord?: number;
  /**
   * Words shorter than this are not checked (default 3): a one- or two-letter string is one edit
   * from dozens of words (common practice, no source).
   */
  minLength?: number;
  /**
   * Distance 2 is allowed only for words at least this long (default 5): a short word is two edits
   * from too many others (common practice, no source; spell checkers scale the distance allowed
   * with the word's length).
   */
  twoEditLength?: number;
  /**
   * A word written with capitals of its own mid-sentence ("Marcy") at least this many times is
   * taken as the client's own name and not flagged (default 2: a slip is rarely capitalised the same
   * way twice; common practice, no source). Other words are flagged however often they were
   * written: a misspelling made every time is worth reviewing.
   */
  nameCount?: number;
};

export type MisspellingCorrection = { word: string; distance: number; frequency: number };
export type MisspellingCandidate = { key: string; count: number; corrections: MisspellingCorrection[] };

const DEFAULTS = {
  minFrequency: 1,
  rareBelow: 1,
  ratio: 50,
  perWord: 3,
  minLength: 3,
  twoEditLength: 5,
  nameCount: 5,
};
const MAX_DISTANCE = 2;

/** The strings made by deleting up to `depth` characters after the first (code units). */
function deletions(word: string, depth: number, into: Set<string>): Set<string> {
  into.add(word);
  if (depth === 0 || word.length <= 2) return into;
  for (let i = 1; i < word.length; i++) {
    const shorter = word.slice(0, i) + word.slice(i + 1);
    if (!into.has(shorter)) deletions(shorter, depth - 1, into);
  }
  return into;
}

/** An index of the known words frequent enough to be corrections, by their deletion neighbourhoods. */
export class MisspellingIndex {
  private readonly index = new Map<string, string[]>();
  readonly words: number;

  constructor(
    readonly known: KnownWords,
    readonly minFrequency = DEFAULTS.minFrequency,
  ) {
    let words = 0;
    for (const key of known.keys) {
      if (known.frequency(key) < minFrequency || !/^\p{L}/u.test(key)) continue;
      words++;
      for (const d of deletions(key, MAX_DISTANCE, new Set())) {
        const list = this.index.get(d);
        if (list) list.push(key);
        else this.index.set(d, [key]);
      }
    }
    this.words = words;
  }

  /** Known words within `maxDistance` edits of `word`, nearest and then commonest first. */
  near(word: string, maxDistance: number): MisspellingCorrection[] {
    const seen = new Set<string>();
    const out: MisspellingCorrection[] = [];
    for (const d of deletions(word, maxDistance, new Set())) {
      for (const k of this.index.get(d) ?? []) {
        if (seen.has(k) || k === word) continue;
        seen.add(k);
        if (Math.abs(k.length - word.length) > maxDistance) continue;
        const distance = damerauLevenshtein(word, k).steps;
        if (distance >= 1 && distance <= maxDistance)
          out.push({ word: k, distance, frequency: this.known.frequency(k) });
      }
    }
    return out.sort(
      (a, b) => a.distance - b.distance || b.frequency - a.frequency || (a.word < b.word ? -1 : 1),
    );
  }
}

/**
 * The client's words that look like misspellings of common known words, with up to `perWord`
 * corrections each; ranked by the nearest correction's distance, then by how often the client
 * wrote the word. Pass a MisspellingIndex as `known` to reuse one across calls.
 */
export function misspellingCandidates(
  personal: readonly PersonalWord[],
  known: KnownWords | MisspellingIndex,
  options: MisspellingOptions = {},
): MisspellingCandidate[] {
  const o = { ...DEFAULTS, ...options };
  const index =
    known instanceof MisspellingIndex && known.minFrequency === o.minFrequency
      ? known
      : new MisspellingIndex(known instanceof MisspellingIndex ? known.known : known, o.minFrequency);
  const personalKeys = new Set(personal.map((w) => w.key));
  const isWord = (part: string): boolean => index.known.has(part) || personalKeys.has(part);
  const out: MisspellingCandidate[] = [];
  for (const w of personal) {
    const key = w.key;
    if (key.length < o.minLength || !/^\p{L}[\p{L}'-]*$/u.test(key)) continue;
    // A possessive or a compound of words that are known or the client's ("Pepper's", "e-mail")
    // is taken as written (common practice, no source).
    const parts = key.split(/['-]/);
    if (parts.length > 1 && parts.every((part) => part === '' || part === 's' || isWord(part))) continue;
    const held = index.known.has(key);
    const own = held ? index.known.frequency(key) : 0;
    if (held && !(own > 0 && own < o.rareBelow)) continue;
    const ownName = w.form !== undefined && w.form !== w.form.toLowerCase() && w.count >= o.nameCount;
    if (ownName) continue;
    const floor = Math.max(o.minFrequency, o.ratio * own);
    const corrections = index
      .near(key, !held && key.length >= o.twoEditLength ? 2 : 1)
      // A plural and its singular are both words ("meanings", "meaning"; common practice, no source).
      .filter((c) => c.frequency >= floor && c.word + 's' !== key && key + 's' !== c.word)
      .slice(0, o.perWord);
    if (corrections.length > 0) out.push({ key, count: w.count, corrections });
  }
  return out.sort(
    (a, b) =>
      a.corrections[0].distance - b.corrections[0].distance || b.count - a.count || (a.key < b.key ? -1 : 1),
  );
}
