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
  /** The carer's comment when signing the version off, quoted only when the clinician ticked it. */
  carerComment?: { by: string; text: string } | null;
  /** The supervisor's comment when approving the version, quoted only when the clinician ticked it. */
  supervisorComment?: { by: string; text: string } | null;
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

const MONTHS = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
];

/** "1 November 2026" from an ISO date (or the date part of an ISO time): the form families read. */
export function longDate(iso: string): string {
  const [year, month, day] = iso.slice(0, 10).split('-').map(Number);
  return `${day} ${MONTHS[month - 1] ?? '?'} ${year}`;
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

/** A version's status as the family reads it: approved versions are "approved", others say what they are. */
const STATUS_WORDS: Record<string, string> = {
  active: 'approved, in use',
  retired: 'approved, since replaced',
  trained: 'not yet approved: still being tried',
  signed_off: 'not yet approved: tried and waiting for approval',
  sent_back: 'not approved: sent back for changes',
};

/** One line per version, e.g. "Version 2 (approved, in use, 3 November 2026): about 4 in 10 key presses saved, roughly 3 words a minute." */
export function versionLine(v: VersionFigures): string {
  const status = STATUS_WORDS[v.status] ?? v.status.replace('_', ' ');
  const when = v.date ? ` (${status}, ${longDate(v.date)})` : ` (${status})`;
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
  const approved = v.supervisorComment
    ? `${v.supervisorComment.by}, who approved it, wrote: “${v.supervisorComment.text.trim()}”`
    : '';
  return [line, tried, said, approved].filter((part) => part !== '').join(' ');
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
  /** Who signs the e-mail: the clinician's name and role. */
  clinician?: { name: string; role: string } | null;
  /** The clinic's phone and address (lines), when the clinic has set them. */
  clinicPhone?: string | null;
  clinicAddress?: string | null;
};

/** "1 to 30 November 2026", "28 October to 3 November 2026" or "30 December 2026 to 5 January 2027". */
export function periodPhrase(from: string, to: string): string {
  const [a, b] = [longDate(from), longDate(to)];
  if (from.slice(0, 4) !== to.slice(0, 4)) return `${a} to ${b}`;
  if (from.slice(0, 7) !== to.slice(0, 7)) return `${a.replace(/ \d{4}$/, '')} to ${b}`;
  return `${a.replace(/ \D+ \d{4}$/, '')} to ${b}`;
}

/** The subject line of the e-mail. */
export function summarySubject(input: Pick<SummaryTextInput, 'clientName' | 'from' | 'to'>): string {
  return `Progress summary for ${input.clientName}, ${periodPhrase(input.from, input.to)}`;
}

/** The closing lines: who wrote it, the clinic and how to reach it (only what the clinic has set). */
export function signatureLines(input: SummaryTextInput): string {
  const lines = [
    input.clinician ? `${input.clinician.name}, ${input.clinician.role}` : null,
    input.clinicName,
    ...(input.clinicAddress ? input.clinicAddress.split('\n').map((line) => line.trim()) : []),
    input.clinicPhone ? `Phone: ${input.clinicPhone}` : null,
  ];
  return lines.filter((line): line is string => !!line).join('\n');
}

/** The plain-text body (the HTML version wraps the same paragraphs). Paragraphs are separated by a blank line. */
export function summaryText(input: SummaryTextInput): string {
  const paragraphs: string[] = [
    `This is a summary of ${input.clientName}'s typing with word suggestions from ` +
      `${periodPhrase(input.from, input.to)}, sent by ${input.clinicName}.`,
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
  paragraphs.push(
    input.clinicPhone
      ? `If you have questions, call the clinic on ${input.clinicPhone} or reply to this e-mail.`
      : 'If you have questions, reply to this e-mail.',
  );
  paragraphs.push(signatureLines(input));
  return paragraphs.join('\n\n');
}
