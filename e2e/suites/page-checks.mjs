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
