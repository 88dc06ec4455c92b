// Words per minute from access-method timings (docs/references.md §2): one "word" is
// 5 characters including spaces. These are model estimates, not measurements;
// the product shows them beside the caution that keystroke savings are not
// time savings (reading the list costs time, docs/references.md §2).

/** Characters per word in text-entry rates (5, spaces included). */
export const CHARS_PER_WORD = 5;

/**
 * Entry speed of a transcribed phrase (MacKenzie 2002 note): (|T| − 1) / S
 * characters per second, timed from the first keystroke, so the first
 * character is not counted.
 * @param transcribedChars |T| ≥ 1
 * @param seconds S > 0
 */
export function charsPerSecond(transcribedChars: number, seconds: number): number {
  if (!(seconds > 0) || transcribedChars < 1)
    throw new RangeError('need at least one character and a positive time');
  return (transcribedChars - 1) / seconds;
}

/** wpm = characters per second × 60 / 5. */
export function wordsPerMinute(cps: number): number {
  return (cps * 60) / CHARS_PER_WORD;
}

/** How the client makes one selection (a key or a suggestion): the report schema's accessTimingSchema. */
export type { AccessTiming } from '../../schemas/profile-report.schema';
import type { AccessTiming } from '../../schemas/profile-report.schema';

/** Time in ms of one selection; scanning needs the expected steps per selection. */
export function msPerSelection(timing: AccessTiming, scanStepsPerSelection: number): number {
  switch (timing.kind) {
    case 'scanning':
      return scanStepsPerSelection * timing.scanIntervalMs;
    case 'dwell':
      return timing.dwellMs + (timing.travelMs ?? 0);
    case 'direct':
      return timing.keyMs;
  }
}

/** Estimated rates without and with a suggestion list. */
export type RateEstimate = {
  wpmWithout: number;
  wpmWith: number;
  msPerCharWithout: number;
  msPerCharWith: number;
};

/**
 * Estimates wpm without suggestions (one selection per character) and with
 * a list (KSPC selections per character, each preceded by reading the list
 * for `listReadMs`, since the ideal user checks the list before every key).
 * Selecting a suggestion is assumed to cost the same as selecting a key.
 * @param kspc keystrokes per character with the list (0 < kspc ≤ 1 for the ideal user)
 * @param scanStepsPerSelection expected scan steps of one selection (for scanning)
 * @param listReadMs time to read the list once (≥ 0)
 */
export function estimateRates(
  timing: AccessTiming,
  kspc: number,
  scanStepsPerSelection: number,
  listReadMs: number,
): RateEstimate {
  const perSelection = msPerSelection(timing, scanStepsPerSelection);
  const msPerCharWithout = perSelection;
  const msPerCharWith = kspc * (perSelection + listReadMs);
  const wpm = (ms: number): number => wordsPerMinute(1000 / ms);
  return { wpmWithout: wpm(msPerCharWithout), wpmWith: wpm(msPerCharWith), msPerCharWithout, msPerCharWith };
}
