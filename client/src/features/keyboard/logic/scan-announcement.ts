import { type ScanConfig, scanGroups, type ScanState } from './scanner';

/** Keys of a row said before "…" (a whole row of ten keys takes too long to hear at every step). */
export const ANNOUNCED_ROW_KEYS = 5;

/** A key as the announcement says it: its accessible name. */
type SpokenKey = { spokenLabel: string };

/**
 * What the scanner highlights, as a short sentence for a polite live region: "Suggestions",
 * "Row 2: a s d f g …", "Key: e", "Suggestion: tea", and in group–row–key "Group: rows 1 to 3".
 * Key rows are counted from 1 (the suggestion row is not numbered). Empty when nothing is highlighted.
 * @param state the scanner's state, null when it is not running
 * @param words the suggestion row's words (scanner row 0)
 * @param keyRows the key rows (scanner rows 1…)
 */
export function describeScanHighlight(
  state: ScanState | null,
  words: readonly string[],
  keyRows: readonly (readonly SpokenKey[])[],
  config: ScanConfig,
): string {
  if (!state || state.waiting) return '';
  if (state.level === 'groups') {
    const rows = scanGroups(keyRows.length + 1, config)[state.group ?? 0] ?? [];
    const keys = rows.filter((row) => row > 0);
    if (keys.length === 0) return rows.length > 0 ? 'Suggestions' : '';
    const first = keys[0]!;
    const last = keys[keys.length - 1]!;
    return first === last ? `Group: row ${first}` : `Group: rows ${first} to ${last}`;
  }
  if (state.level === 'rows') {
    if (state.row === 0) return 'Suggestions';
    const keys = keyRows[state.row - 1] ?? [];
    const said = keys.slice(0, ANNOUNCED_ROW_KEYS).map((key) => key.spokenLabel);
    return `Row ${state.row}: ${said.join(' ')}${keys.length > ANNOUNCED_ROW_KEYS ? ' …' : ''}`;
  }
  if (state.row === 0) {
    const word = words[state.item];
    return word ? `Suggestion: ${word}` : '';
  }
  const key = keyRows[state.row - 1]?.[state.item];
  return key ? `Key: ${key.spokenLabel}` : '';
}
