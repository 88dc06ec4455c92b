import type { Client, Consent, Contact } from '@keyloom/shared';
import { randomUUID } from 'node:crypto';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { todayIso } from '../src/consents/consent-status';
import { WithdrawalHooks } from '../src/consents/withdrawal-hooks';
import { type Cast, castOrder, newCast, newClient, newConsent, send } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

// A PDF header (ISO 32000-1 §7.5.2) is all the magic-byte check needs.
const PDF = Buffer.from('%PDF-1.4\n% consent form of the test client\n%%EOF\n', 'latin1');
const FAILING_HOOK_CLIENT = randomUUID();

describe('consents, withdrawal and family contacts (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;
  let client: Client;
  let consent: Consent;

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    // Something "derived" from the client's writing, deleted by a hook as samples and models will be.
    await t.dataSource.query(`CREATE TABLE test_derived (client_id uuid NOT NULL)`);
    const hooks = t.app.get(WithdrawalHooks);
    hooks.register('testDerived', async (clientId, manager) => {
      if (clientId === FAILING_HOOK_CLIENT) throw new Error('hook failed on purpose');
      const rows = await manager.query<unknown[]>(
        `DELETE FROM test_derived WHERE client_id = $1 RETURNING client_id`,
        [clientId],
      );
      return rows.length;
    });
    cast = await newCast(t.http, t.dataSource);
    client = await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Consentley');
    consent = await newConsent(t.http, cast.owner, client.id);
    await send(t.http, cast.owner, 'put', `/api/clients/${client.id}/consents/${consent.id}/document`)
      .attach('file', PDF, 'signed form.pdf')
      .expect(200);
  });
  afterAll(async () => {
    await t.app.close();
  });

  describe('who may call which route (role × route)', () => {
    // owner, other clinician, supervisor, assigned carer, unassigned carer, admin, no session
    const table: Array<
      [string, 'get' | 'post' | 'patch', (c: string, k: string) => string, object | undefined, number[]]
    > = [
      [
        'GET consents',
        'get',
        (c) => `/api/clients/${c}/consents`,
        undefined,
        [200, 404, 200, 403, 404, 403, 401],
      ],
      [
        'POST consents',
        'post',
        (c) => `/api/clients/${c}/consents`,
        { givenBy: 'client', scopes: ['summaries'], givenOn: '2026-10-01' },
        [201, 404, 403, 403, 403, 403, 401],
      ],
      [
        'GET consent document',
        'get',
        (c, k) => `/api/clients/${c}/consents/${k}/document`,
        undefined,
        [200, 404, 200, 403, 404, 403, 401],
      ],
      [
        'GET contacts',
        'get',
        (c) => `/api/clients/${c}/contacts`,
        undefined,
        [200, 404, 200, 403, 404, 403, 401],
      ],
      [
        'POST contacts',
        'post',
        (c) => `/api/clients/${c}/contacts`,
        { name: 'Iris Vale', relationship: 'aunt', email: 'iris@family.example', consentToSummaries: false },
        [201, 404, 403, 403, 403, 403, 401],
      ],
    ];

    it.each(table)('%s', async (_name, method, path, body, expected) => {
      const statuses: number[] = [];
      for (const who of castOrder) {
        const res = await send(t.http, cast[who], method, path(client.id, consent.id), body);
        statuses.push(res.status);
      }
      expect(statuses).toEqual(expected);
    });

    it('PUT document and POST withdraw: only the owning clinician', async () => {
      const target = await newConsent(t.http, cast.owner, client.id);
      const base = `/api/clients/${client.id}/consents/${target.id}`;
      const statuses: number[] = [];
      for (const who of castOrder.filter((w) => w !== 'owner')) {
        const put = await send(t.http, cast[who], 'put', `${base}/document`).attach('file', PDF, 'x.pdf');
        const withdraw = await send(t.http, cast[who], 'post', `${base}/withdraw`, {
          reason: 'Changed mind.',
        });
        statuses.push(put.status, withdraw.status);
      }
      // other clinician, supervisor, assigned carer, unassigned carer, admin, no session — each PUT, POST.
      expect(statuses).toEqual([404, 404, 403, 403, 403, 403, 403, 403, 403, 403, 401, 401]);
      const after = (await send(t.http, cast.owner, 'get', `/api/clients/${client.id}/consents`).expect(200))
        .body as Consent[];
      expect(after.find((c) => c.id === target.id)).toMatchObject({ status: 'active', document: null });
    });
  });

  describe('recording consent', () => {
    it('records a representative’s consent, 201, with who recorded it, and audits it', async () => {
      const res = await send(t.http, cast.owner, 'post', `/api/clients/${client.id}/consents`, {
        givenBy: 'representative',
        representativeName: 'Hannah Consentley',
        representativeRelationship: 'sister',
        scopes: ['training', 'training'],
        givenOn: '2026-10-02',
        expiresOn: '2027-10-01',
      }).expect(201);
      const created = res.body as Consent;
      expect(created).toMatchObject({
        clientId: client.id,
        scopes: ['training'],
        givenOn: '2026-10-02',
        expiresOn: '2027-10-01',
        status: 'active',
        recordedBy: 'clinician owner',
        withdrawnAt: null,
        withdrawal: null,
        document: null,
      });
      const [event] = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'consent.create', subjectId: created.id });
      expect(event).toMatchObject({ clientId: client.id, actorId: cast.owner.id });
      expect(event.details).toMatchObject({ givenBy: 'representative', scopes: ['training'] });
    });

    it.each([
      [
        'a representative without a name',
        { givenBy: 'representative', scopes: ['training'], givenOn: '2026-10-01' },
        'representativeName',
      ],
      ['no scopes', { givenBy: 'client', scopes: [], givenOn: '2026-10-01' }, 'scopes'],
      [
        'an expiry before the date given',
        { givenBy: 'client', scopes: ['training'], givenOn: '2026-10-01', expiresOn: '2026-09-01' },
        'expiresOn',
      ],
      ['a date that is not a date', { givenBy: 'client', scopes: ['training'], givenOn: '1 Oct' }, 'givenOn'],
      ['a date in the future', { givenBy: 'client', scopes: ['training'], givenOn: '2999-01-01' }, 'givenOn'],
    ])('answers 400 for %s', async (_name, body, field) => {
      const res = await send(t.http, cast.owner, 'post', `/api/clients/${client.id}/consents`, body).expect(
        400,
      );
      expect((res.body.issues as { path: string }[]).map((i) => i.path)).toContain(field);
    });

    it('accepts consent given today', async () => {
      await newConsent(t.http, cast.owner, client.id, todayIso());
    });
  });

  describe('the consent form', () => {
    it('gives the stored bytes back to the owner and the supervisor, as an attachment', async () => {
      const list = (
        await send(t.http, cast.supervisor, 'get', `/api/clients/${client.id}/consents`).expect(200)
      ).body as Consent[];
      expect(list.find((c) => c.id === consent.id)?.document).toEqual({
        fileName: 'signed form.pdf',
        mimeType: 'application/pdf',
        byteSize: PDF.length,
      });
      const res = await send(
        t.http,
        cast.supervisor,
        'get',
        `/api/clients/${client.id}/consents/${consent.id}/document`,
      )
        .buffer(true)
        .parse((response, done) => {
          const chunks: Buffer[] = [];
          response.on('data', (chunk: Buffer) => chunks.push(chunk));
          response.on('end', () => done(null, Buffer.concat(chunks)));
        })
        .expect(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      expect(res.headers['content-disposition']).toContain('attachment');
      expect(Buffer.compare(res.body as Buffer, PDF)).toBe(0);
      const [event] = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'consent.document-upload', subjectId: consent.id });
      expect(event.details).toMatchObject({
        fileName: 'signed form.pdf',
        mimeType: 'application/pdf',
        byteSize: PDF.length,
      });
      expect(event.details.sha256).toMatch(/^[0-9a-f]{64}$/);
    });

    it('refuses what is not a PDF, PNG or JPEG (by its bytes, whatever its name), 400', async () => {
      const res = await send(
        t.http,
        cast.owner,
        'put',
        `/api/clients/${client.id}/consents/${consent.id}/document`,
      )
        .attach('file', Buffer.from('I consent. (typed, not scanned)'), {
          filename: 'form.pdf',
          contentType: 'application/pdf',
        })
        .expect(400);
      expect(res.body.message).toMatch(/PDF, PNG or JPEG/);
    });

    it('refuses a form over 10 MB with 413 and a message that says what to do', async () => {
      const big = Buffer.concat([PDF, Buffer.alloc(10 * 1024 * 1024)]);
      const res = await send(
        t.http,
        cast.owner,
        'put',
        `/api/clients/${client.id}/consents/${consent.id}/document`,
      )
        .attach('file', big, 'huge.pdf')
        .expect(413);
      expect(res.body).toMatchObject({
        statusCode: 413,
        message: expect.stringContaining('larger than 10 MB'),
      });
    });

    it('answers 400 without a file, or with the file in another field', async () => {
      const path = `/api/clients/${client.id}/consents/${consent.id}/document`;
      const none = await send(t.http, cast.owner, 'put', path).field('note', 'x').expect(400);
      expect(none.body.message).toContain('"file"');
      const wrong = await send(t.http, cast.owner, 'put', path).attach('document', PDF, 'x.pdf').expect(400);
      expect(wrong.body.message).toContain('"file"');
    });

    it('answers 404 for a consent of another client, or none', async () => {
      const other = await newClient(t.http, cast.owner, undefined, 'S. Elsewhere');
      await send(
        t.http,
        cast.owner,
        'get',
        `/api/clients/${other.id}/consents/${consent.id}/document`,
      ).expect(404);
      await send(t.http, cast.owner, 'put', `/api/clients/${client.id}/consents/${randomUUID()}/document`)
        .attach('file', PDF, 'x.pdf')
        .expect(404);
    });
  });

  describe('withdrawal', () => {
    it('deletes what the hooks report in one go, keeps the record, and cannot be repeated', async () => {
      const target = await newClient(t.http, cast.owner, undefined, 'W. Withdrawn');
      const given = await newConsent(t.http, cast.owner, target.id);
      await t.dataSource.query(`INSERT INTO test_derived VALUES ($1), ($1), ($2)`, [target.id, client.id]);
      // Two real language samples (G2's samples module registers the 'samples' hook).
      for (const title of ['Club message', 'Diary']) {
        await send(t.http, cast.owner, 'post', `/api/clients/${target.id}/samples`, {
          sourceKind: 'messages',
          title,
          text: `${title}: Pepper and I are going down to the harbour after lunch.`,
        }).expect(201);
      }
      const sampleCount = async () =>
        ((await send(t.http, cast.owner, 'get', `/api/clients/${target.id}`).expect(200)).body as Client)
          .sampleCount;
      expect(await sampleCount()).toBe(2);

      const res = await send(
        t.http,
        cast.owner,
        'post',
        `/api/clients/${target.id}/consents/${given.id}/withdraw`,
        {
          reason: 'The client asked for his writing to be removed.',
        },
      ).expect(200);
      const withdrawn = res.body as Consent;
      expect(withdrawn).toMatchObject({
        status: 'withdrawn',
        withdrawnBy: 'clinician owner',
        withdrawalReason: 'The client asked for his writing to be removed.',
      });
      expect(withdrawn.withdrawnAt).not.toBeNull();
      expect(withdrawn.withdrawal?.derived.testDerived).toBe(2);
      expect(withdrawn.withdrawal?.samplesDeleted).toBe(2);
      expect(await sampleCount()).toBe(0);
      const samples = await send(t.http, cast.owner, 'get', `/api/clients/${target.id}/samples`).expect(200);
      expect(samples.body).toEqual([]);
      // Only this client's rows went.
      const left = await t.dataSource.query<{ client_id: string }[]>(`SELECT client_id FROM test_derived`);
      expect(left).toEqual([{ client_id: client.id }]);

      const again = await send(
        t.http,
        cast.owner,
        'post',
        `/api/clients/${target.id}/consents/${given.id}/withdraw`,
        {
          reason: 'Again.',
        },
      ).expect(409);
      expect(again.body.message).toBe('This consent was already withdrawn.');
      // No route changes a withdrawn consent.
      const put = await send(
        t.http,
        cast.owner,
        'put',
        `/api/clients/${target.id}/consents/${given.id}/document`,
      )
        .attach('file', PDF, 'late.pdf')
        .expect(409);
      expect(put.body.message).toMatch(/withdrawn/);

      const summary = (await send(t.http, cast.owner, 'get', `/api/clients/${target.id}`).expect(200))
        .body as Client;
      expect(summary).toMatchObject({ consentStatus: 'withdrawn', trainingConsent: false });
      const events = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'consent.withdraw', clientId: target.id });
      expect(events).toHaveLength(1);
      expect(events[0].details).toMatchObject({ samplesDeleted: 2, derived: { testDerived: 2 } });
      expect(JSON.stringify(events[0].details)).not.toContain('asked for');
    });

    it('changes nothing when a hook fails (one transaction)', async () => {
      // A client row with the failing hook's id, made directly so the hook can recognise it.
      await t.dataSource.query(
        `INSERT INTO clients (id, pseudonym, access_method, clinician_id) VALUES ($1, 'F. Failing', 'direct', $2)`,
        [FAILING_HOOK_CLIENT, cast.owner.id],
      );
      const given = await newConsent(t.http, cast.owner, FAILING_HOOK_CLIENT);
      await send(
        t.http,
        cast.owner,
        'post',
        `/api/clients/${FAILING_HOOK_CLIENT}/consents/${given.id}/withdraw`,
        {
          reason: 'Test.',
        },
      ).expect(500);
      const list = (
        await send(t.http, cast.owner, 'get', `/api/clients/${FAILING_HOOK_CLIENT}/consents`).expect(200)
      ).body as Consent[];
      expect(list[0]).toMatchObject({ id: given.id, status: 'active', withdrawal: null });
      expect(
        await t.dataSource
          .getRepository(AuditEvent)
          .countBy({ action: 'consent.withdraw', clientId: FAILING_HOOK_CLIENT }),
      ).toBe(0);
    });

    it('answers 400 without a reason and 404 for an unknown consent', async () => {
      const base = `/api/clients/${client.id}/consents`;
      await send(t.http, cast.owner, 'post', `${base}/${consent.id}/withdraw`, { reason: '  ' }).expect(400);
      await send(t.http, cast.owner, 'post', `${base}/${randomUUID()}/withdraw`, { reason: 'x' }).expect(404);
    });
  });

  describe('family contacts', () => {
    it('adds and changes a contact, audits relationship and consent but not the address', async () => {
      const base = `/api/clients/${client.id}/contacts`;
      const created = (
        await send(t.http, cast.owner, 'post', base, {
          name: 'Marguerite Consentley',
          relationship: 'mother',
          email: 'Marguerite@Family.example',
          consentToSummaries: false,
        }).expect(201)
      ).body as Contact;
      expect(created).toMatchObject({
        clientId: client.id,
        email: 'marguerite@family.example',
        consentToSummaries: false,
        unsubscribedAt: null,
      });

      const changed = (
        await send(t.http, cast.owner, 'patch', `${base}/${created.id}`, { consentToSummaries: true }).expect(
          200,
        )
      ).body as Contact;
      expect(changed.consentToSummaries).toBe(true);
      const list = (await send(t.http, cast.supervisor, 'get', base).expect(200)).body as Contact[];
      expect(list.map((c) => c.id)).toContain(created.id);

      const events = await t.dataSource
        .getRepository(AuditEvent)
        .find({ where: { subjectId: created.id }, order: { at: 'ASC' } });
      expect(events.map((e) => e.action)).toEqual(['contact.create', 'contact.update']);
      expect(events[1].details).toEqual({ fields: ['consentToSummaries'], consentToSummaries: true });
      expect(JSON.stringify(events)).not.toContain('family.example');
    });

    it('answers 400 for a bad e-mail or an empty change, 404 for an unknown contact, 403/404 for others', async () => {
      const base = `/api/clients/${client.id}/contacts`;
      const bad = await send(t.http, cast.owner, 'post', base, {
        name: 'X',
        relationship: 'y',
        email: 'not-an-address',
        consentToSummaries: true,
      }).expect(400);
      expect((bad.body.issues as { path: string }[]).map((i) => i.path)).toContain('email');
      const [existing] = (await send(t.http, cast.owner, 'get', base).expect(200)).body as Contact[];
      await send(t.http, cast.owner, 'patch', `${base}/${existing.id}`, {}).expect(400);
      await send(t.http, cast.owner, 'patch', `${base}/${randomUUID()}`, { name: 'Y' }).expect(404);
      await send(t.http, cast.supervisor, 'patch', `${base}/${existing.id}`, { name: 'Y' }).expect(403);
      await send(t.http, cast.otherClinician, 'patch', `${base}/${existing.id}`, { name: 'Y' }).expect(404);
    });
  });
});
