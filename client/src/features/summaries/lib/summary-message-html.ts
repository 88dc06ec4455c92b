import type { SummaryMessagePreview } from '@keyloom/shared';

/** The HTML part with its inline images (cid: links) turned into data: links, so a browser shows them. */
export const htmlWithImages = (message: Pick<SummaryMessagePreview, 'html' | 'charts'>): string => {
  let html = message.html;
  message.charts.forEach((chart, i) => {
    // The charts go in the message in this order, each referenced once by its Content-ID.
    const cid = html.match(/src="cid:([^"]+)"/g)?.[i];
    if (cid) html = html.replace(cid, `src="data:image/png;base64,${chart.pngBase64}"`);
  });
  return html;
};
