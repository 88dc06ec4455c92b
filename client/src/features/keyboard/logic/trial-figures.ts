import type { TrialSelectionMode } from '@keyloom/shared';

/** "36.7%" from a fraction; "—" when there is none. */
export const percentOrDash = (fraction: number | null | undefined, digits = 1): string =>
  fraction === null || fraction === undefined ? '—' : `${(fraction * 100).toFixed(digits)}%`;

/** "7.4" words per minute; "—" when there is none. */
export const wpmOrDash = (wpm: number | null | undefined): string =>
  wpm === null || wpm === undefined ? '—' : wpm.toFixed(1);

/** Short names of the selection modes for tables. */
export const selectionModeShort: Record<TrialSelectionMode, string> = {
  direct: 'Direct',
  dwell: 'Dwell',
  scanning: 'Scanning',
};

/** "1 min 05 s" / "42 s" from milliseconds. */
export const duration = (ms: number): string => {
  const seconds = Math.round(ms / 1000);
  if (seconds < 60) return `${seconds} s`;
  return `${Math.floor(seconds / 60)} min ${String(seconds % 60).padStart(2, '0')} s`;
};

/** "12.3 kB" or "1.76 MB" (1 kB = 1000 bytes). */
export const kilobytes = (bytes: number): string => {
  if (bytes < 1000) return `${bytes} bytes`;
  if (bytes < 1_000_000) return `${(bytes / 1000).toLocaleString('en-GB', { maximumFractionDigits: 1 })} kB`;
  return `${(bytes / 1_000_000).toLocaleString('en-GB', { maximumFractionDigits: 2 })} MB`;
};

/** Whether this browser can speak text aloud. */
export const canSpeak = (): boolean =>
  typeof window !== 'undefined' &&
  'speechSynthesis' in window &&
  typeof SpeechSynthesisUtterance !== 'undefined';

/** How long the suggestion row must stay the same before it is announced (a quick typist hears only the last). */
export const ANNOUNCE_DELAY_MS = 700;

/** The dwell target id of a suggestion slot. */
export const slotTargetId = (slot: number): string => `suggestion-${slot}`;

/** "Suggestions: garden, go, good." or "No suggestions." */
export const describeRow = (words: readonly string[]): string =>
  words.length === 0 ? 'No suggestions.' : `Suggestions: ${words.join(', ')}.`;

/**
 * Whether a trial log used keys the simulation never presses (shift, caps lock, the layer key): the
 * simulation types lower-case letters with no shift or layer keys, so such a trial's savings differ.
 */
export const usesKeysTheSimulationLacks = (events: readonly { type: string }[]): boolean =>
  events.some((event) => event.type === 'shift' || event.type === 'layer');
