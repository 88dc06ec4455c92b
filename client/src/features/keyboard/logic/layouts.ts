// The test keyboard's keys come from @keyloom/shared (shared/src/keyboard: the letter orders, the
// symbols layer, the control and function rows), the same rows the profile report measures scan steps
// on. What stays here is typing behaviour the keys do not show.
import type { KeyDef } from '@keyloom/shared';
export {
  controlRow,
  functionRow,
  initialKeyState,
  type KeyDef,
  type KeyKind,
  keyRows,
  keysById,
  type KeyState,
  letterWeights,
  nextShift,
} from '@keyloom/shared';

// A capital comes on its own at the message's start, after a line break, and after a sentence's end
// and its space (common practice, no source).
const SENTENCE_START = /(?:^|\n|[.?!] +)$/u;

/** Whether the automatic capital applies at the end of `text`. */
export const atSentenceStart = (text: string): boolean => SENTENCE_START.test(text);

/** Whether a key is a letter of the alphabet (its case follows shift and the automatic capital). */
export const hasCase = (value: string): boolean => value.toLowerCase() !== value.toUpperCase();

/** The trial view's Pause key, a row of its own under the function row there: it pauses the trial, types nothing. */
export const pauseKey: KeyDef = {
  id: 'pause',
  kind: 'pause',
  value: '',
  label: 'Pause',
  spokenLabel: 'Pause',
};
