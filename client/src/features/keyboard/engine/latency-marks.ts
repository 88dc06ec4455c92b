// Performance marks for "key press → suggestion row updated", read by the browser test
// (performance.getEntriesByName('keyloom:suggest')) to report p50 and p95.

/** Name of the measure from a key press to the suggestion row that answers it. */
export const SUGGEST_MEASURE = 'keyloom:suggest';

const keyMark = (seq: number) => `keyloom:key:${seq}`;
const measured = new Set<number>();
const MEASURED_LIMIT = 1000;

const hasPerformance = () => typeof performance !== 'undefined' && typeof performance.mark === 'function';

/** Marks the moment key press `seq` happened (call before asking the engine for `seq`). */
export function markKeyPress(seq: number): void {
  if (!hasPerformance()) return;
  measured.delete(seq);
  performance.mark(keyMark(seq));
}

/**
 * Measures from key press `seq` to now (call once the row for `seq` is on screen). Only the first
 * call per seq counts; a seq without a key-press mark (e.g. the row shown on loading) is skipped.
 */
export function measureRowUpdate(seq: number): void {
  if (!hasPerformance() || measured.has(seq)) return;
  const mark = keyMark(seq);
  if (performance.getEntriesByName(mark, 'mark').length === 0) return;
  measured.add(seq);
  if (measured.size > MEASURED_LIMIT) {
    const oldest = measured.values().next().value;
    if (oldest !== undefined) measured.delete(oldest);
  }
  performance.measure(SUGGEST_MEASURE, mark);
  // The mark has served; dropping it keeps the timeline small over a long trial.
  performance.clearMarks(mark);
}

/** The measured key-to-row times so far, ms, in order. */
export function rowUpdateDurations(): number[] {
  if (!hasPerformance()) return [];
  return performance.getEntriesByName(SUGGEST_MEASURE, 'measure').map((entry) => entry.duration);
}
