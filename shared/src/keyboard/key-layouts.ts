// The test keyboard's keys: three letter orders (typewriter, alphabetical and ordered by the model), a
// numbers-and-symbols layer, the control row and the function row. Pure data and pure functions, no
// React: the keyboard draws these rows and the profile report measures scan steps on the same rows.
import type { KeyboardLayout, TrialKeyLayer, TrialShiftState } from '../schemas/trials.schema';
import { modelOrderedLetterRows } from './model-order';

/** What a key does (the trial step it logs has the same name; a digit logs a `letter` step). */
export type KeyKind =
  | 'letter'
  | 'punctuation'
  | 'space'
  | 'backspace'
  | 'newline'
  | 'delete_word'
  | 'undo_pick'
  | 'shift'
  | 'layer'
  // The trial view's Pause key (client): it pauses the trial and types nothing; never in `keyRows`.
  | 'pause';

/**
 * One key.
 * - `id`: stable, unique in the grid (e.g. "letter-q", "space", "punct-period").
 * - `value`: the character inserted ("" for space and backspace, whose steps carry no value).
 * - `label`: what the key shows; `spokenLabel`: its accessible name.
 */
export type KeyDef = {
  id: string;
  kind: KeyKind;
  value: string;
  label: string;
  spokenLabel: string;
  /** A key with two states (shift): whether it is on, shown as `aria-pressed`. */
  pressed?: boolean;
  /** A key that does nothing now (undo pick with no pick to undo). */
  disabled?: boolean;
};

// The standard typewriter order (top, home and bottom letter rows).
export const TYPEWRITER_ROWS: readonly string[] = ['qwertyuiop', 'asdfghjkl', 'zxcvbnm'];
// Keyloom's alphabetical arrangement: a–z in reading order, three rows of 9, 9 and 8. The layout
// ordered by the model uses the same letter cells (model-order.ts).
export const ALPHABETICAL_ROWS: readonly string[] = ['abcdefghi', 'jklmnopqr', 'stuvwxyz'];

const letterKey = (c: string, capital = false): KeyDef => ({
  id: `letter-${c}`,
  kind: 'letter',
  value: c,
  label: capital ? c.toUpperCase() : c,
  spokenLabel: capital ? c.toUpperCase() : c,
});

// The numbers-and-symbols layer: the digits, then the marks the control row lacks.
const DIGITS = '1234567890';
const symbols: readonly { id: string; value: string; spokenLabel: string }[] = [
  { id: 'punct-exclamation', value: '!', spokenLabel: 'exclamation mark' },
  { id: 'punct-quote', value: '"', spokenLabel: 'quotation mark' },
  { id: 'punct-open-bracket', value: '(', spokenLabel: 'opening bracket' },
  { id: 'punct-close-bracket', value: ')', spokenLabel: 'closing bracket' },
  { id: 'punct-colon', value: ':', spokenLabel: 'colon' },
  { id: 'punct-semicolon', value: ';', spokenLabel: 'semicolon' },
  { id: 'punct-slash', value: '/', spokenLabel: 'slash' },
  { id: 'punct-at', value: '@', spokenLabel: 'at sign' },
  { id: 'punct-ampersand', value: '&', spokenLabel: 'ampersand' },
];

const punctuation: readonly { id: string; value: string; spokenLabel: string }[] = [
  { id: 'punct-period', value: '.', spokenLabel: 'full stop' },
  { id: 'punct-comma', value: ',', spokenLabel: 'comma' },
  { id: 'punct-question', value: '?', spokenLabel: 'question mark' },
  { id: 'punct-apostrophe', value: "'", spokenLabel: 'apostrophe' },
  { id: 'punct-hyphen', value: '-', spokenLabel: 'hyphen' },
];

const markKey = (p: { id: string; value: string; spokenLabel: string }): KeyDef => ({
  id: p.id,
  kind: 'punctuation',
  value: p.value,
  label: p.value,
  spokenLabel: p.spokenLabel,
});

/** The control row: space, delete, then the punctuation keys . , ? ' - */
export const controlRow: readonly KeyDef[] = [
  { id: 'space', kind: 'space', value: '', label: 'space', spokenLabel: 'space' },
  { id: 'backspace', kind: 'backspace', value: '', label: 'delete', spokenLabel: 'delete last letter' },
  ...punctuation.map(markKey),
];

/** What the keys show: the shift state, the layer, whether the next letter is a capital, whether a pick can be undone. */
export type KeyState = {
  shift: TrialShiftState;
  layer: TrialKeyLayer;
  /** The next letter will be a capital (shift, caps lock or the automatic capital). */
  capital: boolean;
  canUndoPick: boolean;
};
export const initialKeyState: KeyState = {
  shift: 'off',
  layer: 'letters',
  capital: false,
  canUndoPick: false,
};

const shiftLabels: Record<TrialShiftState, string> = {
  off: 'shift',
  once: 'shift: next capital',
  lock: 'caps lock',
};

/** The function row: shift, the layer switch, Enter, delete word and undo pick. */
export function functionRow(state: KeyState): KeyDef[] {
  const symbolsShown = state.layer === 'symbols';
  return [
    {
      id: 'shift',
      kind: 'shift',
      value: state.shift,
      label: shiftLabels[state.shift],
      spokenLabel: shiftLabels[state.shift],
      pressed: state.shift !== 'off',
    },
    {
      id: 'layer',
      kind: 'layer',
      value: symbolsShown ? 'letters' : 'symbols',
      label: symbolsShown ? 'ABC' : '123',
      spokenLabel: symbolsShown ? 'ABC letters' : '123 numbers and symbols',
    },
    { id: 'newline', kind: 'newline', value: '', label: 'Enter', spokenLabel: 'Enter new line' },
    { id: 'delete-word', kind: 'delete_word', value: '', label: 'delete word', spokenLabel: 'delete word' },
    {
      id: 'undo-pick',
      kind: 'undo_pick',
      value: '',
      label: 'undo pick',
      spokenLabel: 'undo pick',
      disabled: !state.canUndoPick,
    },
  ];
}

/** The shift state after the shift key: once, then caps lock, then off. */
export const nextShift = (shift: TrialShiftState): TrialShiftState =>
  shift === 'off' ? 'once' : shift === 'once' ? 'lock' : 'off';

/**
 * The letter rows of a layout, each a string of letters in key order. `letterWeights` (26 values,
 * a..z, see model-order.ts) only matters for `model-ordered`; without it that layout is in
 * alphabetical order (every letter equally likely).
 */
export function letterRows(
  layout: KeyboardLayout,
  letterWeights?: ArrayLike<number> | null,
): readonly string[] {
  if (layout === 'model-ordered') return modelOrderedLetterRows(letterWeights ?? null);
  return layout === 'alphabetical' ? ALPHABETICAL_ROWS : TYPEWRITER_ROWS;
}

/**
 * The key rows of a layout: its letter rows (or, on the symbols layer, the digits and the other
 * marks), then the control row, then the function row (always last). `letterWeights`: the model's
 * next-letter probabilities, for the layout ordered by the model (letterRows).
 */
export function keyRows(
  layout: KeyboardLayout,
  state: KeyState = initialKeyState,
  letterWeights?: ArrayLike<number> | null,
): KeyDef[][] {
  const main =
    state.layer === 'symbols'
      ? [
          [...DIGITS].map((d) => letterKey(d)).map((k) => ({ ...k, id: `digit-${k.value}` })),
          symbols.map(markKey),
        ]
      : letterRows(layout, letterWeights).map((row) => [...row].map((c) => letterKey(c, state.capital)));
  return [...main, [...controlRow], functionRow(state)];
}

/** Every key of a layout by id (for looking up what a scanned or dwelt-on target is). */
export function keysById(
  layout: KeyboardLayout,
  state: KeyState = initialKeyState,
  letterWeights?: ArrayLike<number> | null,
): Map<string, KeyDef> {
  return new Map(
    keyRows(layout, state, letterWeights)
      .flat()
      .map((key) => [key.id, key]),
  );
}
