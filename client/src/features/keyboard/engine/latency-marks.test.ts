import { afterEach, describe, expect, it } from 'vitest';
import { markKeyPress, measureRowUpdate, rowUpdateDurations, SUGGEST_MEASURE } from './latency-marks';

describe('latency marks', () => {
  afterEach(() => {
    performance.clearMarks();
    performance.clearMeasures();
  });

  it('measures key press → row once per seq, and skips a row without a key press', () => {
    markKeyPress(1);
    expect(performance.getEntriesByName('keyloom:key:1', 'mark')).toHaveLength(1);
    measureRowUpdate(1);
    measureRowUpdate(1);
    measureRowUpdate(2); // no mark: the row shown on loading
    const measures = performance.getEntriesByName(SUGGEST_MEASURE, 'measure');
    expect(measures).toHaveLength(1);
    expect(measures[0].duration).toBeGreaterThanOrEqual(0);
    expect(rowUpdateDurations()).toHaveLength(1);
    markKeyPress(3);
    measureRowUpdate(3);
    expect(rowUpdateDurations()).toHaveLength(2);
  });
});
