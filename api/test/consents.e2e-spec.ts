import type { Client, Consent, Contact, WithdrawalPreview } from '@keyloom/shared';
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
    hooks.register('testDerived', {
      scope: 'training',
      count: async (clientId, manager) => {
        const rows = await manager.query<{ n: number }[]>(
          `SELECT count(*)::int AS n FROM test_derived WHERE client_id = $1`,
          [clientId],
        );
        return rows[0].n;
      },
      remove: async (clientId, manager) => {
        if (clientId === FAILING_HOOK_CLIENT) throw new Error('hook failed on purpose');
        await manager.query(`DELETE FROM test_derived WHERE client_id = $1`, [clientId]);
      },
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
        const preview = await send(t.http, cast[who], 'get', `${base}/withdrawal-preview`);
        statuses.push(put.status, withdraw.status, preview.status);
      }
      // other clinician, supervisor, assigned carer, unassigned carer, admin, no session — each PUT,
      // POST withdraw, GET withdrawal-preview.
      expect(statuses).toEqual([
        404, 404, 404, 403, 403, 403, 403, 403, 403, 403, 403, 403, 403, 403, 403, 401, 401, 401,
      ]);
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
      expect(event.details).toMatchObject({ mimeType: 'application/pdf', byteSize: PDF.length });
      expect(event.details.sha256).toMatch(/^[0-9a-f]{64}$/);
      // The file name may name the client: the log keeps the hash and size only.
      expect(JSON.stringify(event.details)).not.toContain('signed form');
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

    /** A client with two consents of the given scopes, two samples and two test_derived rows. */
    const clientWithTwoConsents = async (
      pseudonym: string,
      first: ('training' | 'summaries')[],
      second: ('training' | 'summaries')[],
    ) => {
      const target = await newClient(t.http, cast.owner, undefined, pseudonym);
      const consents: Consent[] = [];
      for (const [scopes, givenOn] of [
        [first, '2026-09-14'],
        [second, '2026-10-01'],
      ] as const) {
        const res = await send(t.http, cast.owner, 'post', `/api/clients/${target.id}/consents`, {
          givenBy: 'client',
          scopes,
          givenOn,
        }).expect(201);
        consents.push(res.body as Consent);
      }
      await t.dataSource.query(`INSERT INTO test_derived VALUES ($1), ($1)`, [target.id]);
      for (const title of ['Club message', 'Diary']) {
        await send(t.http, cast.owner, 'post', `/api/clients/${target.id}/samples`, {
          sourceKind: 'messages',
          title,
          text: `${title} of ${pseudonym}: the ferry was late again, so we walked along the pier.`,
        }).expect(201);
      }
      return { target, consents };
    };
    const samplesOf = async (clientId: string) =>
      ((await send(t.http, cast.owner, 'get', `/api/clients/${clientId}`).expect(200)).body as Client)
        .sampleCount;
    const derivedOf = async (clientId: string) =>
      (
        await t.dataSource.query<{ n: number }[]>(
          `SELECT count(*)::int AS n FROM test_derived WHERE client_id = $1`,
          [clientId],
        )
      )[0].n;
    const withdraw = (clientId: string, consentId: string, reason: string) =>
      send(t.http, cast.owner, 'post', `/api/clients/${clientId}/consents/${consentId}/withdraw`, { reason });
    const preview = async (clientId: string, consentId: string) =>
      (
        await send(
          t.http,
          cast.owner,
          'get',
          `/api/clients/${clientId}/consents/${consentId}/withdrawal-preview`,
        ).expect(200)
      ).body as WithdrawalPreview;

    it('withdrawing a summaries-only consent deletes nothing while a training consent stands', async () => {
      const { target, consents } = await clientWithTwoConsents(
        'S. Summariesonly',
        ['training'],
        ['summaries'],
      );
      const [training, summaries] = consents;

      const before = await preview(target.id, summaries.id);
      expect(before.report).toMatchObject({ samplesDeleted: 0, derived: { testDerived: 0 }, keptScopes: [] });
      expect(before.scopes).toEqual([{ scope: 'summaries', coveredBy: [] }]);

      const res = await withdraw(target.id, summaries.id, 'family asked to stop e-mails').expect(200);
      const report = (res.body as Consent).withdrawal;
      expect(report?.samplesDeleted).toBe(0);
      expect(Object.values(report?.derived ?? { none: 1 }).every((n) => n === 0)).toBe(true);
      expect(report).toEqual(before.report);
      expect(await samplesOf(target.id)).toBe(2);
      expect(await derivedOf(target.id)).toBe(2);
      const summary = (await send(t.http, cast.owner, 'get', `/api/clients/${target.id}`).expect(200))
        .body as Client;
      expect(summary).toMatchObject({ consentStatus: 'active', trainingConsent: true });

      // Withdrawing the training consent now releases training: everything goes, each kind counted.
      const last = await preview(target.id, training.id);
      expect(last.report).toMatchObject({ samplesDeleted: 2, derived: { testDerived: 2 } });
      const done = await withdraw(target.id, training.id, 'client asked').expect(200);
      expect((done.body as Consent).withdrawal).toEqual(last.report);
      expect(await samplesOf(target.id)).toBe(0);
      expect(await derivedOf(target.id)).toBe(0);
    });

    it('withdrawing one of two training consents deletes nothing, and the preview names the other', async () => {
      const { target, consents } = await clientWithTwoConsents('T. Twotraining', ['training'], ['training']);
      const [older, newer] = consents;
      const before = await preview(target.id, newer.id);
      expect(before.report).toMatchObject({
        samplesDeleted: 0,
        derived: { testDerived: 0 },
        keptScopes: ['training'],
      });
      expect(before.scopes).toEqual([
        { scope: 'training', coveredBy: [{ id: older.id, givenOn: '2026-09-14', expiresOn: null }] },
      ]);
      const res = await withdraw(target.id, newer.id, 'duplicate form').expect(200);
      expect((res.body as Consent).withdrawal).toMatchObject({ samplesDeleted: 0, keptScopes: ['training'] });
      expect(await samplesOf(target.id)).toBe(2);
      expect(await derivedOf(target.id)).toBe(2);
      // The preview of a withdrawn consent: 409, like a second withdrawal.
      await send(
        t.http,
        cast.owner,
        'get',
        `/api/clients/${target.id}/consents/${newer.id}/withdrawal-preview`,
      ).expect(409);
    });

    it('a training consent that expired or is given only in the future keeps nothing', async () => {
      const { target, consents } = await clientWithTwoConsents('E. Expiredother', ['training'], ['training']);
      const [older, newer] = consents;
      // Records made directly: the API refuses a future givenOn, and time cannot pass in a test.
      const today = todayIso();
      await t.dataSource.query(`UPDATE consents SET expires_on = '2026-09-20' WHERE id = $1`, [older.id]);
      const future = `${Number(today.slice(0, 4)) + 1}${today.slice(4)}`;
      await t.dataSource.query(
        `INSERT INTO consents (client_id, given_by, scopes, given_on, recorded_by_id)
         VALUES ($1, 'client', ARRAY['training'], $2, $3)`,
        [target.id, future, cast.owner.id],
      );
      const res = await withdraw(target.id, newer.id, 'client asked').expect(200);
      expect((res.body as Consent).withdrawal).toMatchObject({
        samplesDeleted: 2,
        derived: { testDerived: 2 },
      });
      expect(await samplesOf(target.id)).toBe(0);
    });

    it('two withdrawals of the two training consents at once: one deletes everything, once', async () => {
      const { target, consents } = await clientWithTwoConsents('C. Concurrent', ['training'], ['training']);
      const results = await Promise.all(
        consents.map((consent) => withdraw(target.id, consent.id, 'client asked')),
      );
      expect(results.map((r) => r.status)).toEqual([200, 200]);
      const deleted = results.map((r) => (r.body as Consent).withdrawal?.samplesDeleted).sort();
      expect(deleted).toEqual([0, 2]);
      expect(await samplesOf(target.id)).toBe(0);
      expect(await derivedOf(target.id)).toBe(0);
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
    it('adds and changes a contact, audits its consent but not the address, name or relationship', async () => {
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
      expect(events[0].details).toEqual({ consentToSummaries: false });
      expect(JSON.stringify(events)).not.toMatch(/family\.example|mother|Marguerite/);
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
