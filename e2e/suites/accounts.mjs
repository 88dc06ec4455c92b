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

/** A fresh page and session signed in as `email`, on its home page `home`. */
export async function signedInAs(t, email, home) {
  await t.context.clearCookies();
  const page = await t.newPage();
  await signIn(page, t.appUrl, email);
  await page.waitForURL((url) => url.pathname === home);
  return page;
}

/**
 * A fresh page signed in as the demo clinician, on one tab of a client's page reached from the
 * caseload (as a clinician would go).
 * @param t the runner's helpers
 * @param clientName the client's pseudonym, e.g. "R. Ashby"
 * @param tab the tab's name, e.g. "Profile versions"
 */
export async function openClientTabAsClinician(t, clientName, tab) {
  const page = await signedInAs(t, 'clinician@willowmere.example', '/caseload');
  await page.getByRole('link', { name: clientName, exact: true }).first().click();
  await page.getByRole('heading', { level: 1, name: clientName }).waitFor();
  await page.getByRole('tab', { name: tab }).click();
  return page;
}
