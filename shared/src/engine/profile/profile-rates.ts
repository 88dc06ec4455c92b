// Words per minute for the client's access method, with and without the
// suggestion list (evaluation/text-entry-rate.ts, estimateRates). The
// assumptions travel with the figures so the report can show them.
import { estimateRates, type AccessTiming } from '../evaluation/text-entry-rate';
import type { RateReport } from '../../schemas/profile-report.schema';
import type { AccessSettings } from './profile-settings';

// Timings used when the access settings give none: the same values as the
// client record's defaults (schemas/clients.schema.ts defaultAccessTiming;
// common practice, no source), so a record left at its defaults and a
// profile without timings give the same estimate.
/** Scan interval, ms (intervals of 0.5–2 s per step are common practice, no source: docs/references.md §3). */
export const DEFAULT_SCAN_INTERVAL_MS = 1000;
/** Dwell, ms (typical 450–1000 ms, Majaranta et al. 2009: docs/references.md §3). */
export const DEFAULT_DWELL_MS = 800;
/** Time per key for direct selection, ms. */
export const DEFAULT_KEY_TIME_MS = 1500;
/** Time to read the suggestion list once: 500 ms (assumption, no source; Koester & Levine 1994 model it but give no single value we verified). */
export const DEFAULT_LIST_READ_MS = 500;

export type { RateReport } from '../../schemas/profile-report.schema';

/** The timing model of an access method: scanning, dwell or direct selection. */
export function accessTiming(access: AccessSettings): { timing: AccessTiming; defaultTiming: boolean } {
  const scanning = (): { timing: AccessTiming; defaultTiming: boolean } => ({
    timing: { kind: 'scanning', scanIntervalMs: access.scanIntervalMs ?? DEFAULT_SCAN_INTERVAL_MS },
    defaultTiming: access.scanIntervalMs === undefined,
  });
  const dwell = (): { timing: AccessTiming; defaultTiming: boolean } => ({
    timing: { kind: 'dwell', dwellMs: access.dwellMs ?? DEFAULT_DWELL_MS },
    defaultTiming: access.dwellMs === undefined,
  });
  const direct = (): { timing: AccessTiming; defaultTiming: boolean } => ({
    timing: { kind: 'direct', keyMs: access.keyTimeMs ?? DEFAULT_KEY_TIME_MS },
    defaultTiming: access.keyTimeMs === undefined,
  });
  switch (access.method) {
    case 'switch':
      return scanning();
    case 'eye_gaze':
      return dwell();
    case 'head_pointer':
      // The client record keeps a head pointer's time per key (movement and selection together);
      // a dwell time alone, when that is all there is, stands in for it.
      if (access.keyTimeMs === undefined && access.dwellMs !== undefined) return dwell();
      return direct();
    case 'direct':
      return direct();
    case 'other':
      // Whatever timing the record gives, in this order.
      if (access.scanIntervalMs !== undefined) return scanning();
      if (access.dwellMs !== undefined) return dwell();
      return direct();
  }
}

/**
 * Estimated rates for the access method.
 * @param kspc keystrokes per character at `slots` (0 < kspc ≤ 1)
 * @param scanStepsPerSelection expected row–column steps per selection (≥ 0)
 * @param listReadMs time to read the list once (≥ 0)
 */
export function profileRates(
  access: AccessSettings,
  slots: number,
  kspc: number,
  scanStepsPerSelection: number,
  listReadMs: number = DEFAULT_LIST_READ_MS,
): RateReport {
  const { timing, defaultTiming } = accessTiming(access);
  const r = estimateRates(timing, kspc, scanStepsPerSelection, listReadMs);
  return {
    ...r,
    assumptions: {
      timing,
      defaultTiming,
      scanStepsPerSelection,
      msPerSelection: r.msPerCharWithout,
      listReadMs,
      slots,
      kspc,
      note:
        'Estimates, not measurements: one word is 5 characters; a suggestion costs one selection; ' +
        'the list is read before every selection. Keystroke savings are not time savings.',
    },
  };
}
