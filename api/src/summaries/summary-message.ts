import type { SendMailOptions } from 'nodemailer';
import { encodePng, savingsBarChart, speedLineChart } from './summary-chart';
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

/** Alt text of a chart, with every figure in words, so the chart is never the only place a figure is. */
export function chartAltTexts(figures: VersionFigures[]): { savings: string; speed: string } {
  const savings = figures
    .filter((f) => f.keystrokeSavings !== null)
    .map((f) => `version ${f.number}: ${Math.round((f.keystrokeSavings ?? 0) * 100)}%`);
  const speed = figures
    .filter((f) => f.wpmWith !== null && f.wpmWithout !== null)
    .map((f) => `version ${f.number}: ${f.wpmWith?.toFixed(1)} with, ${f.wpmWithout?.toFixed(1)} without`);
  return {
    savings: `Key presses saved by suggestions, by version: ${savings.join('; ')}.`,
    speed: `Estimated words a minute, by version: ${speed.join('; ')}.`,
  };
}

/**
 * nodemailer options for one recipient. Charts are attached only when there are figures to draw
 * (1 to 20 versions); the text already carries every figure.
 */
/** One chart as the e-mail carries it. */
export type SummaryChart = { name: string; cid: string; alt: string; png: Buffer };

/**
 * The charts of a summary: keystroke savings (versions with savings) and speed (versions with both
 * rates), the last 20 versions at most; none when no version has the figures.
 */
export function summaryCharts(figures: VersionFigures[]): SummaryChart[] {
  const withSavings = figures.filter((f) => f.keystrokeSavings !== null).slice(-20);
  const withRates = figures.filter((f) => f.wpmWith !== null && f.wpmWithout !== null).slice(-20);
  const alt = chartAltTexts(figures);
  const charts: SummaryChart[] = [];
  if (withSavings.length > 0) {
    charts.push({
      name: 'keystroke-savings.png',
      cid: SAVINGS_CHART_CID,
      alt: alt.savings,
      png: encodePng(savingsBarChart(withSavings.map((f) => f.keystrokeSavings ?? 0))),
    });
  }
  if (withRates.length > 0) {
    charts.push({
      name: 'typing-speed.png',
      cid: SPEED_CHART_CID,
      alt: alt.speed,
      png: encodePng(
        speedLineChart(
          withRates.map((f) => ({ withSuggestions: f.wpmWith ?? 0, without: f.wpmWithout ?? 0 })),
        ),
      ),
    });
  }
  return charts;
}

export function buildSummaryMessage(input: SummaryMessageInput): SendMailOptions {
  const charts = summaryCharts(input.figures);
  const attachments: NonNullable<SendMailOptions['attachments']> = charts.map((chart) => ({
    filename: chart.name,
    contentType: 'image/png',
    cid: chart.cid,
    content: chart.png,
  }));
  // The chart's figures under it in words too: the picture carries no lettering, and some mail
  // programs do not show images until asked.
  const images = charts.map(
    (chart) =>
      `<p><img src="cid:${chart.cid}" width="480" height="240" alt="${escapeHtml(chart.alt)}"><br>` +
      `<small>${escapeHtml(chart.alt)}</small></p>`,
  );
  const paragraphs = input.text
    .split('\n\n')
    .map((p) => `<p>${escapeHtml(p).replace(/\n/g, '<br>')}</p>`)
    .join('\n');
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
    html:
      `<!doctype html><html lang="en"><body>\n${paragraphs}\n${images.join('\n')}\n` +
      `<p><a href="${escapeHtml(input.stopUrl)}">Stop receiving these summaries</a></p>\n</body></html>`,
    attachments,
  };
}
