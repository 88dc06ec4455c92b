import { type ReactNode, useEffect, useRef } from 'react';
import { useLocation } from 'react-router-dom';

type PageHeaderProps = {
  title: string;
  description?: ReactNode;
  /** Buttons beside the title, e.g. "Add staff member". */
  actions?: ReactNode;
};

/**
 * The page's only h1. It names the document ("Staff — Keyloom") and, after an in-app
 * navigation, takes focus so screen readers announce the new page — except when the navigation
 * says `keepFocus` in its state (e.g. a tab of the same page: focus stays on the tab, as the
 * WAI-ARIA tabs pattern expects).
 */
export const PageHeader = ({ title, description, actions }: PageHeaderProps) => {
  const headingRef = useRef<HTMLHeadingElement>(null);
  const { key, state } = useLocation();
  const keepFocus = (state as { keepFocus?: unknown } | null)?.keepFocus === true;

  useEffect(() => {
    document.title = `${title} — Keyloom`;
  }, [title]);

  useEffect(() => {
    // "default" is the entry the app was opened on: leave focus at the top of the document there.
    if (key !== 'default' && !keepFocus) headingRef.current?.focus();
  }, [key, keepFocus]);

  return (
    <div className="mb-8 flex flex-wrap items-end justify-between gap-4 border-b-2 border-thread pb-6">
      <div className="max-w-3xl">
        <h1 ref={headingRef} tabIndex={-1} className="text-3xl font-bold sm:text-4xl">
          {title}
        </h1>
        {description && <div className="mt-3 text-lg text-ink-soft">{description}</div>}
      </div>
      {actions && <div className="flex flex-wrap gap-3">{actions}</div>}
    </div>
  );
};
