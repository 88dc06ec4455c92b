// What a trial measured, computed from its log alone (the browser shows it at once; the API
// recomputes it from the same log before storing, so the figures never depend on the browser).
import type { TrialEvent, TrialMeasures } from '../schemas/trials.schema';
import { emptyReplayState, isSelection, stepTrial } from './trial-replay';

const round6 = (x: number) => Math.round(x * 1e6) / 1e6;

/**
 * Levenshtein distance between two strings, over code points (insertions, deletions and
 * substitutions each cost 1). Two rows of memory.
 */
export function minimumStringDistance(a: string, b: string): number {
  const x = [...a];
  const y = [...b];
  let previous = Array.from({ length: y.length + 1 }, (_, j) => j);
  for (let i = 1; i <= x.length; i++) {
    const current = [i];
    for (let j = 1; j <= y.length; j++) {
      const substitution = previous[j - 1] + (x[i - 1] === y[j - 1] ? 0 : 1);
      current[j] = Math.min(previous[j] + 1, current[j - 1] + 1, substitution);
    }
    previous = current;
  }
  return previous[y.length];
}

/**
 * The error rate left in the text against the target phrase: MSD / max(|target|, |text|)
 * (the "MSD error rate" of Soukoreff & MacKenzie 2001 — from memory). Compared ignoring case and
 * the spaces at either end, because practice phrases are written without capitals (the automatic
 * capital would otherwise count as an error) and a picked suggestion leaves a space behind.
 */
export function msdErrorRate(target: string, text: string): number {
  const a = target.trim().toLowerCase();
  const b = text.trim().toLowerCase();
  const longer = Math.max([...a].length, [...b].length);
  return longer === 0 ? 0 : minimumStringDistance(a, b) / longer;
}

/**
 * Paused time inside [from, to], ms: each `pause` up to its `resume`, or up to `to` when it is
 * never resumed. A `resume` with no `pause` before it, and a second `pause` before the resume, are
 * ignored.
 */
export function pausedWithin(events: readonly TrialEvent[], from: number, to: number): number {
  let pausedAt: number | null = null;
  let paused = 0;
  const overlap = (a: number, b: number) => Math.max(0, Math.min(b, to) - Math.max(a, from));
  for (const event of events) {
    if (event.type === 'pause' && pausedAt === null) pausedAt = event.t;
    else if (event.type === 'resume' && pausedAt !== null) {
      paused += overlap(pausedAt, event.t);
      pausedAt = null;
    }
  }
  if (pausedAt !== null) paused += overlap(pausedAt, to);
  return paused;
}

/**
 * Measures a trial from its log.
 * - keystroke savings = 1 − keystrokes / characters, KSPC = keystrokes / characters, where a
 *   keystroke is one selection (isSelection: every key chosen, shift and layer keys included) and
 *   characters are the code points of the final text (MacKenzie 2002, KSPC; KS = 1 − KSPC when the
 *   baseline is one key per character — docs/references.md §2, derived);
 * - words per minute = ((characters − 1) / seconds) × 60 / 5, timed from the first selection to the
 *   last (MacKenzie 2002, "A note on calculating text entry speed"), less the paused time in between
 *   (pausedWithin: paused time is not typing time; derived);
 * - error rate: msdErrorRate against the target phrase, when there is one.
 * @param events the log, in order (`t` non-decreasing)
 * @param targetPhrase the phrase the person was asked to type, or null
 */
export function computeTrialMeasures(
  events: readonly TrialEvent[],
  targetPhrase: string | null,
): TrialMeasures {
  let state = emptyReplayState;
  let keystrokes = 0;
  let switchActivations = 0;
  let suggestionsOffered = 0;
  let suggestionsTaken = 0;
  let charactersFromSuggestions = 0;
  let errorsCorrected = 0;
  let first: number | null = null;
  let last = 0;
  for (const event of events) {
    if (event.type === 'switch') switchActivations++;
    if (event.type === 'offer' && (event.words?.length ?? 0) > 0) suggestionsOffered++;
    if (event.type === 'backspace') errorsCorrected++;
    if (isSelection(event)) {
      keystrokes++;
      first ??= event.t;
      last = event.t;
    }
    const next = stepTrial(state, event);
    if (event.type === 'suggestion') {
      suggestionsTaken++;
      charactersFromSuggestions += [...next.text].length - [...state.text].length;
    }
    state = next;
  }
  const text = state.text;
  const characters = [...text].length;
  const pausedMs = first === null ? 0 : pausedWithin(events, first, last);
  const durationMs = first === null ? 0 : Math.max(0, last - first - pausedMs);
  const seconds = durationMs / 1000;
  return {
    characters,
    keystrokes,
    switchActivations,
    suggestionsOffered,
    suggestionsTaken,
    charactersFromSuggestions,
    errorsCorrected,
    durationMs,
    pausedMs,
    keystrokeSavings: characters > 0 ? round6(1 - keystrokes / characters) : null,
    kspc: characters > 0 ? round6(keystrokes / characters) : null,
    wpm: characters >= 2 && seconds > 0 ? round6(((characters - 1) / seconds) * (60 / 5)) : null,
    errorRate:
      targetPhrase === null || targetPhrase.trim() === '' ? null : round6(msdErrorRate(targetPhrase, text)),
  };
}
