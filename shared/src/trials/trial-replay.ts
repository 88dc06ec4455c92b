// The one implementation of what a trial's logged steps do to the text: the test keyboard applies
// each step with it as the person types, and the API replays the whole log with it to check the
// text it is sent and to measure the trial.
import type { TrialEvent } from '../schemas/trials.schema';
import { toCodePoints, wordStart } from '../engine/search/word-chars';

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
 * The text after one step. Selections change it; `switch` and `offer` leave it as it is.
 * A suggestion replaces the word being typed by the whole suggested word and adds a space (and
 * puts one before it right after sentence punctuation). Sentence punctuation typed after a word
 * and a space replaces that space and keeps one after it.
 * @throws TrialReplayError for a letter or punctuation step without exactly one character,
 *   or a suggestion without a word
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
    case 'backspace': {
      if (text === '') return text;
      const chars = [...text];
      chars.pop();
      return chars.join('');
    }
    case 'suggestion': {
      const word = event.value ?? '';
      if (word.trim() === '') throw new TrialReplayError('A suggestion step must name the word picked.');
      const typed = partialWord(text);
      const before = text.slice(0, text.length - typed.length);
      return `${before}${SENTENCE_PUNCTUATION.test(before) ? ' ' : ''}${word} `;
    }
    case 'switch':
    case 'offer':
      return text;
  }
}

/** Whether a step is a selection (counts as a keystroke). */
export function isSelection(event: TrialEvent): boolean {
  return event.type !== 'switch' && event.type !== 'offer';
}

/** Replays a whole log from an empty text. @throws TrialReplayError naming the step (1-based). */
export function replayTrial(events: readonly TrialEvent[]): string {
  let text = '';
  events.forEach((event, index) => {
    try {
      text = applyTrialEvent(text, event);
    } catch (error) {
      if (error instanceof TrialReplayError) {
        throw new TrialReplayError(`Step ${index + 1} of the trial log: ${error.message}`);
      }
      throw error;
    }
  });
  return text;
}
