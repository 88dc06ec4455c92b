import {
  type KeyboardLayout,
  keyboardLayoutLabels,
  keyboardLayouts,
  profileReportSchema,
  type ProfileReport,
} from '@keyloom/shared';

// The engine's report as these pages read it: the shared schema, read leniently, so a stored
// report that does not parse shows "no results" rather than breaking the page.
export type ProfileReportView = ProfileReport;

/** The report of a trained version, or null when there is none (or it is not one we can read). */
export const readReport = (metrics: Record<string, unknown> | null): ProfileReportView | null => {
  if (!metrics) return null;
  const parsed = profileReportSchema.safeParse(metrics);
  return parsed.success ? parsed.data : null;
};

/** Suggestion list sizes the engine measures. */
export const SLOT_COUNTS = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10] as const;

/** A value for `slots` from a per-slot record, or null when it is missing. */
export const atSlots = (values: Record<string, number>, slots: number): number | null =>
  values[String(slots)] ?? null;

/** "42.3%" from a fraction. */
export const percent = (fraction: number | null, digits = 1): string =>
  fraction === null ? '—' : `${(fraction * 100).toFixed(digits)}%`;

/** A number with fixed decimals; "—" for none. */
export const fixed = (value: number | null, digits = 2): string =>
  value === null ? '—' : value.toFixed(digits);

/** The hit rate at `slots` as "65%", or "Not measured" for a report made before it was measured. */
export const hitRateText = (report: ProfileReportView, slots: number): string =>
  report.hitRate ? percent(atSlots(report.hitRate, slots), 0) : 'Not measured';

/** "12,345" for counts. */
export const count = (value: number): string => value.toLocaleString('en-GB');

/** A learning-curve point as the spread sentence reads it (spread absent in reports measured on one fold). */
export type CurvePointSpread = {
  fraction: number;
  bpcIdeal: number;
  spread?: { folds: number; bpcMin: number; bpcMax: number } | undefined;
};

const sharePercent = (fraction: number): string => `${Math.round(fraction * 100)}%`;

/**
 * Whether the curve's changes are larger than the spread between folds: the earliest point whose
 * range of bits per character (lowest to highest over the folds) overlaps the last point's range
 * is named, since the change from there on could be chance. Overlapping ranges as the test is
 * common practice, no source.
 */
export const learningCurveSpreadNote = (points: readonly CurvePointSpread[]): string => {
  const last = points.at(-1);
  if (!last || points.length < 2) return 'Not enough points to compare with the spread between folds.';
  const folds = Math.min(...points.map((point) => point.spread?.folds ?? 1));
  if (folds < 2 || !last.spread) {
    return 'Measured on one fold only, so the spread between folds is not known: small changes between points may be chance.';
  }
  const within = points.slice(0, -1).find((point) => overlaps(point, last));
  if (within) {
    return `The change from ${sharePercent(within.fraction)} to ${sharePercent(last.fraction)} is within the spread between folds, so it may be chance.`;
  }
  return `Each share of the text differs from ${sharePercent(last.fraction)} by more than the spread between the ${folds} folds measured, so the curve's shape is not chance.`;
};

/** Whether two points' ranges of bits per character over the folds overlap (both need a spread). */
const overlaps = (a: CurvePointSpread, b: CurvePointSpread): boolean =>
  Boolean(a.spread && b.spread && a.spread.bpcMin <= b.spread.bpcMax && b.spread.bpcMin <= a.spread.bpcMax);

/**
 * The learning curve in one sentence: whether the last step (from half the text to all of it)
 * still lowered bits per character by at least 0.02 (a judgement threshold: common practice, no
 * source) — and, where the folds' spread is known, whether that step is larger than the spread, so
 * it never claims a gain the spread sentence calls chance.
 */
export const learningCurveVerdict = (points: readonly CurvePointSpread[]): string => {
  const last = points.at(-1);
  const before = points.at(-2);
  if (!last || !before) return 'Not enough points to tell whether more text would help.';
  const gain = before.bpcIdeal - last.bpcIdeal;
  const span = `from ${sharePercent(before.fraction)} to ${sharePercent(last.fraction)} of the text`;
  if (gain >= 0.02 && overlaps(before, last)) {
    return `More text may still help: going ${span} lowered bits per character by ${gain.toFixed(2)}, but by less than the spread between folds, so this could be chance. Collect more writing and train again to be sure.`;
  }
  if (gain >= 0.02) {
    return `More text still helps: going ${span} lowered bits per character by ${gain.toFixed(2)}. Collecting more writing is likely to improve the profile.`;
  }
  const change =
    gain >= 0
      ? `lowered bits per character by only ${gain.toFixed(2)}`
      : `raised bits per character by ${(-gain).toFixed(2)}`;
  return `More text has stopped helping much: going ${span} ${change}. More writing of the same kind will add little.`;
};

/** One line of a chart by list size: a version, or the base model alone. */
export type SlotSeries = { name: string; values: Record<string, number> };

const BASE_NAME = 'General English model alone';

/** Keystroke-savings and KSPC series of a report: the version, and the base model alone when measured. */
export const slotSeries = (report: ProfileReportView, name = 'This version') => {
  const savings: SlotSeries[] = [{ name, values: report.keystrokeSavings }];
  const kspc: SlotSeries[] = [{ name, values: report.kspc }];
  if (report.baseOnly) {
    savings.push({ name: BASE_NAME, values: report.baseOnly.keystrokeSavings });
    kspc.push({ name: BASE_NAME, values: report.baseOnly.kspc });
  }
  return { savings, kspc };
};

/**
 * What the suggestion list offers, in plain words: whether it offers only whole words (and how that
 * was checked). Reports made before the word list say so. How it weighs its sources is an engine
 * detail (`mixtureDescription`).
 */
export const listDescription = (report: ProfileReportView): string[] => {
  const lines: string[] = [];
  if (report.predictor !== 'word') {
    lines.push(
      'This version was trained with the earlier list, which could offer parts of words. Train a new version to get a list of whole words only.',
    );
  } else {
    lines.push(
      "The list offers whole words only: the client's own words, a general English vocabulary, and words the client finishes while typing.",
    );
  }
  const n = report.nonWordSlots;
  if (n && n.slots > 0) {
    lines.push(
      n.nonWordSlots === 0
        ? `Checked: all ${count(n.slots)} words offered in ${count(n.lists)} lists were real words.`
        : `Checked: ${count(n.nonWordSlots)} of ${count(n.slots)} offered slots (${percent(n.share)}) were not words, for example ${n.examples
            .slice(0, 4)
            .map((e) => `“${e}”`)
            .join(', ')}.`,
    );
  }
  return lines;
};

/** How the word list weighs its sources, in one line; null for the character-only list. */
export const mixtureDescription = (report: ProfileReportView): string | null => {
  const w = report.wordWeights;
  if (report.predictor !== 'word' || !w) return null;
  const parts = [
    `the client's own writing ${percent(w.personal, 0)}`,
    `general English ${percent(w.base + w.lexicon, 0)}`,
    `words used in the last few hundred ${percent(w.cache, 0)}`,
  ];
  return `It ranks words by the two words before them and by spelling, weighing ${parts.join(', ')}.`;
};

/** Shown instead of the scan figures for a version trained before they were measured per layout. */
export const SCAN_STEPS_NOT_MEASURED =
  'Trained before scan steps were measured per keyboard layout; train a new version to see them.';

/** What the scan figures count, in one line. */
export const SCAN_STEPS_NOTE =
  'Row–column scanning on the test keyboard’s key rows; the suggestion row is not counted.';

/** One keyboard layout's scan steps per character, labelled as the keyboard's layout setting is. */
export type LayoutScanSteps = { layout: KeyboardLayout; label: string; steps: number };

/** The scan steps per character of each keyboard layout, or null for a report made before them. */
export const scanStepsByLayout = (report: ProfileReportView): LayoutScanSteps[] | null => {
  const measured = report.scanStepsByLayout;
  if (!measured) return null;
  return keyboardLayouts.map((layout) => ({
    layout,
    label: keyboardLayoutLabels[layout],
    steps: measured[layout],
  }));
};
