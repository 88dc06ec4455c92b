import { PASSWORD_CHANGE_REQUIRED_CODE } from '@keyloom/shared';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { validateEnv } from '../src/config/env.schema';
import { demoStaffStep } from '../src/db/seeds/demo-staff.seed';
import { User } from '../src/users/user.entity';
import { WEAK_PASSWORD_MESSAGE } from '../src/users/password-strength';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { type Agent, csrfToken, newUser, signIn } from './factories';

const STRONG = 'Tulip-Harbour-Lantern-42';
const WEAK_BODY = (path: string) => ({
  statusCode: 400,
  message: WEAK_PASSWORD_MESSAGE,
  error: 'Bad Request',
  issues: [{ path, message: WEAK_PASSWORD_MESSAGE }],
});

describe('passwords (HTTP)', () => {
  let t: TestApp;
  let admin: { agent: Agent; csrf: string };

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    admin = await signIn(t.http, await newUser(t.dataSource, { role: 'admin' }));
  });
  afterAll(async () => {
    await t.app.close();
  });

  const staff = (password: string) => ({
    email: `new-${randomUUID().slice(0, 8)}@willowmere.example`,
    name: 'Nova Quill',
    role: 'carer',
    password,
  });

  describe('strength, wherever a password is set', () => {
    it.each(['aaaaaaaaaaaa', 'password1234'])(
      'refuses %j for a new account with 400 and the reason',
      async (pw) => {
        const res = await admin.agent
          .post('/api/users')
          .set('X-CSRF-Token', admin.csrf)
          .send(staff(pw))
          .expect(400);
        expect(res.body).toEqual(WEAK_BODY('password'));
      },
    );

    it('accepts a strong password for a new account', async () => {
      await admin.agent.post('/api/users').set('X-CSRF-Token', admin.csrf).send(staff(STRONG)).expect(201);
    });

    it('refuses a weak password set by an administrator, and keeps the old one', async () => {
      const user = await newUser(t.dataSource);
      const res = await admin.agent
        .patch(`/api/users/${user.id}`)
        .set('X-CSRF-Token', admin.csrf)
        .send({ password: 'password1234' })
        .expect(400);
      expect(res.body).toEqual(WEAK_BODY('password'));
      await signIn(t.http, user);
    });

    it("refuses the account's own name as a password", async () => {
      const res = await admin.agent
        .post('/api/users')
        .set('X-CSRF-Token', admin.csrf)
        .send({ ...staff('pennickorla1'), name: 'Orla Pennick' })
        .expect(400);
      expect(res.body.message).toBe(WEAK_PASSWORD_MESSAGE);
    });
  });

  describe('POST /api/auth/password (own password)', () => {
    const change = (who: { agent: Agent; csrf: string }, body: object) =>
      who.agent.post('/api/auth/password').set('X-CSRF-Token', who.csrf).send(body);

    it('needs a session (401) and a CSRF token (403)', async () => {
      const agent = request.agent(t.http);
      const token = await csrfToken(agent);
      await agent.post('/api/auth/password').set('X-CSRF-Token', token).send({}).expect(401);
      const me = await signIn(t.http, await newUser(t.dataSource));
      await me.agent.post('/api/auth/password').send({}).expect(403);
    });

    it('refuses a wrong current password, a weak new one and two different new ones (400)', async () => {
      const user = await newUser(t.dataSource);
      const me = await signIn(t.http, user);
      const wrong = await change(me, {
        currentPassword: 'not my password',
        newPassword: STRONG,
        confirmPassword: STRONG,
      }).expect(400);
      expect(wrong.body.issues).toEqual([
        { path: 'currentPassword', message: 'Your current password is not right.' },
      ]);
      const weak = await change(me, {
        currentPassword: user.password,
        newPassword: 'aaaaaaaaaaaa',
        confirmPassword: 'aaaaaaaaaaaa',
      }).expect(400);
      expect(weak.body).toEqual(WEAK_BODY('newPassword'));
      const mismatch = await change(me, {
        currentPassword: user.password,
        newPassword: STRONG,
        confirmPassword: `${STRONG}!`,
      }).expect(400);
      expect(mismatch.body.issues).toEqual([
        { path: 'confirmPassword', message: 'The two new passwords are not the same.' },
      ]);
      await signIn(t.http, user); // still the old password
    });

    it('changes it: the old one stops working, other sessions end, this one stays, audit row', async () => {
      const user = await newUser(t.dataSource);
      const me = await signIn(t.http, user);
      const elsewhere = await signIn(t.http, user);
      const res = await change(me, {
        currentPassword: user.password,
        newPassword: STRONG,
        confirmPassword: STRONG,
      }).expect(200);
      expect(res.body).toEqual({ id: user.id, email: user.email, name: user.name, role: user.role });
      await me.agent.get('/api/auth/me').expect(200);
      await elsewhere.agent.get('/api/auth/me').expect(401);
      const agent = request.agent(t.http);
      const token = await csrfToken(agent);
      await agent.post('/api/auth/login').set('X-CSRF-Token', token).send(user).expect(401);
      await signIn(t.http, { email: user.email, password: STRONG });
      const events = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'auth.password-change', actorId: user.id });
      expect(events).toHaveLength(1);
      expect(JSON.stringify(events[0].details)).not.toContain(STRONG);
    });
  });

  describe('an account that must change its password', () => {
    it('may only ask who it is, change the password and sign out (403 with a code elsewhere); then works', async () => {
      const user = await newUser(t.dataSource, { role: 'clinician' });
      await t.dataSource.getRepository(User).update({ id: user.id }, { mustChangePassword: true });
      const me = await signIn(t.http, user);

      const who = await me.agent.get('/api/auth/me').expect(200);
      expect(who.body).toMatchObject({ id: user.id, mustChangePassword: true });
      for (const path of ['/api/clients', '/api/audit']) {
        const refused = await me.agent.get(path).expect(403);
        expect(refused.body).toEqual({
          statusCode: 403,
          message: 'Choose a new password before you continue.',
          error: 'Forbidden',
          code: PASSWORD_CHANGE_REQUIRED_CODE,
        });
      }
      await me.agent.post('/api/clients').set('X-CSRF-Token', me.csrf).send({}).expect(403);

      const changed = await me.agent
        .post('/api/auth/password')
        .set('X-CSRF-Token', me.csrf)
        .send({ currentPassword: user.password, newPassword: STRONG, confirmPassword: STRONG })
        .expect(200);
      expect(changed.body).not.toHaveProperty('mustChangePassword');
      await me.agent.get('/api/clients').expect(200);
      expect((await me.agent.get('/api/auth/me').expect(200)).body).not.toHaveProperty('mustChangePassword');
      await me.agent.post('/api/auth/logout').set('X-CSRF-Token', me.csrf).expect(204);
    });

    it('can sign out while the change is due', async () => {
      const user = await newUser(t.dataSource);
      await t.dataSource.getRepository(User).update({ id: user.id }, { mustChangePassword: true });
      const me = await signIn(t.http, user);
      await me.agent.post('/api/auth/logout').set('X-CSRF-Token', me.csrf).expect(204);
      await me.agent.get('/api/auth/me').expect(401);
    });

    it('is what the seed makes of the demo accounts outside demo mode, and not in demo mode', async () => {
      const seed = (DEMO_MODE: string, resetPasswords: boolean) =>
        t.dataSource.transaction((manager) =>
          demoStaffStep.run({
            manager,
            env: validateEnv({ ...process.env, DEMO_MODE }),
            resetPasswords,
            log: () => undefined,
          }),
        );
      const flags = async () =>
        (await t.dataSource.getRepository(User).find({ order: { email: 'ASC' } }))
          .filter((user) => user.email.endsWith('@willowmere.example') && !user.email.includes('-'))
          .map((user) => [user.email, user.mustChangePassword]);
      await seed('true', false);
      expect(await flags()).toEqual([
        ['admin@willowmere.example', false],
        ['carer@willowmere.example', false],
        ['clinician@willowmere.example', false],
        ['supervisor@willowmere.example', false],
      ]);
      await seed('false', true);
      expect((await flags()).map(([, flag]) => flag)).toEqual([true, true, true, true]);
      const demo = await signIn(t.http, {
        email: 'carer@willowmere.example',
        password: validateEnv(process.env).DEMO_PASSWORD,
      });
      expect((await demo.agent.get('/api/clients').expect(403)).body.code).toBe(
        PASSWORD_CHANGE_REQUIRED_CODE,
      );
    });
  });
});
