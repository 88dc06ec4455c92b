// Scanning over the suggestion row and the key grid (logic/scanner.ts) in the chosen pattern.
// Automatic patterns: a timer moves the highlight; Space or Enter is the switch. Step, one switch:
// Space (or Enter) moves one step; a pause of the acceptance time chooses. Step, two switches:
// Space moves, Enter chooses; no timer. A trial can pause the scan (it goes on where it was), take
// Escape for itself and hear a long press of the switch.
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import {
  fitScanState,
  initialScanState,
  scanAdvance,
  scanChoose,
  type ScanConfig,
  type ScanPattern,
  type ScanState,
  type SuggestionsAt,
} from '../logic/scanner';

export type { ScanState } from '../logic/scanner';

export type ScannerOptions = {
  /** When false, scanning stops and the switch keys are left alone. */
  enabled: boolean;
  /** Time the highlight stays on each row or item, ms (≥ 100; automatic patterns). */
  intervalMs: number;
  /** The scanning pattern (default automatic row–column). */
  pattern?: ScanPattern;
  /** The suggestion row (row 0) scanned first or last (default first). */
  suggestionsAt?: SuggestionsAt;
  /** Step, one switch: ms without a press before the highlighted entry is chosen (≥ 100). */
  acceptMs?: number;
  /** Items in each scanned row, in order (an empty row is skipped). */
  rowLengths: number[];
  /** A press selected item `item` of row `row`. */
  onSelect: (row: number, item: number) => void;
  /** Called for every switch press (log it as a `switch` step); two switches say which one. */
  onSwitch: (value?: 'move' | 'select') => void;
  /**
   * While true the highlight stays where it is: no timer moves or chooses, and the switch keys and
   * Escape are left alone (a paused trial). Scanning goes on from there when it turns false.
   */
  paused?: boolean;
  /** Escape calls this instead of stopping the scan (a trial pauses). */
  onEscape?: () => void;
  /** A switch key held down for `longPressMs` calls this once (a trial pauses). */
  onLongPress?: () => void;
  /** How long a press must be held to count as a long press, ms (default LONG_PRESS_MS). */
  longPressMs?: number;
};

/** A switch held this long is a long press, ms (common practice, no source). */
export const LONG_PRESS_MS = 2000;

const SWITCH_KEYS = new Set([' ', 'Spacebar', 'Enter']);
const MOVE_KEYS = new Set([' ', 'Spacebar']);

/**
 * Runs scanning. While running, a keydown of Space or Enter anywhere in the document is a switch
 * (its default is prevented, so the page neither scrolls nor clicks the focused control); a held key
 * does not repeat; Escape stops (or calls `onEscape`); a key held for `longPressMs` calls `onLongPress`. Automatic: after a press the highlight stays a whole interval before
 * moving on. Step, one switch: the acceptance time counts from the last press.
 */
export function useScanner(o: ScannerOptions): {
  state: ScanState | null;
  running: boolean;
  start: () => void;
  stop: () => void;
} {
  const { enabled, intervalMs } = o;
  const pattern = o.pattern ?? 'auto-row-column';
  const suggestionsAt = o.suggestionsAt ?? 'first';
  const acceptMs = o.acceptMs ?? 1500;
  const config: ScanConfig = useMemo(() => ({ pattern, suggestionsAt }), [pattern, suggestionsAt]);
  const configRef = useRef(config);
  const automatic = pattern === 'auto-row-column' || pattern === 'auto-group-row-key';
  const [running, setRunning] = useState(false);
  const [state, setState] = useState<ScanState | null>(null);
  // The timer restarts after each press (so the highlight holds for a full interval).
  const [pressCount, setPressCount] = useState(0);

  const stateRef = useRef<ScanState | null>(null);
  const optionsRef = useRef(o);
  useEffect(() => {
    optionsRef.current = o;
    configRef.current = config;
  });

  const update = useCallback((next: ScanState | null) => {
    stateRef.current = next;
    setState(next);
  }, []);

  const start = useCallback(() => {
    // Scanning starts only where it is the selection mode in use.
    if (!optionsRef.current.enabled) return;
    update(initialScanState(optionsRef.current.rowLengths, configRef.current));
    setRunning(true);
  }, [update]);

  const stop = useCallback(() => {
    setRunning(false);
    update(null);
  }, [update]);

  const active = running && enabled;
  // Running and not paused: the timers run and the switch keys are taken.
  const live = active && !o.paused;
  // A switch key is down (a long press may be coming); released presses restart the acceptance time.
  const holdingRef = useRef(false);
  const [releaseCount, setReleaseCount] = useState(0);

  // Keep the highlight valid when the rows change (the suggestion row grows and shrinks).
  const lengthsKey = o.rowLengths.join(',');
  useEffect(() => {
    if (!active) return;
    const fitted = fitScanState(stateRef.current, optionsRef.current.rowLengths, configRef.current);
    if (fitted !== stateRef.current) update(fitted);
  }, [active, lengthsKey, update]);

  // A new pattern or suggestion place starts the scan again at the top.
  useEffect(() => {
    if (active) update(initialScanState(optionsRef.current.rowLengths, config));
  }, [active, config, update]);

  const choose = useCallback(() => {
    const options = optionsRef.current;
    const { state: next, selected } = scanChoose(stateRef.current, options.rowLengths, configRef.current);
    update(next);
    if (selected) options.onSelect(selected.row, selected.item);
  }, [update]);

  // Automatic: the highlight moves at every interval.
  useEffect(() => {
    if (!live || !automatic) return;
    const timer = setInterval(
      () => {
        update(scanAdvance(stateRef.current, optionsRef.current.rowLengths, configRef.current));
      },
      Math.max(100, intervalMs),
    );
    return () => clearInterval(timer);
  }, [live, automatic, intervalMs, pressCount, update]);

  // Step, one switch: the acceptance time after the last press chooses what is highlighted. While
  // the switch is still held (a long press may be coming) nothing is chosen; its release starts the
  // acceptance time again.
  useEffect(() => {
    if (!live || pattern !== 'step-one-switch' || pressCount === 0) return;
    if (stateRef.current === null || stateRef.current.waiting) return;
    const timer = setTimeout(
      () => {
        if (holdingRef.current && optionsRef.current.onLongPress) return;
        choose();
      },
      Math.max(100, acceptMs),
    );
    return () => clearTimeout(timer);
  }, [live, pattern, acceptMs, pressCount, releaseCount, choose]);

  useEffect(() => {
    if (!live) return;
    let longPress: ReturnType<typeof setTimeout> | null = null;
    const endHold = () => {
      holdingRef.current = false;
      if (longPress !== null) clearTimeout(longPress);
      longPress = null;
    };
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.key === 'Escape') {
        event.preventDefault();
        const { onEscape } = optionsRef.current;
        if (onEscape) onEscape();
        else stop();
        return;
      }
      if (!SWITCH_KEYS.has(event.key)) return;
      event.preventDefault();
      if (event.repeat) return;
      const options = optionsRef.current;
      if (options.onLongPress) {
        endHold();
        holdingRef.current = true;
        longPress = setTimeout(() => {
          endHold();
          optionsRef.current.onLongPress?.();
        }, options.longPressMs ?? LONG_PRESS_MS);
      }
      const { pattern: now } = configRef.current;
      if (now === 'step-two-switch') {
        const move = MOVE_KEYS.has(event.key);
        options.onSwitch(move ? 'move' : 'select');
        if (move) update(scanAdvance(stateRef.current, options.rowLengths, configRef.current));
        else choose();
      } else if (now === 'step-one-switch') {
        options.onSwitch();
        update(scanAdvance(stateRef.current, options.rowLengths, configRef.current));
      } else {
        options.onSwitch();
        choose();
      }
      setPressCount((n) => n + 1);
    };
    // A focused button clicks on the keyup of Space: stop that too while Space is the switch.
    const onKeyUp = (event: KeyboardEvent) => {
      if (!SWITCH_KEYS.has(event.key)) return;
      event.preventDefault();
      if (holdingRef.current) setReleaseCount((n) => n + 1);
      endHold();
    };
    document.addEventListener('keydown', onKeyDown);
    document.addEventListener('keyup', onKeyUp);
    return () => {
      endHold();
      document.removeEventListener('keydown', onKeyDown);
      document.removeEventListener('keyup', onKeyUp);
    };
  }, [live, choose, stop, update]);

  // Turning the option off ends a running scan.
  useEffect(() => {
    if (!enabled) return;
    return stop;
  }, [enabled, stop]);

  return { state: active ? state : null, running: active, start, stop };
}
