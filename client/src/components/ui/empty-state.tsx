import type { ReactNode } from 'react';

type EmptyStateProps = { title: string; children?: ReactNode; action?: ReactNode };

/** What a list shows before it has anything in it, and what will appear there. */
export const EmptyState = ({ title, children, action }: EmptyStateProps) => (
  <section
    aria-label={title}
    className="flex flex-col items-start gap-3 rounded-xl border-2 border-dashed border-field-border bg-surface p-6 sm:flex-row sm:items-center sm:gap-6 sm:p-8"
  >
    <svg aria-hidden="true" viewBox="0 0 64 64" className="size-16 shrink-0 text-ink-soft">
      {/* An empty frame of the loom: warp threads with no weft yet. */}
      <rect x="6" y="8" width="52" height="48" rx="6" fill="none" stroke="currentColor" strokeWidth="3" />
      <path
        d="M18 14v36M28 14v36M38 14v36M48 14v36"
        stroke="currentColor"
        strokeWidth="2"
        strokeDasharray="4 4"
      />
    </svg>
    <div>
      <h2 className="text-xl font-bold">{title}</h2>
      {children && <div className="mt-1 text-ink-soft">{children}</div>}
      {action && <div className="mt-4">{action}</div>}
    </div>
  </section>
);
