// Blocked and added words on the test keyboard. The word the demo client's version offers first
// after "p" is found on the test keyboard (the version trained last); the clinician blocks it and
// adds the names "Okafor" and "Oyelaran" through the API (PUT /api/clients/:id/vocabulary), then
// creates and trains a version (it freezes the vocabulary into its settings and its file's header).
// As the carer, the keyboard on the new version never shows the blocked word while every prefix of
// it is typed after several openings — nor after the word is typed in full and learned — whereas
// the version before shows it on many of the same rows; "Okafor" is offered right after "o" in a
// sensible opening, and "Oyelaran", never offered by the version before, by its third letter.
// Screenshot and axe scan of the keyboard with the block in force.
import { headerVocabulary, readProfileFile, wordKey } from '@keyloom/shared';
import assert from 'node:assert/strict';
import { gunzipSync } from 'node:zlib';
import { signIn, signOut } from './accounts.mjs';
import { csrfHeaders } from './api-helpers.mjs';
import { capitalsOff, keyButton, rowSettled, suggestionRow } from './keyboard-page.mjs';

const DEMO_CLIENT = 'R. Ashby';
// Added names. The demo samples already write "Okafor" once (so every version offers it); the
// invented "Oyelaran" is in no sample and not in the base vocabulary: only the addition brings it.
const ADDED = 'Okafor';
const NEW_NAME = 'Oyelaran';
// Openings typed before each prefix of the blocked word (invented, in the demo client's manner;
// lower case: the keyboard has no capitals). The last ones follow the full word typed once.
const OPENINGS = ['', 'hannah and ', 'we took ', 'i said to ', 'can ', 'my dog and '];
// Where the added name makes sense ("Mrs Okafor", "Dr Okafor").
const NAME_OPENINGS = ['i said to mrs ', 'we saw dr ', 'ask '];
// Versions the carer can open on the test keyboard.
const READY = new Set(['trained', 'signed_off', 'active']);

let clientId = null;
let before = null; // the version trained last before the vocabulary changed: { id, number }
let blocked = null; // the blocked word's key
let after = null; // the version trained with the vocabulary: { id, number }
let firstOffers = null; // rows of the version before: { text, words }[]

/**
 * Per name opening, the letters of `name` typed after it before a row offers the name (the first
 * three letters are typed; 4: not offered by then).
 */
function lettersToName(rows, name) {
  const key = wordKey(name);
  return NAME_OPENINGS.map((opening) => {
    for (let n = 1; n <= 3; n++) {
      const row = rows.find((r) => r.text === `${opening}${key.slice(0, n)}`);
      if (row && offers(row.words, key)) return n;
    }
    return 4;
  });
}

/** Types the first three letters of each name after each name opening; every row shown. */
async function nameRows(page) {
  const rows = [];
  for (const name of [ADDED, NEW_NAME])
    for (const opening of NAME_OPENINGS)
      rows.push(...(await typeAndRead(page, `${opening}${wordKey(name).slice(0, 3)}`)));
  return rows;
}

/** The words the row shows now (empty slots left out). */
const rowWords = (page) =>
  suggestionRow(page)
    .getByRole('button')
    .evaluateAll((buttons) => buttons.filter((b) => !b.disabled).map((b) => b.textContent?.trim() ?? ''));

/**
 * Types `text` key by key (no trial: nothing is logged) after clearing the message, and returns
 * every row shown on the way: { text, words } after each key.
 */
async function typeAndRead(page, text) {
  const clear = page.getByRole('button', { name: 'Clear', exact: true });
  if (await clear.isEnabled()) {
    await clear.click();
    await rowSettled(page);
  }
  const rows = [];
  for (const char of text) {
    await keyButton(page, char).click();
    await rowSettled(page);
    rows.push({
      text: await page.locator('[data-output]').getAttribute('data-text'),
      words: await rowWords(page),
    });
  }
  return rows;
}

/** Signs in as the carer and opens the test keyboard on a version, ready to type. */
async function openKeyboard(t, versionId) {
  await t.context.clearCookies();
  const page = await t.newPage();
  await signIn(page, t.appUrl, 'carer@willowmere.example');
  await page.waitForURL((url) => url.pathname === '/my-clients');
  if (!clientId) {
    await page.getByRole('link', { name: DEMO_CLIENT, exact: true }).first().click();
    await page.waitForURL(/\/clients\/[0-9a-f-]{36}\//);
    clientId = new URL(page.url()).pathname.split('/')[2];
  }
  if (!versionId) {
    const res = await page.request.get(`${t.appUrl}/api/clients/${clientId}/profile-versions`);
    assert.equal(res.status(), 200, 'the versions are readable');
    const ready = (await res.json()).filter((v) => READY.has(v.status)).sort((a, b) => b.number - a.number);
    assert.ok(ready.length > 0, 'the demo client has a version to try (the seed trains one)');
    before = { id: ready[0].id, number: ready[0].number };
    versionId = before.id;
  }
  await page.goto(`${t.appUrl}/clients/${clientId}/keyboard?version=${versionId}`, {
    waitUntil: 'networkidle',
  });
  await page.getByRole('heading', { level: 1, name: 'Test keyboard' }).waitFor();
  await page.locator('[data-engine-status="ready"]').waitFor({ timeout: 60_000 });
  await capitalsOff(page);
  await rowSettled(page);
  return page;
}

/** Every opening followed by each prefix of `word`, then the whole word and a space (learned). */
const blockTexts = (word) => OPENINGS.map((opening) => `${opening}${word} `);

const offers = (words, key) => words.some((w) => wordKey(w) === key);

export const vocabularyKeyboardSuite = {
  name: 'vocabulary keyboard',
  tests: [
    [
      'the version before offers a word early: the carer reads it off the test keyboard',
      async (t) => {
        const page = await openKeyboard(t, null);
        // The word the row offers first after "p" (three letters or more: a word worth blocking).
        const [row] = await typeAndRead(page, 'p');
        const first = row.words.find((w) => [...w].length >= 3 && /^[a-z]+$/.test(wordKey(w)));
        assert.ok(first, `the row after "p" offers a word: ${row.words.join(', ')}`);
        blocked = wordKey(first);
        firstOffers = [];
        for (const text of blockTexts(blocked)) firstOffers.push(...(await typeAndRead(page, text)));
        firstOffers.push(...(await nameRows(page)));
        const shown = firstOffers.filter((r) => offers(r.words, blocked));
        console.log(
          `    version ${before.number} offers "${blocked}" on ${shown.length} of ${firstOffers.length} rows ` +
            `(after "p": ${row.words.join(', ')})`,
        );
        assert.ok(
          shown.length >= OPENINGS.length,
          `without the block the word is offered on many rows (${shown.length})`,
        );
        console.log(
          `    letters before the name is offered on version ${before.number}, per opening: ` +
            `"${ADDED}" ${lettersToName(firstOffers, ADDED).join(', ')}; ` +
            `"${NEW_NAME}" ${lettersToName(firstOffers, NEW_NAME).join(', ')} (4: not by the third letter)`,
        );
        assert.equal(
          firstOffers.filter((r) => offers(r.words, wordKey(NEW_NAME))).length,
          0,
          `"${NEW_NAME}" is not a word of version ${before.number}`,
        );
        await signOut(page, 'Carer');
      },
    ],
    [
      'the clinician blocks that word and adds a name, then trains a version with them',
      async (t) => {
        assert.ok(blocked && clientId, 'the first step found the word and the client');
        await t.context.clearCookies();
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'clinician@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/caseload');
        const url = `${t.appUrl}/api/clients/${clientId}/vocabulary`;
        const current = await page.request.get(url);
        assert.equal(current.status(), 200, `the client's vocabulary is readable: ${await current.text()}`);
        const { revision } = await current.json();
        const put = await page.request.put(url, {
          headers: await csrfHeaders(page, t.appUrl),
          data: {
            revision,
            vocabulary: { additions: [{ text: ADDED }, { text: NEW_NAME }], blocks: [{ word: blocked }] },
            keptSpellings: [],
          },
        });
        assert.equal(put.status(), 200, `the vocabulary is saved: ${await put.text()}`);

        const created = await page.request.post(`${t.appUrl}/api/clients/${clientId}/profile-versions`, {
          headers: await csrfHeaders(page, t.appUrl),
          data: { settings: {}, note: 'With the blocked word and the added name.' },
        });
        assert.equal(created.status(), 201, `a version is configured: ${await created.text()}`);
        const version = await created.json();
        after = { id: version.id, number: version.number };
        const train = await page.request.post(`${t.appUrl}/api/profile-versions/${version.id}/train`, {
          headers: await csrfHeaders(page, t.appUrl),
        });
        assert.equal(train.status(), 200, `training is queued: ${await train.text()}`);
        let status = null;
        for (let waited = 0; waited < 240_000; waited += 1000) {
          status = (await (await page.request.get(`${t.appUrl}/api/profile-versions/${version.id}`)).json())
            .status;
          if (status !== 'training' && status !== 'draft') break;
          await page.waitForTimeout(1000);
        }
        assert.equal(status, 'trained', `version ${after.number} is trained`);

        // The version's file carries the vocabulary in its header (what the keyboard applies).
        const model = await page.request.get(`${t.appUrl}/api/profile-versions/${version.id}/model`);
        assert.equal(model.status(), 200, 'the version model downloads');
        const { header } = readProfileFile(new Uint8Array(gunzipSync(await model.body())));
        const vocabulary = headerVocabulary(header);
        assert.deepEqual(
          vocabulary.blocks.map((b) => wordKey(b.word)),
          [blocked],
          'the header blocks the word',
        );
        assert.deepEqual(
          vocabulary.additions.map((a) => a.text),
          [ADDED, NEW_NAME],
          'the header lists the added names',
        );
        await signOut(page, 'Clinician');
      },
    ],
    [
      'on the new version the keyboard never shows the blocked word, and offers the added name',
      async (t) => {
        assert.ok(after, 'the clinician step trained a version');
        const page = await openKeyboard(t, after.id);
        const rows = [];
        for (const text of blockTexts(blocked)) rows.push(...(await typeAndRead(page, text)));
        const shown = rows.filter((r) => offers(r.words, blocked));
        assert.deepEqual(
          shown.map((r) => r.text),
          [],
          `"${blocked}" is never offered on version ${after.number}`,
        );
        // The same rows of the version before offered it (so this check can fail).
        const sameTexts = new Set(rows.map((r) => r.text));
        const shownBefore = firstOffers.filter((r) => sameTexts.has(r.text) && offers(r.words, blocked));
        assert.ok(shownBefore.length >= OPENINGS.length, 'the version before offered it on these rows');
        assert.ok(
          rows.every((r) => !r.text.endsWith(' ') || r.words.length > 0),
          'after a space the row is never empty',
        );
        console.log(
          `    version ${after.number}: "${blocked}" on 0 of ${rows.length} rows ` +
            `(version ${before.number}: ${shownBefore.length} of the same rows)`,
        );

        // The added names: "Okafor" right after "o" in a sensible opening ("mrs o") and by "ok" in
        // every one; "Oyelaran", which the version before never offered, by its third letter in every
        // opening.
        const names = await nameRows(page);
        const okafor = lettersToName(names, ADDED);
        const oyelaran = lettersToName(names, NEW_NAME);
        console.log(
          `    letters before the name is offered on version ${after.number}, per opening: ` +
            `"${ADDED}" ${okafor.join(', ')}; "${NEW_NAME}" ${oyelaran.join(', ')}`,
        );
        assert.equal(okafor[0], 1, `"${ADDED}" is offered right after "${NAME_OPENINGS[0]}o"`);
        assert.ok(
          okafor.every((n) => n <= 2),
          `"${ADDED}" is offered by "ok" after every opening`,
        );
        assert.ok(
          oyelaran.every((n) => n <= 3),
          `"${NEW_NAME}" is offered by "oye" after every opening`,
        );
        assert.ok(
          names.every((r) => !offers(r.words, blocked)),
          `"${blocked}" is not offered while the names are typed`,
        );

        // The row with the block in force: typed up to the blocked word's first letters.
        await typeAndRead(page, `hannah and ${blocked.slice(0, 2)}`);
        assert.ok(!offers(await rowWords(page), blocked));
        assert.deepEqual(await t.seriousViolations(page, 'keyboard with a blocked word'), []);
        await t.screenshot(page, 'vocabulary-keyboard-blocked');
        await signOut(page, 'Carer');
      },
    ],
  ],
};
