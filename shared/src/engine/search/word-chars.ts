// What counts as part of a word, for suggestions and for the keystroke
// simulator (both must agree, or savings would be mis-counted).
//
// - Word characters: letters of any script including accented ones (\p{L}),
//   combining marks (\p{M}, so a decomposed "é" stays one word) and digits
//   (\p{N}).
// - Joiners: apostrophe (' U+0027, ’ U+2019) and hyphen (- U+002D, ‐ U+2010).
//   They belong to a word only INSIDE it, between word characters: "don't",
//   "re-enter". A word never starts or ends with a joiner.
// - Everything else (space, punctuation, newline, symbols) is a boundary.

/** Character classes (plain constants: safe under isolated-module compilers). */
export const CharClass = { Boundary: 0, Word: 1, Joiner: 2 } as const;
export type CharClass = (typeof CharClass)[keyof typeof CharClass];

const WORD_RE = /^[\p{L}\p{M}\p{N}]$/u;
const JOINERS = new Set([0x27, 0x2019, 0x2d, 0x2010]);

// Lazily filled class table for the Basic Multilingual Plane: 0 = not yet
// computed, else class + 1. Shared and read-only once filled.
const bmp = new Uint8Array(0x10000);

/** Classifies one code point (0..0x10FFFF). */
export function charClass(codePoint: number): CharClass {
  if (codePoint < 0x10000) {
    const cached = bmp[codePoint];
    if (cached !== 0) return (cached - 1) as CharClass;
    const c = classify(codePoint);
    bmp[codePoint] = c + 1;
    return c;
  }
  return classify(codePoint);
}

function classify(codePoint: number): CharClass {
  if (JOINERS.has(codePoint)) return CharClass.Joiner;
  if (codePoint >= 0xd800 && codePoint <= 0xdfff) return CharClass.Boundary;
  return WORD_RE.test(String.fromCodePoint(codePoint)) ? CharClass.Word : CharClass.Boundary;
}

/** True for letters, marks and digits. */
export function isWordChar(codePoint: number): boolean {
  return charClass(codePoint) === CharClass.Word;
}

/**
 * Start index of the word being typed at the end of `history[0..end)`: the
 * trailing run of word characters, with joiners allowed after a word
 * character ("don'" is a word in progress). Returns `end` at a word boundary.
 */
export function wordStart(history: ArrayLike<number>, end: number): number {
  let i = end;
  while (i > 0) {
    const c = charClass(history[i - 1]);
    if (c === CharClass.Word) {
      i--;
    } else if (c === CharClass.Joiner && i >= 2 && charClass(history[i - 2]) === CharClass.Word) {
      i--;
    } else {
      break;
    }
  }
  return i;
}

/** Splits a string into code points (the unit every model works on). */
export function toCodePoints(text: string): Int32Array {
  const out = new Int32Array(text.length);
  let n = 0;
  for (let i = 0; i < text.length; i++) {
    const cp = text.codePointAt(i) as number;
    out[n++] = cp;
    if (cp > 0xffff) i++;
  }
  return out.subarray(0, n);
}
