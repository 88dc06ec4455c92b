// Key layouts for row–column scanning and their expected cost.
//
// Row–column scanning (docs/references.md §3): the highlight steps down the rows; a
// switch press picks the row; it then steps along the row; a second press
// picks the key. The key at row r, column c (1-based) costs r + c scan steps,
// and the expected cost over a distribution p is Σ p_i (r_i + c_i).

/** A key grid: `rows[r][c]` is the text a key enters (one character), or "" for an empty cell. */
export type KeyLayout = {
  name: string;
  rows: string[][];
  /** Letters are entered in lower case and matched case-insensitively (no shift key is scanned). */
  caseInsensitive: boolean;
  /**
   * Steps charged for a character that has no key: reaching the last cell
   * (a "more" key) plus this many steps on a second page.
   */
  offLayoutExtraSteps: number;
};

/**
 * Keyloom's default scanning layout (our own), 6 rows × 7 columns. The 40
 * most frequent characters of our Brown reconstruction (case-folded: space
 * e t a o i n s r h l d c u …) fill the cells in order of increasing r + c
 * (ties: upper row first), so frequent keys are cheap; a newline key takes
 * the 41st cell and the last cell (empty here) is the "more" key for
 * everything else.
 */
export const defaultScanLayout: KeyLayout = {
  name: 'keyloom-frequency-6x7',
  caseInsensitive: true,
  offLayoutExtraSteps: 7,
  rows: [
    [' ', 'e', 'a', 'n', 'l', 'f', ','],
    ['t', 'o', 's', 'd', 'p', '.', "'"],
    ['i', 'r', 'c', 'g', 'v', 'x', 'q'],
    ['h', 'u', 'w', 'k', 'j', '?', '2'],
    ['m', 'y', '"', ';', 'z', ')', '5'],
    ['b', '-', '1', '0', '(', '\n', ''],
  ],
};

/** Precomputed cost per character of a layout. */
export type LayoutCost = {
  /** Scan steps for a code point (already case-folded if the layout is case-insensitive). */
  steps(codePoint: number): number;
  /** Steps charged for a character without a key. */
  offLayoutSteps: number;
};

/** Builds the step table of a layout. Throws if a key appears twice. */
export function layoutCost(layout: KeyLayout): LayoutCost {
  const table = new Map<number, number>();
  let lastCell = 0;
  layout.rows.forEach((row, r) =>
    row.forEach((key, c) => {
      const cost = r + 1 + (c + 1);
      lastCell = Math.max(lastCell, cost);
      if (key === '') return;
      const cp = key.codePointAt(0) as number;
      if (table.has(cp)) throw new Error(`key ${JSON.stringify(key)} appears twice in layout ${layout.name}`);
      table.set(cp, cost);
    }),
  );
  const offLayout = lastCell + layout.offLayoutExtraSteps;
  const fold = layout.caseInsensitive;
  return {
    offLayoutSteps: offLayout,
    steps(codePoint: number): number {
      const direct = table.get(codePoint);
      if (direct !== undefined) return direct;
      if (fold) {
        const lower = String.fromCodePoint(codePoint).toLowerCase();
        const folded = lower.length > 0 ? table.get(lower.codePointAt(0) as number) : undefined;
        if (folded !== undefined && [...lower].length === 1) return folded;
      }
      return offLayout;
    },
  };
}

/** A uniform R × C grid of distinct placeholder keys (for checks against the closed form). */
export function uniformGrid(rowsCount: number, columns: number): KeyLayout {
  const rows: string[][] = [];
  let cp = 0x4e00; // CJK block: plenty of distinct single characters
  for (let r = 0; r < rowsCount; r++) {
    const row: string[] = [];
    for (let c = 0; c < columns; c++) row.push(String.fromCodePoint(cp++));
    rows.push(row);
  }
  return { name: `uniform-${rowsCount}x${columns}`, rows, caseInsensitive: false, offLayoutExtraSteps: 0 };
}
