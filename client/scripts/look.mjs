// Screenshots of the built client for a human to look at, with the API mocked in the browser
// (so it runs before the API exists). Start the preview first, from client/:
//   node ../node_modules/vite/bin/vite.js preview          (serves dist on 127.0.0.1:4173)
//   node scripts/look.mjs [base-url]                       (writes ../e2e/out/client-*.png)
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { createRequire } from 'node:module';
import { chromium } from 'playwright-core';

const axePath = createRequire(import.meta.url).resolve('axe-core/axe.min.js');

const base = process.argv[2] ?? 'http://127.0.0.1:4173';
const outDir = fileURLToPath(new URL('../../e2e/out/', import.meta.url));
mkdirSync(outDir, { recursive: true });

const people = {
  admin: {
    id: '2f0e7a52-5d0c-4c6e-9a51-0c1d5b7f9a01',
    email: 'admin@willowmere.example',
    name: 'Imogen Hale',
    role: 'admin',
  },
  clinician: {
    id: '6b1c3d9e-8f2a-4b7c-9d1e-2a3b4c5d6e02',
    email: 'clinician@willowmere.example',
    name: 'Dr. Tomasz Reyes',
    role: 'clinician',
  },
  supervisor: {
    id: '9c2d4e6f-1a3b-4c5d-8e7f-3b4c5d6e7f03',
    email: 'supervisor@willowmere.example',
    name: 'Priya Okonkwo',
    role: 'supervisor',
  },
  carer: {
    id: 'a3e5f7b9-2c4d-4e6f-9a8b-4c5d6e7f8a04',
    email: 'carer@willowmere.example',
    name: 'Hannah Ashby',
    role: 'carer',
  },
};
const staff = Object.values(people).map((person, index) => ({
  ...person,
  active: index !== 3,
  createdAt: '2026-01-05T09:00:00.000Z',
  lastSignInAt: index === 1 ? null : `2026-02-0${index + 1}T14:05:00.000Z`,
}));

const profile = mkdtempSync(join(tmpdir(), 'keyloom-look-'));
const context = await chromium.launchPersistentContext(profile, {
  executablePath: '/usr/bin/chromium',
  headless: true,
  viewport: { width: 1280, height: 800 },
  args: [
    '--no-sandbox',
    '--disable-gpu',
    '--no-first-run',
    '--disable-background-networking',
    '--disable-sync',
  ],
});
const offSite = [];
let signedIn = null;
await context.route('**/*', async (route) => {
  const url = new URL(route.request().url());
  if (url.origin !== new URL(base).origin) {
    offSite.push(url.href);
    return route.abort();
  }
  if (!url.pathname.startsWith('/api/')) return route.continue();
  const reply = (status, body) =>
    route.fulfill({ status, contentType: 'application/json', body: JSON.stringify(body) });
  if (url.pathname === '/api/auth/me')
    return signedIn ? reply(200, signedIn) : reply(401, { statusCode: 401, message: 'Sign in first.' });
  if (url.pathname === '/api/auth/csrf') return reply(200, { token: 'look-script-csrf-token' });
  if (url.pathname === '/api/auth/login')
    return reply(401, { statusCode: 401, message: 'Wrong e-mail or password.' });
  if (url.pathname === '/api/users' && route.request().method() === 'GET') return reply(200, staff);
  if (url.pathname === '/api/users')
    return reply(409, { statusCode: 409, message: 'An account with that e-mail already exists.' });
  return reply(404, { statusCode: 404, message: 'Not mocked' });
});

const page = context.pages()[0] ?? (await context.newPage());
const shot = async (name) => {
  await page.screenshot({ path: join(outDir, `client-${name}.png`), fullPage: true });
  console.log(`saved e2e/out/client-${name}.png`);
};
// axe-core's WCAG 2 A/AA rules; prints what it finds (the lead's browser test is the gate).
const axe = async (label) => {
  await page.addScriptTag({ path: axePath });
  const result = await page.evaluate(() =>
    window.axe.run({ runOnly: ['wcag2a', 'wcag2aa', 'wcag21aa', 'best-practice'] }),
  );
  const found = result.violations.map((v) => `${v.impact} ${v.id} (${v.nodes.length})`);
  console.log(`axe ${label}:`, found.length ? found.join('; ') : 'no violations');
};

// Sign-in at 100%, with errors, and at 200% (a 640-px-wide CSS viewport, like browser zoom).
await page.goto(`${base}/sign-in`, { waitUntil: 'networkidle' });
await page.getByRole('heading', { name: 'Sign in to Keyloom' }).waitFor();
console.log(
  'font:',
  await page.evaluate(() => getComputedStyle(document.body).fontFamily),
  '| fonts ready:',
  await page.evaluate(
    async () => (
      await document.fonts.ready,
      [...document.fonts]
        .filter((f) => f.status === 'loaded')
        .map((f) => `${f.family} ${f.weight}`)
        .join(', ')
    ),
  ),
);
await shot('sign-in-100');
await axe('sign-in');
await page.getByRole('button', { name: 'Sign in' }).click();
await page.getByText('Enter a valid e-mail address.').waitFor();
await page.keyboard.press('Tab');
await shot('sign-in-errors');
await page.getByLabel('E-mail address').fill('carer@willowmere.example');
await page.getByLabel('Password', { exact: true }).fill('wrong-password');
await page.getByRole('button', { name: 'Sign in' }).click();
await page.getByText('Wrong e-mail or password.').waitFor();
await shot('sign-in-401');
// 200% zoom of a 1280×800 window lays out like a 640×400 CSS-pixel viewport.
await page.setViewportSize({ width: 640, height: 400 });
await shot('sign-in-200');
const overflow = await page.evaluate(
  () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
);
console.log('sign-in horizontal overflow at 640px:', overflow);
await page.setViewportSize({ width: 320, height: 640 });
console.log(
  'sign-in horizontal overflow at 320px:',
  await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth),
);
await shot('sign-in-320');

// Signed-in pages.
await page.setViewportSize({ width: 1280, height: 800 });
signedIn = people.admin;
await page.goto(`${base}/`, { waitUntil: 'networkidle' });
await page.getByRole('table').waitFor();
await shot('staff-100');
await axe('staff');
await page.getByRole('button', { name: 'Imogen Hale Administrator' }).click();
await page.getByRole('menuitem', { name: 'Sign out' }).waitFor();
await shot('user-menu');
await page.keyboard.press('Escape');
await page.getByRole('button', { name: 'Add staff member' }).click();
await page.getByText('First password', { exact: true }).waitFor();
await page.getByRole('button', { name: 'Create account' }).click();
await page.getByText('Enter a name.').waitFor();
await page.screenshot({ path: join(outDir, 'client-staff-create-dialog.png') });
await axe('create dialog');
await page.keyboard.press('Escape');
await page.getByRole('button', { name: 'Deactivate Priya Okonkwo' }).click();
await page.getByText('will no longer be able to sign in').waitFor();
await page.screenshot({ path: join(outDir, 'client-staff-deactivate-dialog.png') });
await page.keyboard.press('Escape');
await page.setViewportSize({ width: 640, height: 400 });
console.log(
  'staff horizontal overflow at 640px:',
  await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth),
);
await shot('staff-200');
await page.setViewportSize({ width: 320, height: 640 });
console.log(
  'staff horizontal overflow at 320px:',
  await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth),
);
await shot('staff-320');

await page.setViewportSize({ width: 1280, height: 800 });
for (const role of ['clinician', 'supervisor', 'carer']) {
  signedIn = people[role];
  await page.goto(`${base}/`, { waitUntil: 'networkidle' });
  await page.locator('h1').waitFor();
  await shot(`home-${role}`);
  await axe(`home ${role}`);
}
await page.goto(`${base}/admin/staff`, { waitUntil: 'networkidle' });
await page.getByRole('heading', { name: 'Not allowed' }).waitFor();
await shot('not-allowed');
await page.goto(`${base}/nowhere`, { waitUntil: 'networkidle' });
await page.getByRole('heading', { name: 'Page not found' }).waitFor();
await page.keyboard.press('Tab');
await shot('not-found-skip-link');

console.log('off-site requests:', offSite.length ? offSite : 'none');
await context.close();
rmSync(profile, { recursive: true, force: true });
