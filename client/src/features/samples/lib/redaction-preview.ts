import { applyRedaction, type SampleDetail } from '@keyloom/shared';

/** A stretch of text around one span: the words before, the span, the words after. */
export type PreviewPiece = { lead: string; span: string; tail: string };

/** Characters of text shown each side of the span in a preview. */
export const PREVIEW_CONTEXT = 40;

const around = (text: string, start: number, end: number, context: number): PreviewPiece => {
  const from = Math.max(0, start - context);
  const to = Math.min(text.length, end + context);
  return {
    lead: `${from > 0 ? '…' : ''}${text.slice(from, start)}`,
    span: text.slice(start, end),
    tail: `${text.slice(end, to)}${to < text.length ? '…' : ''}`,
  };
};

/**
 * The text around flag `flagId` before and after redacting it, computed with the same
 * `applyRedaction` the API applies, so the preview shows exactly what will be stored.
 */
export function redactionPreview(
  sample: Pick<SampleDetail, 'text' | 'flags'>,
  flagId: string,
  context = PREVIEW_CONTEXT,
): { before: PreviewPiece; after: PreviewPiece } {
  const flag = sample.flags.find((f) => f.id === flagId);
  if (!flag) throw new Error(`No flag ${flagId} on this sample.`);
  const { text, redacted } = applyRedaction(sample.text, sample.flags, flagId);
  return {
    before: around(sample.text, flag.start, flag.end, context),
    after: around(text, redacted.start, redacted.end, context),
  };
}
