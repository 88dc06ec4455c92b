import type { SessionUser } from '@keyloom/shared';
import request from 'supertest';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { csrfToken, newUser, sessionCookie, signIn } from './factories';

const SIGN_IN_FAILED = {
  statusCode: 401,
  message: 'E-mail or password is not right.',
  error: 'Unauthorized',
};

describe('auth (HTTP)', () => {
  let t: TestApp;

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.app.close();
  });

  describe('POST /api/auth/login', () => {
    it('signs in: 200 with the user, a fresh session cookie with the right flags, and an audit row', async () => {
      const user = await newUser(t.dataSource, { role: 'supervisor', name: 'Priya Test' });
      const agent = request.agent(t.http);
      const csrfRes = await agent.get('/api/auth/csrf').expect(200);
      const anonymousCookie = sessionCookie(csrfRes);
      expect(anonymousCookie).toBeDefined();

      const res = await agent
        .post('/api/auth/login')
        .set('X-CSRF-Token', (csrfRes.body as { token: string }).token)
        .send({ email: user.email.toUpperCase(), password: user.password })
        .expect(200);

      expect(res.body).toEqual({ id: user.id, email: user.email, name: 'Priya Test', role: 'supervisor' });
      const cookie = sessionCookie(res) ?? '';
      expect(cookie).toMatch(/; HttpOnly/);
      expect(cookie).toMatch(/; SameSite=Lax/);
      expect(cookie).toMatch(/; Path=\//);
      expect(cookie).not.toMatch(/; Secure/); // NODE_ENV=test: plain http
      // Session fixation defence: the id issued before sign-in is not the one after.
      expect(cookie.split(';')[0]).not.toBe(anonymousCookie?.split(';')[0]);

      const me = await agent.get('/api/auth/me').expect(200);
      expect(me.body).toEqual(res.body);

      const events = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'auth.sign-in', actorId: user.id });
      expect(events).toHaveLength(1);
      expect(events[0]).toMatchObject({ actorEmail: user.email, subjectType: 'user', subjectId: user.id });
      expect(events[0].ip).toMatch(/127\.0\.0\.1/);
    });

    it('gives the new session a new CSRF token (the client must refetch it)', async () => {
      const user = await newUser(t.dataSource);
      const agent = request.agent(t.http);
      const before = await csrfToken(agent);
      await agent.post('/api/auth/login').set('X-CSRF-Token', before).send(user).expect(200);
      const after = await csrfToken(agent);
      expect(after).not.toBe(before);
      // The old token no longer works for a state change.
      await agent.post('/api/auth/logout').set('X-CSRF-Token', before).expect(403);
    });

    it('answers the same 401 for a wrong password, an unknown e-mail and a deactivated account', async () => {
      const user = await newUser(t.dataSource);
      const inactive = await newUser(t.dataSource, { active: false });
      const attempts = [
        { email: user.email, password: 'not the password' },
        { email: 'nobody-here@willowmere.example', password: 'whatever it is' },
        { email: inactive.email, password: inactive.password },
      ];
      for (const body of attempts) {
        const agent = request.agent(t.http);
        const token = await csrfToken(agent); // before .post(): the agent attaches cookies when the request is built
        const res = await agent.post('/api/auth/login').set('X-CSRF-Token', token).send(body);
        expect(res.status).toBe(401);
        expect(res.body).toEqual(SIGN_IN_FAILED);
        expect(sessionCookie(res)).toBeUndefined();
      }
      const failures = await t.dataSource.getRepository(AuditEvent).findBy({ action: 'auth.sign-in-failed' });
      expect(failures.map((event) => event.details.reason).sort()).toEqual([
        'inactive-account',
        'unknown-account',
        'wrong-password',
      ]);
    });

    it('answers 400 with field messages for a bad body', async () => {
      const agent = request.agent(t.http);
      const token = await csrfToken(agent);
      const res = await agent
        .post('/api/auth/login')
        .set('X-CSRF-Token', token)
        .send({ password: 'x' })
        .expect(400);
      expect(res.body).toMatchObject({ message: 'Check the highlighted fields.' });
      expect(res.body.issues).toEqual([{ path: 'email', message: 'Enter a valid e-mail address.' }]);
    });

    it('refuses a sign-in without, or with a wrong, CSRF token (403)', async () => {
      const user = await newUser(t.dataSource);
      const agent = request.agent(t.http);
      await csrfToken(agent);
      const missing = await agent.post('/api/auth/login').send(user).expect(403);
      expect(missing.body).toEqual({
        statusCode: 403,
        message: 'Missing or invalid CSRF token. Reload the page and try again.',
        error: 'Forbidden',
      });
      await agent.post('/api/auth/login').set('X-CSRF-Token', 'f'.repeat(64)).send(user).expect(403);
    });
  });

  describe('session routes', () => {
    it('answers 401 JSON on /me without a session', async () => {
      const res = await request(t.http).get('/api/auth/me').expect(401);
      expect(res.body).toEqual({ statusCode: 401, message: 'Sign in to continue.', error: 'Unauthorized' });
    });

    it('signs out: the session is destroyed, its cookie cleared, and /me is 401 again', async () => {
      const user = await newUser(t.dataSource, { role: 'carer' });
      const { agent, csrf } = await signIn(t.http, user);
      const sessionsBefore = await t.dataSource.query<{ n: string }[]>(
        `SELECT count(*) AS n FROM "session" WHERE "sess"->'passport'->>'user' = $1`,
        [user.id],
      );
      expect(Number(sessionsBefore[0].n)).toBe(1);

      const res = await agent.post('/api/auth/logout').set('X-CSRF-Token', csrf).expect(204);
      expect(sessionCookie(res)).toMatch(/^keyloom\.sid=;/);
      await agent.get('/api/auth/me').expect(401);
      const sessionsAfter = await t.dataSource.query<{ n: string }[]>(
        `SELECT count(*) AS n FROM "session" WHERE "sess"->'passport'->>'user' = $1`,
        [user.id],
      );
      expect(Number(sessionsAfter[0].n)).toBe(0);
      const signOuts = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'auth.sign-out', actorId: user.id });
      expect(signOuts).toHaveLength(1);
    });

    it('records lastSignInAt', async () => {
      const user = await newUser(t.dataSource, { role: 'admin' });
      const { agent } = await signIn(t.http, user);
      const list = await agent.get('/api/users').expect(200);
      const me = (list.body as (SessionUser & { lastSignInAt: string | null })[]).find(
        (u) => u.id === user.id,
      );
      expect(me?.lastSignInAt).not.toBeNull();
      expect(Date.now() - Date.parse(me?.lastSignInAt ?? '')).toBeLessThan(60_000);
    });
  });
});
