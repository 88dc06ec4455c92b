// The demo clinic's accounts as seeded (see api/src/db/seed.ts) and their home pages.
export const demoPassword = process.env.DEMO_PASSWORD ?? 'keyloom-demo';

export const demoAccounts = [
  { role: 'admin', label: 'Administrator', email: 'admin@willowmere.example', home: '/admin/staff' },
  { role: 'clinician', label: 'Clinician', email: 'clinician@willowmere.example', home: '/caseload' },
  { role: 'supervisor', label: 'Supervisor', email: 'supervisor@willowmere.example', home: '/reviews' },
  { role: 'carer', label: 'Carer', email: 'carer@willowmere.example', home: '/my-clients' },
];

/** Signs in through the form, using the keyboard to submit. */
export async function signIn(page, appUrl, email, password = demoPassword) {
  await page.goto(`${appUrl}/sign-in`, { waitUntil: 'networkidle' });
  await page.getByLabel(/e-?mail/i).fill(email);
  await page.getByLabel(/^password/i).fill(password);
  await page.getByLabel(/^password/i).press('Enter');
}

/** Signs out through the user menu (its button is named after the user and role), by keyboard. */
export async function signOut(page, roleLabel) {
  const menuButton = page.getByRole('banner').getByRole('button', { name: new RegExp(roleLabel) });
  await menuButton.focus();
  await menuButton.press('Enter');
  await page.getByRole('menuitem', { name: /sign out/i }).click();
  await page.waitForURL(/\/sign-in/);
}
