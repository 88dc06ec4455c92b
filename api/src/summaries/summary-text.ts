// Plain-language wording of a progress summary, from the metrics stored with each profile version.
// Pure functions: the e-mail, the preview and the tests all use the same wording, so the figures in
// the text always come from the stored metrics.
import { reportFigures } from '@keyloom/shared';

/** The figures of one version that a summary talks about. */
export type VersionFigures = {
  number: number;
  /** ISO date the version was trained, approved or signed off (whichever the summary reports). */
  date: string | null;
  status: string;
  /** Suggestion slots the version was set up with (1..10). */
  slots: number;
  /** General English only (a base-only version: too little of the client's writing yet, no figures). */
  baseOnly?: boolean;
  /** Keystroke savings at `slots` suggestions, 0..1; null when the metrics lack it. */
  keystrokeSavings: number | null;
  /** Estimated words a minute without and with suggestions (≥ 0); null when unknown. */
  wpmWithout: number | null;
  wpmWith: number | null;
  /** The carer's tries on the test keyboard with this version in the period; absent or null: none. */
  trials?: TrialFigures | null;
  /** The carer's comment when signing the version off after trying it; absent or null: none. */
  carerComment?: { by: string; text: string } | null;
};

/** Means of the measured figures over a version's trials (from `trials.measures`). */
export type TrialFigures = {
  /** Trials counted (≥ 1). */
  count: number;
  /** Mean measured keystroke savings, may be negative (corrections); null when no trial measured it. */
  keystrokeSavings: number | null;
  /** Mean measured words a minute; null when no trial measured it. */
  wpm: number | null;
};

/**
 * The figures of a version from its stored ProfileReport (`profile_versions.metrics`; read
 * defensively by the shared `reportFigures`).
 * @param slots suggestion slots of the version's settings, 1..10
 */
export function figuresFromMetrics(
  version: { number: number; status: string; date: string | null; slots: number; baseOnly?: boolean },
  metrics: Record<string, unknown> | null,
): VersionFigures {
  return { ...version, ...reportFigures(metrics, version.slots) };
}

/**
 * "about 4 in 10 key presses saved" from a keystroke-savings fraction.
 * @param fraction 0..1 (clamped); tenths are the unit families read easily (common practice, no source)
 */
export function savingsPhrase(fraction: number): string {
  const f = Math.min(1, Math.max(0, fraction));
  if (f < 0.05) return 'hardly any key presses saved';
  if (f >= 0.95) return 'nearly all key presses saved';
  return `about ${Math.round(f * 10)} in 10 key presses saved`;
}

/**
 * "roughly 3 words a minute" from an estimated rate (a word is 5 characters).
 * @param wpm ≥ 0; whole words only, as finer figures would suggest a precision the estimate lacks
 */
export function ratePhrase(wpm: number): string {
  if (!(wpm >= 0.5)) return 'less than 1 word a minute';
  const whole = Math.round(wpm);
  return `roughly ${whole} word${whole === 1 ? '' : 's'} a minute`;
}

/**
 * How the later figure compares with the earlier one, in words. Changes under 2 percentage points
 * of savings are called "about the same" (the spread between folds is of that size; derived).
 */
export function savingsChangePhrase(before: number, after: number): string {
  const change = after - before;
  if (Math.abs(change) < 0.02) return 'about the same as before';
  const points = Math.round(Math.abs(change) * 100);
  return `${points} more in every 100 key presses ${change > 0 ? 'saved' : 'needed'} than before`;
}

/**
 * The carer's trials in words, e.g. "In 3 tries on the test keyboard, about 3 in 10 key presses were
 * saved, at roughly 2 words a minute." Empty when there were none.
 */
export function trialsSentence(t: TrialFigures | null | undefined): string {
  if (!t || t.count < 1) return '';
  const parts: string[] = [];
  if (t.keystrokeSavings !== null)
    parts.push(savingsPhrase(t.keystrokeSavings).replace(/ saved$/, ' were saved'));
  if (t.wpm !== null) parts.push(`at ${ratePhrase(t.wpm)}`);
  const tries = `${t.count} ${t.count === 1 ? 'try' : 'tries'} on the test keyboard`;
  return parts.length > 0 ? `In ${tries}, ${parts.join(', ')}.` : `There were ${tries}.`;
}

/** One line per version, e.g. "Version 2 (approved 2026-11-03): about 4 in 10 key presses saved, roughly 3 words a minute." */
export function versionLine(v: VersionFigures): string {
  const when = v.date ? ` (${v.status.replace('_', ' ')} ${v.date})` : ` (${v.status.replace('_', ' ')})`;
  const parts: string[] = [];
  if (v.keystrokeSavings !== null) parts.push(savingsPhrase(v.keystrokeSavings));
  if (v.wpmWith !== null) parts.push(`${ratePhrase(v.wpmWith)} with suggestions`);
  if (v.wpmWithout !== null) parts.push(`${ratePhrase(v.wpmWithout)} without`);
  const none = v.baseOnly
    ? 'suggestions from general English only, while there is too little of their own writing; its figures come from the tries on the test keyboard'
    : 'no figures yet';
  const line = `Version ${v.number}${when}: ${parts.length > 0 ? parts.join(', ') : none}.`;
  const tried = trialsSentence(v.trials);
  const said = v.carerComment
    ? `${v.carerComment.by} tried it and wrote: “${v.carerComment.text.trim()}”`
    : '';
  return [line, tried, said].filter((part) => part !== '').join(' ');
}

export type SummaryTextInput = {
  /** The client's display name (a pseudonym in the demo). */
  clientName: string;
  from: string;
  to: string;
  /** Versions in the order they were made (oldest first). */
  versions: VersionFigures[];
  /** The clinician's own words; may be empty. */
  note: string;
  clinicName: string;
};

/** The subject line of the e-mail. */
export function summarySubject(input: Pick<SummaryTextInput, 'clientName' | 'from' | 'to'>): string {
  return `Progress summary for ${input.clientName}, ${input.from} to ${input.to}`;
}

/** The plain-text body (the HTML version wraps the same paragraphs). Paragraphs are separated by a blank line. */
export function summaryText(input: SummaryTextInput): string {
  const paragraphs: string[] = [
    `This is a summary of ${input.clientName}'s typing with word suggestions from ${input.from} to ${input.to}, ` +
      `sent by ${input.clinicName}.`,
  ];
  const withSavings = input.versions.filter((v) => v.keystrokeSavings !== null);
  if (input.versions.length === 0) {
    paragraphs.push('No new versions of the suggestion settings were made in this period.');
  } else {
    paragraphs.push(input.versions.map(versionLine).join('\n'));
    const first = withSavings[0];
    const last = withSavings[withSavings.length - 1];
    if (
      first &&
      last &&
      first !== last &&
      first.keystrokeSavings !== null &&
      last.keystrokeSavings !== null
    ) {
      paragraphs.push(
        `From version ${first.number} to version ${last.number}: ` +
          `${savingsChangePhrase(first.keystrokeSavings, last.keystrokeSavings)}.`,
      );
    }
  }
  if (input.note.trim() !== '') paragraphs.push(`A note from the clinician:\n${input.note.trim()}`);
  paragraphs.push(
    'These figures are estimates from practice texts, not measurements of everyday use. ' +
      'Fewer key presses do not always mean faster typing, because reading the suggestions takes time too.',
  );
  return paragraphs.join('\n\n');
}
