// The headline figures of a stored profile report, read defensively: the report is kept as JSON
// (jsonb in the API) and an older engine version may lack a field.

/** Keystroke savings at the version's slot count and the estimated words a minute; null when missing. */
export type ReportFigures = {
  /** Keystroke savings at `slots` suggestions, 0..1. */
  keystrokeSavings: number | null;
  /** Estimated words a minute with and without suggestions. */
  wpmWith: number | null;
  wpmWithout: number | null;
};

const finite = (value: unknown): number | null =>
  typeof value === 'number' && Number.isFinite(value) ? value : null;
const record = (value: unknown): Record<string, unknown> =>
  typeof value === 'object' && value !== null && !Array.isArray(value)
    ? (value as Record<string, unknown>)
    : {};

/**
 * Reads `keystrokeSavings[slots]` and `rates.wpmWith` / `rates.wpmWithout` of a ProfileReport.
 * @param metrics the stored report (any JSON; null when the version is not trained)
 * @param slots suggestion slots, 1..10
 */
export function reportFigures(metrics: unknown, slots: number): ReportFigures {
  const report = record(metrics);
  const rates = record(report.rates);
  return {
    keystrokeSavings: finite(record(report.keystrokeSavings)[String(slots)]),
    wpmWith: finite(rates.wpmWith),
    wpmWithout: finite(rates.wpmWithout),
  };
}
