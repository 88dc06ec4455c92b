// Public API of the test keyboard's keys (see client/src/features/keyboard/README.md, "Layouts").
export {
  ALPHABETICAL_ROWS,
  controlRow,
  functionRow,
  initialKeyState,
  keyRows,
  keysById,
  letterRows,
  nextShift,
  TYPEWRITER_ROWS,
} from './key-layouts';
export type { KeyDef, KeyKind, KeyState } from './key-layouts';
export {
  LETTER_CELLS,
  LETTER_ROW_LENGTHS,
  LETTERS,
  letterIndex,
  letterWeights,
  modelOrderedLetterRows,
  modelOrderedLetterSteps,
  rankLetters,
} from './model-order';
export type { LetterCell } from './model-order';
export { keyboardScanSteps, OFF_KEYBOARD_EXTRA_STEPS } from './key-scan-steps';
export type { KeyboardScanSteps } from './key-scan-steps';
