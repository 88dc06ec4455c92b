// The headline figures of a stored profile report, read defensively: the report is kept as JSON
// (jsonb in the API) and an older engine version may lack a field. Each figure is checked with the
// report schema's own field (shared/src/schemas/profile-report.schema.ts), one at a time.
import type { z } from 'zod';
import { perSlotSchema, rateReportSchema } from '../../schemas/profile-report.schema';

/** Keystroke savings at the version's slot count and the estimated words a minute; null when missing. */
export type ReportFigures = {
  /** Keystroke savings at `slots` suggestions, 0..1. */
  keystrokeSavings: number | null;
  /** Estimated words a minute with and without suggestions. */
  wpmWith: number | null;
  wpmWithout: number | null;
};

/** The value when it parses with the report schema's own field schema, else null (z.number() refuses NaN and ±Infinity in zod 4: docs/references.md). */
const field = <T>(schema: z.ZodType<T>, value: unknown): T | null => {
  const parsed = schema.safeParse(value);
  return parsed.success ? parsed.data : null;
};
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
  const { wpmWith, wpmWithout } = rateReportSchema.shape;
  return {
    keystrokeSavings: field(perSlotSchema.valueType, record(report.keystrokeSavings)[String(slots)]),
    wpmWith: field(wpmWith, rates.wpmWith),
    wpmWithout: field(wpmWithout, rates.wpmWithout),
  };
}
