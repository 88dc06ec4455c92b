// Row–column scan steps of every character the test keyboard can type, on its own key rows
// (key-layouts.ts), for the profile report's scan figures.
//
// - A key at key row r, column c (both 1-based) costs r + c steps (docs/references.md §3). Only the
//   key rows count: the suggestion row, which the scanner may visit first, is left out.
// - Letters are case-folded: a capital costs what its small letter costs (shift is not counted).
// - A character on the numbers-and-symbols layer costs reaching the 123 key, then its own steps on
//   that layer, then the ABC key back to the letters (derived from the keys as they are).
// - A character with no key at all (and the mass the model leaves unnamed) is charged the costliest
//   key of the letters layer plus OFF_KEYBOARD_EXTRA_STEPS, as the earlier fixed-grid figure charged
//   a "more" key plus a second page (common practice, no source).
import type { KeyboardLayout } from '../schemas/trials.schema';
import { initialKeyState, type KeyDef, keyRows } from './key-layouts';
import { letterIndex } from './model-order';

/** Steps charged on top of the costliest key for a character the keyboard has no key for. */
export const OFF_KEYBOARD_EXTRA_STEPS = 7;

/** The scan steps of a layout's keys. */
export type KeyboardScanSteps = {
  layout: KeyboardLayout;
  /**
   * Steps of each letter, index 0 = a (case-folded). For `model-ordered` these are the alphabetical
   * start; the letters move at every position (modelOrderedLetterSteps).
   */
  letterSteps: Float64Array;
  /** Steps of a code point that is not a letter a–z or A–Z. */
  otherSteps(codePoint: number): number;
  /** otherSteps of the code points 0..127, as a table (the engine reads it at every position). */
  asciiSteps: Float64Array;
  /** Steps charged for a character with no key. */
  offKeyboardSteps: number;
};

/** The character a key types, or null (delete, shift, the layer switch …). */
function typedBy(key: KeyDef): string | null {
  if (key.kind === 'space') return ' ';
  if (key.kind === 'newline') return '\n';
  if (key.kind === 'letter' || key.kind === 'punctuation') return key.value;
  return null;
}

/** Each key's steps (row + column, 1-based) by the character it types, and the layer key's steps. */
function stepsOfRows(rows: readonly KeyDef[][]): {
  byChar: Map<string, number>;
  layer: number;
  costliest: number;
} {
  const byChar = new Map<string, number>();
  let layer = 0;
  let costliest = 0;
  rows.forEach((row, r) =>
    row.forEach((key, c) => {
      const steps = r + 1 + (c + 1);
      costliest = Math.max(costliest, steps);
      if (key.kind === 'layer') layer = steps;
      const char = typedBy(key);
      if (char !== null && !byChar.has(char)) byChar.set(char, steps);
    }),
  );
  return { byChar, layer, costliest };
}

/** Builds the step table of one of the keyboard's layouts from its key rows. */
export function keyboardScanSteps(layout: KeyboardLayout): KeyboardScanSteps {
  const letters = stepsOfRows(keyRows(layout, initialKeyState));
  const symbolsLayer = stepsOfRows(keyRows(layout, { ...initialKeyState, layer: 'symbols' }));
  const byCodePoint = new Map<number, number>();
  const letterSteps = new Float64Array(26);
  for (const [char, steps] of letters.byChar) {
    const cp = char.codePointAt(0) as number;
    const index = letterIndex(cp);
    if (index >= 0) letterSteps[index] = steps;
    else byCodePoint.set(cp, steps);
  }
  for (const [char, steps] of symbolsLayer.byChar) {
    const cp = char.codePointAt(0) as number;
    if (letterIndex(cp) < 0 && !byCodePoint.has(cp))
      byCodePoint.set(cp, letters.layer + steps + symbolsLayer.layer);
  }
  const offKeyboardSteps = letters.costliest + OFF_KEYBOARD_EXTRA_STEPS;
  // Every key types a character below U+0080 today: a flat table for those, the map for the rest.
  const ascii = new Float64Array(128).fill(offKeyboardSteps);
  for (const [cp, steps] of byCodePoint) if (cp < 128) ascii[cp] = steps;
  return {
    layout,
    letterSteps,
    offKeyboardSteps,
    asciiSteps: ascii,
    otherSteps: (codePoint) =>
      codePoint >= 0 && codePoint < 128 ? ascii[codePoint] : (byCodePoint.get(codePoint) ?? offKeyboardSteps),
  };
}
