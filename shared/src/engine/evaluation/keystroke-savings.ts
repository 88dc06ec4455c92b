// Keystroke savings (KS) and keystrokes per character (KSPC) of a word
// suggestion list, simulated with the "ideal user" convention (docs/references.md §2).
// Conventions, fixed here for every figure Keyloom reports:
//
// 1. Keystrokes without suggestions: one key per character (code point),
//    letters, spaces, punctuation and newlines alike (KSPC = 1.00).
// 2. Before every letter of a word, including before its first letter, the
//    list of the W most probable words (search/suggest) is shown.
// 3. If the whole word is in the list, the user selects it at once: one key
//    inserts the rest of the word AND the space after it. If the character
//    after the word is not a space (punctuation, newline, end of text), the
//    selection's space is taken back automatically when that character is
//    typed ("smart punctuation"), so nothing extra is charged, but nothing
//    is saved on it either.
// 4. A word already typed in full still counts when it is in the list:
//    selecting it costs the same as typing its space.
// 5. Otherwise the user types the next letter (one key) and looks again.
// 6. Words are as defined in search/word-chars.ts (letters, marks, digits,
//    apostrophes and hyphens inside). Everything else is typed key by key.
// 7. The user never misses a visible word and never errs.
// 8. Adaptive runs: the model learns each character right after it is
//    typed (or inserted by a selection), in text order, as on a device; the
//    list at each letter comes from the model as it stands then.
//
// Because the prefix typed before each list is the true prefix whatever W is,
// the rank of the target at each prefix does not depend on W: one pass gives
// every W = 1..maxSlots. For a word, cost(W) = min(L + s, m_W + 1), where L is
// its length, s = 1 if a space follows, and m_W the first prefix length at
// which its rank is ≤ W.
import type { NextSymbolModel } from '../model-types';
import type { SuggestOptions } from '../search/suggest';
import { CharClass, charClass as classOfImported } from '../search/word-chars';
import { CharListPredictor } from '../words/char-list-predictor';
import type { ListPredictor } from '../words/word-predictor';

// Local copies avoid CommonJS getter calls in the per-character loop.
const charClass = classOfImported;
const WORD: number = CharClass.Word;
const JOINER: number = CharClass.Joiner;

export type KeystrokeResult = {
  /** Code points in the text (= keystrokes without suggestions). */
  chars: number;
  /** Keystrokes with a list of W slots, index W (index 0 unused). */
  keystrokes: number[];
  /** KS(W) = 1 − keystrokes(W) / chars, index W. */
  savings: number[];
  /** KSPC(W) = keystrokes(W) / chars, index W (MacKenzie 2002). */
  kspc: number[];
  /** Upper bound: every word selected before its first letter. */
  oracleSavings: number;
  /** Words in the text. */
  words: number;
  /**
   * Words the list offered before their last letter was typed (so selecting saved at least one
   * key), per list size W (index 0 unused): the hit rate is hits(W) / words.
   */
  hits: number[];
};

/**
 * One word of the simulation, given to `onWord`: its span in the text and,
 * for each list size W (index 1..maxSlots), the number of letters typed
 * before the list first showed it (-1: never). The array is reused.
 */
export type WordVisit = { start: number; end: number; firstShownAt: Int32Array };

/** Options of the simulation. */
export type KeystrokeOptions = SuggestOptions & {
  /** Called after each word (e.g. to find the words offered early, or to report progress). */
  onWord?: (visit: WordVisit) => void;
  /** Largest list size simulated (1..100, default 10). */
  maxSlots?: number;
  /** Let the model learn the text as it is typed (default false; clone it first). */
  adaptive?: boolean;
};

/** End (exclusive) of the word starting at `i`: word characters, joiners only between them. */
export function wordEnd(text: ArrayLike<number>, i: number): number {
  let j = i;
  while (j < text.length) {
    const c = charClass(text[j]);
    if (c === WORD) j++;
    else if (c === JOINER && j + 1 < text.length && charClass(text[j + 1]) === WORD) j++;
    else break;
  }
  return j;
}

/**
 * Simulates the ideal user typing `text` (code points) with lists of 1..maxSlots words.
 * @param predictor the list (a word predictor), or a character model whose own search makes the
 *   list (the character-only list); it learns the text only when `adaptive` is true
 */
export function simulateKeystrokes(
  predictor: ListPredictor | NextSymbolModel,
  text: ArrayLike<number>,
  options: KeystrokeOptions = {},
): KeystrokeResult {
  const model: ListPredictor =
    'completionRank' in predictor
      ? predictor
      : new CharListPredictor(predictor, options.adaptive ?? false, options);
  const maxSlots = options.maxSlots ?? 10;
  if (!Number.isInteger(maxSlots) || maxSlots < 1 || maxSlots > 100)
    throw new RangeError(`maxSlots must be 1..100, got ${maxSlots}`);
  const adaptive = options.adaptive ?? false;
  const n = text.length;
  const keys = new Array<number>(maxSlots + 1).fill(0);
  const hits = new Array<number>(maxSlots + 1).fill(0);
  let oracleKeys = 0;
  let words = 0;
  // First prefix length at which the word's rank is ≤ W, per W (reused).
  const firstAt = new Int32Array(maxSlots + 1);
  const learn = (at: number): void => {
    if (adaptive) model.learn(text, at);
  };

  let i = 0;
  while (i < n) {
    if (charClass(text[i]) !== WORD) {
      for (let w = 1; w <= maxSlots; w++) keys[w]++;
      oracleKeys++;
      learn(i);
      i++;
      continue;
    }
    const j = wordEnd(text, i);
    const len = j - i;
    const spaceAfter = j < n && text[j] === 0x20 ? 1 : 0;
    words++;
    firstAt.fill(-1);
    let bestRank = maxSlots + 1; // smallest rank seen so far
    for (let m = 0; m <= len; m++) {
      if (bestRank > 1) {
        const target = sub(text, i + m, j);
        const r = model.completionRank(text, i + m, target, maxSlots);
        if (r > 0 && r < bestRank) {
          // Every W in [r, bestRank) first sees the word at this prefix.
          for (let w = r; w < bestRank; w++) firstAt[w] = m;
          bestRank = r;
        }
      }
      if (m < len) learn(i + m);
    }
    for (let w = 1; w <= maxSlots; w++) {
      const typed = len + spaceAfter;
      const cost = firstAt[w] >= 0 ? Math.min(typed, firstAt[w] + 1) : typed;
      keys[w] += cost;
      if (firstAt[w] >= 0 && firstAt[w] < len) hits[w]++;
    }
    oracleKeys += 1;
    if (options.onWord) options.onWord({ start: i, end: j, firstShownAt: firstAt });
    if (spaceAfter) {
      learn(j);
      i = j + 1;
    } else {
      i = j;
    }
  }
  const savings = keys.map((k, w) => (w === 0 || n === 0 ? 0 : 1 - k / n));
  const kspc = keys.map((k, w) => (w === 0 || n === 0 ? 0 : k / n));
  return {
    chars: n,
    keystrokes: keys,
    savings,
    kspc,
    oracleSavings: n === 0 ? 0 : 1 - oracleKeys / n,
    words,
    hits,
  };
}

function sub(text: ArrayLike<number>, from: number, to: number): ArrayLike<number> {
  if (ArrayBuffer.isView(text)) return (text as unknown as Int32Array).subarray(from, to);
  return Array.prototype.slice.call(text, from, to) as number[];
}
