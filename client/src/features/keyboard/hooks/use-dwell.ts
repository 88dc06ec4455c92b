// Dwell selection: resting the pointer on a target for `dwellMs` activates it once; a visible
// fill shows the progress. Leaving the target cancels; the same target fires again only after
// the pointer has left it and come back (a fresh dwell). After each activation the chosen target
// flashes (CHOSEN_FLASH_MS) and a refractory time runs during which no dwell starts on any target;
// a target the pointer rests on when it ends starts a fresh dwell from zero then.
import { useCallback, useEffect, useRef, useState } from 'react';
import { playSelectionTone } from '../logic/selection-tone';

/** How long a chosen target shows its "chosen" state, ms (common practice, no source). */
export const CHOSEN_FLASH_MS = 250;

export type DwellOptions = {
  enabled: boolean;
  /** Time to rest on a target before it activates, ms (> 0). */
  dwellMs: number;
  /** Time after each activation during which no dwell starts, ms (0 = none). */
  refractoryMs?: number;
  /** A short tone on each activation (the Web Audio API). */
  sound?: boolean;
  onActivate: (id: string) => void;
};

export type DwellTargetProps = { onPointerEnter: () => void; onPointerLeave: () => void };

/**
 * Tracks one dwell at a time. `activeId` is the target being dwelt on (null when none);
 * `progress` rises from 0 to 1 (updated every animation frame) and falls back to 0 when the
 * target activates or is left; `chosenId` is the target just activated, for CHOSEN_FLASH_MS.
 */
export function useDwell(o: DwellOptions): {
  activeId: string | null;
  progress: number;
  chosenId: string | null;
  targetProps: (id: string) => DwellTargetProps;
} {
  const { enabled, dwellMs } = o;
  const refractoryMs = Math.max(0, o.refractoryMs ?? 0);
  const sound = o.sound ?? false;
  const [activeId, setActiveId] = useState<string | null>(null);
  const [progress, setProgress] = useState(0);
  // The target just chosen, with a count so the same target chosen again flashes again.
  const [chosen, setChosen] = useState<{ id: string; n: number } | null>(null);

  const onActivateRef = useRef(o.onActivate);
  useEffect(() => {
    onActivateRef.current = o.onActivate;
  });
  const timerRef = useRef<ReturnType<typeof setTimeout> | null>(null);
  const frameRef = useRef<number | null>(null);
  const refractoryRef = useRef<ReturnType<typeof setTimeout> | null>(null);
  // The target that fired and has not been left since: it does not fire again.
  const spentRef = useRef<string | null>(null);
  const currentRef = useRef<string | null>(null);
  // The target the pointer rests on now (entered and not left), dwelt on or not.
  const hoverRef = useRef<string | null>(null);
  // The refractory timer starts the newest `start` (it was set by an older one).
  const startRef = useRef<(id: string) => void>(() => undefined);

  const cancel = useCallback(() => {
    if (timerRef.current !== null) clearTimeout(timerRef.current);
    if (frameRef.current !== null) cancelAnimationFrame(frameRef.current);
    timerRef.current = null;
    frameRef.current = null;
    currentRef.current = null;
    setActiveId(null);
    setProgress(0);
  }, []);

  const start = useCallback(
    (id: string) => {
      cancel();
      // No dwell starts during the refractory time, nor again on the target just chosen.
      if (refractoryRef.current !== null || spentRef.current === id) return;
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
        setChosen((last) => ({ id, n: (last?.n ?? 0) + 1 }));
        if (refractoryMs > 0) {
          refractoryRef.current = setTimeout(() => {
            refractoryRef.current = null;
            // The pointer still rests on a target: a fresh dwell from zero.
            if (hoverRef.current !== null) startRef.current(hoverRef.current);
          }, refractoryMs);
        }
        if (sound) playSelectionTone();
        onActivateRef.current(id);
      }, dwellMs);
    },
    [cancel, dwellMs, refractoryMs, sound],
  );
  useEffect(() => {
    startRef.current = start;
  });

  const begin = useCallback(
    (id: string) => {
      hoverRef.current = id;
      start(id);
    },
    [start],
  );

  const leave = useCallback(
    (id: string) => {
      if (hoverRef.current === id) hoverRef.current = null;
      if (spentRef.current === id) spentRef.current = null;
      if (currentRef.current === id) cancel();
    },
    [cancel],
  );

  // Turning dwell off (or leaving the page) drops the dwell in progress, the flash and the refractory time.
  useEffect(() => {
    if (!enabled) return;
    return () => {
      spentRef.current = null;
      hoverRef.current = null;
      if (refractoryRef.current !== null) clearTimeout(refractoryRef.current);
      refractoryRef.current = null;
      setChosen(null);
      cancel();
    };
  }, [enabled, cancel]);

  // The flash is timed from when it is on screen (the selection's own re-render may take a while).
  useEffect(() => {
    if (!chosen) return;
    const timer = setTimeout(() => setChosen(null), CHOSEN_FLASH_MS);
    return () => clearTimeout(timer);
  }, [chosen]);

  const targetProps = useCallback(
    (id: string): DwellTargetProps =>
      enabled
        ? { onPointerEnter: () => begin(id), onPointerLeave: () => leave(id) }
        : { onPointerEnter: () => undefined, onPointerLeave: () => undefined },
    [enabled, begin, leave],
  );

  return { activeId, progress, chosenId: chosen?.id ?? null, targetProps };
}
