// Focus walk: the main jobs of each role done with the keyboard alone (Tab, Shift+Tab, Enter, Space,
// arrows; typing into fields; no clicks). After every action focus must be on a sensible element
// (never the page itself) and the page axe-clean (no serious or critical violations, label in name
// included). Clinician: the client's tabs by arrow keys, New version and Cancel, a refused then a
// started training, a redaction, a progress summary sent; admin: a staff role saved; carer: the
// version signed off; supervisor: approved. Screenshots in e2e/out.
import assert from 'node:assert/strict';
import { signedInAs, signOut } from './accounts.mjs';
import { csrfHeaders, postTypedTrial } from './api-helpers.mjs';

// The seeded demo client (api/src/db/seeds/demo-client.seed.ts): consent, ready samples, the demo
// carer assigned.
const DEMO_CLIENT = 'R. Ashby';
const stamp = Date.now() % 100000;
// Invented for this walk: a family contact who agrees to summaries, a staff member whose role is
// changed, and a short note holding one UK-style phone number (Ofcom's drama range) to redact.
const CONTACT = { name: `Ada Walker ${stamp}`, email: `ada.walker.${stamp}@family.example` };
const STAFF = { name: `Noor Tabbed ${stamp}`, email: `noor.tabbed.${stamp}@willowmere.example` };
const PHONE = '07700 900461';
const NOTE_TITLE = `Message to the sailing club ${stamp}`;
const NOTE_TEXT = `Call me on ${PHONE} when the boats are out. I want to crew on Sunday if the wind is light.`;

// Shared between the steps: the version the clinician trains.
let versionPath = null;
let versionNumber = null;

/** What has focus: tag, role, accessible name as the browser computes it (label, aria-label, text). */
const focusedElement = (page) =>
  page.evaluate(() => {
    const element = document.activeElement;
    if (!element || element === document.body) return { tag: element ? 'body' : 'none', role: '', name: '' };
    const labelledBy = element.getAttribute('aria-labelledby');
    const label =
      element.getAttribute('aria-label') ??
      (labelledBy
        ? labelledBy
            .split(/\s+/)
            .map((id) => document.getElementById(id)?.textContent ?? '')
            .join(' ')
        : null) ??
      element.labels?.[0]?.textContent ??
      element.textContent ??
      '';
    return {
      tag: element.tagName.toLowerCase(),
      role: element.getAttribute('role') ?? '',
      name: label.replace(/\s+/g, ' ').trim(),
    };
  });

/**
 * Waits until `target` has focus (up to 3 s: focus may move one frame after the change), then checks
 * the page with axe. Fails with where focus is instead.
 */
async function expectFocusOn(t, page, target, label) {
  await target.waitFor();
  let on = false;
  for (let i = 0; i < 30 && !on; i++) {
    on = await target.evaluate((element) => element === document.activeElement);
    if (!on) await page.waitForTimeout(100);
  }
  const where = await focusedElement(page);
  assert.ok(on, `${label}: focus is on ${JSON.stringify(where)}`);
  assert.notEqual(where.tag, 'body', `${label}: focus is not on the page itself`);
  assert.deepEqual(await t.seriousViolations(page, label), [], `${label}: axe`);
  return where;
}

/** Waits for the page's message holding `text`, then checks focus is on `target` (and axe). */
async function afterMessage(t, page, text, target, label) {
  await page.getByRole('status').filter({ hasText: text }).waitFor();
  return expectFocusOn(t, page, target, label);
}

/** Presses Tab (Shift+Tab with `back`) until `target` has focus; fails after `max` presses. */
async function tabTo(page, target, { back = false, max = 120 } = {}) {
  await target.waitFor();
  for (let i = 0; i < max; i++) {
    if (await target.evaluate((element) => element === document.activeElement)) return;
    await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
  }
  assert.fail(`Tab did not reach ${target} in ${max} presses`);
}

/** Tabs to `target` and presses `key` there. */
async function activate(page, target, key = 'Enter') {
  await tabTo(page, target);
  await page.keyboard.press(key);
}

export const focusWalkSuite = {
  name: 'focus-walk',
  tests: [
    [
      'clinician: client tabs by arrow keys, New version and Cancel, a refused and a started training',
      async (t) => {
        const page = await signedInAs(t, 'clinician@willowmere.example', '/caseload');
        await activate(page, page.getByRole('link', { name: DEMO_CLIENT, exact: true }).first());
        const heading = page.getByRole('heading', { level: 1, name: DEMO_CLIENT });
        await heading.waitFor();
        await expectFocusOn(t, page, heading, 'client page opened');

        // Arrow keys move along the tabs: focus stays on the tab, its panel and the address change.
        const tabs = page.getByRole('tablist', { name: `Parts of ${DEMO_CLIENT}’s record` });
        await tabTo(page, tabs.getByRole('tab', { selected: true }));
        for (const [name, path] of [
          ['Consent & family', /\/consent$/],
          ['Writing samples', /\/samples$/],
          ['Profile versions', /\/profiles$/],
        ]) {
          await page.keyboard.press('ArrowRight');
          // Selected (aria-selected), and the address follows.
          const tab = tabs.getByRole('tab', { name, selected: true });
          await page.waitForURL(path);
          await tab.waitFor();
          await page.getByRole('tabpanel').getByRole('heading', { level: 2, name }).waitFor();
          await expectFocusOn(t, page, tab, `${name} tab by arrow key`);
        }
        await page.keyboard.press('ArrowLeft');
        await page.waitForURL(/\/samples$/);
        await expectFocusOn(t, page, tabs.getByRole('tab', { name: 'Writing samples' }), 'back by arrow key');
        await page.keyboard.press('ArrowRight');
        await page.waitForURL(/\/profiles$/);

        // New version: focus on the form's heading; Cancel: back on New version.
        const newVersion = page.getByRole('button', { name: 'New version' });
        await activate(page, newVersion);
        const formHeading = page.getByRole('heading', { name: 'New profile version' });
        await expectFocusOn(t, page, formHeading, 'new version form opened');
        const form = page.getByRole('form', { name: 'New profile version' });
        await activate(page, form.getByRole('button', { name: 'Cancel' }));
        await expectFocusOn(t, page, newVersion, 'new version form cancelled');

        // A training refused before it is sent (no writing chosen): focus on the list of what is missing;
        // its link leads to the samples; with them ticked again, Train starts and the version's page opens.
        await activate(page, newVersion);
        await expectFocusOn(t, page, formHeading, 'new version form opened again');
        const samples = form
          .getByRole('group', { name: 'Writing samples to learn from' })
          .getByRole('checkbox');
        const boxes = await samples.all();
        assert.ok(boxes.length >= 1, 'the demo client has ready samples');
        for (const box of boxes) await activate(page, box, 'Space');
        for (const box of boxes) assert.equal(await box.isChecked(), false, 'every sample is unticked');
        const train = form.getByRole('button', { name: 'Train this version' });
        await activate(page, train);
        const refused = form.getByRole('group', { name: /needs? attention$/ });
        await expectFocusOn(t, page, refused, 'training refused without samples');
        await t.screenshot(page, 'focus-walk-training-refused');
        await activate(page, refused.getByRole('link').first());
        await expectFocusOn(t, page, boxes[0], 'the refused field from its link');
        for (const box of boxes) await activate(page, box, 'Space');
        await activate(page, train);
        await page.waitForURL(/\/profiles\/[0-9a-f-]{36}$/);
        versionPath = new URL(page.url()).pathname;
        const versionHeading = page.getByRole('heading', { level: 1, name: /^Version \d+ of / });
        await versionHeading.waitFor();
        versionNumber = Number((await versionHeading.textContent())?.match(/Version (\d+)/)?.[1]);
        await afterMessage(
          t,
          page,
          `Version ${versionNumber} is training.`,
          versionHeading,
          'version page after Train',
        );
        await page.getByRole('heading', { name: 'Results' }).waitFor({ timeout: 120_000 });
        await signOut(page, 'Clinician');
      },
    ],
    [
      'clinician: redacts a finding in a pasted sample, then sends a progress summary',
      async (t) => {
        const page = await signedInAs(t, 'clinician@willowmere.example', '/caseload');
        await activate(page, page.getByRole('link', { name: DEMO_CLIENT, exact: true }).first());
        await page.getByRole('heading', { level: 1, name: DEMO_CLIENT }).waitFor();
        const clientId = new URL(page.url()).pathname.split('/')[2];
        // A family contact who agrees to summaries (added through the API; the contact form has its own suite).
        const added = await page.request.post(`${t.appUrl}/api/clients/${clientId}/contacts`, {
          headers: await csrfHeaders(page, t.appUrl),
          data: { name: CONTACT.name, relationship: 'Aunt', email: CONTACT.email, consentToSummaries: true },
        });
        assert.equal(added.status(), 201, `the contact is added: ${await added.text()}`);

        const tabs = page.getByRole('tablist', { name: `Parts of ${DEMO_CLIENT}’s record` });
        await tabTo(page, tabs.getByRole('tab', { selected: true }));
        await page.keyboard.press('ArrowRight');
        await page.keyboard.press('ArrowRight');
        await page.waitForURL(/\/samples$/);

        // Paste a short note holding a phone number and open it.
        await activate(page, page.getByRole('button', { name: 'Paste text' }));
        const paste = page.getByRole('form', { name: 'Paste text' });
        await tabTo(page, paste.getByLabel('Title'));
        await page.keyboard.type(NOTE_TITLE);
        await tabTo(page, paste.getByRole('textbox', { name: 'Text', exact: true }));
        await page.keyboard.type(NOTE_TEXT);
        await activate(page, paste.getByRole('button', { name: 'Store pasted text' }));
        await page
          .getByRole('status')
          .filter({ hasText: /Stored the pasted text/ })
          .waitFor();
        await activate(page, page.getByRole('link', { name: NOTE_TITLE }));
        await page.waitForURL(/\/samples\/[0-9a-f-]{36}$/);
        await expectFocusOn(t, page, page.getByRole('heading', { level: 1 }), 'sample page opened');

        // Redact the number after its preview: focus on the finding, which now shows the placeholder.
        await activate(page, page.getByRole('button', { name: `Redact phone number ${PHONE}…` }));
        const preview = page.getByRole('dialog', { name: 'Redact this?' });
        await preview.getByText('After redaction').waitFor();
        const where = await focusedElement(page);
        assert.notEqual(where.tag, 'body', 'focus is in the preview');
        await activate(page, preview.getByRole('button', { name: 'Redact', exact: true }));
        await preview.waitFor({ state: 'hidden' });
        await afterMessage(
          t,
          page,
          /Redacted the phone number/,
          page.getByRole('article', { name: 'Phone number: ⟪phone⟫' }),
          'after redaction',
        );
        await t.screenshot(page, 'focus-walk-redacted');

        // The note goes again (no version learnt from it), so the demo client's writing stays as seeded.
        await activate(page, page.getByRole('button', { name: 'Delete sample…' }));
        const remove = page.getByRole('dialog', { name: `Delete “${NOTE_TITLE}”?` });
        await tabTo(page, remove.getByLabel('Reason for deleting it'));
        await page.keyboard.type('Pasted to try the redaction.');
        await activate(page, remove.getByRole('button', { name: 'Delete sample' }));
        await page.waitForURL(/\/samples$/);
        await expectFocusOn(
          t,
          page,
          page.getByRole('heading', { name: `Samples of ${DEMO_CLIENT}` }),
          'samples after deleting the note',
        );

        // A progress summary: written as a draft (focus on its heading), then sent (focus on the sent one).
        await tabTo(page, tabs.getByRole('tab', { selected: true }), { back: true });
        // One arrow press at a time, each waited for (the tab selected, the address, focus on it).
        for (const [name, path] of [
          ['Profile versions', /\/profiles$/],
          ['Try-outs', /\/trials$/],
          ['Family updates', /\/summaries$/],
        ]) {
          await page.keyboard.press('ArrowRight');
          const tab = tabs.getByRole('tab', { name, selected: true });
          await tab.waitFor();
          await page.waitForURL(path);
          await expectFocusOn(t, page, tab, `${name} tab by arrow key`);
        }
        await activate(page, page.getByRole('button', { name: 'New progress summary' }));
        const composer = page.getByRole('form', { name: `New progress summary for ${DEMO_CLIENT}` });
        await composer.getByLabel('From').waitFor();
        // The date boxes say the order of their parts as the browser shows them: this Chromium runs in
        // en-US, and its date box reads mm/dd/yyyy (see the screenshot).
        assert.equal(await page.evaluate(() => navigator.language), 'en-US');
        const hint = await composer
          .getByLabel('From')
          .evaluate(
            (box) => document.getElementById(box.getAttribute('aria-describedby') ?? '')?.textContent,
          );
        assert.equal(hint, 'Month, day, year, e.g. 09/14/2026.');
        await t.screenshot(page, 'focus-walk-summary-composer');
        await activate(
          page,
          composer.getByRole('checkbox', { name: new RegExp(`^${CONTACT.name}`) }),
          'Space',
        );
        await activate(page, composer.getByRole('button', { name: 'Write the draft' }));
        const draftHeading = page.getByRole('heading', {
          name: `Draft summary for ${DEMO_CLIENT}, not sent`,
        });
        await expectFocusOn(t, page, draftHeading, 'draft written');
        const send = page
          .getByRole('form', { name: 'Edit the draft summary' })
          .getByRole('button', { name: `Send to ${CONTACT.name}` });
        for (let i = 0; i < 50 && !(await send.isEnabled()); i++) await page.waitForTimeout(100);
        await activate(page, send);
        const sent = page.getByRole('article').first();
        await afterMessage(t, page, /The summary was sent: 1 e-mail queued/, sent, 'summary sent');
        assert.match((await sent.textContent()) ?? '', /sent \d{1,2} [A-Z][a-z]+ \d{4}, \d{2}:\d{2}/);
        await t.screenshot(page, 'focus-walk-summary-sent');
        await signOut(page, 'Clinician');
      },
    ],
    [
      'admin: saves a staff member’s role; focus returns to that row’s role',
      async (t) => {
        const page = await signedInAs(t, 'admin@willowmere.example', '/admin/staff');
        const created = await page.request.post(`${t.appUrl}/api/users`, {
          headers: await csrfHeaders(page, t.appUrl),
          data: { email: STAFF.email, name: STAFF.name, role: 'carer', password: `walk-${stamp}-long-pass` },
        });
        assert.equal(created.status(), 201, `the staff member is added: ${await created.text()}`);
        await page.reload({ waitUntil: 'networkidle' });
        const role = page.getByLabel(`Role for ${STAFF.name}`, { exact: true });
        await tabTo(page, role);
        await page.keyboard.press('ArrowUp');
        assert.notEqual(await role.inputValue(), 'carer', 'the arrow key chose another role');
        const chosen = await role.inputValue();
        await activate(page, page.getByRole('button', { name: `Save role for ${STAFF.name}` }));
        await afterMessage(t, page, STAFF.name, role, 'role saved');
        assert.equal(await role.inputValue(), chosen, 'the saved role is shown');
        await signOut(page, 'Administrator');
      },
    ],
    [
      'carer: signs the trained version off; focus on the page heading or the message',
      async (t) => {
        assert.ok(versionPath, 'the clinician step trained a version');
        const page = await signedInAs(t, 'carer@willowmere.example', '/my-clients');
        // A version is signed off only after a trial (typed through the API here).
        await postTypedTrial(page, t.appUrl, versionPath.split('/').pop());
        await page.reload({ waitUntil: 'networkidle' });
        await activate(page, page.getByRole('link', { name: `Version ${versionNumber} of ${DEMO_CLIENT}` }));
        await page.waitForURL((url) => url.pathname === versionPath);
        await page.getByRole('heading', { name: `What to try with version ${versionNumber}` }).waitFor();
        await activate(page, page.getByRole('button', { name: 'Sign off' }));
        const dialog = page.getByRole('dialog', { name: /^Sign off version/ });
        await tabTo(page, dialog.getByLabel('How did the try-outs go?'));
        await page.keyboard.type('Tried it over three evenings; the word list suited him.');
        await activate(page, dialog.getByRole('button', { name: 'Sign off' }));
        await dialog.waitFor({ state: 'hidden' });
        await afterMessage(
          t,
          page,
          /You signed off version/,
          page.getByRole('heading', { level: 1 }),
          'signed off',
        );
        await signOut(page, 'Carer');
      },
    ],
    [
      'supervisor: approves it; focus on the version’s actions under the message',
      async (t) => {
        assert.ok(versionPath, 'the clinician step trained a version');
        const page = await signedInAs(t, 'supervisor@willowmere.example', '/reviews');
        await activate(page, page.getByRole('link', { name: `Version ${versionNumber} of ${DEMO_CLIENT}` }));
        await page.waitForURL((url) => url.pathname === versionPath);
        await page.getByRole('heading', { name: 'Results' }).waitFor();
        await activate(page, page.getByRole('button', { name: 'Approve' }));
        const dialog = page.getByRole('dialog', { name: /^Approve version/ });
        await tabTo(page, dialog.getByLabel('Comment for the record'));
        await page.keyboard.type('The figures and the carer’s evenings agree.');
        await activate(page, dialog.getByRole('button', { name: 'Approve' }));
        await dialog.waitFor({ state: 'hidden' });
        await afterMessage(
          t,
          page,
          /is now the active profile/,
          page.getByRole('group', { name: 'Actions on this version' }),
          'approved',
        );
        await t.screenshot(page, 'focus-walk-approved');
        await signOut(page, 'Supervisor');
      },
    ],
  ],
};
