import { type ReactNode, useEffect, useRef, useState } from 'react';
import { createPortal } from 'react-dom';
import { cn } from '@/lib/cn';

type TrialViewProps = {
  /** The trial is paused: the keyboard is inert and `pauseDialog` is shown over it. */
  paused: boolean;
  /** The browser left full screen (Escape in full screen, or the browser's own control). */
  onLeaveFullscreen: () => void;
  highContrast: boolean;
  /** The target phrase, the message window, the suggestion row and the keys. */
  children: ReactNode;
  pauseDialog: ReactNode;
};

/** How the view fills the screen: the browser's full screen, or a fixed layer over the page. */
export type TrialViewMode = 'fullscreen' | 'layer';

/**
 * Asks for full screen on `element` (the Fullscreen API). Where it is missing or refused, the view
 * stays a fixed layer over the whole window: nothing else changes.
 */
const enterFullscreen = (element: HTMLElement | null) => {
  if (!element || typeof element.requestFullscreen !== 'function') return;
  if (document.fullscreenElement === element) return;
  element.requestFullscreen().catch(() => undefined);
};

/**
 * The running trial, alone on the screen: browser full screen where allowed, otherwise a fixed
 * full-window layer (`role="dialog"`, labelled "Trial"). The page behind is hidden and inert while it
 * is open (so it neither scrolls nor takes focus); it comes back as it was when the view closes.
 */
export const TrialView = ({
  paused,
  onLeaveFullscreen,
  highContrast,
  children,
  pauseDialog,
}: TrialViewProps) => {
  const layerRef = useRef<HTMLDivElement>(null);
  const [mode, setMode] = useState<TrialViewMode>('layer');
  const onLeaveRef = useRef(onLeaveFullscreen);
  useEffect(() => {
    onLeaveRef.current = onLeaveFullscreen;
  });

  // The rest of the page: hidden and inert while the view is open.
  useEffect(() => {
    const layer = layerRef.current;
    const behind = [...document.body.children].filter(
      (element): element is HTMLElement =>
        element instanceof HTMLElement && !element.contains(layer) && !element.hidden,
    );
    for (const element of behind) {
      element.setAttribute('inert', '');
      element.hidden = true;
    }
    return () => {
      for (const element of behind) {
        element.removeAttribute('inert');
        element.hidden = false;
      }
    };
  }, []);

  useEffect(() => {
    const layer = layerRef.current;
    let wasFullscreen = false;
    // Leaving full screen pauses the trial.
    const onChange = () => {
      const now = document.fullscreenElement === layer && layer !== null;
      setMode(now ? 'fullscreen' : 'layer');
      if (wasFullscreen && !now) onLeaveRef.current();
      wasFullscreen = now;
    };
    document.addEventListener('fullscreenchange', onChange);
    return () => {
      document.removeEventListener('fullscreenchange', onChange);
      if (layer && document.fullscreenElement === layer) document.exitFullscreen().catch(() => undefined);
    };
  }, []);
  // Full screen when the view opens and when the trial resumes (both follow a press, which the
  // browser requires); leaving it pauses the trial (above).
  useEffect(() => {
    if (!paused) enterFullscreen(layerRef.current);
  }, [paused]);

  return createPortal(
    <div
      ref={layerRef}
      role="dialog"
      aria-modal="true"
      aria-label="Trial"
      data-trial-view={mode}
      className={cn(
        // With very large text the view scrolls inside itself rather than cut keys off.
        'fixed inset-0 z-50 flex flex-col overflow-y-auto p-2 sm:p-3',
        highContrast ? 'on-dark bg-black text-white' : 'bg-paper-deep text-ink',
      )}
    >
      <div inert={paused} className="flex min-h-0 flex-1 flex-col gap-2">
        {children}
      </div>
      {paused && pauseDialog}
    </div>,
    document.body,
  );
};
