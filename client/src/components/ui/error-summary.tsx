import { forwardRef } from 'react';
import type { ErrorSummaryEntry } from './error-summary-entries';

type ErrorSummaryProps = { entries: readonly ErrorSummaryEntry[] };

/**
 * The list of what stopped a submit, at the top of the form: one link per field, which moves focus
 * to that field. Focus is moved here after a refused submit, so the list is read first. A list of
 * links at the top of a refused form is common practice, no source; the words are Keyloom's.
 */
export const ErrorSummary = forwardRef<HTMLDivElement, ErrorSummaryProps>(({ entries }, ref) => {
  if (entries.length === 0) return null;
  const heading =
    entries.length === 1 ? 'One field needs attention' : `${entries.length} fields need attention`;
  return (
    <div
      ref={ref}
      tabIndex={-1}
      role="group"
      aria-labelledby="form-error-summary-heading"
      className="mb-6 rounded-lg border-2 border-l-8 border-danger bg-danger-light p-4 text-ink focus:outline-4 focus:outline-offset-2 focus:outline-ink"
    >
      <p id="form-error-summary-heading" className="font-bold">
        {heading}
      </p>
      <ul className="ml-6 mt-2 list-disc">
        {entries.map((entry) => (
          <li key={entry.name}>
            <a
              href={`#${entry.control.id}`}
              className="font-bold underline"
              onClick={(event) => {
                event.preventDefault();
                entry.control.focus();
              }}
            >
              {entry.label}: {entry.message}
            </a>
          </li>
        ))}
      </ul>
    </div>
  );
});
ErrorSummary.displayName = 'ErrorSummary';
