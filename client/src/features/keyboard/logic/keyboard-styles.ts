import type { KeySpacing } from '@keyloom/shared';
import { cn } from '@/lib/cn';

/**
 * The smallest width and height of every key and suggestion slot with large targets on, CSS px.
 * WCAG 2.2 SC 2.5.5 Target Size (Enhanced) asks for 44×44 CSS px; Keyloom applies 64×64 for pointer
 * and gaze users (common practice, no source for 64).
 */
export const LARGE_TARGET_PX = 64;

/** The gap between keys, between key rows and between suggestion slots, CSS px (small is the old gap). */
export const keySpacingPx: Record<KeySpacing, number> = { small: 8, medium: 16, large: 24 };

/**
 * The columns of a row of `columns` units. Without large targets the row always has `columns` equal
 * columns (they shrink on a narrow screen). With large targets a column is never narrower than
 * LARGE_TARGET_PX: as many columns as fit, at most `columns`, so a narrow screen wraps the row onto
 * more lines, keys in the same order.
 */
export const rowColumns = (
  columns: number,
  largeTargets: boolean,
  gapPx: number,
  widthPx: number | null = null,
): string =>
  !largeTargets
    ? `repeat(${columns}, minmax(0, 1fr))`
    : widthPx !== null && widthPx > 0
      ? `repeat(${wrappedColumns(columns, widthPx, gapPx)}, minmax(0, 1fr))`
      : `repeat(auto-fill, minmax(max(${LARGE_TARGET_PX}px, calc((100% - ${(columns - 1) * gapPx}px) / ${columns})), 1fr))`;

/**
 * Columns of a wrapped row with large targets, when the row's width is known: as many as fit at
 * LARGE_TARGET_PX, but spread evenly over the lines the row needs, so 9 keys where 4 fit make three
 * lines of 3 rather than 4, 4 and a lone key. At least 1; never more than `columns`.
 * @param columns the row's width in key units
 * @param widthPx the width the row may fill, CSS px
 * @param gapPx the gap between keys, CSS px
 */
export const wrappedColumns = (columns: number, widthPx: number, gapPx: number): number => {
  const fit = Math.max(1, Math.floor((widthPx + gapPx) / (LARGE_TARGET_PX + gapPx)));
  if (columns <= fit) return columns;
  const lines = Math.ceil(columns / fit);
  return Math.ceil(columns / lines);
};

/** The least size of a target: 64×64 px with large targets, else none beyond its classes. */
export const targetSize = (largeTargets: boolean): { minWidth?: string; minHeight?: string } =>
  largeTargets ? { minWidth: `${LARGE_TARGET_PX}px`, minHeight: `${LARGE_TARGET_PX}px` } : {};

/**
 * Colours of a target just chosen (the "chosen" flash, about 250 ms): ink-dark with white text, or
 * white with black text in high contrast — a change from every other state of a key.
 */
export const chosenStyle = (highContrast: boolean): { backgroundColor: string; color: string } =>
  highContrast
    ? { backgroundColor: '#ffffff', color: '#000000' }
    : { backgroundColor: '#1d2b4f', color: '#ffffff' };

/** How a target of the keyboard is drawn: its modes and what is happening to it right now. */
export type TargetLook = {
  highContrast: boolean;
  largeTargets: boolean;
  /** Highlighted by the scanner (its row or itself). */
  scanned?: boolean;
  /** One of the three likeliest next letters (tint mode): a thick border as a cue beside colour. */
  strongCue?: boolean;
  /** Just chosen (the chosen flash): a thick outline outside the key. */
  chosen?: boolean;
  /** Colours change without a transition. */
  reduceMotion?: boolean;
};

/** Class names of a key or suggestion button. */
export const targetClasses = ({
  highContrast,
  largeTargets,
  scanned,
  strongCue,
  chosen,
  reduceMotion,
}: TargetLook): string =>
  cn(
    'relative isolate flex w-full min-w-0 items-center justify-center overflow-hidden rounded-lg px-1 font-bold [overflow-wrap:anywhere] select-none',
    // Large: at least 64×64 (LARGE_TARGET_PX, also set by targetSize).
    largeTargets ? 'min-h-16 min-w-16' : 'min-h-12',
    !reduceMotion && 'transition-colors duration-150',
    strongCue ? 'border-4' : 'border-2',
    highContrast
      ? cn(strongCue || scanned ? 'border-white' : 'border-[#ffff00]')
      : cn(strongCue ? 'border-ink-deep' : 'border-ink', 'hover:brightness-95'),
    scanned &&
      (highContrast
        ? 'outline-6 outline-black -outline-offset-8'
        : 'outline-6 outline-rust -outline-offset-8'),
    chosen &&
      (highContrast
        ? 'outline-6 outline-[#ffff00] outline-offset-0'
        : 'outline-6 outline-rust outline-offset-0'),
  );

/**
 * The background of a key: plain, or saffron whose strength follows the letter's probability. High
 * contrast keeps to black, white and yellow: the likeliest letters turn yellow, the rest stay black.
 * @param probability the letter's probability of coming next (0–1), or null when not tinted
 * @param top whether it is one of the three likeliest
 */
export const tintStyle = (
  probability: number | null,
  top: boolean,
  highContrast: boolean,
  scanned: boolean,
): { backgroundColor: string; color: string } => {
  if (highContrast) {
    return scanned || (probability !== null && top)
      ? { backgroundColor: '#ffff00', color: '#000000' }
      : { backgroundColor: '#000000', color: '#ffffff' };
  }
  if (scanned) return { backgroundColor: '#fef3d8', color: '#1d2b4f' };
  if (probability === null) return { backgroundColor: '#ffffff', color: '#1d2b4f' };
  // Square root so middling probabilities stay visible; ink on full saffron is still 7.5:1.
  const strength = Math.min(1, Math.sqrt(Math.max(0, probability)));
  return { backgroundColor: `rgba(245, 179, 53, ${strength.toFixed(3)})`, color: '#1d2b4f' };
};
