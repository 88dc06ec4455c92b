// Family updates: the demo clinician composes a progress summary for the demo client with
// the keyboard, previews the figures (text and the two chart images with their alt text), writes
// the draft, edits its text, previews the e-mail as the family gets it and sends it; the worker
// delivers it through SMTP to the fake mail server, whose API shows one message for the consenting
// contact and none for the contact who never agreed. The received HTML is opened at a phone's width
// (390 px): no sideways scroll, axe clean. Then the family member's stop link: opening it changes
// nothing, its button stops the summaries, and the clinician sees that.
// Before all that, the admin sets the clinic's phone on the clinic details page, and the stop page
// (390 px wide, the app's font, a large button) names the clinic, that number and the client's
// preferred name.
// Axe scan (no serious or critical violations) on the way; screenshots in e2e/out.
import assert from 'node:assert/strict';
import { openClientTabAsClinician, signIn, signOut } from './accounts.mjs';
import { assertNoSidewaysScroll } from './page-checks.mjs';

// The seeded demo client and its family contacts (api/src/db/seeds/demo-client.seed.ts): Hannah
// agreed to summaries, Marguerite did not. Version 1 is seeded trained (demo-version.seed.ts).
const DEMO_CLIENT = 'R. Ashby';
const CONSENTING = { name: 'Hannah Ashby', email: 'hannah.ashby@family.example' };
const NOT_CONSENTING = { name: 'Marguerite Ashby', email: 'marguerite.ashby@family.example' };
const NOTE = 'Pepper the dog now gets a mention in every message Robin writes.';
const GREETING = 'Dear Hannah, here is how the typing went this month.';
// The demo clinic and the client's preferred name (api/src/db/seeds/demo-clinic.seed.ts and
// demo-client.seed.ts); the admin step sets another invented number (01632 960xxx: Ofcom's drama range).
const CLINIC = 'Willowmere Community Communication Clinic';
const CLINIC_PHONE = '01632 960 419';
const PREFERRED_NAME = 'Robbie';

/** The fake mail server's messages (maildev JSON API, MAIL_API_URL from scripts/test.mjs). */
async function inbox() {
  const url = process.env.MAIL_API_URL;
  assert.ok(url, 'MAIL_API_URL names the fake mail server API (npm test sets it)');
  const res = await fetch(url);
  assert.equal(res.status, 200, 'the fake mail server answers');
  return /** @type {{id: string, subject: string, text: string, html: string, to: {address: string}[], attachments?: {contentType: string, contentId?: string, generatedFileName: string}[]}[]} */ (
    await res.json()
  );
}

const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));

let stopPath = null;

export const summariesSuite = {
  name: 'summaries',
  tests: [
    [
      'admin changes the clinic’s phone on the clinic details page by keyboard; focus lands on the saved message',
      async (t) => {
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'admin@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/admin/staff');
        const link = page
          .getByRole('navigation', { name: 'Main' })
          .getByRole('link', { name: 'Clinic details' });
        await link.focus();
        await link.press('Enter');
        await page.getByRole('heading', { level: 1, name: 'Clinic details' }).waitFor();
        const form = page.getByRole('form', { name: 'Clinic details' });
        assert.equal(await form.getByLabel('Clinic name').inputValue(), CLINIC, 'the seeded name');
        const phone = form.getByLabel('Phone');
        await phone.focus();
        await phone.fill('');
        await page.keyboard.type(CLINIC_PHONE);
        await page.keyboard.press('Enter');
        const status = page.getByRole('status').filter({ hasText: 'Clinic details saved' });
        await status.waitFor();
        assert.ok(
          await status.evaluate((element) => element === document.activeElement),
          'focus moves to the saved message',
        );
        assert.deepEqual(await t.seriousViolations(page, 'clinic details page'), []);
        await t.screenshot(page, 'clinic-details');
        await signOut(page, 'Administrator');
      },
    ],
    [
      'clinician composes, previews and sends a family update; the consenting contact alone receives it',
      async (t) => {
        const page = await openClientTabAsClinician(t, DEMO_CLIENT, 'Family updates');
        await page.waitForURL(/\/summaries$/);
        await page.getByRole('heading', { name: 'Progress summaries' }).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'family updates tab'), []);

        // Keyboard alone from here: focus, Enter and Space.
        const newButton = page.getByRole('button', { name: 'New progress summary' });
        await newButton.focus();
        await newButton.press('Enter');
        const form = page.getByRole('form', { name: `New progress summary for ${DEMO_CLIENT}` });
        await form.getByLabel('From').waitFor();
        await form.getByText(/figures are estimates/).waitFor();
        await form.getByText(/link with which the family member can stop/).waitFor();
        await form.getByText(/You get a draft to edit before anything is sent/).waitFor();

        const refused = form.getByRole('checkbox', { name: new RegExp(`^${NOT_CONSENTING.name}`) });
        assert.ok(await refused.isDisabled(), 'a contact without consent cannot be chosen');
        await form.getByText('Has not agreed to receive summaries.').waitFor();
        const hannah = form.getByRole('checkbox', { name: new RegExp(`^${CONSENTING.name}`) });
        await hannah.focus();
        await hannah.press('Space');
        assert.ok(await hannah.isChecked(), 'Space ticks the consenting contact');
        const note = form.getByLabel(/Your note to the family/);
        await note.focus();
        await page.keyboard.type(NOTE);

        // Version 1 is seeded trained, not approved (an earlier suite may have approved it): by default a
        // summary carries only approved versions, so it is ticked here, and the e-mail says what it is.
        const version = form.getByRole('checkbox', { name: 'Version 1' });
        await version.focus();
        await version.press('Space');

        const previewButton = form.getByRole('button', { name: 'Preview the figures' });
        await previewButton.focus();
        await previewButton.press('Enter');
        const preview = form.getByRole('region', { name: 'Preview' });
        await preview.waitFor();
        const text = await preview.getByTestId('summary-preview-text').textContent();
        assert.match(
          text ?? '',
          // "not yet approved: still being tried", or "approved, in use" after the profiles suite approved it.
          /Version 1 \((not yet approved: still being tried|approved, in use), \d{1,2} [A-Z][a-z]+ \d{4}\): about \d+ in 10 key presses saved/,
        );
        assert.ok(text?.includes(NOTE), 'the note is in the text');
        assert.ok(text?.includes('These figures are estimates'), 'the caution is in the text');

        // The two charts, drawn by the API as PNG, each with the alt text that states its figures.
        const images = preview.getByRole('img');
        assert.equal(await images.count(), 2, 'two charts');
        for (const image of await images.all()) {
          assert.ok(await image.isVisible(), 'the chart is visible');
          const alt = (await image.getAttribute('alt')) ?? '';
          assert.match(alt, /version 1: /, `alt text states the figures: ${alt}`);
          const width = await image.evaluate((img) => /** @type {HTMLImageElement} */ (img).naturalWidth);
          assert.equal(width, 1200, 'the PNG decodes in the browser, at twice its CSS width');
          const shown = await image.evaluate((img) => img.getBoundingClientRect().width);
          assert.ok(shown > 0 && shown <= 600, `shown at most 600 CSS px wide (${shown})`);
        }
        assert.deepEqual(await t.seriousViolations(page, 'summary preview'), []);
        await t.screenshot(page, 'summary-preview');
        // 640 px wide (1280 px at 200 % zoom): the composer and preview reflow without sideways scrolling.
        await page.setViewportSize({ width: 640, height: 800 });
        await assertNoSidewaysScroll(page, 'summary preview at 200%');
        for (const image of await images.all()) {
          const box = await image.evaluate((img) => {
            const r = img.getBoundingClientRect();
            return { width: r.width, height: r.height };
          });
          // Narrower than 600 here, the chart keeps its shape (height follows width).
          assert.ok(box.width < 600, `the chart shrinks with the window (${box.width})`);
          assert.ok(
            box.height / box.width > 0.5 && box.height / box.width < 0.7,
            'the chart keeps its shape',
          );
        }
        await t.screenshot(page, 'summary-preview-640');
        await page.setViewportSize({ width: 1280, height: 860 });

        // The draft: written, its heading focused, nothing sent yet.
        const write = form.getByRole('button', { name: 'Write the draft' });
        await write.focus();
        await write.press('Enter');
        const draftHeading = page.getByRole('heading', {
          name: `Draft summary for ${DEMO_CLIENT}, not sent`,
        });
        await draftHeading.waitFor();
        let onDraft = false;
        for (let i = 0; i < 30 && !onDraft; i++) {
          onDraft = await draftHeading.evaluate((el) => el === document.activeElement);
          if (!onDraft) await sleep(100);
        }
        assert.ok(onDraft, 'focus lands on the draft');
        const editor = page.getByRole('form', { name: 'Edit the draft summary' });
        const body = editor.getByLabel('Text of the e-mail');
        await body.focus();
        await page.keyboard.press('Control+Home');
        await page.keyboard.type(`${GREETING}\n\n`);
        const save = editor.getByRole('button', { name: 'Save and preview' });
        await save.focus();
        await save.press('Enter');
        const frame = page.frameLocator('iframe[title*="as the family sees it"]');
        await frame.getByText(GREETING).waitFor();
        // The e-mail's own document is scanned below, opened as the family member opens it.
        assert.deepEqual(
          await t.seriousViolations(page, 'draft summary with e-mail preview', { exclude: 'iframe' }),
          [],
        );
        await t.screenshot(page, 'summary-draft');
        const subject = await editor.getByLabel('Subject').inputValue();

        const sendButton = editor.getByRole('button', { name: `Send to ${CONSENTING.name}` });
        // Send is on once the saved draft is what the form holds.
        for (let i = 0; i < 50 && !(await sendButton.isEnabled()); i++) await sleep(100);
        await sendButton.focus();
        await sendButton.press('Enter');
        await page
          .getByRole('status')
          .getByText(/The summary was sent: 1 e-mail queued/)
          .waitFor();

        // The worker sends it; the list polls until the e-mail shows as sent.
        const card = page.getByRole('article').first();
        await card.getByRole('cell', { name: 'Sent', exact: true }).first().waitFor({ timeout: 60_000 });
        let mails = [];
        for (let i = 0; i < 50; i++) {
          mails = (await inbox()).filter((mail) => mail.subject === subject);
          if (mails.length > 0) break;
          await sleep(200);
        }
        assert.equal(mails.length, 1, 'one e-mail with this subject');
        const [mail] = mails;
        assert.deepEqual(
          mail.to.map((to) => to.address),
          [CONSENTING.email],
        );
        assert.ok(mail.text.includes(NOTE), 'the e-mail carries the note');
        assert.ok(mail.text.includes(GREETING), 'the e-mail carries the edited text verbatim');
        assert.equal(
          (mail.attachments ?? []).filter((a) => a.contentType === 'image/png').length,
          2,
          'both charts are attached as images',
        );

        // The received HTML on a phone: 390 px wide, the charts from the message's own attachments.
        const phone = await t.newPage();
        await phone.setViewportSize({ width: 390, height: 844 });
        let html = mail.html;
        for (const attachment of mail.attachments ?? []) {
          const res = await fetch(
            `${process.env.MAIL_API_URL}/${mail.id}/attachment/${attachment.generatedFileName}`,
          );
          if (!res.ok || !attachment.contentId) continue;
          const data = Buffer.from(await res.arrayBuffer()).toString('base64');
          html = html.replace(`cid:${attachment.contentId}`, `data:image/png;base64,${data}`);
        }
        await phone.setContent(html, { waitUntil: 'load' });
        await assertNoSidewaysScroll(phone, 'the received e-mail at 390 px');
        assert.equal(await phone.title(), subject, 'the e-mail has a <title>');
        assert.deepEqual(await t.seriousViolations(phone, 'received e-mail at 390 px'), []);
        await t.screenshot(phone, 'summary-email-390');
        await phone.close();

        const all = await inbox();
        assert.equal(
          all.filter((m) => m.to.some((to) => to.address === NOT_CONSENTING.email)).length,
          0,
          'nothing went to the contact who did not agree',
        );
        stopPath = mail.text.match(/\/api\/summaries\/stop\/[A-Za-z0-9_-]{43}/)?.[0] ?? null;
        assert.ok(stopPath, 'the e-mail carries a stop link');
        assert.deepEqual(await t.seriousViolations(page, 'sent summary list'), []);
        await t.screenshot(page, 'summary-sent');
      },
    ],
    [
      'the family member’s stop link asks first, stops on the button, and the clinician sees it',
      async (t) => {
        assert.ok(stopPath, 'the first step read the stop link from the e-mail');
        await t.context.clearCookies();
        const page = await t.newPage();
        // As the family member, without an account (the app's own address; nothing leaves the machine).
        // A phone's width: 390 CSS px.
        await page.setViewportSize({ width: 390, height: 844 });
        await page.goto(`${t.appUrl}${stopPath}`);
        await page.getByRole('heading', { name: 'Stop progress e-mails?' }).waitFor();
        const next =
          `You will get no more progress e-mails about ${PREFERRED_NAME} from ${CLINIC}. ` +
          `To start them again, contact the clinic on ${CLINIC_PHONE}.`;
        await page.getByText(next).waitFor();
        await page.getByRole('banner').getByText(CLINIC).waitFor();
        await assertNoSidewaysScroll(page, 'stop page at 390 px');
        // The app's own font file, loaded from the app (the route guard aborts anything off-site).
        const fontLoaded = await page.evaluate(async () => {
          await document.fonts.ready;
          return (
            document.fonts.check("700 16px 'Atkinson Hyperlegible'") &&
            [...document.fonts].some((face) => face.family.includes('Atkinson') && face.status === 'loaded')
          );
        });
        assert.ok(fontLoaded, 'Atkinson Hyperlegible is loaded from the web app’s files');
        const stop = page.getByRole('button', { name: 'Stop these e-mails' });
        const box = await stop.boundingBox();
        assert.ok(box && box.height >= 48, `the button is at least 48 px tall (${box?.height})`);
        assert.deepEqual(await t.seriousViolations(page, 'stop link page'), []);
        await t.screenshot(page, 'summary-stop-390');
        await stop.focus();
        await stop.press('Enter');
        await page.getByRole('heading', { name: 'Progress e-mails stopped' }).waitFor();
        await page.getByText(next).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'stopped page'), []);
        await t.screenshot(page, 'summary-stopped');

        const app = await t.newPage();
        await signIn(app, t.appUrl, 'clinician@willowmere.example');
        await app.waitForURL((url) => url.pathname === '/caseload');
        await app.getByRole('link', { name: DEMO_CLIENT, exact: true }).first().click();
        await app.getByRole('tab', { name: 'Family updates' }).click();
        await app
          .getByRole('article')
          .first()
          .getByText('Used the stop link: gets no more summaries.')
          .waitFor();
        await app.getByRole('button', { name: 'New progress summary' }).click();
        const form = app.getByRole('form', { name: `New progress summary for ${DEMO_CLIENT}` });
        const hannah = form.getByRole('checkbox', { name: new RegExp(`^${CONSENTING.name}`) });
        await hannah.waitFor();
        assert.ok(await hannah.isDisabled(), 'a contact who stopped summaries cannot be chosen again');
      },
    ],
  ],
};
