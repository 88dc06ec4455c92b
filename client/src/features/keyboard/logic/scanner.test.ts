// Scanning as the test keyboard specifies it. Row–column (rows then items; two idle passes back to the
// rows; empty rows skipped; wrap-around). The expected positions are derived by counting.
import { describe, expect, it } from 'vitest';
import {
  fitScanState,
  initialScanState,
  keyRowGroupSizes,
  scanAdvance,
  scanChoose,
  type ScanConfig,
  scanGroups,
  scanPress,
  type ScanState,
  scanTick,
} from './scanner';

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

// The other patterns, against sequences worked out by hand (rows: [suggestions, key rows…]).
describe('scanning patterns', () => {
  type Step = 'advance' | 'choose';
  /** Runs steps from the initial state; returns every state and what was selected. */
  const run = (lengths: number[], config: ScanConfig, steps: Step[]) => {
    let s = initialScanState(lengths, config);
    const selected: { row: number; item: number }[] = [];
    for (const step of steps) {
      if (step === 'advance') s = scanAdvance(s, lengths, config);
      else {
        const r = scanChoose(s, lengths, config);
        s = r.state;
        if (r.selected) selected.push(r.selected);
      }
    }
    return { state: s, selected };
  };
  const times = (step: Step, k: number): Step[] => Array.from({ length: k }, () => step);
  const grk = (suggestionsAt: 'first' | 'last' = 'first'): ScanConfig => ({
    pattern: 'auto-group-row-key',
    suggestionsAt,
  });

  it('splits key rows into groups of two or three, larger first', () => {
    expect([1, 2, 3, 4, 5, 6, 7].map(keyRowGroupSizes)).toEqual([
      [1],
      [2],
      [3],
      [2, 2],
      [3, 2],
      [3, 3],
      [3, 2, 2],
    ]);
    expect(scanGroups(5, grk())).toEqual([[0], [1, 2], [3, 4]]);
    expect(scanGroups(5, grk('last'))).toEqual([[1, 2], [3, 4], [0]]);
    expect(scanGroups(3, { pattern: 'step-two-switch', suggestionsAt: 'last' })).toEqual([[1, 2, 0]]);
  });

  it('group–row–key: tick, tick, press → third group; tick, press → its second row; tick, tick, press → key 2', () => {
    // Rows [5, 10, 9, 7, 4]: groups {0}, {1, 2}, {3, 4}.
    const lengths = [5, 10, 9, 7, 4];
    expect(initialScanState(lengths, grk())).toEqual({
      level: 'groups',
      group: 0,
      row: 0,
      item: 0,
      idlePasses: 0,
    });
    expect(run(lengths, grk(), ['advance', 'advance', 'choose']).state).toEqual({
      level: 'rows',
      group: 2,
      row: 3,
      item: 0,
      idlePasses: 0,
    });
    const r = run(lengths, grk(), [
      'advance',
      'advance',
      'choose',
      'advance',
      'choose',
      'advance',
      'advance',
      'choose',
    ]);
    expect(r.selected).toEqual([{ row: 4, item: 2 }]);
    // After a selection: back to the groups, the first one highlighted.
    expect(r.state).toEqual({ level: 'groups', group: 0, row: 0, item: 0, idlePasses: 0 });
  });

  it('group–row–key: two idle passes go up one level, the same entry highlighted; the suggestion group has no rows level', () => {
    const lengths = [5, 10, 9, 7, 4];
    // Enter group 1 (rows 1, 2): row 1, row 2, row 1 (pass 1), row 2, then up to the groups at group 1.
    const enter = ['advance', 'choose'] as Step[];
    expect(run(lengths, grk(), [...enter, ...times('advance', 3)]).state).toEqual({
      level: 'rows',
      group: 1,
      row: 2,
      item: 0,
      idlePasses: 1,
    });
    expect(run(lengths, grk(), [...enter, ...times('advance', 4)]).state).toEqual({
      level: 'groups',
      group: 1,
      row: 1,
      item: 0,
      idlePasses: 0,
    });
    // Items: a row of 9 keys, 18 ticks without a press → back to its rows, the same row highlighted.
    const inRow2 = [...enter, 'advance', 'choose'] as Step[];
    expect(run(lengths, grk(), [...inRow2, ...times('advance', 17)]).state).toMatchObject({
      level: 'items',
      item: 8,
    });
    expect(run(lengths, grk(), [...inRow2, ...times('advance', 18)]).state).toEqual({
      level: 'rows',
      group: 1,
      row: 2,
      item: 0,
      idlePasses: 0,
    });
    // The suggestion group: a press enters its words at once; 10 ticks (two passes of 5) → groups.
    expect(run(lengths, grk(), ['choose']).state).toEqual({
      level: 'items',
      group: 0,
      row: 0,
      item: 0,
      idlePasses: 0,
    });
    expect(run(lengths, grk(), ['choose', ...times('advance', 10)]).state).toEqual({
      level: 'groups',
      group: 0,
      row: 0,
      item: 0,
      idlePasses: 0,
    });
  });

  it('group–row–key: an empty suggestion row is skipped; suggestions last puts its group at the end', () => {
    const empty = [0, 10, 9, 7, 4];
    expect(initialScanState(empty, grk())).toMatchObject({ level: 'groups', group: 1 });
    expect(run(empty, grk(), ['advance']).state).toMatchObject({ level: 'groups', group: 2 });
    expect(run(empty, grk(), ['advance', 'advance']).state).toMatchObject({ level: 'groups', group: 1 });
    const lengths = [5, 10, 9, 7, 4];
    // Groups {1, 2}, {3, 4}, {0}: tick, tick → the suggestion group; press, tick, press → word 1.
    expect(run(lengths, grk('last'), ['advance', 'advance']).state).toMatchObject({
      level: 'groups',
      group: 2,
      row: 0,
    });
    expect(run(lengths, grk('last'), ['advance', 'advance', 'choose', 'advance', 'choose']).selected).toEqual(
      [{ row: 0, item: 1 }],
    );
    // The suggestion row empties while its words are scanned: the next group, at the groups level.
    const inWords = run(lengths, grk(), ['choose', 'advance']).state;
    expect(fitScanState(inWords, empty, grk())).toMatchObject({ level: 'groups', group: 1 });
  });

  it('row–column with suggestions last: rows 1, 2, 0; after a selection back to row 1', () => {
    const lengths = [3, 10, 9];
    const last: ScanConfig = { pattern: 'auto-row-column', suggestionsAt: 'last' };
    expect(initialScanState(lengths, last)).toEqual({ level: 'rows', row: 1, item: 0, idlePasses: 0 });
    expect([1, 2, 3].map((k) => run(lengths, last, times('advance', k)).state?.row)).toEqual([2, 0, 1]);
    const r = run(lengths, last, ['advance', 'advance', 'choose', 'advance', 'choose']);
    expect(r.selected).toEqual([{ row: 0, item: 1 }]);
    expect(r.state).toEqual({ level: 'rows', row: 1, item: 0, idlePasses: 0 });
    expect(initialScanState([0, 10, 9], last)?.row).toBe(1);
    expect(run([0, 10, 9], last, ['advance', 'advance']).state?.row).toBe(1);
  });

  it('step, one switch: press, press, wait → row 1; press ×3, wait → key 2; nothing is chosen before a press', () => {
    const step: ScanConfig = { pattern: 'step-one-switch', suggestionsAt: 'first' };
    const lengths = [3, 10, 9];
    expect(initialScanState(lengths, step)).toEqual({
      level: 'rows',
      row: 0,
      item: 0,
      idlePasses: 0,
      waiting: true,
    });
    // The wait with nothing highlighted chooses nothing.
    expect(run(lengths, step, ['choose']).state).toEqual(initialScanState(lengths, step));
    expect(run(lengths, step, ['advance']).state).toEqual({ level: 'rows', row: 0, item: 0, idlePasses: 0 });
    expect(run(lengths, step, ['advance', 'advance', 'choose']).state).toEqual({
      level: 'items',
      row: 1,
      item: 0,
      idlePasses: 0,
      waiting: true,
    });
    const r = run(lengths, step, ['advance', 'advance', 'choose', ...times('advance', 3), 'choose']);
    expect(r.selected).toEqual([{ row: 1, item: 2 }]);
    expect(r.state).toEqual(initialScanState(lengths, step));
    // Idle return: in the suggestion row (3 words), presses 1–6 go 0, 1, 2, 0, 1, 2; the 7th goes
    // back to the rows with nothing highlighted.
    const inWords = ['advance', 'choose'] as Step[];
    expect(run(lengths, step, [...inWords, ...times('advance', 6)]).state).toMatchObject({
      item: 2,
      idlePasses: 1,
    });
    expect(run(lengths, step, [...inWords, ...times('advance', 7)]).state).toEqual({
      level: 'rows',
      row: 0,
      item: 0,
      idlePasses: 0,
      waiting: true,
    });
    // Suggestions last, empty suggestion row: the first press highlights row 1, the third wraps to it.
    const last: ScanConfig = { ...step, suggestionsAt: 'last' };
    expect(run([0, 10, 9], last, ['advance']).state?.row).toBe(1);
    expect(run([0, 10, 9], last, times('advance', 3)).state?.row).toBe(1);
    expect(run([4, 10, 9], last, times('advance', 3)).state?.row).toBe(0);
  });

  it('step, two switches: move, move, select → row 2; move ×4, select → key 4; no timer involved', () => {
    const two: ScanConfig = { pattern: 'step-two-switch', suggestionsAt: 'first' };
    const lengths = [3, 10, 9];
    expect(initialScanState(lengths, two)).toEqual({ level: 'rows', row: 0, item: 0, idlePasses: 0 });
    const r = run(lengths, two, ['advance', 'advance', 'choose', ...times('advance', 4), 'choose']);
    expect(r.selected).toEqual([{ row: 2, item: 4 }]);
    expect(r.state).toEqual({ level: 'rows', row: 0, item: 0, idlePasses: 0 });
    // Two passes through a 9-key row with moves only → back to the rows at row 2.
    expect(run(lengths, two, ['advance', 'advance', 'choose', ...times('advance', 18)]).state).toEqual({
      level: 'rows',
      row: 2,
      item: 0,
      idlePasses: 0,
    });
  });
});
