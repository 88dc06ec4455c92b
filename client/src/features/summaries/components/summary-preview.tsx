import type { SummaryPreview } from '@keyloom/shared';
import { Alert } from '@/components/ui/alert';

/**
 * The e-mail as the family will read it: subject, the plain text, and the charts as the same PNG
 * images the e-mail carries, at the size the e-mail shows them, each with the alt text that states
 * every figure in it.
 */
export const SummaryPreviewView = ({ preview }: { preview: SummaryPreview }) => (
  <div className="flex flex-col gap-4">
    {preview.versionIds.length === 0 && (
      <Alert tone="info" title="No version to report.">
        No version was trained in this period; the summary will only carry your note.
      </Alert>
    )}
    <dl className="flex flex-col gap-1">
      <dt className="font-bold">Subject</dt>
      <dd>{preview.subject}</dd>
    </dl>
    <div className="rounded-lg border-2 border-thread bg-surface p-4">
      <p className="mb-2 font-bold">Text of the e-mail</p>
      {/* Paragraphs and line breaks as in the e-mail's plain-text part. */}
      <div className="whitespace-pre-wrap leading-relaxed" data-testid="summary-preview-text">
        {preview.text}
      </div>
    </div>
    {preview.charts.length > 0 && (
      <div className="flex flex-col gap-4">
        {preview.charts.map((chart) => (
          // At its CSS size (the PNG has twice the pixels, sharp on dense screens), never wider than
          // the preview: a narrow window shrinks it, keeping its shape, as a phone's mail program does.
          <figure key={chart.name} className="flex max-w-full flex-col gap-2" style={{ width: chart.width }}>
            <img
              src={`data:image/png;base64,${chart.pngBase64}`}
              alt={chart.alt}
              width={chart.width}
              height={chart.height}
              className="h-auto w-full max-w-full rounded border-2 border-thread"
            />
            {/* The same words as the alt text, for sighted readers; hidden from screen readers, who hear the alt. */}
            <figcaption aria-hidden="true" className="text-ink-soft">
              {chart.alt}
            </figcaption>
          </figure>
        ))}
      </div>
    )}
  </div>
);
