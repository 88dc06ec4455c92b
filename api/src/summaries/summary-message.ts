import type { SendMailOptions } from 'nodemailer';
import { savingsChart, speedChart, type RenderedChart } from './summary-chart';
import type { VersionFigures } from './summary-text';

// The e-mail of one summary to one recipient: plain text, an HTML version with the charts as inline
// images (Content-ID, no scripts), the stop link, and the idempotency key as the Message-ID.

export type SummaryMessageInput = {
  from: string;
  to: { name: string; email: string };
  subject: string;
  text: string;
  figures: VersionFigures[];
  idempotencyKey: string;
  /** Absolute link behind which the recipient stops receiving summaries (no account needed). */
  stopUrl: string;
};

export const SAVINGS_CHART_CID = 'savings-chart@keyloom';
export const SPEED_CHART_CID = 'speed-chart@keyloom';

const escapeHtml = (text: string): string =>
  text.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c,
  );

/** The domain part of the sender's address, for the Message-ID ("keyloom.invalid" if there is none). */
export function senderDomain(from: string): string {
  const match = /@([A-Za-z0-9.-]+)>?\s*$/.exec(from);
  return match?.[1] ?? 'keyloom.invalid';
}

/** One chart as the e-mail carries it: the PNG, its size in CSS px and its alt text. */
export type SummaryChart = {
  name: string;
  cid: string;
  alt: string;
  /** The picture as drawn (the printed reports scale it; the e-mail attaches the PNG). */
  svg: string;
  png: Buffer;
  width: number;
  height: number;
};

const mailed = ({ alt, svg, png, width, height }: RenderedChart) => ({ alt, svg, png, width, height });

/**
 * The charts of a summary: keystroke savings (versions with savings) and speed (versions with both
 * rates), the last 20 versions at most; none when no version has the figures. Each chart's alt text
 * is written from the same values, in the same words, as the numbers on the picture.
 */
export function summaryCharts(figures: VersionFigures[]): SummaryChart[] {
  const withSavings = figures.filter((f) => f.keystrokeSavings !== null).slice(-20);
  const withRates = figures.filter((f) => f.wpmWith !== null && f.wpmWithout !== null).slice(-20);
  const charts: SummaryChart[] = [];
  if (withSavings.length > 0) {
    const chart = savingsChart(
      withSavings.map((f) => ({ number: f.number, savings: f.keystrokeSavings ?? 0 })),
    );
    charts.push({ name: 'keystroke-savings.png', cid: SAVINGS_CHART_CID, ...mailed(chart) });
  }
  if (withRates.length > 0) {
    const chart = speedChart(
      withRates.map((f) => ({
        number: f.number,
        withSuggestions: f.wpmWith ?? 0,
        without: f.wpmWithout ?? 0,
      })),
    );
    charts.push({ name: 'typing-speed.png', cid: SPEED_CHART_CID, ...mailed(chart) });
  }
  return charts;
}

/** The app's colours (client/src/index.css) as the e-mail's inline styles: mail programs drop most CSS. */
const INK = '#1d2b4f';
const INK_SOFT = '#44506f';
const PAPER = '#fbf8f1';
const FONT = "'Atkinson Hyperlegible', Verdana, Arial, sans-serif";

/**
 * The HTML part: one column at most 600 px wide that narrows with the screen (a phone at 390 px has
 * no sideways scroll), a <title>, the text's paragraphs, each chart with its figures in words under
 * it, and the stop link. Styles are inline, as mail programs keep them; no scripts, no remote images.
 */
export function summaryHtml(input: {
  subject: string;
  text: string;
  charts: readonly SummaryChart[];
  stopUrl: string;
}): string {
  const paragraphs = input.text
    .split('\n\n')
    .map((p) => `<p style="margin:0 0 16px 0">${escapeHtml(p).replace(/\n/g, '<br>')}</p>`)
    .join('\n');
  // The chart's figures under it in words too: some mail programs do not show images until asked.
  const images = input.charts.map(
    (chart) =>
      `<div style="margin:0 0 20px 0"><img src="cid:${chart.cid}" width="${chart.width}" height="${chart.height}" alt="${escapeHtml(chart.alt)}" ` +
      `style="display:block;width:100%;max-width:${chart.width}px;height:auto;border:0">` +
      `<p style="margin:6px 0 0 0;font-size:15px;color:${INK_SOFT}">${escapeHtml(chart.alt)}</p></div>`,
  );
  return (
    '<!doctype html>\n<html lang="en"><head><meta charset="utf-8">' +
    '<meta name="viewport" content="width=device-width, initial-scale=1">' +
    `<title>${escapeHtml(input.subject)}</title></head>\n` +
    `<body style="margin:0;padding:0;background:${PAPER}">\n` +
    `<div style="max-width:600px;margin:0 auto;padding:16px;box-sizing:border-box;font-family:${FONT};` +
    `font-size:18px;line-height:1.5;color:${INK};background:#ffffff;overflow-wrap:break-word">\n` +
    `<h1 style="margin:0 0 16px 0;font-size:24px;line-height:1.25">${escapeHtml(input.subject)}</h1>\n` +
    `${paragraphs}\n${images.join('\n')}\n` +
    `<p style="margin:24px 0 0 0;padding-top:12px;border-top:1px solid ${INK_SOFT};font-size:16px">` +
    `<a href="${escapeHtml(input.stopUrl)}" style="color:${INK}">Stop receiving these summaries</a></p>\n` +
    '</div>\n</body></html>'
  );
}

/**
 * nodemailer options for one recipient. Charts are attached only when there are figures to draw
 * (1 to 20 versions); the text already carries every figure.
 */
export function buildSummaryMessage(input: SummaryMessageInput): SendMailOptions {
  const charts = summaryCharts(input.figures);
  const attachments: NonNullable<SendMailOptions['attachments']> = charts.map((chart) => ({
    filename: chart.name,
    contentType: 'image/png',
    cid: chart.cid,
    content: chart.png,
  }));
  const stop = `To stop receiving these summaries, open this link: ${input.stopUrl}`;
  return {
    from: input.from,
    to: { name: input.to.name, address: input.to.email },
    subject: input.subject,
    messageId: `<${input.idempotencyKey}@${senderDomain(input.from)}>`,
    headers: {
      'X-Keyloom-Idempotency-Key': input.idempotencyKey,
      // RFC 8058 one-click: a mail program may POST "List-Unsubscribe=One-Click" to the stop URL.
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    },
    // The opt-out header (RFC 2369) beside the link in the body.
    list: { unsubscribe: { url: input.stopUrl, comment: 'Stop progress summaries' } },
    text: `${input.text}\n\n${stop}\n`,
    html: summaryHtml({ subject: input.subject, text: input.text, charts, stopUrl: input.stopUrl }),
    attachments,
  };
}
