import type { SummaryMessagePreview } from '@keyloom/shared';

/**
 * The HTML part with its inline images (cid: links) turned into data: links, so a browser shows
 * them. The charts come in the order the message references them, each once.
 */
export const htmlWithImages = (message: Pick<SummaryMessagePreview, 'html' | 'charts'>): string =>
  message.charts.reduce(
    (html, chart) => html.replace(/src="cid:[^"]+"/, `src="data:image/png;base64,${chart.pngBase64}"`),
    message.html,
  );
