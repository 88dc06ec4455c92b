// Profile versions: the clinician configures and trains a version of the demo client,
// watches the progress bar and reads the results and charts; the assigned carer tries it and signs it off; the
// supervisor approves it and it becomes the active profile. Axe scan (no serious or critical
// violations) of each page on the way; screenshots in e2e/out.
import assert from 'node:assert/strict';
import { openClientTabAsClinician, signedInAs, signOut } from './accounts.mjs';
import { postTypedTrial } from './api-helpers.mjs';
import { assertNoSidewaysScroll, focused, press } from './page-checks.mjs';

// The seeded demo client (api/src/db/seeds/demo-client.seed.ts), with consent, ready samples
// and the demo carer assigned.
const DEMO_CLIENT = 'R. Ashby';

// Shared between the steps below: the version trained in the first one.
let versionPath = null;
let versionNumber = null;

/** A fresh page signed in as `email`, on its home page, once the first step trained a version. */
const signedInAfterTraining = async (t, email, home) => {
  assert.ok(versionPath, 'the clinician step trained a version');
  return signedInAs(t, email, home);
};

export const profilesSuite = {
  name: 'profiles',
  tests: [
    [
      'clinician configures and trains a version of the demo client, sees progress, results and charts',
      async (t) => {
        const page = await openClientTabAsClinician(t, DEMO_CLIENT, 'Profile versions');
        await page.waitForURL(/\/profiles$/);
        await page.getByText('Suggestions are offered, never inserted.').waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'profiles tab'), []);

        await page.getByRole('button', { name: 'New version' }).click();
        const form = page.getByRole('form', { name: 'New profile version' });
        // The engine's own settings wait, closed, under Engine details.
        await form.getByLabel('Suggestion slots').waitFor();
        assert.equal(
          await form.getByLabel('Context order').isVisible(),
          false,
          'engine settings start closed',
        );
        await form.locator('summary', { hasText: 'Engine details' }).click();
        await form.getByLabel('Context order').waitFor();
        assert.equal(await form.getByLabel('Context order').inputValue(), '5');
        assert.equal(await form.getByLabel('Suggestion slots').inputValue(), '5');
        const samples = form
          .getByRole('group', { name: 'Writing samples to learn from' })
          .getByRole('checkbox');
        assert.ok((await samples.count()) >= 1, 'at least one ready sample is offered');
        for (const box of await samples.all())
          assert.ok(await box.isChecked(), 'every ready sample is chosen');
        assert.deepEqual(await t.seriousViolations(page, 'new version form'), []);
        await t.screenshot(page, 'profile-new-version');
        await form.getByRole('button', { name: 'Train this version' }).click();

        await page.waitForURL(/\/profiles\/[0-9a-f-]{36}$/);
        versionPath = new URL(page.url()).pathname;
        const heading = await page.getByRole('heading', { level: 1, name: /^Version \d+ of / }).textContent();
        versionNumber = Number(heading?.match(/Version (\d+)/)?.[1]);
        // The progress bar (if the job is still running when the page opens) moves until the results come.
        const bar = page.getByRole('progressbar');
        if (await bar.count()) {
          const value = Number(await bar.getAttribute('aria-valuenow'));
          assert.ok(value >= 0 && value <= 100, `progress ${value} is a percentage`);
          await t.screenshot(page, 'profile-training');
          assert.deepEqual(await t.seriousViolations(page, 'training page'), []);
        }
        await page.getByRole('heading', { name: 'Results' }).waitFor({ timeout: 120_000 });
        await page.getByText('Ready for trial').first().waitFor();

        // The charts and their text alternatives.
        await page
          .getByRole('table', { name: /^Keystroke savings for 1 to 10 suggestion slots: the figures/ })
          .waitFor();
        assert.equal((await page.locator('.recharts-wrapper').count()) >= 2, true, 'two charts are drawn');
        const ksRows = page
          .getByRole('table', { name: /^Keystroke savings for 1 to 10 suggestion slots: the figures/ })
          .getByRole('row');
        assert.equal(await ksRows.count(), 11, 'a header row and one row per list size');
        await page
          .getByText('Keystroke savings are not time savings: reading the list costs time.')
          .waitFor();
        await page.getByRole('heading', { name: 'Learning curve: does more text still help?' }).waitFor();
        // The clinic's words first: the figures at the version's slots, hit rate among them; bits per
        // character only once Engine details are opened (by keyboard).
        const glance = page.getByRole('table', { name: /^The version’s figures at \d+ suggestion slots$/ });
        for (const figure of [
          'Keystroke savings',
          'Selections per word',
          'Hit rate',
          'What the suggestions change',
        ])
          await glance.getByRole('rowheader', { name: figure, exact: true }).waitFor();
        const bpcTable = page.getByRole('table', { name: /^Bits per character, mean over folds/ });
        assert.equal(
          await bpcTable.isVisible(),
          false,
          'bits per character start under closed Engine details',
        );
        assert.deepEqual(await t.seriousViolations(page, 'version results'), []);
        await t.screenshot(page, 'profile-results');
        const engineSummary = page
          .getByRole('region', { name: 'Results' })
          .locator('summary', { hasText: 'Engine details' });
        await engineSummary.focus();
        await page.keyboard.press('Enter');
        await bpcTable.waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'version results, engine details open'), []);
        await t.screenshot(page, 'profile-results-engine-details');
        await page.setViewportSize({ width: 640, height: 430 });
        await assertNoSidewaysScroll(page, 'version results at 200%');
        await page.setViewportSize({ width: 1280, height: 860 });
        assert.ok(await page.getByRole('link', { name: /^Export version/ }).isVisible());
        await signOut(page, 'Clinician');
      },
    ],
    [
      'the assigned carer signs the version off with a comment',
      async (t) => {
        const page = await signedInAfterTraining(t, 'carer@willowmere.example', '/my-clients');
        await page
          .getByRole('table', { name: 'Profile versions waiting for your sign-off, oldest first' })
          .getByRole('link', { name: `Version ${versionNumber} of ${DEMO_CLIENT}` })
          .waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'my clients'), []);
        await page.goto(`${t.appUrl}${versionPath}`, { waitUntil: 'networkidle' });
        // A carer reads what to try, not the measures.
        await page.getByRole('heading', { name: `What to try with version ${versionNumber}` }).waitFor();
        assert.equal(
          await page.getByRole('heading', { name: 'Results' }).count(),
          0,
          'no results for carers',
        );
        assert.equal(await page.getByText('Engine details').count(), 0, 'no engine details for carers');
        await t.screenshot(page, 'profile-what-to-try');
        assert.equal(
          await page.getByRole('link', { name: /^Export version/ }).count(),
          0,
          'carers do not export',
        );

        // A version is signed off only after a trial (the test keyboard's own suite types one
        // through the screens; here it is logged through the API).
        await postTypedTrial(page, t.appUrl, versionPath.split('/').pop());
        await page.reload({ waitUntil: 'networkidle' });
        await page.getByRole('heading', { name: `What to try with version ${versionNumber}` }).waitFor();
        await page.getByRole('button', { name: 'Sign off' }).click();
        const dialog = page.getByRole('dialog', { name: /^Sign off version/ });
        await dialog.getByRole('button', { name: 'Sign off' }).click();
        // Refused without a comment: the list of what is missing names it (signOffSchema's message).
        await dialog
          .getByRole('group', { name: 'One field needs attention' })
          .getByRole('link', { name: 'How did the try-outs go?: Add a comment about the trial.' })
          .waitFor();
        await dialog
          .getByLabel('How did the try-outs go?')
          .fill('Tried it for a week of evenings; he liked it.');
        assert.deepEqual(await t.seriousViolations(page, 'sign-off dialog'), []);
        await dialog.getByRole('button', { name: 'Sign off' }).click();
        await page
          .getByRole('status')
          .filter({ hasText: /You signed off version/ })
          .waitFor();
        await page.getByText('Signed off by carer').first().waitFor();
        await signOut(page, 'Carer');
      },
    ],
    [
      'the supervisor approves it from the reviews page and it becomes the active profile',
      async (t) => {
        const page = await signedInAfterTraining(t, 'supervisor@willowmere.example', '/reviews');
        const link = page
          .getByRole('table', { name: 'Profile versions waiting for your approval, oldest first' })
          .getByRole('link', { name: `Version ${versionNumber} of ${DEMO_CLIENT}` });
        await link.waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'reviews'), []);
        await t.screenshot(page, 'profile-reviews');
        await link.click();
        await page.waitForURL((url) => url.pathname === versionPath);
        await page.getByRole('button', { name: 'Approve' }).click();
        const dialog = page.getByRole('dialog', { name: /^Approve version/ });
        await dialog.getByLabel('Comment for the record').fill('Figures and the carer’s trial agree.');
        assert.deepEqual(await t.seriousViolations(page, 'approve dialog'), []);
        await dialog.getByRole('button', { name: 'Approve' }).click();
        await page
          .getByRole('status')
          .filter({ hasText: /is now the active profile/ })
          .waitFor();
        await page.getByText('Active profile').first().waitFor();
        await page.getByRole('list', { name: 'History' }).getByText('Active profile').waitFor();
        await t.screenshot(page, 'profile-active');
        await signOut(page, 'Supervisor');
      },
    ],
    [
      'the supervisor retires the active version by keyboard alone, with a reason (focus, axe)',
      async (t) => {
        const page = await signedInAfterTraining(t, 'supervisor@willowmere.example', '/reviews');
        await page.goto(`${t.appUrl}${versionPath}`, { waitUntil: 'networkidle' });
        await page.getByRole('heading', { name: 'Results' }).waitFor();
        const retire = page.getByRole('button', { name: 'Retire this version' });
        // Enabled once the client's versions say which one becomes active instead.
        await page.waitForFunction(() =>
          [...document.querySelectorAll('button')].some(
            (button) => button.textContent === 'Retire this version' && !button.disabled,
          ),
        );
        await press(retire);
        const dialog = page.getByRole('dialog', { name: `Retire version ${versionNumber}?` });
        // The seed's version was never approved: none becomes active instead.
        await dialog
          .getByText(
            `Version ${versionNumber} stops being the active profile; no version will be active until a new one is approved.`,
          )
          .waitFor();
        // A retirement without a reason is refused: focus on the list of what is missing.
        await press(dialog.getByRole('button', { name: 'Retire this version' }));
        await dialog.getByRole('group', { name: 'One field needs attention' }).waitFor();
        assert.deepEqual(await focused(page), { tag: 'div', name: 'One field needs attention' });
        assert.deepEqual(await t.seriousViolations(page, 'retire dialog refused'), []);
        await t.screenshot(page, 'profile-retire-refused');
        const reason = 'Suggestions got slower to reach on the switch; back to the base model for now.';
        await dialog.getByLabel('Why is this version retired?').fill(reason);
        await press(dialog.getByRole('button', { name: 'Retire this version' }));
        await dialog.waitFor({ state: 'hidden' });
        await page
          .getByRole('status')
          .filter({ hasText: `Version ${versionNumber} is retired; no version is active.` })
          .waitFor();
        // Focus lands on the version's actions, right under the message (the Retire button is gone).
        await page.waitForFunction(() => document.activeElement?.getAttribute('role') === 'group');
        assert.deepEqual(await focused(page), { tag: 'div', name: 'Actions on this version' });
        assert.equal(await retire.count(), 0, 'a retired version cannot be retired again');
        // The history keeps the step with the reason.
        const history = page.getByRole('list', { name: 'History' });
        await history.getByText(`“${reason}”`).waitFor();
        assert.match((await history.getByRole('listitem').last().textContent()) ?? '', /^Retired/);
        assert.deepEqual(await t.seriousViolations(page, 'version after retiring'), []);
        await t.screenshot(page, 'profile-retired');
        await signOut(page, 'Supervisor');
      },
    ],
  ],
};
