import { type ReactNode, useEffect, useRef } from 'react';
import { cn } from '@/lib/cn';

type EngineDetailsProps = {
  /** One plain line under the summary: what is inside. */
  description: string;
  children: ReactNode;
  /** Opens the details while true (e.g. a field inside holds an error the summary links to). */
  forceOpen?: boolean;
  className?: string;
};

/**
 * "Engine details": the model's own terms (compression, folds, escape method) behind a native
 * disclosure (`<details>`/`<summary>`: keyboard and screen readers handle it without script), closed
 * by default so the page speaks the clinic's words first. Its accessible name starts with its label.
 */
export const EngineDetails = ({
  description,
  children,
  forceOpen = false,
  className,
}: EngineDetailsProps) => {
  const ref = useRef<HTMLDetailsElement>(null);
  useEffect(() => {
    if (forceOpen && ref.current) ref.current.open = true;
  }, [forceOpen]);
  return (
    <details ref={ref} className={cn('group rounded-lg border-2 border-thread bg-surface', className)}>
      <summary className="flex min-h-11 cursor-pointer list-none items-start gap-3 rounded-lg p-4 focus-visible:outline-4 focus-visible:outline-offset-2 [&::-webkit-details-marker]:hidden">
        <svg
          aria-hidden="true"
          viewBox="0 0 20 20"
          className="mt-1 size-5 shrink-0 fill-current transition-transform group-open:rotate-90"
        >
          <path d="M7 4l6 6-6 6V4Z" />
        </svg>
        <span className="flex flex-col">
          <span className="text-xl font-bold">Engine details</span>
          <span className="text-ink-soft">{description}</span>
        </span>
      </summary>
      <div className="flex flex-col gap-6 border-t-2 border-thread p-4">{children}</div>
    </details>
  );
};
