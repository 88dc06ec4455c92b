import type { AuditPage, Client } from '@keyloom/shared';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { ScrubClientTextFromAudit1764910000001 } from '../src/migrations/1764910000001-scrub-client-text-from-audit';
import { type Cast, newCast, newClient, newConsent, send } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

describe('audit log browsing (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;
  let first: Client;
  let second: Client;

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    cast = await newCast(t.http, t.dataSource);
    first = await newClient(t.http, cast.owner, cast.assignedCarer, 'A. Auditfirst');
    second = await newClient(t.http, cast.otherClinician, undefined, 'B. Auditsecond');
    await newConsent(t.http, cast.owner, first.id);
    await send(t.http, cast.owner, 'post', `/api/clients/${first.id}/contacts`, {
      name: 'Nell Auditfirst',
      relationship: 'niece',
      email: 'nell@family.example',
      consentToSummaries: true,
    }).expect(201);
  });
  afterAll(async () => {
    await t.app.close();
  });

  const page = async (query: string, who: keyof Cast = 'supervisor') =>
    (await send(t.http, cast[who], 'get', `/api/audit${query}`).expect(200)).body as AuditPage;

  it('is for supervisors and admins only', async () => {
    await page('', 'supervisor');
    await page('', 'admin');
    for (const who of ['owner', 'assignedCarer'] as const) {
      const res = await send(t.http, cast[who], 'get', '/api/audit').expect(403);
      expect(res.body.message).toBe('Your role does not allow this.');
    }
    await request(t.http).get('/api/audit').expect(401);
  });

  it('lists newest first, with the client’s pseudonym', async () => {
    const result = await page('?pageSize=200');
    const times = result.items.map((item) => item.at);
    expect([...times].sort().reverse()).toEqual(times);
    // The newest event is the contact added last in beforeAll (sign-ins came earlier).
    expect(result.items[0]).toMatchObject({
      action: 'contact.create',
      clientId: first.id,
      clientPseudonym: 'A. Auditfirst',
      actorId: cast.owner.id,
    });
    expect(result.total).toBe(result.items.length);
  });

  it('filters by client, by user, by exact action and by action prefix', async () => {
    const byClient = await page(`?clientId=${first.id}`);
    expect(byClient.items.map((i) => i.action).sort()).toEqual(
      ['assignment.create', 'client.create', 'consent.create', 'contact.create'].sort(),
    );
    const byUser = await page(`?userId=${cast.otherClinician.id}`);
    expect(byUser.items.map((i) => i.action).sort()).toEqual(['auth.sign-in', 'client.create']);
    expect(byUser.items.find((i) => i.action === 'client.create')?.clientPseudonym).toBe('B. Auditsecond');
    const exact = await page('?action=client.create');
    expect(exact.items.map((i) => i.clientId).sort()).toEqual([first.id, second.id].sort());
    const prefix = await page('?action=auth.');
    expect(prefix.total).toBe(6); // the six sign-ins of the cast
    expect(prefix.items.every((i) => i.action.startsWith('auth.'))).toBe(true);
    // A prefix's "_" or "%" is taken literally, not as a LIKE wildcard.
    expect((await page('?action=a%25.')).total).toBe(0);
    expect((await page(`?clientId=${randomUUID()}`)).total).toBe(0);
  });

  it('filters by days, both ends included', async () => {
    const today = new Date();
    const day = (offset: number) => {
      const d = new Date(today.getFullYear(), today.getMonth(), today.getDate() + offset);
      return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`;
    };
    const all = (await page('')).total;
    expect((await page(`?from=${day(0)}&to=${day(0)}`)).total).toBe(all);
    expect((await page(`?to=${day(-1)}`)).total).toBe(0);
    expect((await page(`?from=${day(1)}`)).total).toBe(0);
  });

  it('pages through the events without gaps or repeats', async () => {
    const all = await page('?pageSize=200');
    const seen: string[] = [];
    for (let n = 1; n <= Math.ceil(all.total / 3); n += 1) {
      const part = await page(`?page=${n}&pageSize=3`);
      expect(part).toMatchObject({ page: n, pageSize: 3, total: all.total });
      seen.push(...part.items.map((i) => i.id));
    }
    expect(seen).toEqual(all.items.map((i) => i.id));
  });

  it.each([
    ['a clientId that is not a uuid', '?clientId=abc'],
    ['a page below 1', '?page=0'],
    ['a page size above 200', '?pageSize=500'],
    ['a date that is not a date', '?from=yesterday'],
  ])('answers 400 for %s', async (_name, query) => {
    const res = await send(t.http, cast.supervisor, 'get', `/api/audit${query}`).expect(400);
    expect(res.body.issues.length).toBeGreaterThan(0);
  });

  it('holds no free text of the client: the contact’s name, address and relationship stay out', async () => {
    const log = JSON.stringify(await page(`?clientId=${first.id}&pageSize=200`, 'admin'));
    expect(log).toContain('contact.create');
    expect(log).not.toMatch(/Nell|nell@family|niece/);
  });

  it('the scrub migration removes client text from stored events, keeps the rest and the lock', async () => {
    // Events as earlier versions wrote them (inserting is allowed; changing is not).
    const insert = async (clientId: string | null, action: string, details: object) =>
      (
        await t.dataSource.query<{ id: string }[]>(
          `INSERT INTO audit_events (action, client_id, details) VALUES ($1, $2, $3) RETURNING id`,
          [action, clientId, JSON.stringify(details)],
        )
      )[0].id;
    const phrase = await insert(first.id, 'practice-phrase.create', {
      text: 'my brother Tom is in ward nine',
    });
    const signOff = await insert(first.id, 'profile.sign-off', { comment: 'Typed to Tom at lunch.' });
    const upload = await insert(first.id, 'sample.upload', {
      fileName: 'Tom letters.txt',
      sha256: 'ab12',
      byteSize: 40,
    });
    const withdrawal = await insert(first.id, 'sample.delete', { reason: 'consent withdrawn', count: 2 });
    const signIn = await insert(null, 'auth.sign-in-failed', { reason: 'wrong-password' });

    const runner = t.dataSource.createQueryRunner();
    try {
      await runner.startTransaction();
      await new ScrubClientTextFromAudit1764910000001().up(runner);
      await runner.commitTransaction();
    } finally {
      await runner.release();
    }

    const details = async (id: string) =>
      (
        await t.dataSource.query<{ details: object }[]>(`SELECT details FROM audit_events WHERE id = $1`, [
          id,
        ])
      )[0].details;
    expect(await details(phrase)).toEqual({});
    expect(await details(signOff)).toEqual({});
    expect(await details(upload)).toEqual({ sha256: 'ab12', byteSize: 40 });
    expect(await details(withdrawal)).toEqual({ cause: 'consent-withdrawn', count: 2 });
    expect(await details(signIn)).toEqual({ reason: 'wrong-password' });
    // The log is append-only again afterwards.
    await expect(
      t.dataSource.query(`UPDATE audit_events SET details = '{}' WHERE id = $1`, [signIn]),
    ).rejects.toThrow(/append-only/);
  });

  it('offers no route that changes or deletes an event', async () => {
    const [event] = (await page('?pageSize=1')).items;
    for (const method of ['patch', 'delete', 'put'] as const) {
      const res = await send(t.http, cast.admin, method, `/api/audit/${event.id}`, {});
      expect(res.status).toBe(404);
    }
  });
});
