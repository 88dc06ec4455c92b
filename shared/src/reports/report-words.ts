// Sentences the printed reports write the same way in the print view and in the PDF.

/** "2 Dec 2026 by Sam Okafor", "2 Dec 2026" without a name, "not yet" without a day. */
export function doneOn(on: string | null, by: string | null): string {
  if (!on) return 'not yet';
  return by ? `${on} by ${by}` : on;
}

/**
 * "2 trials; mean measured words per minute: 4.2", "No trials yet", or "No trial long enough to
 * count" when every trial was left out (no full stop; the notes say why).
 */
export function trialsSentence(trials: {
  count: number;
  meanWpm: string | null;
  notes?: readonly string[];
}): string {
  if (trials.count === 0) return trials.notes?.length ? 'No trial long enough to count' : 'No trials yet';
  const speed =
    trials.meanWpm !== null
      ? `mean measured words per minute: ${trials.meanWpm}`
      : trials.notes?.length
        ? 'measured speed left out (see the note)'
        : 'mean measured words per minute: not measured';
  return `${trials.count} ${trials.count === 1 ? 'trial' : 'trials'}; ${speed}`;
}
