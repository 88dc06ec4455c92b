// The small HTML pages behind the stop link of a summary e-mail: for the recipient's browser (no
// account, no client app), plain HTML without scripts, so the app's CSP allows them as they are.

export const STOP_LINK_UNKNOWN_MESSAGE = 'This stop link is not known. It may have been copied incompletely.';

/** Stop tokens are 32 random bytes in base64url: exactly 43 characters of that alphabet. */
export const isStopToken = (token: string): boolean => /^[A-Za-z0-9_-]{43}$/.test(token);

const page = (heading: string, body: string): string =>
  `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${heading}</title>` +
  `<meta name="viewport" content="width=device-width, initial-scale=1"></head>` +
  `<body><main><h1>${heading}</h1>${body}</main></body></html>`;

/**
 * The page the link opens: says what the button does; nothing changes until it is pressed.
 * @param token a checked stop token (base64url, so safe inside the attribute as it is)
 */
export const stopFormPage = (token: string): string =>
  page(
    'Stop progress summaries?',
    '<p>You receive progress summaries by e-mail from the clinic. Press the button to receive no more.</p>' +
      // Relative to /api/summaries/stop/: the same address as this page, whatever prefix it is served under.
      `<form method="post" action="${token}"><button type="submit">Stop these e-mails</button></form>`,
  );

/** After the button (or when it was pressed before). */
export const stoppedPage = (): string =>
  page(
    'Summaries stopped',
    '<p>You will not receive further progress summaries. If this was a mistake, please tell the clinic.</p>',
  );

/** For an unknown or malformed token. */
export const unknownStopPage = (): string =>
  page('Link not recognised', `<p>${STOP_LINK_UNKNOWN_MESSAGE}</p>`);
