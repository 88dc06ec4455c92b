// Normalising a sample and counting what is in it.
//
// Word definition: the engine's own (`charClass` in engine/search/word-chars.ts): a word is a run
// of letters, marks and digits, with an apostrophe or hyphen allowed only between word characters
// ("don't", "re-enter"). Suggestions, keystroke simulation and these statistics therefore agree
// on what a word is. Words are counted case-folded (String.prototype.toLowerCase) with the curly
// apostrophe (U+2019) written as a straight one, so "Don’t" and "don't" are one word.
import { CharClass, charClass } from '../engine/search/word-chars';

/**
 * The form in which Keyloom stores a sample: the engine's prepareText rules (CRLF and lone CR
 * become LF, then Unicode NFC; no case folding) applied to the string directly — prepareText
 * returns code points, and the round trip costs about a second on 20 MB. The test checks that
 * both give the same text. A leading BOM, if one survived decoding, is dropped.
 */
export function normaliseSampleText(text: string): string {
  const withoutBom = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  return withoutBom.replace(/\r\n?/g, '\n').normalize('NFC');
}

/** A word's place in a string: code-unit offsets [start, end). */
export type WordSpan = { start: number; end: number };

/** Calls `visit(start, end)` for every word of `text` by the engine's word definition, in order. */
export function forEachWord(text: string, visit: (start: number, end: number) => void): void {
  let start = -1; // start of the current word, -1 between words
  let lastWordEnd = -1; // end of the last word character seen in the current word
  for (let i = 0; i < text.length;) {
    const unit = text.charCodeAt(i);
    const cp = unit >= 0xd800 && unit <= 0xdbff ? (text.codePointAt(i) as number) : unit;
    const width = cp > 0xffff ? 2 : 1;
    const c = charClass(cp);
    if (c === CharClass.Word) {
      if (start < 0) start = i;
      lastWordEnd = i + width;
    } else if (c === CharClass.Joiner && start >= 0 && lastWordEnd === i) {
      // a joiner right after a word character: part of the word only if a word character follows
    } else if (start >= 0) {
      visit(start, lastWordEnd);
      start = -1;
    }
    i += width;
  }
  if (start >= 0) visit(start, lastWordEnd);
}

/** Every word of `text` by the engine's word definition, in order. */
export function wordSpans(text: string): WordSpan[] {
  const spans: WordSpan[] = [];
  forEachWord(text, (start, end) => spans.push({ start, end }));
  return spans;
}

/** The counting form of a word: lower case, curly apostrophe and Unicode hyphen made plain. */
export function foldWord(word: string): string {
  return plainJoiners(word.toLowerCase());
}

function plainJoiners(word: string): string {
  if (word.indexOf('\u2019') < 0 && word.indexOf('\u2010') < 0) return word;
  return word.replace(/\u2019/g, "'").replace(/\u2010/g, '-');
}

export type WordCount = { word: string; count: number };

export type TextStatistics = {
  /** Unicode code points (a surrogate pair counts once). */
  characters: number;
  words: number;
  /** Distinct case-folded words. */
  distinctWords: number;
  /** The most frequent words overall, stop words ("the", "and", …) INCLUDED; count desc, then word. */
  topWords: WordCount[];
  /**
   * Words with at least one letter and no digit that `isKnownWord` does not know (the client's
   * names, places, hobbies); count desc, then word. Empty when no `isKnownWord` is given.
   */
  unknownWords: WordCount[];
};

export type StatisticsOptions = {
  /** Lexicon lookup for a case-folded word; a word with joiners is known when every part is. */
  isKnownWord?: (foldedWord: string) => boolean;
  /** How many top words to list (1..1000); default 20. */
  topCount?: number;
  /** How many unknown words to list (1..1000); default 50. */
  unknownCount?: number;
};

const byCountThenWord = (a: WordCount, b: WordCount) =>
  b.count - a.count || (a.word < b.word ? -1 : a.word > b.word ? 1 : 0);

function codePointCount(text: string): number {
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      const d = text.charCodeAt(i + 1);
      if (d >= 0xdc00 && d <= 0xdfff) i++;
    }
    n++;
  }
  return n;
}

const HAS_LETTER = /\p{L}/u;
const HAS_DIGIT = /\p{N}/u;

/** Characters, words, distinct words, most frequent words and words unknown to a lexicon. */
export function textStatistics(text: string, options: StatisticsOptions = {}): TextStatistics {
  const counts = new Map<string, number>();
  // Lower-case the whole text once when that keeps every offset (it does unless a letter such as
  // "İ" changes length), else each word on its own.
  const lower = text.toLowerCase();
  const sameOffsets = lower.length === text.length;
  let words = 0;
  forEachWord(text, (start, end) => {
    const word = sameOffsets ? plainJoiners(lower.slice(start, end)) : foldWord(text.slice(start, end));
    counts.set(word, (counts.get(word) ?? 0) + 1);
    words++;
  });
  const all = [...counts].map(([word, count]) => ({ word, count }));
  const topWords = [...all].sort(byCountThenWord).slice(0, options.topCount ?? 20);
  const isKnown = options.isKnownWord;
  const unknownWords = isKnown
    ? all
        .filter(({ word }) => HAS_LETTER.test(word) && !HAS_DIGIT.test(word))
        .filter(({ word }) => !word.split(/['-]/).every((part) => part === '' || isKnown(part)))
        .sort(byCountThenWord)
        .slice(0, options.unknownCount ?? 50)
    : [];
  return {
    characters: codePointCount(text),
    words,
    distinctWords: counts.size,
    topWords,
    unknownWords,
  };
}

// Keyloom's redaction tokens ("⟪phone⟫", see redactionToken in samples.schema.ts).
const REDACTION_TOKENS = /⟪[a-z-]+⟫/g;

/**
 * The text with every redaction token replaced by one space, so statistics of a redacted sample
 * count neither the placeholder nor the word inside it ("phone").
 */
export function blankRedactionTokens(text: string): string {
  return text.replace(REDACTION_TOKENS, ' ');
}
