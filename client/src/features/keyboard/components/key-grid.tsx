import { memo, type KeyboardEvent, useCallback, useEffect, useRef, useState } from 'react';
import type { KeySpacing } from '@keyloom/shared';
import type { KeyDef } from '../logic/layouts';
import { useElementWidth } from '../hooks/use-element-width';
import { DwellFill } from './dwell-fill';
import {
  chosenStyle,
  keySpacingPx,
  rowColumns,
  wrappedColumns,
  targetClasses,
  targetSize,
  tintStyle,
} from '../logic/keyboard-styles';
import { cn } from '@/lib/cn';

/** Where the scanner is inside the key grid (rows counted from the first key row). */
export type GridScan = { level: 'rows' | 'items'; row: number; item: number } | null;

export type DwellView = {
  activeId: string | null;
  progress: number;
  /** The target just chosen by dwell (its "chosen" flash), or null. */
  chosenId?: string | null;
  targetProps: (id: string) => { onPointerEnter: () => void; onPointerLeave: () => void };
} | null;

type KeyGridProps = {
  rows: readonly KeyDef[][];
  onSelect: (key: KeyDef) => void;
  highContrast: boolean;
  largeTargets: boolean;
  reduceMotion: boolean;
  textScale: number;
  /** Next-letter probabilities when tinting is on, else null. */
  letterProbabilities: ReadonlyMap<string, number> | null;
  scan: GridScan;
  dwell: DwellView;
  /**
   * Group–row–key: the highlighted group's key rows, 1-based and space-separated (the section's
   * `data-scan-group`), kept in sight; else none.
   */
  scanGroup?: string;
  /** The gap between keys and between rows (small, the default, is 8 px). */
  keySpacing?: KeySpacing;
};

/** Columns a key takes: the space bar three, delete and the function keys two, every other key one. */
const WIDE: ReadonlySet<KeyDef['kind']> = new Set([
  'backspace',
  'newline',
  'delete_word',
  'undo_pick',
  'shift',
  'layer',
]);
const span = (key: KeyDef): number => (key.kind === 'space' ? 3 : WIDE.has(key.kind) ? 2 : 1);

const moves: Record<string, [number, number]> = {
  ArrowLeft: [0, -1],
  ArrowRight: [0, 1],
  ArrowUp: [-1, 0],
  ArrowDown: [1, 0],
};

/**
 * The key grid: one Tab stop, arrow keys move between keys (roving tabindex), Home and End jump
 * to the ends of a row. Keys are tinted by the model (with a thick border on the three likeliest),
 * filled while a dwell runs, and outlined where the scanner is.
 */
// Memoised: a key press re-renders the page, but the grid only when its own props change.
export const KeyGrid = memo(function KeyGrid({
  rows,
  onSelect,
  highContrast,
  largeTargets,
  reduceMotion,
  textScale,
  letterProbabilities,
  scan,
  dwell,
  keySpacing = 'small',
  scanGroup,
}: KeyGridProps) {
  const gap = keySpacingPx[keySpacing];
  // A row is the group's width less its own padding (p-1, 4 px a side).
  const [widthRef, groupWidth] = useElementWidth<HTMLDivElement>();
  const rowWidth = groupWidth === null ? null : groupWidth - 8;
  const [focus, setFocus] = useState<[number, number]>([0, 0]);
  const refs = useRef(new Map<string, HTMLButtonElement>());
  // Keep the roving position inside the grid when the layout changes.
  const row = Math.min(focus[0], rows.length - 1);
  const col = Math.min(focus[1], (rows[row]?.length ?? 1) - 1);

  const top = new Set(
    letterProbabilities
      ? [...letterProbabilities.entries()]
          .sort((a, b) => b[1] - a[1])
          .slice(0, 3)
          .map(([char]) => char)
      : [],
  );

  // Where the view scrolls (large targets wrapped on a small screen), the scanned row or key is
  // brought into sight, so a switch user always sees the highlight.
  const groupRef = useRef<HTMLDivElement | null>(null);
  const groupRefs = useCallback(
    (element: HTMLDivElement | null) => {
      groupRef.current = element;
      widthRef(element);
    },
    [widthRef],
  );
  const scanRow = scan?.row ?? null;
  const scanItem = scan?.level === 'items' ? scan.item : null;
  // Group–row–key: the highlighted group's rows (outlined by index.css).
  useEffect(() => {
    if (!scanGroup) return;
    const rowsOfGroup = scanGroup.split(' ').map((row) => Number(row) - 1);
    const children = groupRef.current?.children;
    // The last row first, then the first: the whole group in sight where it fits, its top where not.
    children?.[rowsOfGroup.at(-1)!]?.scrollIntoView?.({ block: 'nearest' });
    children?.[rowsOfGroup[0]!]?.scrollIntoView?.({ block: 'nearest' });
  }, [scanGroup]);
  useEffect(() => {
    if (scanRow === null) return;
    const rowElement = groupRef.current?.children[scanRow];
    const target = scanItem === null ? rowElement : rowElement?.children[scanItem];
    target?.scrollIntoView?.({ block: 'nearest' });
  }, [scanRow, scanItem]);

  const moveFocus = (event: KeyboardEvent<HTMLButtonElement>, r: number, c: number) => {
    let next: [number, number] | null = null;
    const move = moves[event.key];
    if (move) {
      const nr = Math.min(rows.length - 1, Math.max(0, r + move[0]));
      const nc = Math.min(rows[nr]!.length - 1, Math.max(0, move[0] === 0 ? c + move[1] : c));
      next = [nr, nc];
    } else if (event.key === 'Home') next = [r, 0];
    else if (event.key === 'End') next = [r, rows[r]!.length - 1];
    if (!next) return;
    event.preventDefault();
    setFocus(next);
    refs.current.get(rows[next[0]]![next[1]]!.id)?.focus();
  };

  return (
    <div
      ref={groupRefs}
      role="group"
      aria-label="Keys"
      data-key-spacing={keySpacing}
      className="flex flex-col"
      // Capped by the window's width so a letter never outgrows its key on a narrow screen.
      style={{ gap: `${gap}px`, fontSize: `min(${(largeTargets ? 1.6 : 1.3) * textScale}rem, 7vw)` }}
    >
      {rows.map((keys, r) => {
        const rowScanned = scan?.level === 'rows' && scan.row === r;
        const units = keys.reduce((sum, k) => sum + span(k), 0);
        // A wide key never spans more columns than a wrapped row has.
        const columns = largeTargets && rowWidth !== null ? wrappedColumns(units, rowWidth, gap) : units;
        return (
          <div
            key={r}
            data-scan-row={rowScanned ? 'on' : undefined}
            className={cn(
              'grid rounded-xl p-1',
              rowScanned && (highContrast ? 'outline-6 outline-[#ffff00]' : 'outline-6 outline-rust'),
            )}
            style={{
              gap: `${gap}px`,
              // With large targets a narrow screen wraps the row (the same row for arrows and the scanner).
              gridTemplateColumns: rowColumns(units, largeTargets, gap, rowWidth),
            }}
          >
            {keys.map((key, c) => {
              const scanned = rowScanned || (scan?.level === 'items' && scan.row === r && scan.item === c);
              const p =
                key.kind === 'letter' && letterProbabilities
                  ? (letterProbabilities.get(key.value) ?? 0)
                  : null;
              const strongCue = p !== null && top.has(key.value);
              const chosen = dwell?.chosenId === key.id;
              return (
                <button
                  key={key.id}
                  ref={(element) => {
                    if (element) refs.current.set(key.id, element);
                    else refs.current.delete(key.id);
                  }}
                  type="button"
                  tabIndex={r === row && c === col ? 0 : -1}
                  aria-label={key.spokenLabel}
                  aria-pressed={key.pressed}
                  aria-disabled={key.disabled ? true : undefined}
                  data-key={key.id}
                  data-scanned={scanned ? 'on' : undefined}
                  data-chosen={chosen ? 'on' : undefined}
                  className={cn(
                    targetClasses({ highContrast, largeTargets, scanned, strongCue, chosen, reduceMotion }),
                    key.disabled && 'opacity-50',
                  )}
                  style={{
                    gridColumn: `span ${Math.min(span(key), columns)} / span ${Math.min(span(key), columns)}`,
                    ...tintStyle(p, strongCue, highContrast, scanned),
                    ...targetSize(largeTargets),
                    ...(chosen ? chosenStyle(highContrast) : {}),
                  }}
                  onClick={() => {
                    setFocus([r, c]);
                    if (!key.disabled) onSelect(key);
                  }}
                  onFocus={() => setFocus([r, c])}
                  onKeyDown={(event) => moveFocus(event, r, c)}
                  {...dwell?.targetProps(key.id)}
                >
                  <span
                    aria-hidden="true"
                    style={key.label.length > 1 ? { fontSize: 'min(0.85em, 3.6vw)' } : undefined}
                  >
                    {key.label}
                  </span>
                  {dwell && dwell.activeId === key.id && (
                    <DwellFill progress={dwell.progress} reduceMotion={reduceMotion} />
                  )}
                </button>
              );
            })}
          </div>
        );
      })}
    </div>
  );
});
