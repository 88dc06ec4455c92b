import type { Role, User as UserDto } from '@keyloom/shared';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { type Agent, csrfToken, FACTORY_PASSWORD, newUser, signIn } from './factories';

describe('users (HTTP, admin only)', () => {
  let t: TestApp;
  let admin: { agent: Agent; csrf: string; id: string };

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    const account = await newUser(t.dataSource, { role: 'admin', name: 'Ada Admin' });
    admin = { ...(await signIn(t.http, account)), id: account.id };
  });
  afterAll(async () => {
    await t.app.close();
  });

  const newStaff = (
    overrides: Partial<{ email: string; name: string; role: Role; password: string }> = {},
  ) => ({
    email: `new-${randomUUID().slice(0, 8)}@willowmere.example`,
    name: 'Nova Quill',
    role: 'carer' as Role,
    password: 'twelve chars plus',
    ...overrides,
  });

  describe('who may call it', () => {
    it('answers 401 without a session', async () => {
      await request(t.http).get('/api/users').expect(401);
    });

    it.each(['clinician', 'supervisor', 'carer'] as const)(
      'answers 403 to a %s on GET, POST and PATCH',
      async (role) => {
        const user = await newUser(t.dataSource, { role });
        const { agent, csrf } = await signIn(t.http, user);
        const expected = { statusCode: 403, message: 'Your role does not allow this.', error: 'Forbidden' };
        expect((await agent.get('/api/users').expect(403)).body).toEqual(expected);
        expect(
          (await agent.post('/api/users').set('X-CSRF-Token', csrf).send(newStaff()).expect(403)).body,
        ).toEqual(expected);
        const patch = await agent
          .patch(`/api/users/${user.id}`)
          .set('X-CSRF-Token', csrf)
          .send({ role: 'admin' });
        expect(patch.status).toBe(403);
        // …and the attempted self-promotion did not happen.
        expect((await agent.get('/api/auth/me').expect(200)).body.role).toBe(role);
      },
    );
  });

  describe('what an admin can do', () => {
    it('lists staff accounts without password hashes', async () => {
      const res = await admin.agent.get('/api/users').expect(200);
      const list = res.body as UserDto[];
      expect(list.find((u) => u.id === admin.id)).toMatchObject({
        role: 'admin',
        active: true,
        name: 'Ada Admin',
      });
      expect(JSON.stringify(list)).not.toMatch(/password|\$2[aby]\$/i);
    });

    it('creates an account (201), who can then sign in; the audit log records it without the password', async () => {
      const body = newStaff({ role: 'clinician', email: 'Mixed.Case@Willowmere.example' });
      const res = await admin.agent.post('/api/users').set('X-CSRF-Token', admin.csrf).send(body).expect(201);
      expect(res.body).toMatchObject({
        email: 'mixed.case@willowmere.example',
        name: 'Nova Quill',
        role: 'clinician',
        active: true,
        lastSignInAt: null,
      });
      const created = res.body as UserDto;
      await signIn(t.http, { email: body.email, password: body.password });

      const events = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'user.create', subjectId: created.id });
      expect(events).toHaveLength(1);
      expect(events[0]).toMatchObject({ actorId: admin.id, subjectType: 'user' });
      expect(events[0].details).toEqual({ email: created.email, name: 'Nova Quill', role: 'clinician' });
      expect(JSON.stringify(events[0])).not.toContain(body.password);
    });

    it('answers 409 for an e-mail that exists in any letter case', async () => {
      const existing = await newUser(t.dataSource);
      const res = await admin.agent
        .post('/api/users')
        .set('X-CSRF-Token', admin.csrf)
        .send(newStaff({ email: existing.email.toUpperCase() }))
        .expect(409);
      expect(res.body.message).toBe('A staff account with that e-mail address already exists.');
    });

    it('changes a role, and the change applies to that person at once', async () => {
      const user = await newUser(t.dataSource, { role: 'carer' });
      const session = await signIn(t.http, user);
      const res = await admin.agent
        .patch(`/api/users/${user.id}`)
        .set('X-CSRF-Token', admin.csrf)
        .send({ role: 'supervisor' })
        .expect(200);
      expect(res.body).toMatchObject({ id: user.id, role: 'supervisor' });
      expect((await session.agent.get('/api/auth/me').expect(200)).body.role).toBe('supervisor');
      const [event] = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'user.update', subjectId: user.id });
      expect(event.details).toEqual({ changes: { role: { from: 'carer', to: 'supervisor' } } });
    });

    it('deactivates an account: its open session gets 401 and it cannot sign in again', async () => {
      const user = await newUser(t.dataSource, { role: 'clinician' });
      const session = await signIn(t.http, user);
      await session.agent.get('/api/auth/me').expect(200);

      await admin.agent
        .patch(`/api/users/${user.id}`)
        .set('X-CSRF-Token', admin.csrf)
        .send({ active: false })
        .expect(200);

      await session.agent.get('/api/auth/me').expect(401);
      const again = request.agent(t.http);
      const token = await csrfToken(again); // before .post(): the agent attaches cookies when the request is built
      const res = await again
        .post('/api/auth/login')
        .set('X-CSRF-Token', token)
        .send({ email: user.email, password: FACTORY_PASSWORD })
        .expect(401);
      expect(res.body.message).toBe('E-mail or password is not right.');
    });

    it('sets a new password: open sessions end, the old password stops working, the new one works', async () => {
      const user = await newUser(t.dataSource, { role: 'carer' });
      const session = await signIn(t.http, user);
      const newPassword = 'a fresh passphrase for the carer';

      await admin.agent
        .patch(`/api/users/${user.id}`)
        .set('X-CSRF-Token', admin.csrf)
        .send({ password: newPassword })
        .expect(200);

      await session.agent.get('/api/auth/me').expect(401);
      const again = request.agent(t.http);
      const token = await csrfToken(again);
      await again
        .post('/api/auth/login')
        .set('X-CSRF-Token', token)
        .send({ email: user.email, password: FACTORY_PASSWORD })
        .expect(401);
      await signIn(t.http, { ...user, password: newPassword });
      const events = await t.dataSource.getRepository(AuditEvent).findBy({ subjectId: user.id, action: 'user.update' });
      expect(JSON.stringify(events)).not.toContain(newPassword);
      expect(events.some((event) => JSON.stringify(event.details).includes('password'))).toBe(true);
    });

    it('refuses (409) to deactivate or demote yourself', async () => {
      const off = await admin.agent
        .patch(`/api/users/${admin.id}`)
        .set('X-CSRF-Token', admin.csrf)
        .send({ active: false })
        .expect(409);
      expect(off.body.message).toBe('You cannot deactivate your own account.');
      const demote = await admin.agent
        .patch(`/api/users/${admin.id}`)
        .set('X-CSRF-Token', admin.csrf)
        .send({ role: 'clinician' })
        .expect(409);
      expect(demote.body.message).toBe('You cannot remove your own administrator role.');
    });

    it('answers 404 for an unknown id and 400 for an id that is not a uuid', async () => {
      const res = await admin.agent
        .patch(`/api/users/${randomUUID()}`)
        .set('X-CSRF-Token', admin.csrf)
        .send({ name: 'Ghost' })
        .expect(404);
      expect(res.body).toEqual({
        statusCode: 404,
        message: 'There is no staff account with that id.',
        error: 'Not Found',
      });
      await admin.agent
        .patch('/api/users/not-a-uuid')
        .set('X-CSRF-Token', admin.csrf)
        .send({ name: 'X' })
        .expect(400);
    });
  });

  describe('bad requests', () => {
    it.each([
      ['missing e-mail', { name: 'A', role: 'carer', password: 'twelve chars plus' }, 'email'],
      [
        'bad role',
        { email: 'a@willowmere.example', name: 'A', role: 'boss', password: 'twelve chars plus' },
        'role',
      ],
      [
        'short password',
        { email: 'a@willowmere.example', name: 'A', role: 'carer', password: 'short' },
        'password',
      ],
      [
        'blank name',
        { email: 'a@willowmere.example', name: '   ', role: 'carer', password: 'twelve chars plus' },
        'name',
      ],
    ])('POST with %s → 400 naming the field', async (_label, body, field) => {
      const res = await admin.agent.post('/api/users').set('X-CSRF-Token', admin.csrf).send(body).expect(400);
      expect(res.body.message).toBe('Check the highlighted fields.');
      expect((res.body.issues as { path: string }[]).map((issue) => issue.path)).toEqual([field]);
    });

    it('ignores unknown fields: a PATCH cannot set a password hash or an id', async () => {
      const user = await newUser(t.dataSource);
      const res = await admin.agent
        .patch(`/api/users/${user.id}`)
        .set('X-CSRF-Token', admin.csrf)
        .send({ passwordHash: 'x', id: randomUUID() })
        .expect(400);
      expect(res.body.issues).toEqual([{ path: '', message: 'Nothing to change.' }]);
      await signIn(t.http, user); // the password still works
    });

    it('answers malformed JSON with a 400 JSON error', async () => {
      const res = await admin.agent
        .post('/api/users')
        .set('X-CSRF-Token', admin.csrf)
        .set('Content-Type', 'application/json')
        .send('{"email": "a@b.c",')
        .expect(400);
      expect(res.body).toEqual({
        statusCode: 400,
        message: 'The request body is not valid JSON.',
        error: 'Bad Request',
      });
    });

    it('refuses a state change without a CSRF token, or with a wrong one (403)', async () => {
      const body = newStaff();
      await admin.agent.post('/api/users').send(body).expect(403);
      await admin.agent.post('/api/users').set('X-CSRF-Token', 'not-the-token').send(body).expect(403);
      await admin.agent.get('/api/users').expect(200); // safe methods need no token
      const list = (await admin.agent.get('/api/users').expect(200)).body as UserDto[];
      expect(list.some((u) => u.email === body.email)).toBe(false);
    });
  });

  describe('the audit log', () => {
    it('cannot be edited or deleted, even by the application role', async () => {
      await expect(t.dataSource.query(`UPDATE "audit_events" SET "action" = 'tampered'`)).rejects.toThrow(
        /append-only: UPDATE/,
      );
      await expect(t.dataSource.query(`DELETE FROM "audit_events"`)).rejects.toThrow(/append-only: DELETE/);
      await expect(t.dataSource.query(`TRUNCATE "audit_events"`)).rejects.toThrow(/append-only: TRUNCATE/);
      const [{ n }] = await t.dataSource.query<{ n: string }[]>(
        `SELECT count(*) AS n FROM "audit_events" WHERE "action" = 'tampered'`,
      );
      expect(Number(n)).toBe(0);
    });
  });
});
