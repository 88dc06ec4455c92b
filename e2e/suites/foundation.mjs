// Foundation: sign-in and sign-out for every role, the role home pages, the
// admin's staff page, keyboard access and an axe scan of the key pages.
import assert from 'node:assert/strict';
import { demoAccounts, signIn, signOut } from './accounts.mjs';
import { assertNoSidewaysScroll } from './page-checks.mjs';

export const foundationSuite = {
  name: 'foundation',
  tests: [
    [
      'sign-in page: skip link first, no serious axe violations, reflows at 200% zoom',
      async (t) => {
        const page = await t.newPage();
        await page.goto(`${t.appUrl}/sign-in`, { waitUntil: 'networkidle' });
        await page.keyboard.press('Tab');
        const focused = await page.evaluate(() => document.activeElement?.textContent?.trim() ?? '');
        assert.match(focused, /skip to main content/i);
        const font = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
        assert.match(font, /Atkinson Hyperlegible/);
        assert.deepEqual(await t.seriousViolations(page, 'sign-in'), []);
        await t.screenshot(page, 'sign-in');
        // 200% zoom of a 1280px window is a 640px-wide layout viewport.
        await page.setViewportSize({ width: 640, height: 430 });
        await assertNoSidewaysScroll(page, 'sign-in at 200%');
        await t.screenshot(page, 'sign-in-200pct');
      },
    ],
    [
      'a wrong password is refused with a message',
      async (t) => {
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'clinician@willowmere.example', 'not-the-password');
        await assert.doesNotReject(
          page
            .getByRole('alert')
            .filter({ hasText: /not right/i })
            .waitFor(),
        );
        assert.match(page.url(), /\/sign-in/);
      },
    ],
    ...demoAccounts.map(({ role, label, email, home }) => [
      `${role} signs in, lands on the ${home} home page, and signs out`,
      async (t) => {
        const page = await t.newPage();
        await signIn(page, t.appUrl, email);
        await page.waitForURL((url) => url.pathname === home);
        const heading = page.getByRole('heading', { level: 1 });
        await heading.waitFor();
        assert.ok((await heading.textContent())?.trim().length, 'the home page has an h1');
        await t.screenshot(page, `home-${role}`);
        await signOut(page, label);
        // After sign-out the home page needs a session again.
        await page.goto(`${t.appUrl}${home}`, { waitUntil: 'networkidle' });
        await page.waitForURL(/\/sign-in/);
      },
    ]),
    [
      'a carer cannot reach the staff page',
      async (t) => {
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'carer@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/my-clients');
        await page.goto(`${t.appUrl}/admin/staff`, { waitUntil: 'networkidle' });
        await page.getByRole('heading', { level: 1, name: /not allowed|no access|permission/i }).waitFor();
        const status = await page.evaluate(async () => (await fetch('/api/users')).status);
        assert.equal(status, 403);
        await signOut(page, 'Carer');
      },
    ],
    [
      'admin adds a staff member with the keyboard; the staff page has no serious axe violations',
      async (t) => {
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'admin@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/admin/staff');
        await page.getByRole('table').waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'staff'), []);
        const email = `new.carer.${Date.now()}@willowmere.example`;
        const open = page.getByRole('button', { name: /add staff/i });
        await open.focus();
        await open.press('Enter');
        const dialog = page.getByRole('dialog');
        await dialog.getByLabel(/full name/i).fill('Orla Pennick');
        await dialog.getByLabel(/e-?mail/i).fill(email);
        await dialog.getByLabel(/^role/i).selectOption('carer');
        await dialog.getByLabel(/password/i).fill('a-long-enough-passphrase');
        await t.screenshot(page, 'staff-add-dialog');
        assert.deepEqual(await t.seriousViolations(page, 'staff dialog'), []);
        await dialog.getByRole('button', { name: /create account/i }).press('Enter');
        await page.getByRole('cell', { name: email }).waitFor();
        await t.screenshot(page, 'staff');
        await page.setViewportSize({ width: 640, height: 430 });
        await assertNoSidewaysScroll(page, 'staff at 200%');
        await t.screenshot(page, 'staff-200pct');
        await page.setViewportSize({ width: 1280, height: 860 });
        await signOut(page, 'Administrator');
      },
    ],
    [
      'a staff member changes their own password from the user menu, by keyboard; the account page is axe-clean',
      async (t) => {
        const page = await t.newPage();
        await signIn(page, t.appUrl, 'admin@willowmere.example');
        await page.waitForURL((url) => url.pathname === '/admin/staff');
        const email = `own.password.${Date.now()}@willowmere.example`;
        const first = 'Marigold-Quarry-Bellows-7';
        const chosen = 'Tulip-Harbour-Lantern-42';
        const created = await page.evaluate(
          async ({ email, first }) => {
            const { token } = await (await fetch('/api/auth/csrf')).json();
            const res = await fetch('/api/users', {
              method: 'POST',
              headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token },
              body: JSON.stringify({ email, name: 'Ivo Lindqvist', role: 'carer', password: first }),
            });
            return res.status;
          },
          { email, first },
        );
        assert.equal(created, 201);
        await signOut(page, 'Administrator');

        await signIn(page, t.appUrl, email, first);
        await page.waitForURL((url) => url.pathname === '/my-clients');
        const menuButton = page.getByRole('banner').getByRole('button', { name: /Carer/ });
        await menuButton.focus();
        await menuButton.press('Enter');
        await page.getByRole('menuitem', { name: 'Change password' }).press('Enter');
        await page.getByRole('heading', { level: 1, name: 'Your account' }).waitFor();
        assert.deepEqual(await t.seriousViolations(page, 'account'), []);

        const fill = async (current, next, again) => {
          await page.getByLabel('Current password').fill(current);
          await page.getByLabel('New password', { exact: true }).fill(next);
          await page.getByLabel('New password again').fill(again);
          await page.getByLabel('New password again').press('Enter');
        };
        await fill(first, 'password1234', 'password1234');
        await page
          .getByText(/too easy to guess/)
          .first()
          .waitFor();
        await fill(first, chosen, chosen);
        await page
          .getByRole('status')
          .filter({ hasText: /password is changed/i })
          .waitFor();
        await t.screenshot(page, 'account-password-changed');
        assert.deepEqual(await t.seriousViolations(page, 'account after the change'), []);
        await signOut(page, 'Carer');

        await signIn(page, t.appUrl, email, chosen);
        await page.waitForURL((url) => url.pathname === '/my-clients');
        await signOut(page, 'Carer');
      },
    ],
  ],
};
