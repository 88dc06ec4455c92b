// Test keyboard: the carer tries the seeded version 1 of the demo client. Sign-off is
// refused before any trial (button and API); a direct-mode trial types a practice phrase by
// clicking keys and picking suggestions, and the logged keystrokes equal the clicks; scanning
// driven by the Space switch at 150 ms; dwell by hovering; axe in every mode with screenshots;
// the engine's work per key and the key-press → suggestion-row latency (p50/p95, each beside its
// target) and the download sizes are printed for the
// note; then sign-off is accepted, the supervisor approves, and the keyboard opens the active version.
// Every suggestion shown while typing is a word of the vocabulary: the base vocabulary (downloaded
// here as the keyboard does) or a word of the demo client's samples (corpora/demo, read here).
import { deserializeBaseWords, prepareText, sentencesOf, wordKey } from '@keyloom/shared';
import assert from 'node:assert/strict';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gunzipSync } from 'node:zlib';
// The demo samples' folder, as the API's seed finds it (api/src/config/data-paths.ts).
import { demoSamplesDir as demoDir } from '../../api/dist/config/data-paths.js';
import { signIn, signOut } from './accounts.mjs';
import { csrfHeaders } from './api-helpers.mjs';
import {
  capitalsOff,
  finishTrial,
  keyButton,
  printLatency,
  rowSettled,
  suggestionRow,
  trialView,
} from './keyboard-page.mjs';
import { assertNoSidewaysScroll } from './page-checks.mjs';

const DEMO_CLIENT = 'R. Ashby';
// The phrase of his own seeded with version 1 (api/src/db/seeds/demo-version.seed.ts).
const OWN_PHRASE = 'can pepper come sailing with us on sunday?';

// Shared between the steps: the client and version 1 found in the first one.
let clientId = null;
let versionId = null;

const WORD = /^[\p{L}\p{N}']+/u;

async function trialsOf(page, appUrl) {
  const res = await page.request.get(`${appUrl}/api/profile-versions/${versionId}/trials`);
  assert.equal(res.status(), 200, 'the trials are readable');
  return res.json();
}

/** Signs in as the carer and opens the test keyboard on version 1, ready to type. */
async function openKeyboard(t, query = `?version=${versionId}`) {
  await t.context.clearCookies();
  const page = await t.newPage();
  await signIn(page, t.appUrl, 'carer@willowmere.example');
  await page.waitForURL((url) => url.pathname === '/my-clients');
  await page.goto(`${t.appUrl}/clients/${clientId}/keyboard${query}`, { waitUntil: 'networkidle' });
  await page.getByRole('heading', { level: 1, name: 'Test keyboard' }).waitFor();
  await page.locator('[data-engine-status="ready"]').waitFor({ timeout: 60_000 });
  await capitalsOff(page);
  return page;
}

/**
 * The vocabulary the version's suggestion row may offer, built in this process: the base vocabulary
 * the version's download names (X-Keyloom-Base-Words), fetched and unpacked with node:zlib, and the
 * words of the demo client's samples (the engine's own tokeniser over corpora/demo).
 */
async function vocabularyOf(page, appUrl) {
  const model = await page.request.get(`${appUrl}/api/profile-versions/${versionId}/model`);
  assert.equal(model.status(), 200, 'the version model downloads');
  const sha = model.headers()['x-keyloom-base-words'];
  assert.match(sha ?? '', /^[0-9a-f]{64}$/, 'the version names its base vocabulary');
  const res = await page.request.get(`${appUrl}/api/base-words/${sha}`);
  assert.equal(res.status(), 200, 'the base vocabulary downloads');
  const base = deserializeBaseWords(new Uint8Array(gunzipSync(await res.body())));
  const own = new Set();
  for (const file of readdirSync(demoDir).filter((f) => /\.(txt|csv)$/.test(f))) {
    for (const sentence of sentencesOf(prepareText(readFileSync(join(demoDir, file), 'utf8')))) {
      for (const token of sentence) own.add(token.key);
    }
  }
  return (word) => {
    const key = wordKey(word);
    return own.has(key) || base.ngram.has(key) || (base.lexicon ? base.lexicon.idOf(key) >= 0 : false);
  };
}

const outputText = (page) => page.locator('[data-output]').getAttribute('data-text');

// The worker's own time per answer, collected while typing (printed beside the latency).
const engineTimes = [];

/** Clicks, then waits until the suggestion row answers the new text. */
async function selectAndSettle(page, locator) {
  await locator.click();
  await rowSettled(page);
  engineTimes.push(Number(await suggestionRow(page).getAttribute('data-engine-ms')));
}

async function chooseSelectionMode(page, mode) {
  await page.getByLabel('Selection mode').selectOption(mode);
}

export const keyboardSuite = {
  name: 'keyboard',
  tests: [
    [
      'sign-off is refused before any trial: the button waits and the API answers 409',
      async (t) => {
        await t.context.clearCookies();
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'carer@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/my-clients');
        await page.getByRole('link', { name: DEMO_CLIENT, exact: true }).first().click();
        await page.waitForURL(/\/clients\/[0-9a-f-]{36}\//);
        clientId = new URL(page.url()).pathname.split('/')[2];
        const versions = await (
          await page.request.get(`${t.appUrl}/api/clients/${clientId}/profile-versions`)
        ).json();
        const first = versions.find((v) => v.number === 1);
        assert.ok(first, 'the seed trained version 1 of the demo client');
        assert.equal(first.status, 'trained', 'version 1 is ready for trial (fresh database)');
        versionId = first.id;
        assert.equal((await trialsOf(page, t.appUrl)).length, 0, 'no trial yet');

        await page.getByRole('tab', { name: 'Try-outs' }).click();
        await page.waitForURL(/\/trials$/);
        await page.getByRole('heading', { name: 'Versions to try' }).waitFor();
        // Another suite may have made a later version active (the tab's default): choose version 1.
        await page.getByLabel('Version to try or review').selectOption(versionId);
        await page.getByText(/^No trials of version 1 yet\./).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'try-outs tab'), []);
        await t.screenshot(page, 'keyboard-tryouts-tab');
        await page.setViewportSize({ width: 640, height: 800 });
        await assertNoSidewaysScroll(page, 'try-outs tab at 200%');
        await page.setViewportSize({ width: 1280, height: 860 });

        await page.goto(`${t.appUrl}/clients/${clientId}/profiles/${versionId}`, {
          waitUntil: 'networkidle',
        });
        await page.getByText('Try this version on the test keyboard first.').waitFor();
        assert.ok(
          await page.getByRole('button', { name: 'Sign off' }).isDisabled(),
          'Sign off waits for a trial',
        );
        assert.ok(await page.getByRole('button', { name: 'Report a problem' }).isDisabled());
        const res = await page.request.post(`${t.appUrl}/api/profile-versions/${versionId}/sign-off`, {
          headers: await csrfHeaders(page, t.appUrl),
          data: { comment: 'Trying to sign off without a trial.' },
        });
        assert.equal(res.status(), 409, 'the API refuses a sign-off before any trial');
        assert.match((await res.json()).message, /test keyboard/);
        await signOut(page, 'Carer');
      },
    ],
    [
      'direct mode: types a practice phrase with keys and suggestions; the log counts every click',
      async (t) => {
        assert.ok(versionId, 'the first step found version 1');
        const page = await openKeyboard(t);
        await page
          .getByText('Suggestions are offered, never inserted on their own', { exact: false })
          .waitFor();
        const sizes = await page
          .locator('dl[aria-label="Model download"]')
          .evaluate((dl) => ({ ...dl.dataset }));
        console.log(
          `    model download: version ${sizes.versionCompressedBytes} bytes gzip (${sizes.versionBytes} unpacked), ` +
            `base ${sizes.baseCompressedBytes} bytes gzip (${sizes.baseBytes} unpacked), ` +
            `base vocabulary ${sizes.baseWordsCompressedBytes} bytes gzip (${sizes.baseWordsBytes} unpacked), loaded in ${sizes.loadMs} ms`,
        );
        assert.ok(Number(sizes.versionCompressedBytes) > 0, 'the version model was downloaded');
        assert.ok(Number(sizes.baseWordsCompressedBytes) > 0, 'the base vocabulary was downloaded');

        const phrase = page.getByLabel('Practice phrase');
        const option = phrase.locator('option', { hasText: OWN_PHRASE });
        await phrase.selectOption(await option.getAttribute('value'));
        await page.locator('[data-target-phrase]').filter({ hasText: OWN_PHRASE }).waitFor();
        await page.getByRole('button', { name: 'Start trial' }).click();
        await rowSettled(page);

        let clicks = 0;
        let picked = 0;
        const rows = []; // every row shown: the text it answered and its slots
        for (let guard = 0; guard < 200; guard++) {
          const text = await outputText(page);
          if (text === OWN_PHRASE) break;
          assert.ok(OWN_PHRASE.startsWith(text), `"${text}" is on the way to the phrase`);
          const next = OWN_PHRASE[text.length];
          // The word being typed, whole, when a suggestion for it would leave the text on the phrase.
          const start = text.length - (text.match(/[\p{L}\p{N}']*$/u)?.[0].length ?? 0);
          const word = OWN_PHRASE.slice(start).match(WORD)?.[0] ?? null;
          const after = word ? OWN_PHRASE[start + word.length] : undefined;
          const slots = await suggestionRow(page)
            .getByRole('button')
            .evaluateAll((buttons) =>
              buttons.map((b) => ({
                word: b.textContent?.trim() ?? '',
                label: b.getAttribute('aria-label') ?? '',
                enabled: !b.disabled,
              })),
            );
          rows.push({ text, slots });
          const words = slots.map((s) => (s.enabled ? s.word : ''));
          const slot = word && after === ' ' && WORD.test(next) ? words.indexOf(word) : -1;
          if (slot >= 0) {
            await selectAndSettle(
              page,
              suggestionRow(page).getByRole('button', {
                name: `${word} (suggestion ${slot + 1})`,
                exact: true,
              }),
            );
            picked++;
          } else {
            await selectAndSettle(page, keyButton(page, next));
          }
          clicks++;
        }
        assert.equal(await outputText(page), OWN_PHRASE);

        // Every suggestion shown is a whole word of the vocabulary (or one typed in this trial,
        // which the keyboard learns), never empty; an empty slot is disabled and says so.
        const inVocabulary = await vocabularyOf(page, t.appUrl);
        const typedWords = new Set((OWN_PHRASE.match(/[\p{L}']+/gu) ?? []).map(wordKey));
        let shown = 0;
        for (const { text, slots } of rows) {
          for (const [i, slot] of slots.entries()) {
            if (!slot.enabled) {
              assert.equal(slot.label, `Suggestion ${i + 1}: empty`, `an empty slot after "${text}" says so`);
              continue;
            }
            shown++;
            assert.notEqual(slot.word, '', `no empty suggestion after "${text}"`);
            assert.equal(slot.label, `${slot.word} (suggestion ${i + 1})`);
            assert.ok(
              inVocabulary(slot.word) || typedWords.has(wordKey(slot.word)),
              `"${slot.word}" offered after "${text}" is a word of the vocabulary`,
            );
          }
        }
        assert.ok(shown >= rows.length, `suggestions were shown (${shown} over ${rows.length} rows)`);
        console.log(`    ${shown} suggestions over ${rows.length} rows, each a word of the vocabulary`);
        const characters = [...OWN_PHRASE].length;
        console.log(
          `    typed "${OWN_PHRASE}" (${characters} characters) with ${clicks} clicks, ${picked} of them suggestions`,
        );
        assert.deepEqual(await t.seriousViolations(page, 'keyboard direct mode'), []);
        await t.screenshot(page, 'keyboard-direct');

        // Latency: the engine's work per key, and key press → suggestion row on screen (the page's
        // performance measures), each beside its own target.
        const sorted = await printLatency(page, 'direct trial', engineTimes);
        assert.ok(
          sorted.length >= clicks * 0.9,
          `a measure for (nearly) every click: ${sorted.length} of ${clicks}`,
        );

        await finishTrial(page);
        await page.locator('[data-upload-state="sent"]').waitFor();
        await page.getByText('The trial is saved.').waitFor();
        const [trial] = await trialsOf(page, t.appUrl);
        assert.equal(trial.text, OWN_PHRASE);
        assert.equal(trial.measures.characters, characters);
        assert.equal(trial.measures.keystrokes, clicks, 'logged keystrokes equal the clicks made');
        assert.equal(trial.measures.suggestionsTaken, picked);
        // KS = 1 − keystrokes / characters (definition; the API rounds to 6 places).
        assert.ok(
          Math.abs(trial.measures.keystrokeSavings - (1 - clicks / characters)) < 1e-6,
          'savings agree with the clicks',
        );
        assert.equal(trial.settings.selectionMode, 'direct');
        assert.equal(trial.phraseId !== null, true);
        console.log(
          `    measured keystroke savings ${(trial.measures.keystrokeSavings * 100).toFixed(1)}% ` +
            `(simulated ${trial.simulated.keystrokeSavings === null ? '—' : (trial.simulated.keystrokeSavings * 100).toFixed(1) + '%'} at ${trial.simulated.slots} slots)`,
        );
        await t.screenshot(page, 'keyboard-direct-results');
        await signOut(page, 'Carer');
      },
    ],
    [
      'scanning mode at 150 ms, driven by the Space switch, logs the switch presses',
      async (t) => {
        const page = await openKeyboard(t);
        await chooseSelectionMode(page, 'scanning');
        const interval = page.getByLabel('Scan interval (ms)');
        await interval.fill('150');
        await interval.blur();
        const countBefore = (await trialsOf(page, t.appUrl)).length;
        await page.getByRole('button', { name: 'Start trial' }).click();
        await trialView(page).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'keyboard scanning'), []);
        await t.screenshot(page, 'keyboard-scanning');

        // "as": the first two keys of the home row (key row 2 of the grid).
        let presses = 0;
        for (const letter of ['a', 's']) {
          await page.waitForFunction(
            () =>
              document
                .querySelector('[role="group"][aria-label="Keys"] > div:nth-child(2)')
                ?.getAttribute('data-scan-row') === 'on',
            undefined,
            { polling: 'raf', timeout: 10_000 },
          );
          await page.keyboard.press('Space');
          presses++;
          await page.waitForFunction(
            (id) => document.querySelector(`[data-key="${id}"]`)?.getAttribute('data-scanned') === 'on',
            `letter-${letter}`,
            { polling: 'raf', timeout: 10_000 },
          );
          await page.keyboard.press('Space');
          presses++;
        }
        await page.waitForFunction(
          () => document.querySelector('[data-output]')?.getAttribute('data-text') === 'as',
        );
        await finishTrial(page);
        await page.getByText('The trial is saved.').waitFor();
        const trials = await trialsOf(page, t.appUrl);
        assert.equal(trials.length, countBefore + 1);
        const [trial] = trials;
        assert.equal(trial.text, 'as');
        assert.equal(trial.settings.selectionMode, 'scanning');
        assert.equal(trial.settings.scanIntervalMs, 150);
        assert.equal(trial.measures.keystrokes, 2, 'two letters selected');
        assert.equal(trial.measures.switchActivations, presses, 'every switch press is logged');
        await signOut(page, 'Carer');
      },
    ],
    [
      'direct mode takes a physical keyboard: a capital, a digit and a new line typed on it are logged',
      async (t) => {
        const page = await openKeyboard(t);
        await page.getByRole('checkbox', { name: 'Capital after a full stop' }).check();
        assert.ok(
          await page
            .getByLabel('Selection mode')
            .locator('option', { hasText: 'Direct (pointer, touch or keyboard)' })
            .count(),
          'the direct mode says it takes a keyboard',
        );
        const countBefore = (await trialsOf(page, t.appUrl)).length;
        await page.getByRole('button', { name: 'Start trial' }).click();
        await rowSettled(page);
        // h (a capital at the message's start), i, Space, 2, Enter, o, k (a capital after the line break).
        await page.keyboard.type('hi 2');
        await page.keyboard.press('Enter');
        await page.keyboard.type('ok');
        await page.waitForFunction(
          () => document.querySelector('[data-output]')?.getAttribute('data-text') === 'Hi 2\nOk',
        );
        assert.deepEqual(await t.seriousViolations(page, 'keyboard physical keys'), []);
        await finishTrial(page);
        await page.getByText('The trial is saved.').waitFor();
        const trials = await trialsOf(page, t.appUrl);
        assert.equal(trials.length, countBefore + 1);
        const [trial] = trials;
        assert.equal(trial.text, 'Hi 2\nOk');
        assert.equal(trial.measures.characters, 7);
        assert.equal(trial.measures.keystrokes, 7, 'one selection per key typed');
        await signOut(page, 'Carer');
      },
    ],
    [
      'two-switch step scanning, suggestions last: Space moves, Enter selects, "as" typed with no timer',
      async (t) => {
        const page = await openKeyboard(t);
        await chooseSelectionMode(page, 'scanning');
        await page.getByLabel('Scanning pattern').selectOption('step-two-switch');
        await page.getByLabel('Suggestions scanned').selectOption('last');
        await page.getByText('Space moves one step; Enter chooses.').waitFor();
        const countBefore = (await trialsOf(page, t.appUrl)).length;
        await page.getByRole('button', { name: 'Start trial' }).click();
        await trialView(page).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'keyboard two-switch scanning'), []);
        const rowOn = (n) =>
          page.waitForFunction(
            (k) =>
              document
                .querySelector(`[role="group"][aria-label="Keys"] > div:nth-child(${k})`)
                ?.getAttribute('data-scan-row') === 'on',
            n,
            { polling: 'raf', timeout: 10_000 },
          );
        // Suggestions last: key row 1 first. Move to the home row (row 2), select it, then the key.
        const presses = [];
        const press = async (key) => {
          await page.keyboard.press(key);
          presses.push(key);
        };
        await rowOn(1);
        await press('Space');
        await rowOn(2);
        await press('Enter'); // the home row: "a" highlighted
        await press('Enter'); // a
        await rowOn(1);
        await press('Space');
        await rowOn(2);
        await press('Enter');
        await press('Space'); // "s"
        await press('Enter'); // s
        await page.waitForFunction(
          () => document.querySelector('[data-output]')?.getAttribute('data-text') === 'as',
        );
        await finishTrial(page);
        await page.getByText('The trial is saved.').waitFor();
        const trials = await trialsOf(page, t.appUrl);
        assert.equal(trials.length, countBefore + 1);
        const [trial] = trials;
        assert.equal(trial.text, 'as');
        assert.equal(trial.settings.scanPattern, 'step-two-switch');
        assert.equal(trial.settings.suggestionsScanned, 'last');
        assert.equal(trial.measures.keystrokes, 2, 'two letters selected');
        assert.equal(
          trial.measures.switchActivations,
          presses.length,
          'every press of either switch is logged',
        );
        await signOut(page, 'Carer');
      },
    ],
    [
      'offline: the model keeps answering, a finished trial waits, and it uploads once the network is back',
      async (t) => {
        const page = await openKeyboard(t);
        const countBefore = (await trialsOf(page, t.appUrl)).length;
        await page.getByRole('button', { name: 'Start trial' }).click();
        await rowSettled(page);
        await selectAndSettle(page, keyButton(page, 'h'));
        await t.context.setOffline(true);
        try {
          // The engine runs in the page: suggestions still follow every key press.
          await selectAndSettle(page, keyButton(page, 'i'));
          assert.equal(await outputText(page), 'hi');
          await finishTrial(page);
          await page.locator('[data-upload-state="queued"]').waitFor();
          await page.getByText(/Waiting for the network/).waitFor();
          assert.deepEqual(await t.seriousViolations(page, 'keyboard offline'), []);
          await t.screenshot(page, 'keyboard-offline');
        } finally {
          // Never leave the shared browser offline for the suites after this one.
          await t.context.setOffline(false);
        }
        // The queue retries on the browser's "online" event (and every 15 s).
        await page.locator('[data-upload-state="sent"]').waitFor({ timeout: 40_000 });
        const trials = await trialsOf(page, t.appUrl);
        assert.equal(trials.length, countBefore + 1, 'uploaded exactly once');
        assert.equal(trials[0].text, 'hi');
        await signOut(page, 'Carer');
      },
    ],
    [
      'dwell mode: resting the pointer on a key types it; axe in dwell, high-contrast and large-target modes',
      async (t) => {
        const page = await openKeyboard(t);
        await chooseSelectionMode(page, 'dwell');
        const dwell = page.getByLabel('Dwell time (ms)');
        await dwell.fill('1200');
        await dwell.blur();
        const k = keyButton(page, 'k');
        await k.hover();
        await page.locator('[data-dwell-fill]').waitFor();
        await page.waitForTimeout(500);
        await t.screenshot(page, 'keyboard-dwell');
        assert.deepEqual(await t.seriousViolations(page, 'keyboard dwell'), []);
        await page.waitForFunction(
          () => document.querySelector('[data-output]')?.getAttribute('data-text') === 'k',
        );
        await page.mouse.move(0, 0);

        await page.getByLabel('High contrast').check();
        await page.getByLabel('Tint likely next keys').check();
        assert.deepEqual(await t.seriousViolations(page, 'keyboard high contrast'), []);
        await t.screenshot(page, 'keyboard-high-contrast');
        await page.getByLabel('High contrast').uncheck();
        await page.getByLabel('Large targets').check();
        await page.getByLabel('Text size').selectOption('2');
        assert.deepEqual(await t.seriousViolations(page, 'keyboard large targets'), []);
        const keyHeight = (await k.boundingBox())?.height ?? 0;
        assert.ok(keyHeight >= 64, `large targets are at least 64 px high (${keyHeight})`);
        await t.screenshot(page, 'keyboard-large-targets');
        // 640 px wide (1280 px at 200 % zoom): no sideways scrolling of the page.
        await page.setViewportSize({ width: 640, height: 430 });
        await assertNoSidewaysScroll(page, 'keyboard page');
        await t.screenshot(page, 'keyboard-640');
        await page.setViewportSize({ width: 1280, height: 860 });
        await signOut(page, 'Carer');
      },
    ],
    [
      'ordered by the model: the letters re-order after a letter, each letter once, the other keys stay; axe',
      async (t) => {
        const page = await openKeyboard(t);
        await page.getByLabel('Key order').selectOption('model-ordered');
        await page.getByText(/moves the letters after every letter typed/).waitFor();
        // The letter keys in grid order (their ids stay letter-x), and every key id in grid order.
        const keyIds = () =>
          page.locator('[data-key]').evaluateAll((keys) => keys.map((key) => key.getAttribute('data-key')));
        const letterOrder = async () =>
          (await keyIds())
            .filter((id) => id.startsWith('letter-'))
            .map((id) => id.slice('letter-'.length))
            .join('');
        await rowSettled(page);
        const before = await letterOrder();
        assert.equal([...before].sort().join(''), 'abcdefghijklmnopqrstuvwxyz', 'every letter once');
        const othersBefore = (await keyIds()).filter((id) => !id.startsWith('letter-'));
        await selectAndSettle(page, keyButton(page, 't'));
        await page.waitForFunction(
          (old) =>
            [...document.querySelectorAll('[data-key^="letter-"]')]
              .map((key) => key.getAttribute('data-key').slice('letter-'.length))
              .join('') !== old,
          before,
        );
        const after = await letterOrder();
        assert.equal([...after].sort().join(''), 'abcdefghijklmnopqrstuvwxyz', 'every letter once after');
        assert.deepEqual(
          (await keyIds()).filter((id) => !id.startsWith('letter-')),
          othersBefore,
          'the other keys do not move',
        );
        // After "t" an English model puts "h" among its likeliest letters: in one of the three
        // cheapest cells, row 1 columns 1 and 2 and row 2 column 1 (letters 1, 2 and 10 in grid order).
        assert.ok(
          [after[0], after[1], after[9]].includes('h'),
          `"h" in a cell of 2 or 3 steps after "t" (${after})`,
        );
        assert.equal(await outputText(page), 't');
        assert.deepEqual(await t.seriousViolations(page, 'keyboard ordered by the model'), []);
        await t.screenshot(page, 'keyboard-model-ordered');
        await signOut(page, 'Carer');
      },
    ],
    [
      'after the trial the carer signs off, the supervisor approves, and the keyboard opens the active version',
      async (t) => {
        assert.ok(versionId, 'the first step found version 1');
        await t.context.clearCookies();
        let page = await t.newPage();
        await signIn(page, t.appUrl, 'carer@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/my-clients');
        await page.goto(`${t.appUrl}/clients/${clientId}/profiles/${versionId}`, {
          waitUntil: 'networkidle',
        });
        await page.getByRole('table', { name: 'Trials of version 1, newest first' }).waitFor();
        await t.screenshot(page, 'keyboard-version-trials');
        const signOff = page.getByRole('button', { name: 'Sign off' });
        await page.waitForFunction(() =>
          [...document.querySelectorAll('button')].some((b) => b.textContent === 'Sign off' && !b.disabled),
        );
        await signOff.click();
        const dialog = page.getByRole('dialog', { name: /^Sign off version/ });
        await dialog
          .getByLabel('How did the try-outs go?')
          .fill('Two trials on the test keyboard; the words he uses came up.');
        await dialog.getByRole('button', { name: 'Sign off' }).click();
        await page
          .getByRole('status')
          .filter({ hasText: /You signed off version/ })
          .waitFor();
        await signOut(page, 'Carer');

        await t.context.clearCookies();
        page = await t.newPage();
        await signIn(page, t.appUrl, 'supervisor@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/reviews');
        await page.goto(`${t.appUrl}/clients/${clientId}/profiles/${versionId}`, {
          waitUntil: 'networkidle',
        });
        await page.getByRole('table', { name: 'Trials of version 1, newest first' }).waitFor();
        assert.equal(
          await page.getByRole('link', { name: /on the test keyboard/ }).count(),
          0,
          'supervisors get no keyboard',
        );
        await page.getByRole('button', { name: 'Approve' }).click();
        const approve = page.getByRole('dialog', { name: /^Approve version/ });
        await approve.getByLabel('Comment for the record').fill('Trials and the simulated figures agree.');
        await approve.getByRole('button', { name: 'Approve' }).click();
        await page
          .getByRole('status')
          .filter({ hasText: /is now the active profile/ })
          .waitFor();
        await signOut(page, 'Supervisor');

        page = await openKeyboard(t, '');
        assert.equal(
          await page.getByLabel('Profile version to try').inputValue(),
          versionId,
          'the active version opens by default',
        );
        const chosen = await page
          .getByLabel('Profile version to try')
          .evaluate((select) => select.options[select.selectedIndex]?.textContent);
        assert.equal(chosen, 'Version 1 — Active profile');
        await signOut(page, 'Carer');
      },
    ],
  ],
};
