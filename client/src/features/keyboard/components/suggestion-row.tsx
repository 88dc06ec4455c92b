import type { KeySpacing } from '@keyloom/shared';
import { useEffect, useLayoutEffect, useRef, useState } from 'react';
import { measureRowUpdate } from '../engine/latency-marks';
import { DwellFill } from './dwell-fill';
import type { DwellView } from './key-grid';
import { useElementWidth } from '../hooks/use-element-width';
import { chosenStyle, keySpacingPx, rowColumns, targetClasses, targetSize } from '../logic/keyboard-styles';
import { cn } from '@/lib/cn';
import { ANNOUNCE_DELAY_MS, describeRow, slotTargetId } from '../logic/trial-figures';

type SuggestionRowProps = {
  slots: number;
  /** The words of the newest answer (fewer than `slots` leaves the last slots empty). */
  words: readonly string[];
  /** The key press the words answer; measured once it is on screen. */
  seq: number | null;
  /** The text the words answer (tests wait until it matches the text on screen). */
  answersText?: string | null;
  /** The worker's own time for this answer, ms (shown to the browser test beside the latency). */
  engineMs?: number | null;
  onPick: (slot: number, word: string) => void;
  highContrast: boolean;
  largeTargets: boolean;
  reduceMotion: boolean;
  textScale: number;
  /** The scanner is on this row (all of it), or on one of its slots. */
  scan: { level: 'rows' | 'items'; item: number } | null;
  dwell: DwellView;
  /** The gap between slots (small, the default, is 8 px). */
  keySpacing?: KeySpacing;
};

/**
 * The row of word suggestions. Slots keep their places (an empty slot stays, empty), each names its
 * word for screen readers, and a polite live region reads the row once it has settled. Nothing is
 * ever inserted without a pick.
 */
export const SuggestionRow = ({
  slots,
  words,
  seq,
  answersText,
  engineMs,
  onPick,
  highContrast,
  largeTargets,
  reduceMotion,
  textScale,
  scan,
  dwell,
  keySpacing = 'small',
}: SuggestionRowProps) => {
  const gap = keySpacingPx[keySpacing];
  const [announcement, setAnnouncement] = useState('');
  const lastAnnounced = useRef<string | null>(null);
  const summary = describeRow(words);

  // The time from key press to this row on screen (performance marks read by the browser test;
  // a row that answers no key press, e.g. the first one, has no mark and is skipped).
  useLayoutEffect(() => {
    if (seq !== null) measureRowUpdate(seq);
  }, [seq]);

  useEffect(() => {
    const timer = window.setTimeout(() => {
      if (summary === lastAnnounced.current) return;
      lastAnnounced.current = summary;
      setAnnouncement(summary);
    }, ANNOUNCE_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [summary]);

  const rowScanned = scan?.level === 'rows';
  // The row's content width (inside its padding), for wrapping large targets evenly.
  const [widthRef, rowWidth] = useElementWidth<HTMLDivElement>();
  return (
    <div className="flex flex-col gap-1">
      <div
        ref={widthRef}
        role="group"
        aria-label="Suggestions"
        data-seq={seq ?? undefined}
        data-answers={answersText ?? undefined}
        data-engine-ms={engineMs ?? undefined}
        data-scan-row={rowScanned ? 'on' : undefined}
        className={cn(
          'grid rounded-xl p-1',
          rowScanned && (highContrast ? 'outline-6 outline-[#ffff00]' : 'outline-6 outline-rust'),
        )}
        style={{
          gap: `${gap}px`,
          gridTemplateColumns: rowColumns(Math.min(slots, 5), largeTargets, gap, rowWidth),
          fontSize: `min(${(largeTargets ? 1.5 : 1.2) * textScale}rem, 4.5vw)`,
        }}
      >
        {Array.from({ length: slots }, (_, slot) => {
          const word = words[slot];
          const scanned = rowScanned || (scan?.level === 'items' && scan.item === slot);
          const id = slotTargetId(slot);
          const chosen = Boolean(word) && dwell?.chosenId === id;
          return (
            <button
              key={slot}
              type="button"
              disabled={!word}
              // The name starts with the visible word (WCAG 2.5.3); an empty slot shows no word.
              aria-label={word ? `${word} (suggestion ${slot + 1})` : `Suggestion ${slot + 1}: empty`}
              data-scanned={scanned ? 'on' : undefined}
              data-chosen={chosen ? 'on' : undefined}
              className={cn(
                targetClasses({ highContrast, largeTargets, scanned, chosen, reduceMotion }),
                !word && (highContrast ? 'border-dashed' : 'border-dashed border-field-border'),
              )}
              style={{
                ...(highContrast
                  ? scanned
                    ? { backgroundColor: '#ffff00', color: '#000000' }
                    : { backgroundColor: '#000000', color: '#ffffff' }
                  : {
                      backgroundColor: scanned ? '#fef3d8' : word ? '#ffffff' : '#f3ede0',
                      color: '#1d2b4f',
                    }),
                ...targetSize(largeTargets),
                ...(chosen ? chosenStyle(highContrast) : {}),
              }}
              onClick={() => word && onPick(slot, word)}
              {...(word ? dwell?.targetProps(id) : {})}
            >
              <span aria-hidden="true">{word ?? '\u00a0'}</span>
              {dwell && word && dwell.activeId === id && (
                <DwellFill progress={dwell.progress} reduceMotion={reduceMotion} />
              )}
            </button>
          );
        })}
      </div>
      <p role="status" aria-live="polite" aria-atomic="true" className="sr-only">
        {announcement}
      </p>
    </div>
  );
};
