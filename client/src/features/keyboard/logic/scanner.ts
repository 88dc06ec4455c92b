// Row–column scanning as a pure state machine. The rows are highlighted one after another;
// a switch press on a highlighted row enters it, and its items are highlighted one after
// another; a press on an item selects it and scanning returns to the rows, starting again at
// the first row. After two passes through a row's items without a press, scanning goes back
// to the rows (the same row highlighted). Empty rows (e.g. a suggestion row with no words)
// are skipped, and both levels wrap around.

/**
 * Where the highlight is. `row` is the highlighted row (rows level) or the row being scanned
 * (items level); `item` the highlighted item (items level, 0 at rows level); `idlePasses` the
 * passes through the row's items completed without a press (items level).
 */
export type ScanState = { level: 'rows' | 'items'; row: number; item: number; idlePasses: number };

/** Passes through a row's items without a press before scanning goes back to the rows. */
export const IDLE_PASSES_BEFORE_ROWS = 2;

/** The first non-empty row at or after `from` (wrapping), or -1 when every row is empty. */
function nextNonEmptyRow(rowLengths: readonly number[], from: number): number {
  const n = rowLengths.length;
  for (let k = 0; k < n; k++) {
    const row = (((from + k) % n) + n) % n;
    if (rowLengths[row] > 0) return row;
  }
  return -1;
}

/** The state when scanning starts: the first non-empty row highlighted; null when there is nothing to scan. */
export function initialScanState(rowLengths: readonly number[]): ScanState | null {
  const row = nextNonEmptyRow(rowLengths, 0);
  return row < 0 ? null : { level: 'rows', row, item: 0, idlePasses: 0 };
}

/**
 * Fits a state to rows whose lengths changed (the suggestion row grows and shrinks as one types):
 * a row that became empty or vanished gives way to the next non-empty row at rows level; an item
 * past the row's end moves to its last item. Null when every row is empty.
 */
export function fitScanState(state: ScanState | null, rowLengths: readonly number[]): ScanState | null {
  if (state === null) return initialScanState(rowLengths);
  const length = rowLengths[state.row] ?? 0;
  if (length === 0) {
    const row = nextNonEmptyRow(rowLengths, state.row < rowLengths.length ? state.row : 0);
    return row < 0 ? null : { level: 'rows', row, item: 0, idlePasses: 0 };
  }
  if (state.level === 'items' && state.item >= length) return { ...state, item: length - 1 };
  return state;
}

/** One scan interval passes without a press. */
export function scanTick(state: ScanState | null, rowLengths: readonly number[]): ScanState | null {
  const s = fitScanState(state, rowLengths);
  if (s === null) return null;
  if (s.level === 'rows') {
    const row = nextNonEmptyRow(rowLengths, s.row + 1);
    return { level: 'rows', row, item: 0, idlePasses: 0 };
  }
  const length = rowLengths[s.row];
  const item = s.item + 1;
  if (item < length) return { ...s, item };
  const idlePasses = s.idlePasses + 1;
  if (idlePasses >= IDLE_PASSES_BEFORE_ROWS) return { level: 'rows', row: s.row, item: 0, idlePasses: 0 };
  return { ...s, item: 0, idlePasses };
}

/**
 * A switch press. At rows level it enters the highlighted row (its first item highlighted);
 * at items level it selects the highlighted item and returns to the rows at the first non-empty row.
 */
export function scanPress(
  state: ScanState | null,
  rowLengths: readonly number[],
): { state: ScanState | null; selected: { row: number; item: number } | null } {
  const s = fitScanState(state, rowLengths);
  if (s === null) return { state: null, selected: null };
  if (s.level === 'rows')
    return { state: { level: 'items', row: s.row, item: 0, idlePasses: 0 }, selected: null };
  return { state: initialScanState(rowLengths), selected: { row: s.row, item: s.item } };
}
