// The test keyboard's keys: two letter orders and one control row. Pure data, no React.
import type { KeyboardLayout } from '@keyloom/shared';

/** What a key does to the text (the trial step it logs has the same name). */
export type KeyKind = 'letter' | 'punctuation' | 'space' | 'backspace';

/**
 * One key.
 * - `id`: stable, unique in the grid (e.g. "letter-q", "space", "punct-period").
 * - `value`: the character inserted ("" for space and backspace, whose steps carry no value).
 * - `label`: what the key shows; `spokenLabel`: its accessible name.
 */
export type KeyDef = { id: string; kind: KeyKind; value: string; label: string; spokenLabel: string };

// The standard typewriter order (top, home and bottom letter rows).
const TYPEWRITER_ROWS = ['qwertyuiop', 'asdfghjkl', 'zxcvbnm'] as const;
// Keyloom's alphabetical arrangement: a–z in reading order, three rows of 9, 9 and 8.
const ALPHABETICAL_ROWS = ['abcdefghi', 'jklmnopqr', 'stuvwxyz'] as const;

const letterKey = (c: string): KeyDef => ({
  id: `letter-${c}`,
  kind: 'letter',
  value: c,
  label: c,
  spokenLabel: c,
});

const punctuation: readonly { id: string; value: string; spokenLabel: string }[] = [
  { id: 'punct-period', value: '.', spokenLabel: 'full stop' },
  { id: 'punct-comma', value: ',', spokenLabel: 'comma' },
  { id: 'punct-question', value: '?', spokenLabel: 'question mark' },
  { id: 'punct-apostrophe', value: "'", spokenLabel: 'apostrophe' },
  { id: 'punct-hyphen', value: '-', spokenLabel: 'hyphen' },
];

/** The control row: space, delete, then the punctuation keys . , ? ' - */
export const controlRow: readonly KeyDef[] = [
  { id: 'space', kind: 'space', value: '', label: 'space', spokenLabel: 'space' },
  { id: 'backspace', kind: 'backspace', value: '', label: 'delete', spokenLabel: 'delete last letter' },
  ...punctuation.map((p): KeyDef => ({
    id: p.id,
    kind: 'punctuation',
    value: p.value,
    label: p.value,
    spokenLabel: p.spokenLabel,
  })),
];

/** The key rows of a layout: its letter rows, then the control row (always last). */
export function keyRows(layout: KeyboardLayout): KeyDef[][] {
  const letters = layout === 'alphabetical' ? ALPHABETICAL_ROWS : TYPEWRITER_ROWS;
  return [...letters.map((row) => [...row].map(letterKey)), [...controlRow]];
}

/** Every key of a layout by id (for looking up what a scanned or dwelt-on target is). */
export function keysById(layout: KeyboardLayout): Map<string, KeyDef> {
  return new Map(
    keyRows(layout)
      .flat()
      .map((key) => [key.id, key]),
  );
}
