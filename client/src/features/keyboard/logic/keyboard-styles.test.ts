import { describe, expect, it } from 'vitest';
import { LARGE_TARGET_PX, rowColumns, wrappedColumns } from './keyboard-styles';

// Hand-worked: with 64 px keys and 8 px gaps, a 300 px row holds ⌊(300 + 8) / (64 + 8)⌋ = 4 keys.
describe('wrappedColumns: large targets spread evenly over the lines a row needs', () => {
  it('keeps a row that fits on one line', () => {
    expect(wrappedColumns(4, 300, 8)).toBe(4);
    expect(wrappedColumns(10, 1200, 8)).toBe(10);
  });

  it('makes 9 keys where 4 fit three lines of 3, not 4 + 4 + a lone key', () => {
    expect(wrappedColumns(9, 300, 8)).toBe(3);
  });

  it('makes 10 units where 4 fit three lines of at most 4; 5 suggestions where 4 fit 3 + 2', () => {
    expect(wrappedColumns(10, 300, 8)).toBe(4);
    expect(wrappedColumns(5, 300, 8)).toBe(3);
  });

  it('never gives a column narrower than the large target, and at least one column', () => {
    for (const [units, width, gap] of [
      [9, 300, 8],
      [10, 390, 24],
      [26, 700, 16],
      [3, 50, 8],
    ] as const) {
      const columns = wrappedColumns(units, width, gap);
      expect(columns).toBeGreaterThanOrEqual(1);
      expect(columns).toBeLessThanOrEqual(units);
      if (columns > 1)
        expect((width - (columns - 1) * gap) / columns).toBeGreaterThanOrEqual(LARGE_TARGET_PX);
    }
  });
});

describe('rowColumns', () => {
  it('uses the measured width with large targets, the CSS fallback before it is measured', () => {
    expect(rowColumns(9, true, 8, 300)).toBe('repeat(3, minmax(0, 1fr))');
    expect(rowColumns(9, true, 8, null)).toContain('auto-fill');
    expect(rowColumns(9, false, 8, 300)).toBe('repeat(9, minmax(0, 1fr))');
  });
});
