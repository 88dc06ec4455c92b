// Caseload: the clinician opens a client, records consent, uploads two demo samples,
// redacts a flagged phone number and reads the statistics; the supervisor reads the audit log.
// Axe scan (no serious or critical violations) of each page on the way; screenshots in e2e/out.
import assert from 'node:assert/strict';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
// The demo samples' folder, as the API's seed finds it (api/src/config/data-paths.ts).
import { demoSamplesDir as demoDir } from '../../api/dist/config/data-paths.js';
import { signedInAs, signIn, signOut } from './accounts.mjs';
import { assertNoSidewaysScroll, focused, focusSettled, press } from './page-checks.mjs';

// A phone number as the detector looks for (loose: UK-style and +country forms).
const phonePattern = /(\+\d{1,3}[\s-]?)?\(?0?\d{2,5}\)?[\s-]?\d{3}[\s-]?\d{3,4}\b/;

/** Two demo samples from corpora/demo, preferring one that holds a phone number. */
function pickDemoFiles() {
  const files = readdirSync(demoDir)
    .filter((name) => /\.(txt|md)$/i.test(name) && !/^readme/i.test(name))
    .sort()
    .map((name) => join(demoDir, name));
  assert.ok(files.length >= 2, `corpora/demo holds at least two samples (found ${files.length})`);
  const withPhone = files.find((file) => phonePattern.test(readFileSync(file, 'utf8')));
  const first = withPhone ?? files[0];
  const second = files.find((file) => file !== first);
  return [first, second];
}

const pseudonym = `E. Tern ${Date.now() % 100000}`;
const correctedPseudonym = `C. Orrect ${Date.now() % 100000}`;
const redactedPseudonym = `U. Ndo ${Date.now() % 100000}`;

// Invented writing for the redaction test: one UK-style phone number for the detector to flag.
const PHONE = '07700 900123';
const pastedText = `Ring me on ${PHONE} after the race. The club meets on Saturdays at the boathouse and we row if the river is calm.`;

/** Also kept outside e2e/out, for a person to look at. */
const screenshotTo = (page, name) =>
  page.screenshot({ path: `/tmp/corrections-${name}.png`, fullPage: true });

/** Signed in as the clinician, a new client created by keyboard alone; its consent tab open. */
const newClientByKeyboard = async (t, name) => {
  const page = await signedInAs(t, 'clinician@willowmere.example', '/caseload');
  await press(page.getByRole('button', { name: 'New client' }));
  const newClient = page.getByRole('dialog', { name: 'New client' });
  await newClient.getByLabel('Pseudonym').fill(name);
  await press(newClient.getByRole('button', { name: 'Create client' }));
  await page.getByRole('heading', { level: 1, name }).waitFor();
  await press(page.getByRole('tab', { name: 'Consent & family' }));
  await page.waitForURL(/\/consent$/);
  return page;
};

export const caseloadSuite = {
  name: 'caseload',
  tests: [
    [
      'clinician creates a client, records consent, uploads two demo samples and redacts a phone number',
      async (t) => {
        await t.context.clearCookies();
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'clinician@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/caseload');
        await page.getByRole('table').waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'caseload'), []);
        await t.screenshot(page, 'caseload');

        // New client, by keyboard.
        const open = page.getByRole('button', { name: 'New client' });
        await open.focus();
        await open.press('Enter');
        const dialog = page.getByRole('dialog', { name: 'New client' });
        await dialog.getByLabel('Pseudonym').fill(pseudonym);
        await dialog.getByLabel('Access method').selectOption('head_pointer');
        await dialog.getByLabel('Time per key (ms)').fill('1800');
        await dialog.getByLabel('Communication goals').fill('Send messages to the rowing club without help.');
        await t.screenshot(page, 'caseload-new-client');
        assert.deepEqual(await t.seriousViolations(page, 'new client dialog'), []);
        await dialog.getByRole('button', { name: 'Create client' }).press('Enter');
        await page.waitForURL(/\/clients\/[0-9a-f-]{36}\/overview$/);
        await page.getByRole('heading', { level: 1, name: pseudonym }).waitFor();
        const clientUrl = page.url().replace(/\/overview$/, '');
        assert.deepEqual(await t.seriousViolations(page, 'client overview'), []);
        await t.screenshot(page, 'client-overview');

        // Without consent, uploading is switched off and says why.
        await page.getByRole('tab', { name: 'Writing samples' }).click();
        await page.waitForURL(/\/samples$/);
        assert.ok(await page.getByRole('button', { name: 'Upload files' }).isDisabled());

        // Record consent.
        await page.getByRole('tab', { name: 'Consent & family' }).click();
        await page.waitForURL(/\/consent$/);
        await page.getByRole('button', { name: 'Record consent' }).click();
        const consent = page.getByRole('dialog', { name: /Record consent/ });
        // The dialog starts empty: who, what and when come from the signed form.
        await consent.getByLabel(/^The client, /).check();
        await consent.getByLabel(/Training a personal model/).check();
        await consent.getByLabel(/Sending progress summaries/).check();
        await consent.getByLabel('Date consent was given').fill('2026-09-14');
        await t.screenshot(page, 'consent-dialog');
        assert.deepEqual(await t.seriousViolations(page, 'consent dialog'), []);
        await consent.getByRole('button', { name: 'Record consent' }).click();
        await page
          .getByRole('status')
          .filter({ hasText: /is recorded/ })
          .waitFor();
        await page.getByRole('heading', { name: /Consent given on/ }).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'consent tab'), []);
        await t.screenshot(page, 'client-consent');

        // Upload two demo samples through the file input.
        await page.getByRole('tab', { name: 'Writing samples' }).click();
        await page.waitForURL(/\/samples$/);
        const files = pickDemoFiles();
        // The samples' own input (it takes many files): right after the tab switch the consent
        // tab's single-file input for the scanned form may still be on the page.
        await page.locator('input[type=file][multiple]').setInputFiles(files);
        await page.getByLabel('Where the text came from').selectOption('messages');
        await page.getByRole('button', { name: 'Upload files' }).click();
        await page
          .getByRole('status')
          .filter({ hasText: /2 files stored\./ })
          .waitFor({ timeout: 60_000 });
        await page.getByRole('table', { name: /Language samples \(2\)/ }).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'samples tab'), []);
        await t.screenshot(page, 'client-samples');

        // Find the sample with a flagged phone number and redact it.
        const links = page.getByRole('table', { name: /Language samples/ }).getByRole('link');
        const hrefs = await links.evaluateAll((anchors) => anchors.map((a) => a.getAttribute('href')));
        let redacted = false;
        for (const href of hrefs) {
          await page.goto(`${t.appUrl}${href}`, { waitUntil: 'networkidle' });
          await page.getByRole('heading', { name: 'Size and vocabulary' }).waitFor();
          const words = Number(
            (await page.locator('dt:text-is("Words") + dd').textContent())?.replace(/\D/g, ''),
          );
          assert.ok(words > 0, 'the sample has a word count');
          const redact = page.getByRole('button', { name: /^Redact phone number/ }).first();
          if ((await redact.count()) === 0) continue;
          assert.deepEqual(await t.seriousViolations(page, 'sample page'), []);
          await t.screenshot(page, 'sample-before-redaction');
          await redact.focus();
          await redact.press('Enter');
          // The preview shows the text before and after; the redaction is applied from the dialog.
          const preview = page.getByRole('dialog', { name: 'Redact this?' });
          await preview.getByText('After redaction').waitFor();
          assert.deepEqual(await t.seriousViolations(page, 'redaction preview'), []);
          await preview.getByRole('button', { name: 'Redact', exact: true }).press('Enter');
          await page
            .getByRole('status')
            .filter({ hasText: /Redacted the phone number/ })
            .waitFor();
          await page.getByText('⟪phone⟫').first().waitFor();
          await t.screenshot(page, 'sample-after-redaction');
          await page.setViewportSize({ width: 640, height: 430 });
          await assertNoSidewaysScroll(page, 'sample page at 200%');
          await t.screenshot(page, 'sample-200pct');
          await page.setViewportSize({ width: 1280, height: 860 });
          redacted = true;
          break;
        }
        assert.ok(redacted, 'one of the uploaded demo samples has a flagged phone number to redact');

        // The same file again is reported as a duplicate, not stored twice.
        await page.goto(`${clientUrl}/samples`, { waitUntil: 'networkidle' });
        await page.locator('input[type=file]').setInputFiles(files[1]);
        await page.getByRole('button', { name: 'Upload files' }).click();
        await page
          .getByRole('status')
          .filter({ hasText: /0 files stored, 1 not stored/ })
          .waitFor();
        await page.getByRole('list', { name: 'Chosen files' }).getByText('Already uploaded').waitFor();
        await page.setViewportSize({ width: 640, height: 430 });
        await assertNoSidewaysScroll(page, 'samples tab at 200%');
        await page.setViewportSize({ width: 1280, height: 860 });
        await signOut(page, 'Clinician');
      },
    ],
    [
      'supervisor reads the audit log, filtered to redactions',
      async (t) => {
        // Start signed out even when the test before stopped half-way.
        await t.context.clearCookies();
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'supervisor@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/reviews');
        await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Audit log' }).click();
        await page.waitForURL(/\/audit/);
        await page.getByRole('table', { name: /Events/ }).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'audit'), []);
        await t.screenshot(page, 'audit');
        await page.getByLabel('Action').selectOption('sample.flag-redact');
        await page.getByRole('button', { name: 'Show events' }).click();
        await page.waitForURL(/action=sample\.flag-redact/);
        await page.getByRole('cell', { name: pseudonym }).first().waitFor();
        // Each event in words, and the CSV of exactly these filters (page left out).
        await page
          .getByRole('cell', {
            name: new RegExp(`^[^@]+: Redacted personal data \\(${pseudonym.replace('.', '\\.')}\\)`),
          })
          .first()
          .waitFor();
        const csvHref = await page
          .getByRole('link', { name: 'Download CSV of these events' })
          .getAttribute('href');
        assert.equal(csvHref, '/api/audit.csv?action=sample.flag-redact');
        const csv = await page.evaluate(async (href) => (await fetch(href)).text(), csvHref);
        // fetch's text() drops the byte order mark.
        assert.match(csv, /^time,person,role,action,sentence,client\r\n/);
        // A reversed date range: the error summary takes focus and names the "To" field.
        await page.getByLabel('From').fill('2026-09-15');
        await page.getByLabel('To').fill('2026-09-14');
        await page.getByRole('button', { name: 'Show events' }).click();
        const summary = page.getByRole('group', { name: 'One field needs attention' });
        await summary.waitFor();
        assert.equal((await focused(page)).name, 'One field needs attention');
        assert.deepEqual(await t.seriousViolations(page, 'audit date range refused'), []);
        await t.screenshot(page, 'audit-date-range');
        await page.getByRole('button', { name: 'Clear filters' }).click();
        await page.getByLabel('Action').selectOption('sample.flag-redact');
        await page.getByRole('button', { name: 'Show events' }).click();
        await page.getByRole('cell', { name: pseudonym }).first().waitFor();
        await page.setViewportSize({ width: 640, height: 430 });
        await assertNoSidewaysScroll(page, 'audit at 200%');
        await t.screenshot(page, 'audit-200pct');
        await page.setViewportSize({ width: 1280, height: 860 });
        await signOut(page, 'Supervisor');
      },
    ],
    [
      'carer sees the assigned client without consent or samples tabs; the API refuses samples',
      async (t) => {
        await t.context.clearCookies();
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'carer@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/my-clients');
        await page.getByRole('link', { name: 'R. Ashby', exact: true }).click();
        await page.waitForURL(/\/clients\/[0-9a-f-]{36}\/overview$/);
        await page.getByRole('tab', { name: 'Overview' }).waitFor();
        const tabs = await page.getByRole('tab').allTextContents();
        assert.ok(
          !tabs.includes('Consent & family') && !tabs.includes('Writing samples'),
          `carer tabs: ${tabs.join(', ')}`,
        );
        assert.deepEqual(await t.seriousViolations(page, 'carer client overview'), []);
        await t.screenshot(page, 'client-overview-carer');
        const clientId = page.url().match(/clients\/([0-9a-f-]{36})/)?.[1];
        const status = await page.evaluate(
          async (id) => (await fetch(`/api/clients/${id}/samples`)).status,
          clientId,
        );
        assert.equal(status, 403);
        await signOut(page, 'Carer');
      },
    ],
    [
      'clinician sees what a withdrawal deletes before confirming, then the report (keyboard, axe)',
      async (t) => {
        await t.context.clearCookies();
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'clinician@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/caseload');
        await page.getByRole('link', { name: pseudonym, exact: true }).click();
        await page.waitForURL(/\/clients\/[0-9a-f-]{36}\/overview$/);
        await page.getByRole('tab', { name: 'Consent & family' }).click();
        await page.waitForURL(/\/consent$/);
        const open = page.getByRole('button', { name: /^Withdraw consent given on/ });
        await open.focus();
        await open.press('Enter');
        const dialog = page.getByRole('dialog', { name: `Withdraw consent for ${pseudonym}?` });
        const deletes = dialog.getByRole('region', { name: 'Will be deleted' });
        await deletes.waitFor();
        // The two samples stored by the first test of this suite (the duplicate was not stored).
        assert.deepEqual(await deletes.getByRole('listitem').first().textContent(), '2 language samples');
        assert.deepEqual(await t.seriousViolations(page, 'withdraw dialog'), []);
        await t.screenshot(page, 'withdraw-dialog');
        // Escape closes it and gives focus back to the button that opened it; nothing was withdrawn.
        await page.keyboard.press('Escape');
        await dialog.waitFor({ state: 'hidden' });
        assert.equal(await open.evaluate((button) => button === document.activeElement), true);

        await open.press('Enter');
        await deletes.waitFor();
        await dialog.getByLabel('Reason for the withdrawal').fill('The client asked in clinic.');
        await dialog.getByRole('button', { name: 'Withdraw and delete 2 language samples' }).press('Enter');
        await page
          .getByRole('status')
          .filter({ hasText: /Consent withdrawn\. Deleted: 2 language samples/ })
          .waitFor();
        await page.getByText(/^Deleted: 2 language samples/).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'consent tab after withdrawal'), []);
        await signOut(page, 'Clinician');
      },
    ],
    [
      'clinician records, voids and withdraws consent and deletes a contact by keyboard alone (focus, axe)',
      async (t) => {
        const page = await newClientByKeyboard(t, correctedPseudonym);

        // An empty submit is refused: focus lands on the list of what is missing.
        const recordButton = page.getByRole('button', { name: 'Record consent' });
        const recordConsent = async (scopes, givenOn, shownAs) => {
          await press(recordButton);
          const dialog = page.getByRole('dialog', { name: /Record consent/ });
          await press(dialog.getByLabel(/^The client, /), 'Space');
          for (const scope of scopes) await press(dialog.getByLabel(scope), 'Space');
          await dialog.getByLabel('Date consent was given').fill(givenOn);
          await press(dialog.getByRole('button', { name: 'Record consent' }));
          await dialog.waitFor({ state: 'hidden' });
          // Focus goes to the heading of the list that now shows the record.
          await page.getByRole('heading', { name: `Consent given on ${shownAs}` }).waitFor();
          assert.deepEqual(await focusSettled(page, { tag: 'h3', name: 'Consent records' }), {
            tag: 'h3',
            name: 'Consent records',
          });
        };
        await press(recordButton);
        const empty = page.getByRole('dialog', { name: /Record consent/ });
        await press(empty.getByRole('button', { name: 'Record consent' }));
        const summary = empty.getByRole('group', { name: '3 fields need attention' });
        await summary.waitFor();
        assert.deepEqual(await focused(page), { tag: 'div', name: '3 fields need attention' });
        assert.deepEqual(await t.seriousViolations(page, 'consent dialog refused'), []);
        await screenshotTo(page, 'consent-refused');
        await page.keyboard.press('Escape');
        await empty.waitFor({ state: 'hidden' });

        await recordConsent(
          [/Training a personal model/, /Sending progress summaries/],
          '2026-09-01',
          '1 Sept 2026',
        );
        await recordConsent([/Training a personal model/], '2026-09-14', '14 Sept 2026');

        // Void the second record: the first still covers training, so nothing is deleted.
        await press(
          page.getByRole('button', { name: 'Void (recorded in error): consent given on 14 Sept 2026' }),
        );
        const voidDialog = page.getByRole('dialog', {
          name: `Void this consent record for ${correctedPseudonym}?`,
        });
        await voidDialog.getByLabel('Why this record is wrong').waitFor();
        const voidWords = await voidDialog.textContent();
        assert.match(voidWords ?? '', /Nothing will be deleted/);
        assert.match(voidWords ?? '', /the consent given on 1 Sept 2026 still covers training/i);
        assert.deepEqual(await t.seriousViolations(page, 'void dialog'), []);
        await screenshotTo(page, 'void-dialog');
        await voidDialog.getByLabel('Why this record is wrong').fill('Entered twice from the same form.');
        await press(voidDialog.getByRole('button', { name: 'Void the record' }));
        await voidDialog.waitFor({ state: 'hidden' });
        await page.getByText(/Voided on .* — Entered twice from the same form\./).waitFor();
        assert.deepEqual(await focusSettled(page, { tag: 'h3', name: 'Consent records' }), {
          tag: 'h3',
          name: 'Consent records',
        });
        assert.deepEqual(await t.seriousViolations(page, 'consent tab after void'), []);
        await screenshotTo(page, 'voided');

        // Withdraw the first: it is the only consent in force now.
        await press(page.getByRole('button', { name: 'Withdraw consent given on 1 Sept 2026' }));
        const withdrawDialog = page.getByRole('dialog', {
          name: `Withdraw consent for ${correctedPseudonym}?`,
        });
        await withdrawDialog.getByLabel('Reason for the withdrawal').fill('The client asked in clinic.');
        await screenshotTo(page, 'withdraw-dialog');
        await press(withdrawDialog.getByRole('button', { name: 'Withdraw consent' }));
        await withdrawDialog.waitFor({ state: 'hidden' });
        await page
          .getByRole('status')
          .filter({ hasText: /Consent withdrawn\./ })
          .waitFor();
        assert.deepEqual(await focusSettled(page, { tag: 'h3', name: 'Consent records' }), {
          tag: 'h3',
          name: 'Consent records',
        });

        // A family contact: added, then deleted, by keyboard.
        await press(page.getByRole('button', { name: 'Add family contact' }));
        const contactDialog = page.getByRole('dialog', { name: 'Add family contact' });
        await contactDialog.getByLabel('Name').fill('Rowan Orrect');
        await contactDialog.getByLabel('Relationship to the client').fill('Brother');
        await contactDialog.getByLabel('E-mail address').fill('rowan.orrect@family.example');
        await press(contactDialog.getByRole('button', { name: 'Add contact' }));
        await contactDialog.waitFor({ state: 'hidden' });
        // Focus goes back to the button that opened the dialog.
        await page.getByRole('button', { name: 'Delete Rowan Orrect' }).waitFor();
        assert.deepEqual(await focused(page), { tag: 'button', name: 'Add family contact' });
        await press(page.getByRole('button', { name: 'Delete Rowan Orrect' }));
        const deleteDialog = page.getByRole('dialog', { name: 'Delete Rowan Orrect?' });
        await deleteDialog.getByRole('button', { name: 'Cancel' }).waitFor();
        // The safe choice has focus; Shift+Tab reaches the delete button.
        assert.deepEqual(await focused(page), { tag: 'button', name: 'Cancel' });
        assert.match(
          (await deleteDialog.textContent()) ?? '',
          /Summaries already sent to them keep their record/,
        );
        assert.deepEqual(await t.seriousViolations(page, 'delete contact dialog'), []);
        await screenshotTo(page, 'delete-contact');
        await page.keyboard.press('Shift+Tab');
        assert.deepEqual(await focused(page), { tag: 'button', name: 'Delete Rowan Orrect' });
        await page.keyboard.press('Enter');
        await deleteDialog.waitFor({ state: 'hidden' });
        await page.getByText('No family contacts yet.').waitFor();
        assert.deepEqual(await focusSettled(page, { tag: 'h3', name: 'Family contacts' }), {
          tag: 'h3',
          name: 'Family contacts',
        });
        assert.deepEqual(await t.seriousViolations(page, 'consent tab after corrections'), []);
        await screenshotTo(page, 'after');
        await signOut(page, 'Clinician');
      },
    ],
    [
      'clinician redacts a phone number, undoes it and deletes the sample by keyboard alone (focus, axe)',
      async (t) => {
        const page = await newClientByKeyboard(t, redactedPseudonym);
        await press(page.getByRole('button', { name: 'Record consent' }));
        const consent = page.getByRole('dialog', { name: /Record consent/ });
        await press(consent.getByLabel(/^The client, /), 'Space');
        await press(consent.getByLabel(/Training a personal model/), 'Space');
        await consent.getByLabel('Date consent was given').fill('2026-09-14');
        await press(consent.getByRole('button', { name: 'Record consent' }));
        await consent.waitFor({ state: 'hidden' });

        // Paste a sample; an empty paste is refused first, focus on the list of what is missing.
        await press(page.getByRole('tab', { name: 'Writing samples' }));
        await page.waitForURL(/\/samples$/);
        await press(page.getByRole('button', { name: 'Paste text' }));
        const paste = page.getByRole('form', { name: 'Paste text' });
        await press(paste.getByRole('button', { name: 'Store pasted text' }));
        await paste.getByRole('group', { name: '2 fields need attention' }).waitFor();
        assert.deepEqual(await focused(page), { tag: 'div', name: '2 fields need attention' });
        assert.deepEqual(await t.seriousViolations(page, 'paste refused'), []);
        await screenshotTo(page, 'paste-refused');
        await paste.getByLabel('Title').fill('Note to the rowing club');
        await paste.getByRole('textbox', { name: 'Text', exact: true }).fill(pastedText);
        await press(paste.getByRole('button', { name: 'Store pasted text' }));
        await page
          .getByRole('status')
          .filter({ hasText: /Stored the pasted text/ })
          .waitFor();
        await press(page.getByRole('link', { name: 'Note to the rowing club' }));
        await page.waitForURL(/\/samples\/[0-9a-f-]{36}$/);
        await page.getByRole('heading', { name: 'Size and vocabulary' }).waitFor();
        const text = page.getByRole('region', { name: 'Sample text' });
        // The words of the text as shown (without the marks' words for screen readers).
        const shownText = () =>
          text.evaluate((region) => {
            const copy = region.cloneNode(true);
            for (const hidden of copy.querySelectorAll('.sr-only')) hidden.remove();
            return copy.textContent;
          });

        // Redact, after the preview: focus on the flag, which now shows the placeholder.
        await press(page.getByRole('button', { name: `Redact phone number ${PHONE}…` }));
        const preview = page.getByRole('dialog', { name: 'Redact this?' });
        await preview.getByText('After redaction').waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'redaction preview'), []);
        await screenshotTo(page, 'redaction-preview');
        await press(preview.getByRole('button', { name: 'Redact', exact: true }));
        await preview.waitFor({ state: 'hidden' });
        await page
          .getByRole('status')
          .filter({ hasText: /Redacted the phone number/ })
          .waitFor();
        await text.getByText('⟪phone⟫').waitFor();
        assert.equal(await shownText(), pastedText.replace(PHONE, '⟪phone⟫'));
        await page.waitForFunction(() => document.activeElement?.tagName === 'ARTICLE');
        assert.deepEqual(await focused(page), { tag: 'article', name: 'Phone number: ⟪phone⟫' });
        assert.deepEqual(await t.seriousViolations(page, 'sample after redaction'), []);
        await screenshotTo(page, 'redacted');

        // Undo: the number is back in the text and waits for a decision; focus stays on the flag.
        await press(page.getByRole('button', { name: 'Undo redaction of phone number' }));
        await page
          .getByRole('status')
          .filter({ hasText: /Undid the redaction: the phone number is back in the text/ })
          .waitFor();
        await text.getByText(PHONE).waitFor();
        assert.equal(await shownText(), pastedText, 'the text is restored as pasted');
        await page.waitForFunction(
          (phone) => document.activeElement?.getAttribute('aria-label') === `Phone number: ${phone}`,
          PHONE,
        );
        assert.deepEqual(await focused(page), { tag: 'article', name: `Phone number: ${PHONE}` });
        assert.deepEqual(await t.seriousViolations(page, 'sample after undo'), []);
        await screenshotTo(page, 'undone');

        // Delete the sample from its page, with a reason: the samples list opens, focus on its heading.
        await press(page.getByRole('button', { name: 'Delete sample…' }));
        const remove = page.getByRole('dialog', { name: 'Delete “Note to the rowing club”?' });
        await remove.getByLabel('Reason for deleting it').fill('Pasted for the wrong client.');
        assert.deepEqual(await t.seriousViolations(page, 'delete sample dialog'), []);
        await screenshotTo(page, 'delete-sample');
        await press(remove.getByRole('button', { name: 'Delete sample' }));
        await page.waitForURL(/\/samples$/);
        await page
          .getByRole('status')
          .filter({ hasText: '“Note to the rowing club” was deleted.' })
          .waitFor();
        await page.getByText('No writing samples yet.').waitFor();
        await page.waitForFunction(() => document.activeElement?.tagName === 'H3');
        assert.deepEqual(await focused(page), { tag: 'h3', name: `Samples of ${redactedPseudonym}` });
        assert.deepEqual(await t.seriousViolations(page, 'samples tab after deleting'), []);
        await screenshotTo(page, 'sample-deleted');
        await signOut(page, 'Clinician');
      },
    ],
  ],
};
