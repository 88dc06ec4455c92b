import { z } from 'zod';
import { isoDateField, localTodayIso } from './common';
import { versionFigureKeys } from '../reports/version-figures';

// The printed reports: a version's report and a client's report over a period, as the print view
// shows them (GET …/report) and as the PDF prints them (GET …/report.pdf). The API writes every
// word and date; the print view and the PDF only lay them out.

/** Paper sizes of the PDF: A4 unless `?paper=letter`. */
export const reportPapers = ['a4', 'letter'] as const;
export type ReportPaper = (typeof reportPapers)[number];

export const REPORT_PERIOD_MESSAGE = 'The period must end on or after its start.';
/** Days a client report covers when no period is given: the last 90 days, today included. */
export const DEFAULT_REPORT_DAYS = 90;

// ?paper=a4|letter on both PDF routes.
export const reportPaperQuerySchema = z.object({ paper: z.enum(reportPapers).default('a4') });
export type ReportPaperQuery = z.infer<typeof reportPaperQuerySchema>;

/** The first day of the default period ending on `today` (YYYY-MM-DD): DEFAULT_REPORT_DAYS days in all. */
export function defaultReportFrom(today: string): string {
  const date = new Date(`${today}T00:00:00Z`);
  date.setUTCDate(date.getUTCDate() - (DEFAULT_REPORT_DAYS - 1));
  return date.toISOString().slice(0, 10);
}

// GET /api/clients/:id/report(.pdf)?from&to: the period, each end optional (default: the last 90
// days up to today; a missing end is taken from the other); a reversed period is refused.
export const clientReportQuerySchema = reportPaperQuerySchema
  .extend({ from: isoDateField.optional(), to: isoDateField.optional() })
  .transform(({ from, to, paper }) => {
    const end = to ?? (from && from > localTodayIso() ? from : localTodayIso());
    return { paper, from: from ?? defaultReportFrom(end), to: end };
  })
  .refine((period) => period.from <= period.to, { message: REPORT_PERIOD_MESSAGE, path: ['to'] });
export type ClientReportQuery = z.infer<typeof clientReportQuerySchema>;

/** A chart as the reports carry it: the SVG the API draws, its size in CSS px and its alt text. */
export const reportChartSchema = z.object({
  svg: z.string(),
  width: z.number(),
  height: z.number(),
  alt: z.string(),
});
export type ReportChart = z.infer<typeof reportChartSchema>;

/** The clinic as a report's letterhead names it (from the clinic settings). */
export const reportClinicSchema = z.object({
  name: z.string(),
  address: z.string().nullable(),
  phone: z.string().nullable(),
});

/** What every report carries: the letterhead, the client, when it was printed and the cautions. */
const reportBase = {
  clinic: reportClinicSchema,
  client: z.object({ id: z.uuid(), pseudonym: z.string() }),
  /** "Printed 3 Dec 2026". */
  printedOn: z.string(),
  cautions: z.array(z.string()),
};

/** One step of a version's approval trail: what happened, who did it, the day. */
export const reportTrailStepSchema = z.object({
  step: z.string(),
  by: z.string().nullable(),
  on: z.string().nullable(),
});

/** The figures of versionFigures, as the report prints them. */
export const reportFigureSchema = z.object({
  key: z.enum(versionFigureKeys),
  label: z.string(),
  value: z.string(),
  explanation: z.string(),
});

/** Trials of a version on the test keyboard: how many, and the mean measured words per minute. */
export const reportTrialsSchema = z.object({
  count: z.number().int(),
  /** "4.2" words a minute, null when no trial measured a rate (or its rate was left out). */
  meanWpm: z.string().nullable(),
  /** What was left out and why (trials too short to measure, a speed far above the estimate). */
  notes: z.array(z.string()),
});

// GET /api/profile-versions/:id/report: a trained version's report.
export const versionReportSchema = z.object({
  ...reportBase,
  version: z.object({
    id: z.uuid(),
    number: z.number().int(),
    status: z.string(),
    statusLabel: z.string(),
    createdBy: z.string(),
    createdOn: z.string(),
    trainedBy: z.string().nullable(),
    trainedOn: z.string().nullable(),
  }),
  trail: z.array(reportTrailStepSchema),
  figures: z.array(reportFigureSchema),
  /** Keystroke savings by suggestion slots; null when the report has no savings. */
  chart: reportChartSchema.nullable(),
  trials: reportTrialsSchema,
  samples: z.array(z.object({ title: z.string(), characters: z.number().int() })),
});
export type VersionReport = z.infer<typeof versionReportSchema>;

/** One row of the client report's table of versions. */
export const clientReportVersionSchema = z.object({
  id: z.uuid(),
  number: z.number().int(),
  statusLabel: z.string(),
  trainedOn: z.string().nullable(),
  approvedOn: z.string().nullable(),
  slots: z.number().int(),
  /** versionFigures' values, null where the version's report lacks the figure. */
  keystrokeSavings: z.string().nullable(),
  hitRate: z.string().nullable(),
  wpm: z.string().nullable(),
});

// GET /api/clients/:id/report?from&to: the versions trained or approved in the period, the charts
// of the progress summaries, trials in the period.
export const clientReportSchema = z.object({
  ...reportBase,
  period: z.object({ from: isoDateField, to: isoDateField, fromOn: z.string(), toOn: z.string() }),
  versions: z.array(clientReportVersionSchema),
  charts: z.array(reportChartSchema),
  trials: z.array(z.object({ versionNumber: z.number().int(), ...reportTrialsSchema.shape })),
});
export type ClientReport = z.infer<typeof clientReportSchema>;
