import type { SuggestionsScanned, TrialScanPattern } from '@keyloom/shared';

// Scanning as a pure state machine, in four patterns (ScanPattern). Rows are given by their lengths;
// row 0 is the suggestion row, rows 1… the key rows. The suggestion row is scanned first or last
// (ScanConfig.suggestionsAt); empty rows (a suggestion row with no words) are skipped everywhere and
// every level wraps around.
//
// Levels: items (keys or words) inside rows; rows inside groups. In the group–row–key pattern the
// groups are a third level above the rows: the suggestion row is a group of its own, and the key
// rows are split into ⌈n/3⌉ groups of consecutive rows, as even as possible, larger groups first
// (4 key rows → 2 + 2, 5 → 3 + 2, 7 → 3 + 2 + 2); a group of one row has no rows level (entering it
// highlights its first item). In the other patterns all rows form one group, scanned from the rows
// level. Choosing a group enters its first non-empty row; choosing a row enters its first item;
// choosing an item selects it and scanning starts again at the top level.
//
// Idle return (the same at every level below the top): after two passes through a level's
// entries without a choice, scanning goes up one level with the same entry highlighted. At the top
// level it wraps around for ever.
//
// How the switches drive it (the hook times it; these functions only step):
// - automatic (row–column, group–row–key): a tick (scan interval) is `scanAdvance`, the switch `scanChoose`;
// - step, one switch: the switch is `scanAdvance`; when no press comes for the acceptance time the
//   hook calls `scanChoose`. A level is entered with nothing highlighted (`waiting`): the first press
//   highlights its first entry, so the k-th entry is chosen with k presses and a wait. Going up after
//   idle passes also leaves nothing highlighted, so the wait never chooses an entry by itself;
// - step, two switches: switch 1 is `scanAdvance` (move), switch 2 `scanChoose` (select); no timer.

export type ScanPattern = TrialScanPattern;
export type SuggestionsAt = SuggestionsScanned;
export type ScanConfig = { pattern: ScanPattern; suggestionsAt: SuggestionsAt };

/** Automatic row–column scanning with the suggestion row first (the default, and trials logged before patterns). */
export const DEFAULT_SCAN_CONFIG: ScanConfig = { pattern: 'auto-row-column', suggestionsAt: 'first' };

/**
 * Where the highlight is. `row` is the highlighted row (rows level) or the row being scanned
 * (items level), as an index into the row lengths; `item` the highlighted item (items level, else 0);
 * `idlePasses` the passes through the current level completed without a choice. `group` (group–row–key
 * only) is the highlighted or entered group. `waiting` (step, one switch only): nothing is highlighted yet.
 */
export type ScanState = {
  level: 'groups' | 'rows' | 'items';
  row: number;
  item: number;
  idlePasses: number;
  group?: number;
  waiting?: true;
};

/** Passes through a level without a choice before scanning goes up one level. */
export const IDLE_PASSES_BEFORE_ROWS = 2;

/** The number of rows in each group of n key rows: ⌈n/3⌉ groups, as even as possible, larger first. */
export function keyRowGroupSizes(n: number): number[] {
  if (n <= 0) return [];
  const count = Math.ceil(n / 3);
  return Array.from({ length: count }, (_, g) => Math.floor(n / count) + (g < n % count ? 1 : 0));
}

/** The groups, each a list of row indices in scan order (one group of every row unless group–row–key). */
export function scanGroups(rowCount: number, config: ScanConfig = DEFAULT_SCAN_CONFIG): number[][] {
  const keyRows = Array.from({ length: Math.max(0, rowCount - 1) }, (_, k) => k + 1);
  const suggestions = rowCount > 0 ? [0] : [];
  if (config.pattern !== 'auto-group-row-key') {
    return [config.suggestionsAt === 'first' ? [...suggestions, ...keyRows] : [...keyRows, ...suggestions]];
  }
  let start = 0;
  const keyGroups = keyRowGroupSizes(keyRows.length).map((size) => keyRows.slice(start, (start += size)));
  const suggestionGroup = suggestions.length > 0 ? [suggestions] : [];
  return config.suggestionsAt === 'first'
    ? [...suggestionGroup, ...keyGroups]
    : [...keyGroups, ...suggestionGroup];
}

const hasGroupsLevel = (config: ScanConfig) => config.pattern === 'auto-group-row-key';
const startsWaiting = (config: ScanConfig) => config.pattern === 'step-one-switch';

type Ctx = { lengths: readonly number[]; groups: number[][]; config: ScanConfig };
const ctxOf = (lengths: readonly number[], config: ScanConfig): Ctx => ({
  lengths,
  groups: scanGroups(lengths.length, config),
  config,
});

const rowsOf = (c: Ctx, group: number) => (c.groups[group] ?? []).filter((row) => (c.lengths[row] ?? 0) > 0);
const groupIndexOf = (c: Ctx, row: number) => c.groups.findIndex((g) => g.includes(row));
/** The group a state is in (0 without a groups level: one group of every row). */
const groupOf = (c: Ctx, s: ScanState) =>
  hasGroupsLevel(c.config) ? (s.group ?? groupIndexOf(c, s.row)) : 0;
/** Whether a group is scanned through a rows level (not a lone row, which goes straight to its items). */
const hasRowsLevel = (c: Ctx, group: number) =>
  !hasGroupsLevel(c.config) || (c.groups[group]?.length ?? 0) > 1;

/** The entries of the state's level, in order. */
function entries(c: Ctx, s: ScanState): number[] {
  if (s.level === 'groups') return c.groups.map((_, g) => g).filter((g) => rowsOf(c, g).length > 0);
  if (s.level === 'rows') return rowsOf(c, groupOf(c, s));
  return Array.from({ length: c.lengths[s.row] ?? 0 }, (_, k) => k);
}
const currentOf = (s: ScanState) =>
  s.level === 'groups' ? (s.group ?? 0) : s.level === 'rows' ? s.row : s.item;

/** A state at a level with `entry` highlighted. */
function at(
  c: Ctx,
  level: ScanState['level'],
  entry: number,
  inside: { row: number; group: number },
): ScanState {
  const g = (group: number) => (hasGroupsLevel(c.config) ? { group } : {});
  if (level === 'groups')
    return { level, row: rowsOf(c, entry)[0] ?? 0, item: 0, idlePasses: 0, ...g(entry) };
  if (level === 'rows') return { level, row: entry, item: 0, idlePasses: 0, ...g(inside.group) };
  return { level, row: inside.row, item: entry, idlePasses: 0, ...g(inside.group) };
}
const waiting = (s: ScanState, wait: boolean): ScanState => (wait ? { ...s, waiting: true } : s);

/** The top level with its first entry highlighted (or, step one-switch, nothing); null with nothing to scan. */
function top(c: Ctx): ScanState | null {
  const groups = c.groups.map((_, g) => g).filter((g) => rowsOf(c, g).length > 0);
  if (groups.length === 0) return null;
  const state = hasGroupsLevel(c.config)
    ? at(c, 'groups', groups[0]!, { row: 0, group: 0 })
    : at(c, 'rows', rowsOf(c, 0)[0]!, { row: 0, group: 0 });
  return waiting(state, startsWaiting(c.config));
}

/** The state when scanning starts; null when there is nothing to scan. */
export function initialScanState(
  rowLengths: readonly number[],
  config: ScanConfig = DEFAULT_SCAN_CONFIG,
): ScanState | null {
  return top(ctxOf(rowLengths, config));
}

/** The level above a state's level, or null at the top. */
function parentLevel(c: Ctx, s: ScanState): 'groups' | 'rows' | null {
  if (s.level === 'items') return hasRowsLevel(c, groupOf(c, s)) ? 'rows' : 'groups';
  if (s.level === 'rows') return hasGroupsLevel(c.config) ? 'groups' : null;
  return null;
}

function up(c: Ctx, s: ScanState, level: 'groups' | 'rows'): ScanState {
  const group = groupOf(c, s);
  const state = at(c, level, level === 'groups' ? group : s.row, { row: s.row, group });
  return waiting(state, startsWaiting(c.config));
}

/**
 * Fits a state to rows whose lengths changed (the suggestion row grows and shrinks as one types).
 * A row that became empty or vanished: at rows level the next non-empty row (wrapping, across groups
 * when needed), at items level the same rule one level up (step, one switch: with nothing highlighted). An item past the row's end moves to the
 * last item. Null when every row is empty.
 */
export function fitScanState(
  state: ScanState | null,
  rowLengths: readonly number[],
  config: ScanConfig = DEFAULT_SCAN_CONFIG,
): ScanState | null {
  const c = ctxOf(rowLengths, config);
  if (state === null) return top(c);
  const fitted = fitInside(c, state);
  // Step, one switch: what takes the place of a vanished highlight is not highlighted by itself.
  return fitted !== null &&
    fitted !== state &&
    startsWaiting(config) &&
    (fitted.level !== state.level || fitted.row !== state.row)
    ? waiting(fitted, true)
    : fitted;
}

function fitInside(c: Ctx, state: ScanState): ScanState | null {
  const rowLengths = c.lengths;
  const group = groupOf(c, state);
  if (group < 0) return top(c);
  if (state.level === 'groups')
    return rowsOf(c, group).length > 0 ? state : nextFrom(c, state, 'groups', group);
  const length = rowLengths[state.row] ?? 0;
  if (length === 0) {
    const inGroup = rowsOf(c, group);
    if (inGroup.length === 0 || !hasRowsLevel(c, group)) return nextFrom(c, state, 'groups', group);
    return nextFrom(c, state, 'rows', state.row);
  }
  if (state.level === 'items' && state.item >= length) return { ...state, item: length - 1 };
  return state;
}

/** The first non-empty group or row at or after a vanished one (wrapping), at its own level. */
function nextFrom(c: Ctx, s: ScanState, level: 'groups' | 'rows', from: number): ScanState | null {
  if (level === 'groups' && hasGroupsLevel(c.config)) {
    const n = c.groups.length;
    for (let k = 0; k < n; k++) {
      const g = (from + k) % n;
      if (rowsOf(c, g).length > 0) return at(c, 'groups', g, { row: 0, group: g });
    }
    return null;
  }
  // Rows: in scan order, starting from the vanished row's place.
  const order = c.groups.flat();
  const place = Math.max(0, order.indexOf(from));
  for (let k = 0; k < order.length; k++) {
    const row = order[(place + k) % order.length]!;
    if ((c.lengths[row] ?? 0) > 0) {
      const g = groupIndexOf(c, row);
      return hasGroupsLevel(c.config) && g !== groupOf(c, s)
        ? at(c, 'groups', g, { row, group: g })
        : at(c, 'rows', row, { row, group: g });
    }
  }
  return null;
}

/**
 * One step forward: a scan interval without a press (automatic), a press (step, one switch) or the
 * move switch (step, two switches). Past the last entry the level wraps; the second wrap without a
 * choice goes up one level (not at the top).
 */
export function scanAdvance(
  state: ScanState | null,
  rowLengths: readonly number[],
  config: ScanConfig = DEFAULT_SCAN_CONFIG,
): ScanState | null {
  const c = ctxOf(rowLengths, config);
  const s = fitScanState(state, rowLengths, config);
  if (s === null) return null;
  const list = entries(c, s);
  const inside = { row: s.row, group: groupOf(c, s) };
  if (s.waiting) return at(c, s.level, list[0]!, inside);
  const place = list.indexOf(currentOf(s));
  if (place + 1 < list.length)
    return { ...at(c, s.level, list[place + 1]!, inside), idlePasses: s.idlePasses };
  const parent = parentLevel(c, s);
  if (parent === null) return at(c, s.level, list[0]!, inside);
  const idlePasses = s.idlePasses + 1;
  if (idlePasses >= IDLE_PASSES_BEFORE_ROWS) return up(c, s, parent);
  return { ...at(c, s.level, list[0]!, inside), idlePasses };
}

/**
 * Chooses the highlighted entry: a switch press (automatic), the wait of the acceptance time (step,
 * one switch) or the select switch (step, two switches). A group or row is entered; an item is
 * selected and scanning starts again at the top. Nothing happens while nothing is highlighted.
 */
export function scanChoose(
  state: ScanState | null,
  rowLengths: readonly number[],
  config: ScanConfig = DEFAULT_SCAN_CONFIG,
): { state: ScanState | null; selected: { row: number; item: number } | null } {
  const c = ctxOf(rowLengths, config);
  const s = fitScanState(state, rowLengths, config);
  if (s === null) return { state: null, selected: null };
  if (s.waiting) return { state: s, selected: null };
  const wait = startsWaiting(config);
  if (s.level === 'items') return { state: top(c), selected: { row: s.row, item: s.item } };
  if (s.level === 'rows') {
    return { state: waiting(at(c, 'items', 0, { row: s.row, group: groupOf(c, s) }), wait), selected: null };
  }
  const group = s.group ?? 0;
  const first = rowsOf(c, group)[0]!;
  const entered = hasRowsLevel(c, group)
    ? at(c, 'rows', first, { row: first, group })
    : at(c, 'items', 0, { row: first, group });
  return { state: waiting(entered, wait), selected: null };
}

/** Automatic row–column: one scan interval passes without a press. */
export const scanTick = (state: ScanState | null, rowLengths: readonly number[]) =>
  scanAdvance(state, rowLengths);
/** Automatic row–column: a switch press. */
export const scanPress = (state: ScanState | null, rowLengths: readonly number[]) =>
  scanChoose(state, rowLengths);
