// The one implementation of what a trial's logged steps do to the text: the test keyboard applies
// each step with it as the person types, and the API replays the whole log with it to check the
// text it is sent and to measure the trial.
import { type TrialEvent, trialKeyLayers, trialShiftStates } from '../schemas/trials.schema';
import { isWordChar, toCodePoints, wordStart } from '../engine/search/word-chars';

/** A trial log that cannot be replayed; the message says which step and why. */
export class TrialReplayError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'TrialReplayError';
  }
}

// Sentence punctuation: typed right after a word and its space it takes the space's place
// ("tea ." → "tea. "), and a word picked right after it gets a space first ("tea?" → "tea? more ").
const SENTENCE_PUNCTUATION = /[.,?!;:]$/u;
const WORD_THEN_SPACE = /[\p{L}\p{M}\p{N}] $/u;

/**
 * The text the model should read to suggest the next word: a new message reads as the start of a
 * line ("\n"), and after sentence punctuation a space is assumed, as picking a word will add one.
 */
export function suggestionContext(text: string): string {
  if (text === '') return '\n';
  return SENTENCE_PUNCTUATION.test(text) ? `${text} ` : text;
}

/** The word being typed at the end of `text` ("" right after a space or punctuation). */
export function partialWord(text: string): string {
  const cps = toCodePoints(text);
  const start = wordStart(cps, cps.length);
  return String.fromCodePoint(...cps.subarray(start));
}

/**
 * The text after one step. Selections change it; `shift`, `layer`, `pause`, `resume`, `switch` and
 * `offer` leave it as it is (a `shift` or `layer` step must name a known state).
 * A suggestion replaces the word being typed by the whole suggested word and adds a space (and
 * puts one before it right after sentence punctuation). Sentence punctuation typed after a word
 * and a space replaces that space and keeps one after it.
 * `undo_pick` needs the texts before earlier picks: use stepTrial (or replayTrial) for it.
 * @throws TrialReplayError for a letter or punctuation step without exactly one character,
 *   a suggestion without a word, a shift or layer step with an unknown value, or an `undo_pick`
 */
export function applyTrialEvent(text: string, event: TrialEvent): string {
  switch (event.type) {
    case 'letter':
    case 'punctuation': {
      const value = event.value ?? '';
      if ([...value].length !== 1) {
        throw new TrialReplayError(`A ${event.type} step must insert exactly one character, not "${value}".`);
      }
      if (event.type === 'punctuation' && SENTENCE_PUNCTUATION.test(value) && WORD_THEN_SPACE.test(text)) {
        return `${text.slice(0, -1)}${value} `;
      }
      return text + value;
    }
    case 'space':
      return `${text} `;
    case 'newline':
      return `${text}\n`;
    case 'backspace': {
      if (text === '') return text;
      const chars = [...text];
      chars.pop();
      return chars.join('');
    }
    case 'delete_word':
      return deleteWord(text);
    case 'suggestion': {
      const word = event.value ?? '';
      if (word.trim() === '') throw new TrialReplayError('A suggestion step must name the word picked.');
      const typed = partialWord(text);
      const before = text.slice(0, text.length - typed.length);
      return `${before}${SENTENCE_PUNCTUATION.test(before) ? ' ' : ''}${word} `;
    }
    case 'undo_pick':
      throw new TrialReplayError('An undo pick step needs the log before it (replay the whole log).');
    case 'shift':
      return knownValue(text, event, trialShiftStates);
    case 'layer':
      return knownValue(text, event, trialKeyLayers);
    case 'pause':
    case 'resume':
    case 'switch':
    case 'offer':
      return text;
  }
}

function knownValue(text: string, event: TrialEvent, values: readonly string[]): string {
  if (!values.includes(event.value ?? '')) {
    throw new TrialReplayError(
      `A ${event.type} step must be one of ${values.join(', ')}, not "${event.value ?? ''}".`,
    );
  }
  return text;
}

/**
 * Removes the word before the caret with the spaces after it. Punctuation between that word and the
 * caret goes with it ("i want tea. " → "i want "), so one press never leaves a mark hanging; a line
 * break (with the spaces after it) is removed on its own.
 */
function deleteWord(text: string): string {
  const cps = toCodePoints(text);
  let end = cps.length;
  while (end > 0 && cps[end - 1] === SPACE) end--;
  if (end > 0 && cps[end - 1] === NEWLINE) return fromCodePoints(cps.subarray(0, end - 1));
  while (end > 0 && cps[end - 1] !== SPACE && cps[end - 1] !== NEWLINE && !isWordChar(cps[end - 1]!)) end--;
  return fromCodePoints(cps.subarray(0, wordStart(cps, end)));
}

const SPACE = 0x20;
const NEWLINE = 0x0a;
const fromCodePoints = (cps: Int32Array): string => String.fromCodePoint(...cps);

/** Steps that are not selections (not keystrokes): they choose no key. */
const NOT_SELECTIONS: ReadonlySet<TrialEvent['type']> = new Set(['switch', 'offer', 'pause', 'resume']);

/** Whether a step is a selection (counts as a keystroke). */
export function isSelection(event: TrialEvent): boolean {
  return !NOT_SELECTIONS.has(event.type);
}

/**
 * Where a replay stands after some steps: the text, and the texts just before each suggestion pick
 * not yet undone (newest last), which an `undo_pick` step goes back to.
 */
export type TrialReplayState = { readonly text: string; readonly beforePicks: readonly string[] };

/** The state before the first step: an empty text, no picks. */
export const emptyReplayState: TrialReplayState = { text: '', beforePicks: [] };

/**
 * The state after one step: applyTrialEvent for every step but `undo_pick`, which goes back to the
 * text before the last pick not yet undone; a suggestion remembers the text before it.
 * @throws TrialReplayError as applyTrialEvent does, and for an `undo_pick` with no pick left to undo
 */
export function stepTrial(state: TrialReplayState, event: TrialEvent): TrialReplayState {
  if (event.type === 'undo_pick') {
    const text = state.beforePicks.at(-1);
    if (text === undefined)
      throw new TrialReplayError('An undo pick step comes with no suggestion pick to undo.');
    return { text, beforePicks: state.beforePicks.slice(0, -1) };
  }
  const text = applyTrialEvent(state.text, event);
  if (event.type !== 'suggestion') return text === state.text ? state : { ...state, text };
  return { text, beforePicks: [...state.beforePicks, state.text] };
}

/** Replays a whole log from an empty text. @throws TrialReplayError naming the step (1-based). */
export function replayTrial(events: readonly TrialEvent[]): string {
  let state = emptyReplayState;
  events.forEach((event, index) => {
    try {
      state = stepTrial(state, event);
    } catch (error) {
      if (error instanceof TrialReplayError) {
        throw new TrialReplayError(`Step ${index + 1} of the trial log: ${error.message}`);
      }
      throw error;
    }
  });
  return state.text;
}
