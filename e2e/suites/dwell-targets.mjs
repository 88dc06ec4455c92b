// Targets and dwell on the test keyboard: with large targets on, every key and suggestion slot is at
// least 64 × 64 CSS px (WCAG 2.2 SC 2.5.5 Target Size (Enhanced) asks for 44 × 44; 64 is Keyloom's
// choice, common practice, no source) at 390 × 844 and at 1280 × 800, rows wrap instead of shrinking
// and the page never scrolls sideways; the dwell fill covers the key, the chosen key flashes, and
// axe finds nothing serious with large spacing, dwell sound and scan announcements on. Screenshots go
// to e2e/out/ and /tmp/dwell-targets-*.png.
import assert from 'node:assert/strict';
import { signOut } from './accounts.mjs';
import { openDemoKeyboard } from './keyboard-page.mjs';
import { assertNoSidewaysScroll } from './page-checks.mjs';

const LEAST = 64;

/** The width and height of every key and suggestion slot, with its name. */
const targetBoxes = (page) =>
  page.evaluate(() =>
    [
      ...document.querySelectorAll(
        '[role="group"][aria-label="Keys"] button, [role="group"][aria-label="Suggestions"] button',
      ),
    ].map((button) => {
      const box = button.getBoundingClientRect();
      return { name: button.getAttribute('aria-label'), width: box.width, height: box.height, top: box.top };
    }),
  );

async function assertLargeTargets(page, label) {
  const boxes = await targetBoxes(page);
  assert.ok(boxes.length > 30, `${label}: keys and slots found (${boxes.length})`);
  const small = boxes.filter((b) => b.width < LEAST - 0.01 || b.height < LEAST - 0.01);
  assert.deepEqual(small, [], `${label}: every target is at least ${LEAST} × ${LEAST} px`);
  const widths = boxes.map((b) => b.width);
  console.log(
    `    ${label}: ${boxes.length} targets, narrowest ${Math.min(...widths).toFixed(1)} px, ` +
      `lowest ${Math.min(...boxes.map((b) => b.height)).toFixed(1)} px`,
  );
  await assertNoSidewaysScroll(page, label);
}

/** How many lines each key row takes on screen (distinct tops of its keys). */
const linesPerRow = (page) =>
  page.evaluate(() =>
    [...document.querySelectorAll('[role="group"][aria-label="Keys"] > div')].map(
      (row) =>
        new Set([...row.querySelectorAll('button')].map((b) => Math.round(b.getBoundingClientRect().top)))
          .size,
    ),
  );

/** Back to the suites' window size (the user menu is in the wide header), then signs out. */
async function signOutWide(page) {
  await page.setViewportSize({ width: 1280, height: 860 });
  await signOut(page, 'Carer');
}

async function shoot(t, page, name) {
  // The keyboard alone first (quick, while a dwell is still running), to look at the keys.
  await page
    .locator('section[aria-labelledby="keyboard-heading"]')
    .screenshot({ path: `/tmp/dwell-targets-${name}-keyboard.png` });
  await t.screenshot(page, `dwell-targets-${name}`);
  await page.screenshot({ path: `/tmp/dwell-targets-${name}.png`, fullPage: true });
}

export const dwellTargetsSuite = {
  name: 'dwell-targets',
  tests: [
    [
      'large targets at 390 × 844: every key and slot at least 64 × 64, rows wrap, no sideways scroll; axe clean',
      async (t) => {
        const { page } = await openDemoKeyboard(t, { width: 390, height: 844 });
        await page.getByLabel('Large targets').check();
        await assertLargeTargets(page, '390 × 844');
        // The first key row (ten letters) no longer fits on one line of 390 px: it wraps.
        const tops = (await linesPerRow(page))[0];
        assert.ok(tops >= 2, `the first row wraps onto ${tops} lines`);
        await page.getByLabel('Key spacing').selectOption('large');
        await assertLargeTargets(page, '390 × 844, large spacing');
        assert.deepEqual(await t.seriousViolations(page, 'large targets at 390'), []);
        await page.getByRole('group', { name: 'Keys' }).scrollIntoViewIfNeeded();
        await shoot(t, page, '390');
        await signOutWide(page);
      },
    ],
    [
      'large targets at 1280 × 800: every key and slot at least 64 × 64, one line per row',
      async (t) => {
        const { page } = await openDemoKeyboard(t, { width: 1280, height: 800 });
        await page.getByLabel('Large targets').check();
        await assertLargeTargets(page, '1280 × 800');
        const lines = await linesPerRow(page);
        assert.deepEqual(
          lines.filter((n) => n !== 1),
          [],
          'every key row keeps one line on a wide screen',
        );
        await shoot(t, page, '1280');
        await signOutWide(page);
      },
    ],
    [
      'dwell: the fill covers the key from the bottom up, the chosen key flashes; axe with sound, spacing and announcements on',
      async (t) => {
        const { page } = await openDemoKeyboard(t, { width: 1280, height: 860 });
        await page.getByLabel('Selection mode').selectOption('dwell');
        await page.getByLabel('Large targets').check();
        await page.getByLabel('Key spacing').selectOption('medium');
        await page.getByLabel('Sound on selection').check();
        const dwell = page.getByLabel('Dwell time (ms)');
        await dwell.fill('1600');
        await dwell.blur();
        const key = page.getByRole('group', { name: 'Keys' }).getByRole('button', { name: 'g', exact: true });
        // Watches the key's "chosen" flash in the page: when it came and how long it stayed.
        await page.evaluate(() => {
          const target = document.querySelector('[data-key="letter-g"]');
          window.__chosen = [];
          new MutationObserver(() =>
            window.__chosen.push([target.getAttribute('data-chosen'), performance.now()]),
          ).observe(target, { attributes: true, attributeFilter: ['data-chosen'] });
        });
        await key.hover();
        await page.locator('[data-dwell-fill]').waitFor();
        await page.waitForTimeout(800);
        const cover = await page.evaluate(() => {
          const fill = document.querySelector('[data-dwell-fill]');
          const keyBox = fill.parentElement.getBoundingClientRect();
          const box = fill.getBoundingClientRect();
          return {
            keyWidth: fill.parentElement.clientWidth, // inside the key's border
            width: box.width,
            bottomGap: keyBox.bottom - box.bottom,
            share: box.height / keyBox.height,
          };
        });
        assert.ok(
          Math.abs(cover.width - cover.keyWidth) < 1,
          `the fill spans the key (${cover.width} of ${cover.keyWidth})`,
        );
        assert.ok(cover.bottomGap < 3, 'the fill rises from the bottom edge');
        assert.ok(
          cover.share > 0.2 && cover.share < 0.9,
          `half-way, the fill covers part of the key (${cover.share})`,
        );
        await page.waitForFunction(() => window.__chosen.length >= 2, null, { timeout: 5_000 });
        const flash = await page.evaluate(() => window.__chosen);
        assert.equal(flash[0][0], 'on', 'the chosen key flashes');
        assert.equal(flash[1][0], null, 'the flash ends');
        const flashMs = flash[1][1] - flash[0][1];
        console.log(`    chosen flash: ${flashMs.toFixed(0)} ms`);
        assert.ok(
          flashMs >= 200 && flashMs < 1000,
          `the flash lasts about 250 ms (${flashMs.toFixed(0)} ms)`,
        );
        assert.deepEqual(await t.seriousViolations(page, 'dwell with sound and spacing'), []);
        await page.waitForFunction(
          () => document.querySelector('[data-output]')?.getAttribute('data-text') === 'g',
        );
        // A second dwell, for the picture: the window as it is (no scrolling, which would end the dwell).
        const h = page.getByRole('group', { name: 'Keys' }).getByRole('button', { name: 'h', exact: true });
        await h.hover();
        await page.waitForTimeout(600);
        await page.screenshot({ path: '/tmp/dwell-targets-dwell-fill.png' });
        await page.getByLabel('High contrast').check();
        await page.mouse.move(0, 0);
        await page.waitForTimeout(400);
        await h.hover();
        await page.waitForTimeout(600);
        await page.screenshot({ path: '/tmp/dwell-targets-dwell-fill-high-contrast.png' });
        await page.getByLabel('High contrast').uncheck();
        await page.mouse.move(0, 0);

        await page.getByLabel('Selection mode').selectOption('scanning');
        await page.getByLabel('Announce the scan highlight').check();
        await page.getByLabel('High contrast').check();
        await page.getByRole('button', { name: 'Start scanning' }).click();
        await page.waitForFunction(() =>
          /^(Suggestions|Row \d)/.test(document.querySelector('[data-scan-announcement]')?.textContent ?? ''),
        );
        assert.deepEqual(await t.seriousViolations(page, 'scanning with announcements, high contrast'), []);
        await shoot(t, page, 'scan-high-contrast');
        await page.keyboard.press('Escape');
        await signOut(page, 'Carer');
      },
    ],
  ],
};
