// Printed reports: the demo clinician opens version 1's report for printing from the version page and
// the client report from the client page, by keyboard. On screen: axe clean, Tab reaches "Download
// PDF" with a visible focus ring, and that link answers a PDF. In print (emulated print media): the
// app's header, navigation and footer and every button are hidden, the report stays, axe clean, and
// Chromium prints the page to an A4 PDF. Screenshots and the PDFs in e2e/out.
import assert from 'node:assert/strict';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { openClientTabAsClinician } from './accounts.mjs';

// The seeded demo client; version 1 is seeded trained (api/src/db/seeds/demo-version.seed.ts).
const DEMO_CLIENT = 'R. Ashby';

const isPdf = (bytes) => bytes.subarray(0, 5).toString('latin1') === '%PDF-';

/** Presses Tab until `target` has focus (at most `limit` times); asserts it got there. */
async function tabTo(page, target, limit = 25) {
  for (let i = 0; i < limit; i++) {
    if (await target.evaluate((element) => element === document.activeElement)) return;
    await page.keyboard.press('Tab');
  }
  assert.ok(await target.evaluate((element) => element === document.activeElement), 'Tab reaches the target');
}

/** The focused element's outline, as drawn: style and width. */
const focusRing = (locator) =>
  locator.evaluate((element) => {
    const style = getComputedStyle(element);
    return { style: style.outlineStyle, width: parseFloat(style.outlineWidth) };
  });

/** The Download PDF link answers a PDF with the session's cookies; returns its bytes and headers. */
async function downloadPdf(page) {
  const href = await page.getByRole('link', { name: 'Download PDF' }).getAttribute('href');
  assert.ok(href, 'the link has an address');
  const res = await page.request.get(new URL(href, page.url()).toString());
  assert.equal(res.status(), 200, 'the PDF route answers');
  assert.equal(res.headers()['content-type'], 'application/pdf');
  const bytes = await res.body();
  assert.ok(isPdf(bytes), 'the body is a PDF');
  return { bytes, disposition: res.headers()['content-disposition'] ?? '' };
}

/** In print: no app header, navigation, footer or buttons; the report shows; axe clean; an A4 PDF. */
async function checkPrint(t, page, name) {
  await page.emulateMedia({ media: 'print' });
  assert.ok(await page.getByRole('article').isVisible(), 'the report is printed');
  for (const hidden of [
    page.getByRole('navigation', { name: 'Main' }),
    page.locator('#root header').first(),
    page.locator('#root footer').first(),
    page.getByRole('button', { name: 'Print' }),
    page.getByRole('link', { name: 'Download PDF' }),
  ]) {
    assert.ok(await hidden.isHidden(), 'the app’s frame and the buttons are not printed');
  }
  assert.deepEqual(await t.seriousViolations(page, `${name} (print)`), []);
  await t.screenshot(page, `${name}-print`);
  const pdf = await page.pdf({ format: 'A4', printBackground: true });
  assert.ok(isPdf(pdf), 'Chromium prints the page to a PDF');
  writeFileSync(join(t.outDir, `${name}-print.pdf`), pdf);
  await page.emulateMedia({ media: 'screen' });
}

export const reportSuite = {
  name: 'report',
  tests: [
    [
      'clinician opens version 1’s report for printing by keyboard; Download PDF answers a PDF; print hides the app’s frame',
      async (t) => {
        const page = await openClientTabAsClinician(t, DEMO_CLIENT, 'Profile versions');
        await page.getByRole('link', { name: 'Version 1', exact: true }).click();
        await page.getByRole('heading', { level: 1, name: /^Version 1 of / }).waitFor();
        const link = page.getByRole('link', { name: 'Report for printing' });
        await link.focus();
        await link.press('Enter');
        const heading = page.getByRole('heading', { level: 1, name: `Version 1 report: ${DEMO_CLIENT}` });
        await heading.waitFor();
        await page.waitForFunction(() => document.activeElement?.tagName === 'H1');
        const results = page.getByRole('region', { name: 'Results' });
        for (const label of ['Keystroke savings', 'Hit rate', 'Estimated words per minute'])
          assert.ok(await results.getByText(label, { exact: true }).isVisible(), `${label} is shown`);
        await page.getByRole('region', { name: 'Please keep in mind' }).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'version report'), []);

        const download = page.getByRole('link', { name: 'Download PDF' });
        await tabTo(page, download);
        const ring = await focusRing(download);
        assert.notEqual(ring.style, 'none', 'the focused link shows a ring');
        assert.ok(ring.width >= 2, 'the ring is at least 2 px wide');
        await t.screenshot(page, 'report-version');

        const { bytes, disposition } = await downloadPdf(page);
        assert.match(disposition, /attachment; filename="keyloom-r-ashby-version-1\.pdf"/);
        writeFileSync(join(t.outDir, 'report-version.pdf'), bytes);
        await checkPrint(t, page, 'report-version');
      },
    ],
    [
      'clinician opens the client report from the client page and shows another period by keyboard',
      async (t) => {
        const page = await openClientTabAsClinician(t, DEMO_CLIENT, 'Overview');
        const link = page.getByRole('link', { name: 'Client report' });
        await link.focus();
        await link.press('Enter');
        await page.getByRole('heading', { level: 1, name: `Client report: ${DEMO_CLIENT}` }).waitFor();
        // Version 1 was trained when the demo was seeded: within the last 90 days.
        const table = page.getByRole('table');
        await table.getByRole('rowheader', { name: /Version 1/ }).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'client report'), []);

        const form = page.getByRole('form', { name: 'Period of the report' });
        // Date fields take their digits in the browser's own order: filled as ISO days, sent by Enter.
        await form.getByLabel('From').fill('2020-01-01');
        await form.getByLabel('To').fill('2020-03-31');
        await form.getByLabel('To').press('Enter');
        await page.getByRole('status').filter({ hasText: 'Showing 1 Jan 2020 to 31 Mar 2020.' }).waitFor();
        await page.getByText('No version was trained or approved in this period.').waitFor();
        const href = await page.getByRole('link', { name: 'Download PDF' }).getAttribute('href');
        assert.match(href ?? '', /from=2020-01-01&to=2020-03-31$/);
        await page.goBack();
        await table.getByRole('rowheader', { name: /Version 1/ }).waitFor();
        // Back shows the last 90 days again, and the fields follow.
        await page.waitForFunction(
          () => document.querySelector('input[name="from"]')?.value !== '2020-01-01',
        );
        assert.match(await form.getByLabel('To').inputValue(), /^\d{4}-\d{2}-\d{2}$/);
        assert.notEqual(await form.getByLabel('To').inputValue(), '2020-03-31');
        const { bytes } = await downloadPdf(page);
        writeFileSync(join(t.outDir, 'report-client.pdf'), bytes);
        await t.screenshot(page, 'report-client');
        await checkPrint(t, page, 'report-client');
      },
    ],
  ],
};
