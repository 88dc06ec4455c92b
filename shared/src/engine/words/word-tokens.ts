// Words as the word model sees them: the same word characters as the
// character search (search/word-chars.ts), a key for counting (lower case,
// typographic apostrophe and hyphen mapped to the plain ones), sentence
// breaks, and redaction placeholders kept out of the vocabulary.
import * as wordChars from '../search/word-chars';

// Local copies: under CommonJS interop every access to an imported binding goes through a getter.
const { CharClass, charClass, wordStart } = wordChars;

/** Key of the sentence-start pad (never offered, never a display form). */
export const SENTENCE_START = '<s>';
/** Key of a token that must not be learned as a word: a redaction placeholder. */
export const UNKNOWN_WORD = '<unk>';

/** Open and close of Keyloom's redaction placeholder (⟪person-name⟫). */
const PLACEHOLDER_OPEN = 0x27ea;
const PLACEHOLDER_CLOSE = 0x27eb;
const LETTER = /\p{L}/u;

/**
 * Punctuation that is part of the word context (a word after a comma or an opening quote is not
 * the word after the same word without it). Never offered: their keys hold no letter.
 */
const CONTEXT_PUNCTUATION = new Set([0x2c, 0x3b, 0x3a, 0x22, 0x28, 0x29, 0x201c, 0x201d]);

/** True for a mark that is a token of the word context (a comma, colon, semicolon, quote or bracket). */
export function isContextMark(codePoint: number): boolean {
  return CONTEXT_PUNCTUATION.has(codePoint);
}

/** Sentence ends: . ! ? and line breaks (a new line starts a new message or paragraph). */
export function isSentenceEnd(codePoint: number): boolean {
  return codePoint === 0x2e || codePoint === 0x21 || codePoint === 0x3f || codePoint === 0x0a;
}

/** The counting key of a written word: lower case, ’ → ' and ‐ → -. */
export function wordKey(form: string): string {
  let key = form.toLowerCase();
  if (key.includes('\u2019')) key = key.replaceAll('\u2019', "'");
  if (key.includes('\u2010')) key = key.replaceAll('\u2010', '-');
  return key;
}

/**
 * Single letters offered as words: "a" and "I". Other single letters in a corpus are initials or
 * letters named in the text ("R. Ashby", "plan B"), not words to offer (common practice, no source).
 */
const ONE_LETTER_WORDS = new Set(['a', 'i']);

/** True when a key may be offered: it holds a letter, is not a pad or placeholder, and is not a stray single letter. */
export function isOfferable(key: string): boolean {
  if (key === SENTENCE_START || key === UNKNOWN_WORD || !LETTER.test(key)) return false;
  return key.length > 1 || ONE_LETTER_WORDS.has(key);
}

/** End (exclusive) of the word starting at `i`: word characters, joiners only between them. */
export function wordEndAt(text: ArrayLike<number>, i: number, limit = text.length): number {
  let j = i;
  while (j < limit) {
    const c = charClass(text[j]);
    if (c === CharClass.Word) j++;
    else if (c === CharClass.Joiner && j + 1 < limit && charClass(text[j + 1]) === CharClass.Word) j++;
    else break;
  }
  return j;
}

function stringOf(text: ArrayLike<number>, from: number, to: number): string {
  let s = '';
  for (let i = from; i < to; i++) s += String.fromCodePoint(text[i]);
  return s;
}

/** One word of a text. */
export type WordToken = {
  /** Counting key (wordKey of the form), or UNKNOWN_WORD for a redaction placeholder. */
  key: string;
  /** The word as written. */
  form: string;
  /** First word of a sentence (its capital says nothing about the word). */
  sentenceStart: boolean;
  start: number;
  end: number;
};

function isPlaceholder(text: ArrayLike<number>, start: number, end: number): boolean {
  return (
    start > 0 && end < text.length && text[start - 1] === PLACEHOLDER_OPEN && text[end] === PLACEHOLDER_CLOSE
  );
}

/**
 * The text's words, grouped by sentence (a sentence ends at . ! ? or a line break).
 * Numbers are words too (they are context), but never offered (isOfferable).
 */
export function sentencesOf(text: ArrayLike<number>): WordToken[][] {
  const sentences: WordToken[][] = [];
  let current: WordToken[] = [];
  let words = 0;
  let i = 0;
  const n = text.length;
  while (i < n) {
    const c = text[i];
    if (charClass(c) !== CharClass.Word) {
      if (isSentenceEnd(c)) {
        if (current.length > 0) sentences.push(current);
        current = [];
        words = 0;
      } else if (CONTEXT_PUNCTUATION.has(c)) {
        const key = String.fromCodePoint(c);
        // A run of the same mark is one token.
        if (current.length === 0 || current[current.length - 1].key !== key)
          current.push({ key, form: key, sentenceStart: false, start: i, end: i + 1 });
      }
      i++;
      continue;
    }
    const j = wordEndAt(text, i);
    const form = stringOf(text, i, j);
    current.push({
      key: isPlaceholder(text, i, j) ? UNKNOWN_WORD : wordKey(form),
      form,
      sentenceStart: words === 0,
      start: i,
      end: j,
    });
    words++;
    i = j;
  }
  if (current.length > 0) sentences.push(current);
  return sentences;
}

/**
 * The two words before position `end` of `history` within the current sentence, oldest first,
 * padded with SENTENCE_START: the word model's context. `end` must be at a word start or boundary.
 */
export function precedingKeys(history: ArrayLike<number>, end: number): [string, string] {
  const keys: string[] = [];
  let i = end;
  while (keys.length < 2 && i > 0) {
    const c = history[i - 1];
    if (charClass(c) === CharClass.Word) {
      const start = wordStart(history, i);
      keys.push(isPlaceholder(history, start, i) ? UNKNOWN_WORD : wordKey(stringOf(history, start, i)));
      i = start;
      continue;
    }
    if (isSentenceEnd(c)) break;
    if (CONTEXT_PUNCTUATION.has(c)) {
      const key = String.fromCodePoint(c);
      if (keys.length === 0 || keys[keys.length - 1] !== key) keys.push(key);
    }
    i--;
  }
  while (keys.length < 2) keys.push(SENTENCE_START);
  return [keys[1], keys[0]];
}

/**
 * True when a word starting at `wordBegin` would begin a sentence: nothing but spaces, quotes,
 * brackets and hyphens or apostrophes outside words (a list's "- ") since the start of the text or
 * the last sentence end, as in sentencesOf.
 */
export function atSentenceStart(history: ArrayLike<number>, wordBegin: number): boolean {
  for (let i = wordBegin - 1; i >= 0; i--) {
    const c = history[i];
    if (isSentenceEnd(c)) return true;
    if (charClass(c) === CharClass.Word) return false;
    // Commas, colons, semicolons and dashes continue a sentence.
    if (c === 0x2c || c === 0x3a || c === 0x3b) return false;
  }
  return true;
}

/**
 * The form to offer, given the word's display form and what was typed:
 * - a word with capitals of its own (a name, "I", an acronym) is offered as it is;
 * - otherwise the typed letters stay as typed and the rest comes from the display form;
 * - with `capitalize`, the first letter is raised at a sentence start (nothing typed yet) or
 *   when the first typed letter is a capital.
 */
export function caseForOffer(
  display: string,
  typedPrefix: string,
  sentenceStart: boolean,
  capitalize: boolean,
): string {
  const prefixChars = [...typedPrefix];
  const displayChars = [...display];
  const rest = displayChars.slice(Math.min(prefixChars.length, displayChars.length)).join('');
  if (!capitalize) return typedPrefix + rest;
  if (display !== display.toLowerCase()) return display;
  let word = typedPrefix + rest;
  const first = [...word][0] ?? '';
  const wantCapital =
    (typedPrefix === '' && sentenceStart) ||
    (prefixChars.length > 0 && prefixChars[0] !== prefixChars[0].toLowerCase());
  if (wantCapital && first !== first.toUpperCase()) word = first.toUpperCase() + word.slice(first.length);
  return word;
}
