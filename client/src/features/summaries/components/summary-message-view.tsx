import { useState } from 'react';
import { LoadError } from '@/components/ui/load-error';
import { LoadingState } from '@/components/ui/loading-state';
import { useSummaryMessage } from '../api/get-summary-message';
import { htmlWithImages } from '../lib/summary-message-html';

const widths = [
  { label: 'Phone (390 px)', px: 390 },
  { label: 'Computer (full width)', px: null },
] as const;

/**
 * The e-mail exactly as it goes out (from the API's message builder): the header lines, the HTML
 * part in a frame that runs no scripts, at a phone's width or the full width, and the plain-text
 * part that mail programs without HTML show.
 */
export const SummaryMessageView = ({ summaryId }: { summaryId: string }) => {
  const message = useSummaryMessage(summaryId, true);
  const [width, setWidth] = useState<number | null>(390);
  const [height, setHeight] = useState(900);
  if (message.isPending) return <LoadingState label="Building the e-mail…" />;
  if (message.isError)
    return (
      <LoadError
        title="The e-mail could not be built."
        error={message.error}
        onRetry={() => void message.refetch()}
      />
    );
  const m = message.data;
  return (
    <div className="flex flex-col gap-4">
      <dl className="grid max-w-3xl grid-cols-[auto_1fr] gap-x-4 gap-y-1">
        <dt className="font-bold">To</dt>
        <dd>{m.to}</dd>
        <dt className="font-bold">From</dt>
        <dd>{m.from}</dd>
        <dt className="font-bold">Subject</dt>
        <dd>{m.subject}</dd>
      </dl>
      <fieldset className="flex flex-wrap gap-4">
        <legend className="mb-1 font-bold">Show it as on a</legend>
        {widths.map((option) => (
          <label key={option.label} className="flex min-h-11 items-center gap-2">
            <input
              type="radio"
              name={`${summaryId}-width`}
              className="size-5 accent-ink"
              checked={width === option.px}
              onChange={() => setWidth(option.px)}
            />
            {option.label}
          </label>
        ))}
      </fieldset>
      <iframe
        title={`The e-mail “${m.subject}” as the family sees it`}
        // No scripts; same origin only so the frame's height can follow its content.
        sandbox="allow-same-origin"
        srcDoc={htmlWithImages(m)}
        style={{ width: width === null ? '100%' : `${width}px`, height }}
        className="max-w-full rounded-lg border-2 border-thread bg-surface"
        onLoad={(event) => {
          const doc = event.currentTarget.contentDocument;
          if (doc) setHeight(Math.max(300, doc.documentElement.scrollHeight + 8));
        }}
      />
      <details className="max-w-3xl">
        <summary className="min-h-11 cursor-pointer py-2 font-bold">
          The plain-text part (for mail programs without pictures)
        </summary>
        <pre className="whitespace-pre-wrap rounded-lg border-2 border-thread bg-surface p-4 font-sans leading-relaxed">
          {m.text}
        </pre>
      </details>
    </div>
  );
};
