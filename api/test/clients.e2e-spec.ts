import type { Assignment, Client, ClientSummary } from '@keyloom/shared';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { validateEnv } from '../src/config/env.schema';
import { demoClientStep, findDemoClient } from '../src/db/seeds/demo-client.seed';
import { demoStaffStep } from '../src/db/seeds/demo-staff.seed';
import { type Cast, castOrder, newCast, newClient, newConsent, send } from './caseload-helpers';
import { newUser, signIn } from './factories';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

describe('clients and assignments (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;
  let client: Client;

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    cast = await newCast(t.http, t.dataSource);
    client = await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Testley');
  });
  afterAll(async () => {
    await t.app.close();
  });

  it('has a schema that matches the entities (the migration is complete)', async () => {
    const pending = await t.dataSource.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((query) => query.query)).toEqual([]);
  });

  describe('who may call which route (role × route)', () => {
    // Expected status per caller, in castOrder:
    // owner, other clinician, supervisor, assigned carer, unassigned carer, admin, no session.
    const table: Array<
      [string, 'get' | 'post' | 'patch' | 'delete', (id: string) => string, object | undefined, number[]]
    > = [
      [
        'GET /clients/:id',
        'get',
        (id) => `/api/clients/${id}`,
        undefined,
        [200, 404, 200, 200, 404, 403, 401],
      ],
      [
        'PATCH /clients/:id',
        'patch',
        (id) => `/api/clients/${id}`,
        { keyTimeMs: 1500 },
        [200, 404, 403, 403, 403, 403, 401],
      ],
      [
        'GET /clients/:id/assignments',
        'get',
        (id) => `/api/clients/${id}/assignments`,
        undefined,
        [200, 404, 200, 200, 404, 200, 401],
      ],
      [
        'GET /clients/:id/carers-available',
        'get',
        (id) => `/api/clients/${id}/carers-available`,
        undefined,
        [200, 404, 403, 403, 403, 200, 401],
      ],
      [
        'POST /clients/:id/assignments (already assigned)',
        'post',
        (id) => `/api/clients/${id}/assignments`,
        undefined,
        [409, 404, 403, 403, 403, 409, 401],
      ],
    ];

    it.each(table)('%s', async (_name, method, path, body, expected) => {
      const assignBody = { userId: cast.assignedCarer.id };
      const statuses: number[] = [];
      for (const who of castOrder) {
        const res = await send(
          t.http,
          cast[who],
          method,
          path(client.id),
          body ?? (method === 'post' ? assignBody : undefined),
        );
        statuses.push(res.status);
        if (res.status === 404)
          expect(res.body.message).toBe('There is no client with that id in your caseload.');
        if (res.status === 403) expect(res.body.message).toBe('Your role does not allow this.');
      }
      expect(statuses).toEqual(expected);
    });

    it('answers a made-up id with the same 404 as another clinician’s client', async () => {
      const made = await send(t.http, cast.owner, 'get', `/api/clients/${randomUUID()}`).expect(404);
      const foreign = await send(t.http, cast.otherClinician, 'get', `/api/clients/${client.id}`).expect(404);
      expect(made.body).toEqual(foreign.body);
      await send(t.http, cast.supervisor, 'get', `/api/clients/${randomUUID()}/assignments`).expect(404);
      await send(t.http, cast.owner, 'get', '/api/clients/not-a-uuid').expect(400);
    });

    it('creates clients for clinicians only', async () => {
      const body = { pseudonym: 'Q. Nobody', accessMethod: 'direct' };
      for (const who of ['supervisor', 'assignedCarer', 'admin'] as const) {
        await send(t.http, cast[who], 'post', '/api/clients', body).expect(403);
      }
      await request(t.http).post('/api/clients').send(body).expect(401);
    });
  });

  describe('the caseload list', () => {
    it('shows each role only what it may see', async () => {
      const mine = await newClient(t.http, cast.otherClinician, undefined, 'B. Otherlist');
      const ids = async (who: keyof Cast) =>
        ((await send(t.http, cast[who], 'get', '/api/clients').expect(200)).body as ClientSummary[]).map(
          (c) => c.id,
        );
      expect(await ids('owner')).toEqual([client.id]);
      expect(await ids('otherClinician')).toEqual([mine.id]);
      expect(await ids('assignedCarer')).toEqual([client.id]);
      expect(await ids('unassignedCarer')).toEqual([]);
      expect((await ids('supervisor')).sort()).toEqual([client.id, mine.id].sort());
      expect((await ids('admin')).sort()).toEqual([client.id, mine.id].sort());
      await request(t.http).get('/api/clients').expect(401);
    });

    it('gives admins summaries without goals or notes, and carers the goals but not the notes', async () => {
      const rows = (await send(t.http, cast.admin, 'get', '/api/clients').expect(200))
        .body as ClientSummary[];
      const row = rows.find((c) => c.id === client.id)!;
      expect(row).not.toHaveProperty('goals');
      expect(row).not.toHaveProperty('notes');
      expect(row.carers).toEqual([{ id: cast.assignedCarer.id, name: 'assigned carer' }]);
      expect(row.clinician).toEqual({ id: cast.owner.id, name: 'clinician owner' });
      const carerView = (
        await send(t.http, cast.assignedCarer, 'get', `/api/clients/${client.id}`).expect(200)
      ).body as Client;
      expect(carerView.goals).toBe('Order at the café on his own.');
      expect(carerView.notes).toBeNull();
      const ownerView = (await send(t.http, cast.owner, 'get', `/api/clients/${client.id}`).expect(200))
        .body as Client;
      expect(ownerView.notes).toBe('Tires after twenty minutes.');
    });

    it('computes the consent flags from the consent records', async () => {
      const fresh = await newClient(t.http, cast.owner, undefined, 'C. Consentless');
      expect(fresh).toMatchObject({
        consentStatus: 'none',
        trainingConsent: false,
        summariesConsent: false,
        sampleCount: 0,
      });
      await newConsent(t.http, cast.owner, fresh.id);
      const after = (await send(t.http, cast.owner, 'get', `/api/clients/${fresh.id}`).expect(200))
        .body as Client;
      expect(after).toMatchObject({ consentStatus: 'active', trainingConsent: true, summariesConsent: true });
    });
  });

  describe('creating and changing a client', () => {
    it('creates a client owned by the caller, 201, and audits it without goals or notes', async () => {
      const res = await send(t.http, cast.owner, 'post', '/api/clients', {
        pseudonym: '  M. Gale  ',
        accessMethod: 'eye_gaze',
        dwellMs: 700,
        goals: 'Tell jokes at dinner.',
        notes: '',
      }).expect(201);
      const created = res.body as Client;
      expect(created).toMatchObject({
        pseudonym: 'M. Gale',
        accessMethod: 'eye_gaze',
        dwellMs: 700,
        scanIntervalMs: null,
        notes: null,
        clinician: { id: cast.owner.id },
        carers: [],
      });
      const [event] = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'client.create', clientId: created.id });
      expect(event).toMatchObject({ actorId: cast.owner.id, subjectType: 'client', subjectId: created.id });
      expect(JSON.stringify(event.details)).not.toContain('jokes');
    });

    it('changes only the given fields and audits their names', async () => {
      const res = await send(t.http, cast.owner, 'patch', `/api/clients/${client.id}`, {
        accessMethod: 'head_pointer',
        keyTimeMs: 1800,
        notes: 'Prefers mornings.',
      }).expect(200);
      expect(res.body).toMatchObject({
        accessMethod: 'head_pointer',
        keyTimeMs: 1800,
        notes: 'Prefers mornings.',
        goals: 'Order at the café on his own.',
      });
      const events = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'client.update', clientId: client.id });
      const last = events.find((e) => JSON.stringify(e.details).includes('accessMethod'))!;
      expect((last.details.fields as string[]).sort()).toEqual(['accessMethod', 'keyTimeMs', 'notes']);
      expect(JSON.stringify(last.details)).not.toContain('mornings');
    });

    it.each([
      ['no pseudonym', { accessMethod: 'direct' }, 'pseudonym'],
      ['an unknown access method', { pseudonym: 'X', accessMethod: 'telepathy' }, 'accessMethod'],
      [
        'a scan interval below 100 ms',
        { pseudonym: 'X', accessMethod: 'switch', scanIntervalMs: 20 },
        'scanIntervalMs',
      ],
    ])('answers 400 for %s', async (_name, body, field) => {
      const res = await send(t.http, cast.owner, 'post', '/api/clients', body).expect(400);
      expect((res.body.issues as { path: string }[]).map((i) => i.path)).toContain(field);
    });

    it('keeps a preferred name beside the pseudonym: set, trimmed, cleared, audited by field name only, never shown to carers or in lists', async () => {
      const created = (
        await send(t.http, cast.owner, 'post', '/api/clients', {
          pseudonym: 'P. Quennell',
          preferredName: '  Pip  ',
          accessMethod: 'direct',
        }).expect(201)
      ).body as Client;
      expect(created).toMatchObject({ pseudonym: 'P. Quennell', preferredName: 'Pip' });
      await send(t.http, cast.owner, 'post', `/api/clients/${created.id}/assignments`, {
        userId: cast.assignedCarer.id,
      }).expect(201);

      const renamed = await send(t.http, cast.owner, 'patch', `/api/clients/${created.id}`, {
        preferredName: 'Pippa',
      }).expect(200);
      expect(renamed.body).toMatchObject({ pseudonym: 'P. Quennell', preferredName: 'Pippa' });
      const events = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'client.update', clientId: created.id });
      expect(events.map((event) => event.details)).toEqual([{ fields: ['preferredName'] }]);
      expect(JSON.stringify(events)).not.toContain('Pippa');

      const seenBy = async (who: keyof Cast) =>
        ((await send(t.http, cast[who], 'get', `/api/clients/${created.id}`).expect(200)).body as Client)
          .preferredName;
      expect(await seenBy('owner')).toBe('Pippa');
      expect(await seenBy('supervisor')).toBe('Pippa');
      // Carers see what they need to work with the client, not the family's name for them.
      expect(await seenBy('assignedCarer')).toBeNull();
      for (const who of ['owner', 'assignedCarer', 'admin'] as const) {
        const rows = (await send(t.http, cast[who], 'get', '/api/clients').expect(200))
          .body as ClientSummary[];
        expect(JSON.stringify(rows)).not.toContain('Pippa');
      }

      // An empty field clears it; too long or a control character is refused with the field named.
      const cleared = await send(t.http, cast.owner, 'patch', `/api/clients/${created.id}`, {
        preferredName: '',
      }).expect(200);
      expect(cleared.body.preferredName).toBeNull();
      for (const preferredName of ['x'.repeat(81), 'Pip\u0000', 'Pip\npa']) {
        const res = await send(t.http, cast.owner, 'patch', `/api/clients/${created.id}`, {
          preferredName,
        }).expect(400);
        expect((res.body.issues as { path: string }[]).map((i) => i.path)).toEqual(['preferredName']);
      }
      expect(await seenBy('owner')).toBeNull();
    });

    it('answers 400 to an empty PATCH', async () => {
      const res = await send(t.http, cast.owner, 'patch', `/api/clients/${client.id}`, {}).expect(400);
      expect(res.body.issues[0].message).toBe('Nothing to change.');
    });
  });

  describe('assignments', () => {
    it('lets the owner and an admin assign and remove carers, with audit events', async () => {
      const target = await newClient(t.http, cast.owner, undefined, 'A. Assignable');
      const carer = await newUser(t.dataSource, { role: 'carer', name: 'Aaron Carer' });

      const offered = (
        await send(t.http, cast.admin, 'get', `/api/clients/${target.id}/carers-available`).expect(200)
      ).body as { id: string }[];
      expect(offered.map((c) => c.id)).toEqual(expect.arrayContaining([carer.id, cast.assignedCarer.id]));

      const created = (
        await send(t.http, cast.admin, 'post', `/api/clients/${target.id}/assignments`, {
          userId: carer.id,
        }).expect(201)
      ).body as Assignment;
      expect(created).toMatchObject({ userId: carer.id, name: 'Aaron Carer', assignedBy: 'admin' });
      const after = (
        await send(t.http, cast.owner, 'get', `/api/clients/${target.id}/carers-available`).expect(200)
      ).body as { id: string }[];
      expect(after.map((c) => c.id)).not.toContain(carer.id);

      await send(t.http, cast.owner, 'delete', `/api/clients/${target.id}/assignments/${carer.id}`).expect(
        204,
      );
      await send(t.http, cast.owner, 'delete', `/api/clients/${target.id}/assignments/${carer.id}`).expect(
        404,
      );
      const list = (
        await send(t.http, cast.owner, 'get', `/api/clients/${target.id}/assignments`).expect(200)
      ).body as Assignment[];
      expect(list).toEqual([]);

      const events = await t.dataSource
        .getRepository(AuditEvent)
        .find({ where: { clientId: target.id }, order: { at: 'ASC' } });
      expect(events.map((e) => e.action)).toEqual([
        'client.create',
        'assignment.create',
        'assignment.delete',
      ]);
      expect(events[1]).toMatchObject({ actorId: cast.admin.id, subjectId: carer.id });
    });

    it('refuses a non-carer, an inactive carer and a made-up user with 400 "Choose an active carer."', async () => {
      const inactive = await newUser(t.dataSource, { role: 'carer', active: false });
      for (const userId of [cast.supervisor.id, inactive.id, randomUUID()]) {
        const res = await send(t.http, cast.owner, 'post', `/api/clients/${client.id}/assignments`, {
          userId,
        }).expect(400);
        expect(res.body.message).toBe('Choose an active carer.');
      }
      await send(t.http, cast.owner, 'post', `/api/clients/${client.id}/assignments`, { userId: 'x' }).expect(
        400,
      );
    });

    it('stops a carer seeing a client once the assignment is removed', async () => {
      const carer = await newUser(t.dataSource, { role: 'carer' });
      const target = await newClient(
        t.http,
        cast.owner,
        { ...cast.assignedCarer, id: carer.id },
        'D. Unassigned',
      );
      const session = await signIn(t.http, carer);
      await session.agent.get(`/api/clients/${target.id}`).expect(200);
      await send(t.http, cast.owner, 'delete', `/api/clients/${target.id}/assignments/${carer.id}`).expect(
        204,
      );
      await session.agent.get(`/api/clients/${target.id}`).expect(404);
    });
  });

  it('documents every caseload route in the OpenAPI document, with request bodies', async () => {
    type Operation = {
      summary?: string;
      requestBody?: { content: Record<string, { schema: { properties?: object } }> };
    };
    const doc = (await request(t.http).get('/api/docs-json').expect(200)).body as {
      paths: Record<string, Record<string, Operation>>;
    };
    const expected: Array<[string, string[]]> = [
      ['/api/clients', ['get', 'post']],
      ['/api/clients/{id}', ['get', 'patch']],
      ['/api/clients/{id}/assignments', ['get', 'post']],
      ['/api/clients/{id}/assignments/{userId}', ['delete']],
      ['/api/clients/{id}/carers-available', ['get']],
      ['/api/clients/{id}/consents', ['get', 'post']],
      ['/api/clients/{id}/consents/{consentId}/withdraw', ['post']],
      ['/api/clients/{id}/consents/{consentId}/withdrawal-preview', ['get']],
      ['/api/clients/{id}/consents/{consentId}/document', ['get', 'put']],
      ['/api/clients/{id}/contacts', ['get', 'post']],
      ['/api/clients/{id}/contacts/{contactId}', ['patch']],
      ['/api/audit', ['get']],
    ];
    for (const [path, methods] of expected) {
      for (const method of methods) {
        const operation = doc.paths[path]?.[method];
        expect({ path, method, summary: operation?.summary }).toEqual({
          path,
          method,
          summary: expect.any(String),
        });
        if (method === 'post' || method === 'patch') {
          const body = operation?.requestBody?.content['application/json']?.schema;
          expect({ path, method, properties: body?.properties }).toEqual({
            path,
            method,
            properties: expect.any(Object),
          });
        }
      }
    }
    expect(
      doc.paths['/api/clients']?.post?.requestBody?.content['application/json']?.schema.properties,
    ).toHaveProperty('accessMethod');
  });

  describe('demo seed', () => {
    it('adds R. Ashby with carer, consent and contacts, and changes nothing the second time', async () => {
      const run = () =>
        t.dataSource.transaction(async (manager) => {
          for (const step of [demoStaffStep, demoClientStep]) {
            await step.run({
              manager,
              env: validateEnv(process.env),
              resetPasswords: false,
              log: () => undefined,
            });
          }
        });
      await run();
      const count = async () => {
        const [row] = await t.dataSource.query<{ n: string }[]>(`SELECT
          (SELECT count(*) FROM clients) + (SELECT count(*) FROM client_assignments) +
          (SELECT count(*) FROM consents) + (SELECT count(*) FROM family_contacts) +
          (SELECT count(*) FROM audit_events) AS n`);
        return Number(row.n);
      };
      const before = await count();
      await run();
      expect(await count()).toBe(before);

      const demo = await findDemoClient(t.dataSource.manager);
      expect(demo).toMatchObject({ accessMethod: 'head_pointer', keyTimeMs: 1800, preferredName: 'Robbie' });
      const carer = await signIn(t.http, {
        email: 'carer@willowmere.example',
        password: validateEnv(process.env).DEMO_PASSWORD,
      });
      const seen = (await carer.agent.get('/api/clients').expect(200)).body as ClientSummary[];
      expect(seen).toEqual([
        expect.objectContaining({
          pseudonym: 'R. Ashby',
          consentStatus: 'active',
          trainingConsent: true,
          summariesConsent: true,
        }),
      ]);
      const contacts = await t.dataSource.query<{ name: string; consent_to_summaries: boolean }[]>(
        `SELECT name, consent_to_summaries FROM family_contacts WHERE client_id = $1 ORDER BY name`,
        [demo!.id],
      );
      expect(contacts).toEqual([
        { name: 'Hannah Ashby', consent_to_summaries: true },
        { name: 'Marguerite Ashby', consent_to_summaries: false },
      ]);
    });
  });
});
