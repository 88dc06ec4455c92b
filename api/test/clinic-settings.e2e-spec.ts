import { type ClinicSettings, PHONE_MESSAGE } from '@keyloom/shared';
import request from 'supertest';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { demoClinicStep } from '../src/db/seeds/demo-clinic.seed';
import { validateEnv } from '../src/config/env.schema';
import { type Agent, newUser, signIn } from './factories';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

// The clinic's details: any signed-in staff reads them, only an admin sets them, every change audited.
describe('clinic settings (HTTP)', () => {
  let t: TestApp;
  let admin: { agent: Agent; csrf: string; id: string };

  const valid = {
    name: 'Larchfield Speech and Access Service',
    // 01632 960xxx: the UK range Ofcom keeps for drama, so the number reaches nobody.
    phone: '01632 960 731',
    address: '12 Quarry Row\nLarchfield\nLF2 9ZZ',
    email: '',
    website: '',
  };

  const put = (caller: { agent: Agent; csrf: string }, body: unknown) =>
    caller.agent
      .put('/api/clinic-settings')
      .set('X-CSRF-Token', caller.csrf)
      .send(body as object);

  const auditEvents = () =>
    t.dataSource
      .getRepository(AuditEvent)
      .find({ where: { action: 'clinic-settings.update' }, order: { at: 'ASC' } });

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    const account = await newUser(t.dataSource, { role: 'admin', name: 'Ada Admin' });
    admin = { ...(await signIn(t.http, account)), id: account.id };
  });
  afterAll(async () => {
    await t.app.close();
  });

  it('answers 401 without a session, to GET and PUT', async () => {
    await request(t.http).get('/api/clinic-settings').expect(401);
    await request(t.http).put('/api/clinic-settings').send(valid).expect(401);
  });

  it('answers the default before anything is saved: configured false, "the clinic", no phone', async () => {
    const res = await admin.agent.get('/api/clinic-settings').expect(200);
    expect(res.body).toEqual({
      configured: false,
      name: 'the clinic',
      phone: '',
      address: '',
      email: null,
      website: null,
      updatedAt: null,
      updatedBy: null,
    });
  });

  it.each(['clinician', 'supervisor', 'carer'] as const)(
    'lets a %s read the details (200) but not change them (403, nothing stored)',
    async (role) => {
      const caller = await signIn(t.http, await newUser(t.dataSource, { role }));
      await caller.agent.get('/api/clinic-settings').expect(200);
      expect((await put(caller, valid).expect(403)).body.message).toBe('Your role does not allow this.');
      expect((await admin.agent.get('/api/clinic-settings').expect(200)).body.configured).toBe(false);
    },
  );

  // Each row: what is wrong, the change, the field the 400 names, its message (null: any message).
  it.each<[string, Record<string, unknown>, string, string | null]>([
    ['an empty name', { name: '  ' }, 'name', 'Enter the clinic’s name.'],
    ['letters for a phone', { phone: 'call us' }, 'phone', PHONE_MESSAGE],
    ['too few digits', { phone: '123 45' }, 'phone', PHONE_MESSAGE],
    ['more than 15 digits (E.164)', { phone: '0163 2960 4180 0000' }, 'phone', PHONE_MESSAGE],
    ['a line break in the phone', { phone: '01632\n960418' }, 'phone', null],
    ['a NUL in the address', { address: 'Quarry\u0000Row' }, 'address', null],
    ['an address over 500 characters', { address: 'x'.repeat(501) }, 'address', null],
    ['a malformed e-mail', { email: 'clinic at larchfield' }, 'email', null],
    ['a script address as website', { website: 'javascript:alert(1)' }, 'website', null],
    ['a missing address', { address: undefined }, 'address', 'Enter the clinic’s address.'],
  ])('refuses %s (400 naming the field), storing nothing', async (_what, change, field, message) => {
    const res = await put(admin, { ...valid, ...change }).expect(400);
    const issues = res.body.issues as { path: string; message: string }[];
    expect([...new Set(issues.map((issue) => issue.path))]).toEqual([field]);
    if (message !== null) expect(issues[0].message).toBe(message);
    expect((await admin.agent.get('/api/clinic-settings').expect(200)).body.configured).toBe(false);
  });

  it('round-trips an admin PUT (trimmed, empty optional fields as null) and audits before → after', async () => {
    const saved = (await put(admin, { ...valid, name: `  ${valid.name} ` }).expect(200))
      .body as ClinicSettings;
    expect(saved).toMatchObject({ ...valid, configured: true, email: null, website: null });
    expect(saved.updatedBy).toEqual({ id: admin.id, name: 'Ada Admin' });
    expect((await admin.agent.get('/api/clinic-settings').expect(200)).body).toEqual(saved);

    const changed = {
      ...valid,
      phone: '+44 1632 960 732',
      email: 'Front.Desk@Larchfield.example',
      website: 'https://larchfield.example/speech',
    };
    const again = (await put(admin, changed).expect(200)).body as ClinicSettings;
    expect(again).toMatchObject({
      phone: '+44 1632 960 732',
      email: 'front.desk@larchfield.example',
      website: 'https://larchfield.example/speech',
    });

    expect(again.updatedAt).not.toBe(saved.updatedAt);
    const events = await auditEvents();
    expect(events).toHaveLength(2);
    expect(events[0].actorId).toBe(admin.id);
    expect(events[0].details).toEqual({
      changes: {
        name: { from: null, to: valid.name },
        phone: { from: null, to: valid.phone },
        address: { from: null, to: valid.address },
      },
    });
    expect(events[1].details).toEqual({
      changes: {
        phone: { from: valid.phone, to: '+44 1632 960 732' },
        email: { from: null, to: 'front.desk@larchfield.example' },
        website: { from: null, to: 'https://larchfield.example/speech' },
      },
    });

    // The same details again change nothing and add no event.
    await put(admin, changed).expect(200);
    expect(await auditEvents()).toHaveLength(2);
  });

  it('keeps the row, with no author, when the account that saved it is deleted (ON DELETE SET NULL)', async () => {
    // Accounts with audit events are never deleted (the log is append-only): one without any.
    const gone = await newUser(t.dataSource, { role: 'admin', name: 'Never Signed In' });
    await t.dataSource.query(`UPDATE clinic_settings SET updated_by_id = $1`, [gone.id]);
    expect((await admin.agent.get('/api/clinic-settings').expect(200)).body.updatedBy.name).toBe(
      'Never Signed In',
    );
    await t.dataSource.query(`DELETE FROM users WHERE id = $1`, [gone.id]);
    const res = await admin.agent.get('/api/clinic-settings').expect(200);
    expect(res.body).toMatchObject({ name: valid.name, updatedBy: null });
  });

  it('seeds the demo clinic once and never over an admin’s details', async () => {
    const env = validateEnv(process.env);
    const run = () =>
      t.dataSource.transaction((manager) =>
        demoClinicStep.run({ manager, env, resetPasswords: false, log: () => undefined }),
      );
    await run();
    expect((await admin.agent.get('/api/clinic-settings').expect(200)).body.name).toBe(valid.name);
    await t.dataSource.query(`DELETE FROM clinic_settings`);
    await run();
    await run();
    const seeded = (await admin.agent.get('/api/clinic-settings').expect(200)).body as ClinicSettings;
    expect(seeded).toMatchObject({
      name: 'Willowmere Community Communication Clinic',
      phone: '01632 960 418',
      configured: true,
    });
    expect(seeded.address.split('\n').length).toBeGreaterThan(2);
  });
});
