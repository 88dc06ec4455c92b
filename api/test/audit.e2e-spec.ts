import { AUDIT_DATE_RANGE_MESSAGE, auditActionLabels, type AuditPage, type Client } from '@keyloom/shared';
import { randomUUID } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import request from 'supertest';
import { ScrubClientTextFromAudit1764910000001 } from '../src/migrations/1764910000001-scrub-client-text-from-audit';
import { type Cast, newCast, newClient, newConsent, send } from './caseload-helpers';
import { newUser } from './factories';
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

  it('answers 400 for a reversed date range, with the shared message on the "to" field', async () => {
    for (const path of ['/api/audit', '/api/audit.csv']) {
      const res = await send(t.http, cast.supervisor, 'get', `${path}?from=2026-09-15&to=2026-09-14`).expect(
        400,
      );
      expect(res.body.issues).toEqual([{ path: 'to', message: AUDIT_DATE_RANGE_MESSAGE }]);
    }
    // One day, both ends the same, is a valid range.
    await send(t.http, cast.supervisor, 'get', '/api/audit?from=2026-09-15&to=2026-09-15').expect(200);
  });

  it('says a role change in plain words, with names instead of ids', async () => {
    const sam = await newUser(t.dataSource, { name: 'Sam Okafor', role: 'carer' });
    await send(t.http, cast.admin, 'patch', `/api/users/${sam.id}`, { role: 'clinician' }).expect(200);
    const [event] = (await page('?action=user.update')).items;
    expect(event).toMatchObject({ subjectId: sam.id, actorName: 'admin' });
    expect(event.sentence).toBe('admin changed Sam Okafor’s role from carer to clinician');
    const assigned = (await page(`?action=assignment.create&clientId=${first.id}`)).items[0];
    expect(assigned.sentence).toBe('clinician owner assigned assigned carer as carer of A. Auditfirst');
  });

  // CSV read back with csv-parse (an npm package independent of papaparse, which writes it).
  const csvRows = async (query: string, who: keyof Cast = 'supervisor') => {
    const res = await send(t.http, cast[who], 'get', `/api/audit.csv${query}`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toBe('attachment; filename="audit-log.csv"');
    return parse<Record<string, string>>(res.text, { bom: true, columns: true });
  };

  it('exports exactly the filtered events as CSV, every page, in the same words', async () => {
    const filtered = await page(`?clientId=${first.id}&pageSize=200`);
    const rows = await csvRows(`?clientId=${first.id}`);
    expect(Object.keys(rows[0])).toEqual(['time', 'person', 'role', 'action', 'sentence', 'client']);
    expect(rows.map((r) => r.time)).toEqual(filtered.items.map((i) => i.at));
    expect(rows.map((r) => r.sentence)).toEqual(filtered.items.map((i) => i.sentence));
    expect(new Set(rows.map((r) => r.client))).toEqual(new Set(['A. Auditfirst']));
    // Not only the first page: the export of everything has as many rows as the log has events.
    const all = await page('?pageSize=1');
    expect(await csvRows('')).toHaveLength(all.total);
    const roleChange = (await csvRows('?action=user.update', 'admin'))[0];
    expect(roleChange).toMatchObject({
      person: 'admin',
      role: 'admin',
      action: auditActionLabels['user.update'],
      sentence: 'admin changed Sam Okafor’s role from carer to clinician',
    });
  });

  it('keeps a cell that a spreadsheet would run as a formula as text (OWASP, CSV Injection)', async () => {
    // A name a spreadsheet would run; an event of that person inserted as the log stores it.
    const plotter = await newUser(t.dataSource, { name: '=HYPERLINK("http://x.example")', role: 'carer' });
    await t.dataSource.query(`INSERT INTO audit_events (actor_id, actor_email, action) VALUES ($1, $2, $3)`, [
      plotter.id,
      plotter.email,
      'auth.sign-in',
    ]);
    const [row] = await csvRows(`?userId=${plotter.id}`);
    expect(row.person).toBe(`'=HYPERLINK("http://x.example")`);
    expect(row.sentence).toBe(`'=HYPERLINK("http://x.example"): ${auditActionLabels['auth.sign-in']}`);
  });

  it('gives the CSV to supervisors and admins only', async () => {
    for (const who of ['owner', 'assignedCarer'] as const) {
      await send(t.http, cast[who], 'get', '/api/audit.csv').expect(403);
    }
    await request(t.http).get('/api/audit.csv').expect(401);
  });

  it('offers no route that changes or deletes an event', async () => {
    const [event] = (await page('?pageSize=1')).items;
    for (const method of ['patch', 'delete', 'put'] as const) {
      const res = await send(t.http, cast.admin, method, `/api/audit/${event.id}`, {});
      expect(res.status).toBe(404);
    }
  });
});
