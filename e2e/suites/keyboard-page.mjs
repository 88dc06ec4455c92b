// The test keyboard page as the browser suites drive it: its keys, its suggestion row and the
// wait until the row answers the text on screen.
import assert from 'node:assert/strict';
import { signIn } from './accounts.mjs';

/** Accessible names of the keys that are not letters. */
export const keyNames = {
  ' ': 'space',
  '.': 'full stop',
  ',': 'comma',
  '?': 'question mark',
  "'": 'apostrophe',
  '-': 'hyphen',
};

export const suggestionRow = (page) => page.getByRole('group', { name: 'Suggestions' });

/** The key that types `char` (a lower-case letter or one of keyNames). */
export const keyButton = (page, char) =>
  page
    .getByRole('group', { name: 'Keys' })
    .getByRole('button', { name: keyNames[char] ?? char, exact: true });

/** Waits until the suggestion row answers the text on screen. */
export async function rowSettled(page) {
  await page.waitForFunction(() => {
    const row = document.querySelector('[role="group"][aria-label="Suggestions"]');
    const output = document.querySelector('[data-output]');
    return (
      row !== null && output !== null && row.getAttribute('data-answers') === output.getAttribute('data-text')
    );
  });
}

/**
 * Turns the automatic capital off (it is on by default): the suites type lower-case phrases with the
 * lower-case keys.
 */
export async function capitalsOff(page) {
  const box = page.getByRole('checkbox', { name: 'Capital after a full stop' });
  if (await box.isChecked()) await box.uncheck();
}

/** The running trial's view: the keyboard alone on the screen. */
export const trialView = (page) => page.getByRole('dialog', { name: 'Trial', exact: true });

/** The pause dialog of a running trial. */
export const pauseDialog = (page) => page.getByRole('dialog', { name: 'Trial paused' });

/** Pauses the running trial with Escape and finishes it from the pause dialog. */
export async function finishTrial(page) {
  await page.keyboard.press('Escape');
  await pauseDialog(page).getByRole('button', { name: 'Finish trial' }).click();
}

/** The nearest rank percentile of sorted values (p in 0..100). */
export const percentile = (sorted, p) => sorted[Math.max(0, Math.ceil((p / 100) * sorted.length) - 1)];

/**
 * Prints the two latency figures, each beside its own target (reported, never asserted): the
 * worker's engine work per key (target p95 ≤ 16 ms) and key selection → updated suggestion row on
 * screen (the page's `keyloom:suggest` measures; target p95 ≤ 50 ms). Returns the row times, sorted.
 * @param engineTimes the worker's own time per answer (data-engine-ms of each row), ms
 */
export async function printLatency(page, label, engineTimes) {
  const durations = await page.evaluate(() =>
    performance.getEntriesByName('keyloom:suggest').map((entry) => entry.duration),
  );
  const sorted = [...durations].sort((a, b) => a - b);
  const engine = [...engineTimes].sort((a, b) => a - b);
  const fixed = (values, p) => (values.length === 0 ? '—' : percentile(values, p).toFixed(2));
  console.log(
    `    ${label}: engine work per key over ${engine.length} answers: p50 ${fixed(engine, 50)} ms, ` +
      `p95 ${fixed(engine, 95)} ms (target p95 ≤ 16 ms, not asserted)`,
  );
  console.log(
    `    ${label}: key selection → updated suggestion row on screen over ${sorted.length} selections: ` +
      `p50 ${fixed(sorted, 50)} ms, p95 ${fixed(sorted, 95)} ms, max ${sorted.length ? sorted.at(-1).toFixed(2) : '—'} ms ` +
      `(target p95 ≤ 50 ms, not asserted)`,
  );
  return sorted;
}

/**
 * Signs in as the carer and opens the test keyboard on the demo client's version 1 at `viewport`,
 * with the automatic capital off; returns the page and the version's id.
 */
export async function openDemoKeyboard(t, viewport) {
  await t.context.clearCookies();
  const page = await t.newPage();
  await page.setViewportSize(viewport);
  await signIn(page, t.appUrl, 'carer@willowmere.example');
  await page.waitForURL((url) => url.pathname === '/my-clients');
  await page.getByRole('link', { name: 'R. Ashby', exact: true }).first().click();
  await page.waitForURL(/\/clients\/[0-9a-f-]{36}\//);
  const clientId = new URL(page.url()).pathname.split('/')[2];
  const versions = await (
    await page.request.get(`${t.appUrl}/api/clients/${clientId}/profile-versions`)
  ).json();
  const version = versions.find((v) => v.number === 1);
  assert.ok(version, 'the seed trained version 1 of the demo client');
  await page.goto(`${t.appUrl}/clients/${clientId}/keyboard?version=${version.id}`, {
    waitUntil: 'networkidle',
  });
  await page.getByRole('heading', { level: 1, name: 'Test keyboard' }).waitFor();
  await page.locator('[data-engine-status="ready"]').waitFor({ timeout: 60_000 });
  await capitalsOff(page);
  return { page, versionId: version.id };
}
