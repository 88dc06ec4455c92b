// Calls to the API from a signed-in page (its cookies), for steps a suite needs but does not test
// through the screens.
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';

/** Headers for a state-changing request: the session's CSRF token and JSON. */
export async function csrfHeaders(page, appUrl) {
  const res = await page.request.get(`${appUrl}/api/auth/csrf`);
  assert.equal(res.status(), 200, 'a CSRF token is handed out');
  const { token } = await res.json();
  return { 'X-CSRF-Token': token, 'Content-Type': 'application/json' };
}

/**
 * Logs a short trial of a version, typed key by key (direct access), as the signed-in carer or
 * clinician; returns the stored trial.
 */
export async function postTypedTrial(page, appUrl, versionId, text = 'see you soon') {
  const chars = [...text];
  const events = chars.map((c, i) => ({
    t: i * 900,
    type: c === ' ' ? 'space' : 'letter',
    ...(c === ' ' ? {} : { value: c }),
  }));
  const res = await page.request.post(`${appUrl}/api/profile-versions/${versionId}/trials`, {
    headers: await csrfHeaders(page, appUrl),
    data: {
      localTrialId: randomUUID(),
      startedAt: new Date(Date.now() - 15_000).toISOString(),
      finishedAt: new Date().toISOString(),
      text,
      events,
      settings: {
        selectionMode: 'direct',
        layout: 'typewriter',
        slots: 5,
        dwellMs: null,
        scanIntervalMs: null,
        largeTargets: false,
        highContrast: false,
        textScale: 1,
        tintKeys: false,
      },
    },
  });
  assert.equal(res.status(), 201, `the trial is logged: ${await res.text()}`);
  return res.json();
}
