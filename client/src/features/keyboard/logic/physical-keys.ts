// A physical keyboard in direct mode: which on-screen key (or suggestion) a key press stands for.
// Pure, no React: the test keyboard listens for key presses and runs the answer through the same
// path as a click, so the trial logs the same steps.
import { controlRow, functionRow, initialKeyState, type KeyDef } from './layouts';

/** What a physical key press does: press an on-screen key, or pick suggestion `slot` (0-based). */
export type PhysicalAction = { key: KeyDef } | { slot: number };

type PressedKey = Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'altKey' | 'metaKey'>;

const byKind = (kind: KeyDef['kind']): KeyDef =>
  [...controlRow, ...functionRow(initialKeyState)].find((key) => key.kind === kind)!;

const WORD_CHAR = /^[\p{L}\p{M}\p{N}]$/u;

/**
 * The action of a physical key press, or null when the page should keep it (Tab, Shift+Tab,
 * Escape, arrows, shortcuts with Ctrl, Alt or Meta).
 * @param onControl focus is on a button or link: Space and Enter stay with it (they press it)
 * @param numberKeysPick 1–9 pick suggestions 1–9 instead of typing the digit
 */
export function physicalKeyAction(
  event: PressedKey,
  { onControl, numberKeysPick }: { onControl: boolean; numberKeysPick: boolean },
): PhysicalAction | null {
  if (event.ctrlKey || event.altKey || event.metaKey) return null;
  const { key } = event;
  if (key === 'Backspace') return { key: byKind('backspace') };
  if (key === ' ' || key === 'Enter') {
    if (onControl) return null;
    return { key: byKind(key === ' ' ? 'space' : 'newline') };
  }
  if ([...key].length !== 1) return null;
  if (numberKeysPick && /^[1-9]$/.test(key)) return { slot: Number(key) - 1 };
  // A capital typed with Shift (or Caps Lock) stays a capital; a small letter follows the
  // on-screen shift and the automatic capital, as its on-screen key does.
  const kind = WORD_CHAR.test(key) ? 'letter' : 'punctuation';
  return { key: { id: `physical-${key}`, kind, value: key, label: key, spokenLabel: key } };
}
