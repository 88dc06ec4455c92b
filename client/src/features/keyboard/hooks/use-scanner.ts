// Single-switch row–column scanning over the suggestion row and the key grid (logic/scanner.ts)
// driven by a timer; Space or Enter is the switch while scanning runs.
import { useCallback, useEffect, useRef, useState } from 'react';
import { fitScanState, initialScanState, scanPress, type ScanState, scanTick } from '../logic/scanner';

export type { ScanState } from '../logic/scanner';

export type ScannerOptions = {
  /** When false, scanning stops and the switch keys are left alone. */
  enabled: boolean;
  /** Time the highlight stays on each row or item, ms (≥ 100). */
  intervalMs: number;
  /** Items in each scanned row, in order (an empty row is skipped). */
  rowLengths: number[];
  /** A press selected item `item` of row `row`. */
  onSelect: (row: number, item: number) => void;
  /** Called for every switch press (log it as a `switch` step). */
  onSwitch: () => void;
};

const SWITCH_KEYS = new Set([' ', 'Spacebar', 'Enter']);

/**
 * Runs row–column scanning. While running, a keydown of Space or Enter anywhere in the document
 * is the switch (its default is prevented, so the page neither scrolls nor clicks the focused
 * control); a held key does not repeat; Escape stops. After a press the highlight stays a whole
 * interval before moving on.
 */
export function useScanner(o: ScannerOptions): {
  state: ScanState | null;
  running: boolean;
  start: () => void;
  stop: () => void;
} {
  const { enabled, intervalMs } = o;
  const [running, setRunning] = useState(false);
  const [state, setState] = useState<ScanState | null>(null);
  // The timer restarts after each press (so the highlight holds for a full interval).
  const [pressCount, setPressCount] = useState(0);

  const stateRef = useRef<ScanState | null>(null);
  const optionsRef = useRef(o);
  useEffect(() => {
    optionsRef.current = o;
  });

  const update = useCallback((next: ScanState | null) => {
    stateRef.current = next;
    setState(next);
  }, []);

  const start = useCallback(() => {
    // Scanning starts only where it is the selection mode in use.
    if (!optionsRef.current.enabled) return;
    update(initialScanState(optionsRef.current.rowLengths));
    setRunning(true);
  }, [update]);

  const stop = useCallback(() => {
    setRunning(false);
    update(null);
  }, [update]);

  const active = running && enabled;

  // Keep the highlight valid when the rows change (the suggestion row grows and shrinks).
  const lengthsKey = o.rowLengths.join(',');
  useEffect(() => {
    if (!active) return;
    const fitted = fitScanState(stateRef.current, optionsRef.current.rowLengths);
    if (fitted !== stateRef.current) update(fitted);
  }, [active, lengthsKey, update]);

  useEffect(() => {
    if (!active) return;
    const timer = setInterval(
      () => {
        update(scanTick(stateRef.current, optionsRef.current.rowLengths));
      },
      Math.max(100, intervalMs),
    );
    return () => clearInterval(timer);
  }, [active, intervalMs, pressCount, update]);

  useEffect(() => {
    if (!active) return;
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.key === 'Escape') {
        event.preventDefault();
        stop();
        return;
      }
      if (!SWITCH_KEYS.has(event.key)) return;
      event.preventDefault();
      if (event.repeat) return;
      const options = optionsRef.current;
      options.onSwitch();
      const { state: next, selected } = scanPress(stateRef.current, options.rowLengths);
      update(next);
      setPressCount((n) => n + 1);
      if (selected) options.onSelect(selected.row, selected.item);
    };
    // A focused button clicks on the keyup of Space: stop that too while Space is the switch.
    const onKeyUp = (event: KeyboardEvent) => {
      if (SWITCH_KEYS.has(event.key)) event.preventDefault();
    };
    document.addEventListener('keydown', onKeyDown);
    document.addEventListener('keyup', onKeyUp);
    return () => {
      document.removeEventListener('keydown', onKeyDown);
      document.removeEventListener('keyup', onKeyUp);
    };
  }, [active, stop, update]);

  // Turning the option off ends a running scan.
  useEffect(() => {
    if (!enabled) return;
    return stop;
  }, [enabled, stop]);

  return { state: active ? state : null, running: active, start, stop };
}
