// Sentences the printed reports write the same way in the print view and in the PDF.

/** "2 Dec 2026 by Sam Okafor", "2 Dec 2026" without a name, "not yet" without a day. */
export function doneOn(on: string | null, by: string | null): string {
  if (!on) return 'not yet';
  return by ? `${on} by ${by}` : on;
}

/** "2 trials; mean measured words per minute: 4.2", or "No trials yet" (no full stop). */
export function trialsSentence(trials: { count: number; meanWpm: string | null }): string {
  if (trials.count === 0) return 'No trials yet';
  return `${trials.count} ${trials.count === 1 ? 'trial' : 'trials'}; mean measured words per minute: ${trials.meanWpm ?? 'not measured'}`;
}
