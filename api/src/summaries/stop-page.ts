// The small HTML pages behind the stop link of a summary e-mail: for the recipient's browser (no
// account, no client app), plain HTML without scripts, so the app's CSP allows them as they are. They
// look like the app: its font (the web app's own files), its colours, a large button.

import type { ClinicSettings } from '@keyloom/shared';
import { escapeHtml } from '../common/html/escape-html';
import type { WebAppFonts } from '../web-app/web-app-fonts';

export const STOP_LINK_UNKNOWN_MESSAGE = 'This stop link is not known. It may have been copied incompletely.';

/** Stop tokens are 32 random bytes in base64url: exactly 43 characters of that alphabet. */
export const isStopToken = (token: string): boolean => /^[A-Za-z0-9_-]{43}$/.test(token);

/** What every stop page names: the clinic (from clinic settings) and the font files to use. */
export type StopPageClinic = {
  clinic: Pick<ClinicSettings, 'name' | 'phone'>;
  fonts: WebAppFonts;
};

/** A stop page for one recipient: also the client, by the name the family uses. */
export type StopPageContext = StopPageClinic & {
  /** The client's preferred name; null when none is recorded ("this client"). */
  clientName: string | null;
};

// The app's palette (client/src/index.css): ink on paper, saffron primary button, rust focus ring.
// Contrast: ink on paper 13.1:1, ink on saffron 7.5:1, paper on ink-deep above 14:1.
const fontFace = (url: string | null, weight: number) =>
  url
    ? `@font-face{font-family:'Atkinson Hyperlegible';font-style:normal;font-display:swap;` +
      `font-weight:${weight};src:url('${url}') format('woff2')}`
    : '';

const styles = (fonts: WebAppFonts) =>
  fontFace(fonts.regular, 400) +
  fontFace(fonts.bold, 700) +
  `html{font-size:112.5%;-webkit-text-size-adjust:100%}` +
  `body{margin:0;background:#fbf8f1;color:#1d2b4f;line-height:1.55;` +
  `font-family:'Atkinson Hyperlegible',ui-sans-serif,system-ui,sans-serif}` +
  `header{background:#152039;color:#fbf8f1;padding:1rem 1.25rem;font-weight:700}` +
  `main{max-width:36rem;margin:0 auto;padding:1.5rem 1.25rem 3rem}` +
  `h1{font-size:1.75rem;line-height:1.25;margin:0.5rem 0 1rem}` +
  `h2{font-size:1.2rem;margin:1.5rem 0 0.5rem}` +
  `.card{background:#fff;border:1px solid #d9d0bd;border-radius:0.75rem;padding:1.25rem}` +
  `.card>:first-child{margin-top:0}.card>:last-child{margin-bottom:0}` +
  `button{font:inherit;font-weight:700;font-size:1.1rem;color:#1d2b4f;background:#f5b335;` +
  `border:2px solid #1d2b4f;border-radius:0.5rem;min-height:3.25rem;width:100%;padding:0.75rem 1.25rem;` +
  `cursor:pointer;margin-top:0.5rem}` +
  `button:hover{background:#fef3d8}` +
  `a{color:#1d2b4f;text-underline-offset:0.2em}` +
  `:focus-visible{outline:3px solid #8a4300;outline-offset:3px}` +
  `@media (min-width:40rem){button{width:auto}}`;

const page = (context: StopPageClinic, heading: string, body: string): string =>
  `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${heading} – ${escapeHtml(context.clinic.name)}</title>` +
  `<meta name="viewport" content="width=device-width, initial-scale=1">` +
  `<style>${styles(context.fonts)}</style></head>` +
  `<body><header>${escapeHtml(context.clinic.name)}</header>` +
  `<main><h1>${heading}</h1>${body}</main></body></html>`;

/** The clinic's phone number as a link a phone can call ("tel:" keeps the digits and a leading +). */
const phoneLink = (phone: string) => `<a href="tel:${phone.replace(/[^\d+]/g, '')}">${escapeHtml(phone)}</a>`;

/** "contact the clinic on <phone>." (HTML), without the number when none is recorded. */
const contactTheClinic = ({ phone }: StopPageClinic['clinic']) =>
  `contact the clinic${phone ? ` on ${phoneLink(phone)}` : ''}.`;

/**
 * What stopping does, in the family's words: "You will get no more progress e-mails about <name or
 * 'this client'> from <clinic>. To start them again, contact the clinic on <phone>." (HTML).
 */
export const whatHappensNext = ({ clinic, clientName }: StopPageContext): string =>
  `You will get no more progress e-mails about ${escapeHtml(clientName ?? 'this client')} from ` +
  `${escapeHtml(clinic.name)}. To start them again, ${contactTheClinic(clinic)}`;

/**
 * The page the link opens: says what the button does; nothing changes until it is pressed.
 * @param token a checked stop token (base64url, so safe inside the attribute as it is)
 * @param context the clinic, the client's preferred name and the font files
 */
export const stopFormPage = (token: string, context: StopPageContext): string =>
  page(
    context,
    'Stop progress e-mails?',
    `<p>You get progress e-mails about ${escapeHtml(context.clientName ?? 'this client')} from ` +
      `${escapeHtml(context.clinic.name)}. Nothing changes until you press the button.</p>` +
      // Relative to /api/summaries/stop/: the same address as this page, whatever prefix it is served under.
      `<div class="card"><h2>What happens next</h2><p>${whatHappensNext(context)}</p>` +
      `<form method="post" action="${token}"><button type="submit">Stop these e-mails</button></form></div>`,
  );

/** After the button (or when it was pressed before). */
export const stoppedPage = (context: StopPageContext): string =>
  page(context, 'Progress e-mails stopped', `<p class="card">${whatHappensNext(context)}</p>`);

/** For an unknown or malformed token. */
export const unknownStopPage = (context: StopPageClinic): string =>
  page(
    context,
    'Link not recognised',
    `<p>${STOP_LINK_UNKNOWN_MESSAGE}</p><p>To stop progress e-mails, ${contactTheClinic(context.clinic)}</p>`,
  );
