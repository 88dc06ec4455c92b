import request from 'supertest';
import { IsNull } from 'typeorm';
import { AuditEvent } from '../src/audit/audit-event.entity';
import type { SignInLimitSettings } from '../src/auth/sign-in-limits/sign-in-limit-settings';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { type Agent, csrfToken, newUser, signIn } from './factories';

const LOCKED = { statusCode: 429, error: 'Too Many Requests' };
/** The held-back answer, whose message says the wait in words (e.g. "about 15 minutes"). */
const locked = (wait: RegExp) => ({
  ...LOCKED,
  message: expect.stringMatching(
    new RegExp(`^Too many failed sign-in attempts\\. Try again in ${wait.source}\\.$`),
  ),
});

/** One sign-in attempt from a fresh agent (its own session and CSRF token), as a new browser tab would. */
async function attempt(t: TestApp, email: string, password: string): Promise<request.Response> {
  const agent: Agent = request.agent(t.http);
  const token = await csrfToken(agent);
  return agent.post('/api/auth/login').set('X-CSRF-Token', token).send({ email, password });
}

const retryAfter = (res: request.Response) => Number(res.headers['retry-after']);
const clearLimits = (t: TestApp) => t.dataSource.query('DELETE FROM sign_in_limits');

describe('sign-in limits (HTTP)', () => {
  let t: TestApp;
  // One app per file (passport keeps one serializer per process); the tests change its limits here.
  const limits: Partial<SignInLimitSettings> = {};

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp({ loginRateLimit: 5, signInLimits: limits });
  });
  beforeEach(() => clearLimits(t));
  afterAll(async () => {
    await t.app.close();
  });

  describe('a clinic behind one address, per-address limit 5 (LOGIN_RATE_LIMIT=5)', () => {
    beforeAll(() => {
      delete limits.addressFailures;
      delete limits.baseLockSeconds;
    });

    it('lets 8 staff sign in one after the other from the same address (successes are not counted)', async () => {
      const staff = await Promise.all(Array.from({ length: 8 }, () => newUser(t.dataSource)));
      const statuses: number[] = [];
      for (const user of staff) statuses.push((await attempt(t, user.email, user.password)).status);
      expect(statuses).toEqual([200, 200, 200, 200, 200, 200, 200, 200]);
      // And one person signing in again and again (new tabs, after signing out).
      const again: number[] = [];
      for (let i = 0; i < 6; i += 1) again.push((await attempt(t, staff[0].email, staff[0].password)).status);
      expect(again).toEqual([200, 200, 200, 200, 200, 200]);
    });

    it('stops wrong guesses spread over many accounts at the address limit: 429 with Retry-After', async () => {
      const accounts = await Promise.all(Array.from({ length: 6 }, () => newUser(t.dataSource)));
      const statuses: number[] = [];
      for (const user of accounts.slice(0, 5)) {
        statuses.push((await attempt(t, user.email, 'a wrong guess!')).status);
      }
      expect(statuses).toEqual([401, 401, 401, 401, 401]);
      // The sixth account has never failed, yet the address is held back, even with its right password.
      const blocked = await attempt(t, accounts[5].email, accounts[5].password);
      expect(blocked.status).toBe(429);
      expect(blocked.body).toEqual(locked(/about 15 minutes/));
      // The rest of the 15-minute window.
      expect(retryAfter(blocked)).toBeGreaterThan(14 * 60);
      expect(retryAfter(blocked)).toBeLessThanOrEqual(15 * 60);
      const [lock] = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'auth.sign-in-locked', subjectType: IsNull() });
      expect(lock).toMatchObject({
        actorId: null,
        actorEmail: null,
        details: { scope: 'address', failures: 5 },
      });
      // Other routes are not held back.
      await request(t.http).get('/api/health').expect(200);
    });
  });

  describe('one account, 5 free failures, then 1 s·2^n (raised to 60 s·2^n here so no timing matters)', () => {
    beforeAll(() => {
      limits.addressFailures = 1_000;
      limits.baseLockSeconds = 60;
    });

    it('answers 429 with Retry-After after 5 wrong passwords and refuses the right one during the lock', async () => {
      const user = await newUser(t.dataSource);
      const statuses: number[] = [];
      for (let i = 0; i < 5; i += 1) statuses.push((await attempt(t, user.email, 'not it at all')).status);
      expect(statuses).toEqual([401, 401, 401, 401, 401]);

      const refused = await attempt(t, user.email, user.password);
      expect(refused.status).toBe(429);
      expect(refused.body).toEqual(locked(/about (1 minute|59 seconds)/));
      expect(retryAfter(refused)).toBeGreaterThanOrEqual(59);
      expect(retryAfter(refused)).toBeLessThanOrEqual(60);
      expect(refused.headers['set-cookie']?.toString() ?? '').not.toMatch(/keyloom\.sid=s%3A/);

      const locks = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'auth.sign-in-locked', subjectId: user.id });
      expect(locks).toHaveLength(1);
      expect(locks[0]).toMatchObject({
        actorEmail: null,
        subjectType: 'user',
        details: { scope: 'account', failures: 5, lockSeconds: 60 },
      });

      // When the lock has run out (moved into the past here), the next failure doubles it: 120 s.
      await t.dataSource.query(
        `UPDATE sign_in_limits SET locked_until = now() - interval '1 second' WHERE kind = 'account'`,
      );
      expect((await attempt(t, user.email, 'still not it')).status).toBe(401);
      const longer = await attempt(t, user.email, user.password);
      expect(longer.status).toBe(429);
      expect(retryAfter(longer)).toBeGreaterThanOrEqual(119);
      expect(retryAfter(longer)).toBeLessThanOrEqual(120);
    });

    it('treats an unknown e-mail address exactly like an account (same answers, same lock)', async () => {
      const user = await newUser(t.dataSource);
      const answers = async (email: string, right: string) => {
        const seen: { status: number; body: unknown; retryAfter: string | undefined }[] = [];
        for (let i = 0; i < 5; i += 1) {
          const res = await attempt(t, email, 'not it at all');
          seen.push({ status: res.status, body: res.body, retryAfter: res.headers['retry-after'] });
        }
        const last = await attempt(t, email, right);
        seen.push({ status: last.status, body: last.body, retryAfter: last.headers['retry-after'] });
        return seen;
      };
      const known = await answers(user.email, user.password);
      await clearLimits(t);
      const unknown = await answers('nobody-at-all@willowmere.example', 'some password');
      expect(unknown).toEqual(known);
      expect(known.map((answer) => answer.status)).toEqual([401, 401, 401, 401, 401, 429]);
    });

    it('forgets the failures after a successful sign-in', async () => {
      const user = await newUser(t.dataSource);
      for (let i = 0; i < 4; i += 1) expect((await attempt(t, user.email, 'wrong guess')).status).toBe(401);
      expect((await attempt(t, user.email, user.password)).status).toBe(200);
      const after: number[] = [];
      for (let i = 0; i < 4; i += 1) after.push((await attempt(t, user.email, 'wrong guess')).status);
      expect(after).toEqual([401, 401, 401, 401]);
      expect((await attempt(t, user.email, user.password)).status).toBe(200);
    });

    it('locks an account for good at 100 consecutive failures, until an administrator sets a new password', async () => {
      const user = await newUser(t.dataSource);
      const admin = await newUser(t.dataSource, { role: 'admin' });
      const { agent, csrf } = await signIn(t.http, admin);
      // 99 earlier failures (their locks long over), then the 100th.
      await t.dataSource.query(
        `INSERT INTO sign_in_limits (kind, subject, failures) VALUES ('account', $1, 99)`,
        [user.email],
      );
      expect((await attempt(t, user.email, 'the hundredth guess')).status).toBe(401);
      const refused = await attempt(t, user.email, user.password);
      expect(refused.status).toBe(429);
      expect(refused.body).toEqual({
        ...LOCKED,
        message:
          'Too many failed sign-in attempts for this account. Ask an administrator to set a new password.',
      });
      expect(retryAfter(refused)).toBeGreaterThan(0);

      const newPassword = 'Tulip-Harbour-Lantern-42';
      await agent
        .patch(`/api/users/${user.id}`)
        .set('X-CSRF-Token', csrf)
        .send({ password: newPassword })
        .expect(200);
      expect((await attempt(t, user.email, newPassword)).status).toBe(200);
    });
  });
});
