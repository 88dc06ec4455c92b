// Row–column scanning as the test keyboard specifies it (rows then items; two idle passes back to the
// rows; empty rows skipped; wrap-around). The expected positions are derived by counting.
import { describe, expect, it } from 'vitest';
import { fitScanState, initialScanState, scanPress, type ScanState, scanTick } from './scanner';

const ticks = (state: ScanState | null, lengths: number[], k: number) => {
  let s = state;
  for (let i = 0; i < k; i++) s = scanTick(s, lengths);
  return s;
};

describe('row–column scanner', () => {
  it('highlights rows in turn, skipping empty ones, and wraps around', () => {
    const lengths = [0, 10, 9, 7, 7];
    const s0 = initialScanState(lengths);
    expect(s0).toEqual({ level: 'rows', row: 1, item: 0, idlePasses: 0 });
    const rows = [s0, ...Array.from({ length: 5 }, (_, k) => ticks(s0, lengths, k + 1))].map((s) => s?.row);
    expect(rows).toEqual([1, 2, 3, 4, 1, 2]);
  });

  it('in a row of n items, k ticks after entering highlight item k mod n, then back to rows after 2 passes', () => {
    for (const n of [1, 3, 7]) {
      const lengths = [5, n, 4];
      const entered = scanPress(ticks(initialScanState(lengths), lengths, 1), lengths);
      expect(entered.selected).toBeNull();
      expect(entered.state).toEqual({ level: 'items', row: 1, item: 0, idlePasses: 0 });
      for (let k = 0; k < 2 * n; k++) {
        expect(ticks(entered.state, lengths, k)).toEqual({
          level: 'items',
          row: 1,
          item: k % n,
          idlePasses: Math.floor(k / n),
        });
      }
      // Two full passes without a press: back to the rows, the same row highlighted.
      expect(ticks(entered.state, lengths, 2 * n)).toEqual({ level: 'rows', row: 1, item: 0, idlePasses: 0 });
      expect(ticks(entered.state, lengths, 2 * n + 1)?.row).toBe(2);
    }
  });

  it('a press on an item selects it and returns to the first row', () => {
    const lengths = [3, 10, 9];
    let s = ticks(initialScanState(lengths), lengths, 2); // row 2
    s = scanPress(s, lengths).state;
    s = ticks(s, lengths, 4); // item 4
    const { state, selected } = scanPress(s, lengths);
    expect(selected).toEqual({ row: 2, item: 4 });
    expect(state).toEqual({ level: 'rows', row: 0, item: 0, idlePasses: 0 });
  });

  it('fits the state when a row shrinks or empties, and gives null with nothing to scan', () => {
    expect(initialScanState([0, 0])).toBeNull();
    expect(scanTick(null, [0])).toBeNull();
    expect(scanPress(null, [])).toEqual({ state: null, selected: null });
    const inSuggestions: ScanState = { level: 'items', row: 0, item: 4, idlePasses: 1 };
    expect(fitScanState(inSuggestions, [2, 10])).toEqual({ level: 'items', row: 0, item: 1, idlePasses: 1 });
    expect(fitScanState(inSuggestions, [0, 10])).toEqual({ level: 'rows', row: 1, item: 0, idlePasses: 0 });
    // The empty suggestion row is skipped while scanning rows.
    expect(scanTick({ level: 'rows', row: 3, item: 0, idlePasses: 0 }, [0, 10, 9, 7])?.row).toBe(1);
  });
});
