// Dwell selection: resting the pointer on a target for `dwellMs` activates it once; a visible
// fill shows the progress. Leaving the target cancels; the same target fires again only after
// the pointer has left it and come back (a fresh dwell).
import { useCallback, useEffect, useRef, useState } from 'react';

export type DwellOptions = {
  enabled: boolean;
  /** Time to rest on a target before it activates, ms (> 0). */
  dwellMs: number;
  onActivate: (id: string) => void;
};

export type DwellTargetProps = { onPointerEnter: () => void; onPointerLeave: () => void };

/**
 * Tracks one dwell at a time. `activeId` is the target being dwelt on (null when none);
 * `progress` rises from 0 to 1 (updated every animation frame) and falls back to 0 when the
 * target activates or is left.
 */
export function useDwell(o: DwellOptions): {
  activeId: string | null;
  progress: number;
  targetProps: (id: string) => DwellTargetProps;
} {
  const { enabled, dwellMs } = o;
  const [activeId, setActiveId] = useState<string | null>(null);
  const [progress, setProgress] = useState(0);

  const onActivateRef = useRef(o.onActivate);
  useEffect(() => {
    onActivateRef.current = o.onActivate;
  });
  const timerRef = useRef<ReturnType<typeof setTimeout> | null>(null);
  const frameRef = useRef<number | null>(null);
  // The target that fired and has not been left since: it does not fire again.
  const spentRef = useRef<string | null>(null);
  const currentRef = useRef<string | null>(null);

  const cancel = useCallback(() => {
    if (timerRef.current !== null) clearTimeout(timerRef.current);
    if (frameRef.current !== null) cancelAnimationFrame(frameRef.current);
    timerRef.current = null;
    frameRef.current = null;
    currentRef.current = null;
    setActiveId(null);
    setProgress(0);
  }, []);

  const begin = useCallback(
    (id: string) => {
      cancel();
      if (spentRef.current === id) return;
      spentRef.current = null;
      currentRef.current = id;
      setActiveId(id);
      const started = performance.now();
      const frame = () => {
        setProgress(Math.min(1, (performance.now() - started) / dwellMs));
        frameRef.current = requestAnimationFrame(frame);
      };
      frameRef.current = requestAnimationFrame(frame);
      // The activation runs on a timer, not on frames: frames pause in a hidden tab.
      timerRef.current = setTimeout(() => {
        timerRef.current = null;
        spentRef.current = id;
        cancel();
        onActivateRef.current(id);
      }, dwellMs);
    },
    [cancel, dwellMs],
  );

  const leave = useCallback(
    (id: string) => {
      if (spentRef.current === id) spentRef.current = null;
      if (currentRef.current === id) cancel();
    },
    [cancel],
  );

  // Turning dwell off (or leaving the page) drops the dwell in progress.
  useEffect(() => {
    if (!enabled) return;
    return () => {
      spentRef.current = null;
      cancel();
    };
  }, [enabled, cancel]);

  const targetProps = useCallback(
    (id: string): DwellTargetProps =>
      enabled
        ? { onPointerEnter: () => begin(id), onPointerLeave: () => leave(id) }
        : { onPointerEnter: () => undefined, onPointerLeave: () => undefined },
    [enabled, begin, leave],
  );

  return { activeId, progress, targetProps };
}
