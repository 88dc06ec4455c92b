// The trial view: a trial typed end to end with the keyboard alone on the screen at 1280×800, once
// by dwell (the mouse resting on key centres) and once by two-switch step scanning (Space moves,
// Enter selects; keyboard presses only). Each types a capital, a digit from the symbols layer, a new
// line, a suggestion pick and its undo, pauses and resumes, and finishes from the pause dialog. In
// the view the page does not scroll and every key is on screen; axe finds nothing serious in the
// view or the pause dialog; the trial the API stored (replayed on the server) has the text typed.
// The latency figures are printed beside their targets. Screenshots: /tmp/trial-view-*.png.
import assert from 'node:assert/strict';
import { signOut } from './accounts.mjs';
import { openDemoKeyboard, pauseDialog, printLatency, suggestionRow, trialView } from './keyboard-page.mjs';

const VIEWPORT = { width: 1280, height: 800 };

const outputText = (page) => page.locator('[data-output]').getAttribute('data-text');

async function trialsOf(page, appUrl, versionId) {
  const res = await page.request.get(`${appUrl}/api/profile-versions/${versionId}/trials`);
  assert.equal(res.status(), 200, 'the trials are readable');
  return res.json();
}

/** In the view: no page scroll, and every key and suggestion lies inside the window. */
async function assertFitsScreen(page, label, size = VIEWPORT) {
  const fit = await page.evaluate(() => {
    const targets = [...document.querySelectorAll('[data-trial-view] button')];
    return {
      scrollHeight: document.scrollingElement.scrollHeight,
      innerHeight: window.innerHeight,
      lowest: Math.max(...targets.map((b) => b.getBoundingClientRect().bottom)),
      shortest: Math.min(...targets.map((b) => b.getBoundingClientRect().height)),
      mode: document.querySelector('[data-trial-view]')?.getAttribute('data-trial-view'),
    };
  });
  assert.ok(
    fit.scrollHeight <= fit.innerHeight,
    `${label}: the page scrolls (${fit.scrollHeight} px in a ${fit.innerHeight} px window)`,
  );
  assert.ok(fit.lowest <= fit.innerHeight, `${label}: a key ends at ${fit.lowest} px, below the window`);
  console.log(
    `    ${label} (${fit.mode}): fits ${size.width}×${size.height}, keys at least ${Math.round(fit.shortest)} px high`,
  );
}

/** Waits for the text in the message window (and says what it was instead). */
async function textIs(page, text) {
  try {
    await page.waitForFunction(
      (want) => document.querySelector('[data-output]')?.getAttribute('data-text') === want,
      text,
      { timeout: 10_000 },
    );
  } catch {
    assert.fail(
      `the text should read ${JSON.stringify(text)}, not ${JSON.stringify(await outputText(page))}`,
    );
  }
}

/** The first word the suggestion row offers now (waits for the row to answer the text). */
async function firstSuggestion(page) {
  await page.waitForFunction(() => {
    const row = document.querySelector('[role="group"][aria-label="Suggestions"]');
    const output = document.querySelector('[data-output]');
    return (
      row?.getAttribute('data-answers') === output?.getAttribute('data-text') &&
      !row.querySelector('button')?.disabled
    );
  });
  return (await suggestionRow(page).getByRole('button').first().textContent()).trim();
}

/** The worker's own time for the row on screen now (collected after each selection). */
const engineMs = async (page) => Number(await suggestionRow(page).getAttribute('data-engine-ms'));

async function checkStored(page, t, versionId, countBefore, typed, mode) {
  const trials = await trialsOf(page, t.appUrl, versionId);
  assert.equal(trials.length, countBefore + 1, 'one trial stored');
  const [trial] = trials;
  assert.equal(trial.text, typed, 'the server replayed the log to the text typed');
  assert.equal(trial.settings.selectionMode, mode);
  assert.ok(trial.measures.pausedMs > 0, `the pause was logged and left out (${trial.measures.pausedMs} ms)`);
  console.log(
    `    stored "${typed.replace('\n', '\\n')}": ${trial.measures.keystrokes} keystrokes, typing ${trial.measures.durationMs} ms, ` +
      `${trial.measures.pausedMs} ms paused left out, ${trial.measures.wpm?.toFixed(1) ?? '—'} wpm`,
  );
}

export const trialViewSuite = {
  name: 'trial-view',
  tests: [
    [
      'dwell: a trial typed by resting the mouse on the keys, paused with the Pause key, resumed and finished',
      async (t) => {
        const { page, versionId } = await openDemoKeyboard(t, VIEWPORT);
        await page.getByLabel('Selection mode').selectOption('dwell');
        const dwell = page.getByLabel('Dwell time (ms)');
        await dwell.fill('250');
        await dwell.blur();
        const countBefore = (await trialsOf(page, t.appUrl, versionId)).length;
        // Started from the keyboard, the mouse out of the way: resting on a key of the view, it would type.
        await page.mouse.move(2, 2);
        await page.getByRole('button', { name: 'Start trial' }).focus();
        await page.keyboard.press('Enter');
        await trialView(page).waitFor();
        await assertFitsScreen(page, 'dwell view');
        assert.deepEqual(await t.seriousViolations(page, 'trial view (dwell)'), []);
        // A phone held upright: the keys still fit without scrolling.
        const phone = { width: 390, height: 844 };
        await page.setViewportSize(phone);
        await assertFitsScreen(page, 'dwell view', phone);
        await page.screenshot({ path: '/tmp/trial-view-390.png' });
        await page.setViewportSize(VIEWPORT);

        const engine = [];
        /**
         * Rests the mouse on a target's centre until the text reads `after` (a string) or `after.until`
         * reaches `after.state` (default visible), then moves off. Waiting for the effect, not a fixed
         * time: after each selection the dwell's refractory time (default 300 ms) comes first.
         */
        const dwellOn = async (selector, after) => {
          const box = await page.locator(selector).boundingBox();
          assert.ok(box, `${selector} is on screen`);
          await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
          if (typeof after === 'string') {
            await textIs(page, after);
            engine.push(await engineMs(page));
          } else await after.until.waitFor({ state: after.state ?? 'visible' });
          await page.mouse.move(2, 2);
        };
        await dwellOn('[data-key="shift"]', {
          until: page.locator('[data-key="shift"][aria-pressed="true"]'),
        });
        await dwellOn('[data-key="letter-h"]', 'H');
        await dwellOn('[data-key="letter-i"]', 'Hi');
        await dwellOn('[data-key="space"]', 'Hi ');
        await dwellOn('[data-key="layer"]', { until: page.locator('[data-key="digit-2"]') });
        await dwellOn('[data-key="digit-2"]', 'Hi 2');
        await dwellOn('[data-key="layer"]', { until: page.locator('[data-key="letter-g"]') });
        await dwellOn('[data-key="newline"]', 'Hi 2\n');
        await dwellOn('[data-key="letter-g"]', 'Hi 2\ng');
        const word = await firstSuggestion(page);
        await dwellOn('[role="group"][aria-label="Suggestions"] button >> nth=0', `Hi 2\n${word} `);
        await page.screenshot({ path: '/tmp/trial-view-dwell.png' });
        await dwellOn('[data-key="undo-pick"]', 'Hi 2\ng');

        // The Pause key: the pause dialog, Resume focused.
        await dwellOn('[data-key="pause"]', { until: pauseDialog(page) });
        assert.equal(
          await page.evaluate(() => document.activeElement?.textContent?.trim()),
          'Resume trial',
          'focus is on Resume',
        );
        assert.deepEqual(await t.seriousViolations(page, 'pause dialog (dwell)'), []);
        await page.screenshot({ path: '/tmp/trial-view-dwell-paused.png' });
        await page.waitForTimeout(300); // a pause worth leaving out
        await dwellOn('[data-pause-choice="pause-resume"]', { until: pauseDialog(page), state: 'detached' });
        await dwellOn('[data-key="letter-o"]', 'Hi 2\ngo');
        await printLatency(page, 'dwell trial view', engine);

        // Escape pauses too; Finish (dwelt on) closes the view and shows the results.
        await page.keyboard.press('Escape');
        await pauseDialog(page).waitFor();
        await dwellOn('[data-pause-choice="pause-finish"]', { until: page.getByText('The trial is saved.') });
        assert.equal(await page.evaluate(() => document.activeElement?.id), 'trial-results-heading');
        await checkStored(page, t, versionId, countBefore, 'Hi 2\ngo', 'dwell');
        await signOut(page, 'Carer');
      },
    ],
    [
      'two-switch step scanning: a trial typed with key presses only, paused by a long press, Escape and the Pause key',
      async (t) => {
        const { page, versionId } = await openDemoKeyboard(t, VIEWPORT);
        await page.getByLabel('Selection mode').selectOption('scanning');
        await page.getByLabel('Scanning pattern').selectOption('step-two-switch');
        const countBefore = (await trialsOf(page, t.appUrl, versionId)).length;
        await page.getByRole('button', { name: 'Start trial' }).click();
        await trialView(page).waitFor();
        await assertFitsScreen(page, 'scanning view');
        assert.deepEqual(await t.seriousViolations(page, 'trial view (scanning)'), []);

        let presses = 0;
        const press = async (key) => {
          await page.keyboard.press(key);
          presses++;
        };
        const engine = [];
        /**
         * Space moves until the target's row is highlighted, Enter enters it; Space moves to the
         * target, Enter selects it. Then waits for the text (when given).
         */
        const scanSelect = async (selector, after) => {
          const state = () =>
            page.locator(selector).evaluate((target) => ({
              row: target.parentElement?.getAttribute('data-scan-row') === 'on',
              item: target.getAttribute('data-scanned') === 'on',
            }));
          for (let guard = 0; !(await state()).row; guard++) {
            assert.ok(guard < 12, `the scan reaches the row of ${selector}`);
            await press('Space');
          }
          await press('Enter');
          for (let guard = 0; !(await state()).item; guard++) {
            assert.ok(guard < 14, `the scan reaches ${selector}`);
            await press('Space');
          }
          await press('Enter');
          if (after !== undefined) {
            await textIs(page, after);
            engine.push(await engineMs(page));
          }
        };
        await scanSelect('[data-key="shift"]');
        await page.locator('[data-key="shift"][aria-pressed="true"]').waitFor();
        await scanSelect('[data-key="letter-h"]', 'H');
        await scanSelect('[data-key="letter-i"]', 'Hi');
        await scanSelect('[data-key="space"]', 'Hi ');
        await scanSelect('[data-key="layer"]');
        await page.locator('[data-key="digit-2"]').waitFor();
        await scanSelect('[data-key="digit-2"]', 'Hi 2');
        await scanSelect('[data-key="layer"]');
        await page.locator('[data-key="letter-g"]').waitFor();
        await scanSelect('[data-key="newline"]', 'Hi 2\n');
        await scanSelect('[data-key="letter-g"]', 'Hi 2\ng');
        const word = await firstSuggestion(page);
        await scanSelect('[role="group"][aria-label="Suggestions"] button >> nth=0', `Hi 2\n${word} `);
        await page.screenshot({ path: '/tmp/trial-view-scanning.png' });
        await scanSelect('[data-key="undo-pick"]', 'Hi 2\ng');

        // A long press (Space held 2.2 s) pauses; the dialog's buttons are scanned: Enter takes Resume.
        await page.keyboard.down('Space');
        await page.waitForTimeout(2_200);
        await page.keyboard.up('Space');
        presses++;
        await pauseDialog(page).waitFor();
        await page.locator('[data-pause-choice="pause-resume"][data-scanned="on"]').waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'pause dialog (scanning)'), []);
        await page.screenshot({ path: '/tmp/trial-view-scanning-paused.png' });
        await page.keyboard.press('Enter');
        await pauseDialog(page).waitFor({ state: 'detached' });

        // Escape pauses; Enter resumes. Then the Pause key, scanned like any key.
        await page.keyboard.press('Escape');
        await pauseDialog(page).waitFor();
        await page.keyboard.press('Enter');
        await pauseDialog(page).waitFor({ state: 'detached' });
        await scanSelect('[data-key="letter-o"]', 'Hi 2\ngo');
        await scanSelect('[data-key="pause"]');
        await pauseDialog(page).waitFor();
        await printLatency(page, 'scanning trial view', engine);
        // Space moves to Finish, Enter takes it.
        await page.keyboard.press('Space');
        await page.locator('[data-pause-choice="pause-finish"][data-scanned="on"]').waitFor();
        await page.keyboard.press('Enter');
        await page.getByText('The trial is saved.').waitFor();
        await page.screenshot({ path: '/tmp/trial-view-scanning-results.png' });
        await checkStored(page, t, versionId, countBefore, 'Hi 2\ngo', 'scanning');
        const [trial] = await trialsOf(page, t.appUrl, versionId);
        assert.equal(trial.measures.switchActivations, presses, 'every switch press in the view is logged');
        await signOut(page, 'Carer');
      },
    ],
  ],
};
