import { useCallback, useRef, useState } from 'react';

/**
 * The content width of an element in CSS px, kept up to date with a ResizeObserver (null until the
 * first measurement, and where ResizeObserver is missing). Pass the returned ref callback as `ref`.
 */
export function useElementWidth<T extends HTMLElement>(): [(element: T | null) => void, number | null] {
  const [width, setWidth] = useState<number | null>(null);
  const observer = useRef<ResizeObserver | null>(null);
  const ref = useCallback((element: T | null) => {
    observer.current?.disconnect();
    observer.current = null;
    if (!element || typeof ResizeObserver === 'undefined') return;
    observer.current = new ResizeObserver((entries) => {
      const box = entries[0]?.contentRect;
      if (box) setWidth(Math.round(box.width));
    });
    observer.current.observe(element);
  }, []);
  return [ref, width];
}
