// Scanning over a few buttons in a row (the pause dialog's Resume, Finish, Discard) with the same
// switches and timing as the keyboard's scanning pattern, so a switch user can operate every one.
import { useEffect, useRef, useState } from 'react';
import type { ScanPattern } from '../logic/scanner';

export type ChoiceScanOptions = {
  /** When false nothing is highlighted and the switch keys are left alone. */
  enabled: boolean;
  pattern: ScanPattern;
  /** Automatic patterns: time on each choice, ms (≥ 100). */
  intervalMs: number;
  /** Step, one switch: ms without a press before the highlighted choice is taken (≥ 100). */
  acceptMs: number;
  /** Which choices can be taken, in order (a disabled one is skipped). */
  available: readonly boolean[];
  onChoose: (index: number) => void;
};

const SWITCH_KEYS = new Set([' ', 'Spacebar', 'Enter']);

/** The next available choice after `from` (wrapping), or null when none is available. */
const nextAvailable = (available: readonly boolean[], from: number | null): number | null => {
  for (let step = 1; step <= available.length; step++) {
    const index = ((from ?? -1) + step) % available.length;
    if (available[index]) return index;
  }
  return null;
};

/**
 * Returns the highlighted choice (null when none). Automatic patterns: the highlight starts on the
 * first choice and moves at every interval; Space or Enter takes it. Step, two switches: Space moves,
 * Enter takes. Step, one switch: nothing is highlighted at first; each press moves one step and the
 * acceptance time without a press takes the highlighted choice. Key repeat is ignored; keys typed in
 * a form field (the trial note) are left to it.
 */
export function useChoiceScan(o: ChoiceScanOptions): number | null {
  const { enabled, pattern, intervalMs, acceptMs } = o;
  const oneSwitch = pattern === 'step-one-switch';
  const automatic = pattern === 'auto-row-column' || pattern === 'auto-group-row-key';
  const [highlight, setHighlight] = useState<number | null>(null);
  const [presses, setPresses] = useState(0);
  const optionsRef = useRef(o);
  const highlightRef = useRef<number | null>(null);
  useEffect(() => {
    optionsRef.current = o;
  });
  const move = (to: number | null) => {
    highlightRef.current = to;
    setHighlight(to);
  };
  const moveRef = useRef(move);

  // Entering: the first available choice, or nothing yet with one switch.
  useEffect(() => {
    moveRef.current(enabled && !oneSwitch ? nextAvailable(optionsRef.current.available, null) : null);
  }, [enabled, oneSwitch]);

  useEffect(() => {
    if (!enabled || !automatic) return;
    const timer = setInterval(
      () => moveRef.current(nextAvailable(optionsRef.current.available, highlightRef.current)),
      Math.max(100, intervalMs),
    );
    return () => clearInterval(timer);
  }, [enabled, automatic, intervalMs, presses]);

  useEffect(() => {
    if (!enabled || !oneSwitch || presses === 0 || highlightRef.current === null) return;
    const timer = setTimeout(
      () => {
        const chosen = highlightRef.current;
        if (chosen !== null) optionsRef.current.onChoose(chosen);
      },
      Math.max(100, acceptMs),
    );
    return () => clearTimeout(timer);
  }, [enabled, oneSwitch, acceptMs, presses]);

  useEffect(() => {
    if (!enabled) return;
    const inField = (event: KeyboardEvent) =>
      event.target instanceof Element && event.target.closest('input, textarea, select') !== null;
    const onKeyDown = (event: KeyboardEvent) => {
      if (!SWITCH_KEYS.has(event.key) || inField(event)) return;
      event.preventDefault();
      if (event.repeat) return;
      const options = optionsRef.current;
      const moves = oneSwitch || (pattern === 'step-two-switch' && event.key !== 'Enter');
      if (moves) moveRef.current(nextAvailable(options.available, highlightRef.current));
      else if (highlightRef.current !== null) options.onChoose(highlightRef.current);
      setPresses((n) => n + 1);
    };
    // A focused button would click on the keyup of Space: the switch is not a click.
    const onKeyUp = (event: KeyboardEvent) => {
      if (SWITCH_KEYS.has(event.key) && !inField(event)) event.preventDefault();
    };
    document.addEventListener('keydown', onKeyDown);
    document.addEventListener('keyup', onKeyUp);
    return () => {
      document.removeEventListener('keydown', onKeyDown);
      document.removeEventListener('keyup', onKeyUp);
    };
  }, [enabled, oneSwitch, pattern]);

  return enabled ? highlight : null;
}
