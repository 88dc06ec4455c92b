// Checks every suite makes of a page.
import assert from 'node:assert/strict';

/** Fails when the page scrolls sideways (WCAG 1.4.10 reflow). */
export async function assertNoSidewaysScroll(page, label) {
  const { scrollWidth, clientWidth } = await page.evaluate(() => ({
    scrollWidth: document.documentElement.scrollWidth,
    clientWidth: document.documentElement.clientWidth,
  }));
  assert.ok(
    scrollWidth <= clientWidth + 1,
    `${label}: page is ${scrollWidth}px wide in a ${clientWidth}px window`,
  );
}

/** The accessible name (or text) and tag of the focused element, to say where focus landed. */
export const focused = (page) =>
  page.evaluate(() => {
    const element = document.activeElement;
    const labelledBy = element?.getAttribute('aria-labelledby');
    const name =
      element?.getAttribute('aria-label') ??
      (labelledBy ? document.getElementById(labelledBy)?.textContent : null) ??
      element?.textContent ??
      '';
    return { tag: element?.tagName.toLowerCase() ?? '', name: name.trim() };
  });

/**
 * Where focus lands after an action that refetches the page's data: `focused` once it equals
 * `expected`, or after `timeoutMs` whatever it is then (for the caller's assertion to report).
 */
export async function focusSettled(page, expected, timeoutMs = 2000) {
  const until = Date.now() + timeoutMs;
  let now = await focused(page);
  while (Date.now() < until && (now.tag !== expected.tag || now.name !== expected.name)) {
    await page.waitForTimeout(50);
    now = await focused(page);
  }
  return now;
}

/** Focuses `locator` (as Tab would reach it) and presses `key` on it. */
export const press = async (locator, key = 'Enter') => {
  await locator.focus();
  await locator.press(key);
};
