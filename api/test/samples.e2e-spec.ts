// Language samples over HTTP against real PostgreSQL: uploads (multipart and paste), every kind of bad
// input, roles × routes, flag decisions and consent withdrawal. Phone numbers are from Ofcom's
// drama range (07700 900xxx); e-mail domains example.org (RFC 2606). Byte encodings are made with
// Node's Buffer (a general-purpose reference), gzip/PNG/PDF by their published signatures.
import type { Role, SampleDetail, SampleSummary, UploadResult } from '@keyloom/shared';
import { Test } from '@nestjs/testing';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { createHash } from 'node:crypto';
import type { Server } from 'node:http';
import { DataSource } from 'typeorm';
import { AppModule } from '../src/app.module';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { ClientAssignment } from '../src/clients/client-assignment.entity';
import { Client } from '../src/clients/client.entity';
import { AppConfig } from '../src/config/app-config';
import { configureApp } from '../src/configure-app';
import { Consent } from '../src/consents/consent.entity';
import { SampleFlag } from '../src/samples/sample-flag.entity';
import { Sample } from '../src/samples/sample.entity';
import { type Agent, newUser, signIn } from './factories';
import { resetDatabase } from './test-app';
import { validateEnv } from '../src/config/env.schema';
import { seedSteps } from '../src/db/seed-steps';

// Small limits so "too big" and "too many" are cheap to provoke (the defaults are 20 MB, 200 MB, 50).
const LIMITS = { maxFileBytes: 64 * 1024, maxClientBytes: 256 * 1024, maxFiles: 3 };

type Signed = { agent: Agent; csrf: string; id: string };

const diary =
  'Took the dinghy out past the harbour wall with Pepper. Wind was kind. Rang Hannah on 07700 900123 ' +
  'after, and she wants the photos sent to hannah@example.org. Jazz at the club on Friday.\n';
const messages = 'Hannah: are you coming Sunday?\nMe: yes, Pepper too. Bring the scores.\n';

describe('language samples (HTTP)', () => {
  let app: NestExpressApplication;
  let http: Server;
  let dataSource: DataSource;
  let owner: Signed;
  let other: Signed;
  let supervisor: Signed;
  let carer: Signed;
  let admin: Signed;
  let clientId: string;

  async function sign(role: Role): Promise<Signed> {
    const user = await newUser(dataSource, { role, name: `Test ${role}` });
    return { ...(await signIn(http, user)), id: user.id };
  }

  async function newClient(clinicianId: string, consent = true): Promise<string> {
    const client = await dataSource.getRepository(Client).save(
      dataSource.getRepository(Client).create({
        pseudonym: `Client ${Math.random().toString(36).slice(2, 8)}`,
        accessMethod: 'head_pointer',
        clinicianId,
      }),
    );
    if (consent) {
      await dataSource.getRepository(Consent).insert({
        clientId: client.id,
        givenBy: 'client',
        scopes: ['training', 'summaries'],
        givenOn: '2020-01-01',
        recordedById: clinicianId,
      });
    }
    return client.id;
  }

  const upload = (
    who: Signed,
    id: string,
    files: { name: string; bytes: Buffer }[],
    fields: Record<string, string> = {},
  ) => {
    let req = who.agent.post(`/api/clients/${id}/samples`).set('X-CSRF-Token', who.csrf);
    for (const [k, v] of Object.entries({ sourceKind: 'diary', ...fields })) req = req.field(k, v);
    for (const f of files) req = req.attach('files', f.bytes, f.name);
    return req;
  };
  const utf8 = (s: string) => Buffer.from(s, 'utf8');
  const unique = (s: string) => `${s} ${Math.random().toString(36).slice(2)}\n`;
  const sampleCount = async (id: string) => dataSource.getRepository(Sample).countBy({ clientId: id });

  beforeAll(async () => {
    await resetDatabase();
    class TestConfig extends AppConfig {
      override get loginRateLimit(): number {
        return 1_000;
      }
      override get sampleLimits() {
        return LIMITS;
      }
    }
    const moduleRef = await Test.createTestingModule({ imports: [AppModule] })
      .overrideProvider(AppConfig)
      .useClass(TestConfig)
      .compile();
    app = moduleRef.createNestApplication<NestExpressApplication>({ logger: ['error'] });
    configureApp(app);
    await app.init();
    http = app.getHttpServer();
    dataSource = app.get(DataSource);
    owner = await sign('clinician');
    other = await sign('clinician');
    supervisor = await sign('supervisor');
    carer = await sign('carer');
    admin = await sign('admin');
    clientId = await newClient(owner.id);
    await dataSource.getRepository(ClientAssignment).insert({ clientId, userId: carer.id });
  });
  afterAll(async () => {
    await app.close();
  });

  describe('uploads', () => {
    it('stores several files in one multipart upload, with statistics and flags', async () => {
      const res = await upload(owner, clientId, [
        { name: 'diary-june.txt', bytes: utf8(diary) },
        { name: 'chat.md', bytes: utf8(messages) },
      ]).expect(201);
      const result = res.body as UploadResult;
      expect(result.duplicates).toEqual([]);
      expect(result.samples.map((s) => s.title)).toEqual(['diary-june', 'chat']);
      const [d, m] = result.samples;
      expect(d.sha256).toBe(createHash('sha256').update(diary).digest('hex'));
      expect(d.byteSize).toBe(Buffer.byteLength(diary));
      expect(d.status).toBe('needs_review');
      expect(d.openFlags).toBe(2);
      expect(m.status).toBe('ready');
      expect(m.words).toBe(12); // hand count
      const detail = (await owner.agent.get(`/api/samples/${d.id}`).expect(200)).body as SampleDetail;
      expect(detail.flags.map((f) => [f.kind, f.text])).toEqual([
        ['phone', '07700 900123'],
        ['email', 'hannah@example.org'],
      ]);
      // SUBTLEX-US has no "hannah"; the other words are everyday English.
      expect(detail.unknownWords).toEqual([{ word: 'hannah', count: 2 }]);
      expect(detail.topWords[0]).toEqual({ word: 'the', count: 4 });
      const audit = await dataSource.getRepository(AuditEvent).findBy({ action: 'sample.upload', clientId });
      expect(audit).toHaveLength(2);
      expect(JSON.stringify(audit.map((a) => a.details))).not.toContain('07700');
    });

    it('takes pasted text as JSON', async () => {
      const text = unique('Pasted from my phone: sailing on Saturday, Mirrorlake regatta');
      const res = await owner.agent
        .post(`/api/clients/${clientId}/samples`)
        .set('X-CSRF-Token', owner.csrf)
        .send({ title: 'Pasted', sourceKind: 'messages', text })
        .expect(201);
      const [sample] = (res.body as UploadResult).samples;
      expect(sample.encoding).toBe('pasted');
      expect(sample.fileName).toBeNull();
      const detail = (await owner.agent.get(`/api/samples/${sample.id}`).expect(200)).body as SampleDetail;
      expect(detail.unknownWords.map((w) => w.word)).toContain('mirrorlake');
    });

    it('takes the chosen CSV column, and lists the columns when it is missing', async () => {
      const csv = utf8(
        `when,from,text\n2026-06-01,me,"Back from the club, tired"\n2026-06-02,me,"Pepper ate my, sandwich"\n${Date.now()},x,\n`,
      );
      const bad = await upload(owner, clientId, [{ name: 'm.csv', bytes: csv }], {
        csvColumn: 'body',
      }).expect(400);
      expect(bad.body.message).toContain('The CSV has no column "body". Its columns are: when, from, text.');
      const none = await upload(owner, clientId, [{ name: 'm.csv', bytes: csv }]).expect(400);
      expect(none.body.message).toContain('Its columns are: when, from, text.');
      const res = await upload(owner, clientId, [{ name: 'm.csv', bytes: csv }], {
        csvColumn: 'text',
        sourceKind: 'messages',
      }).expect(201);
      const detail = (
        await owner.agent.get(`/api/samples/${(res.body as UploadResult).samples[0].id}`).expect(200)
      ).body as SampleDetail;
      expect(detail.text).toBe('Back from the club, tired\n\nPepper ate my, sandwich');
    });

    it('accepts UTF-16 with and without BOM', async () => {
      const text = unique('Hannah’s boat is called Kittiwake — naïve café');
      const le = Buffer.from('\ufeff' + text, 'utf16le');
      const be = Buffer.from('\ufeff' + text + ' be', 'utf16le').swap16();
      const bare = Buffer.from(text + ' bare', 'utf16le');
      const res = await upload(owner, clientId, [
        { name: 'le.txt', bytes: le },
        { name: 'be.txt', bytes: be },
        { name: 'bare.txt', bytes: bare },
      ]).expect(201);
      expect((res.body as UploadResult).samples.map((s) => s.encoding)).toEqual([
        'utf-16le',
        'utf-16be',
        'utf-16le',
      ]);
    });

    const refused: [string, string, Buffer, number, RegExp][] = [
      [
        'a binary file',
        'x.txt',
        Buffer.from([0x41, 0x00, 0x42, 0x43, 0x01, 0x02, 0x00, 0x00, 0x44]),
        400,
        /binary data/,
      ],
      [
        'a PNG',
        'photo.txt',
        Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]),
        400,
        /PNG image/,
      ],
      [
        'a PDF',
        'letter.pdf',
        Buffer.from('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n', 'latin1'),
        400,
        /This is a PDF document, not plain text/,
      ],
      [
        'invalid UTF-8',
        'old.txt',
        Buffer.from('Caf\xe9 on the quay', 'latin1'),
        400,
        /not valid UTF-8 or UTF-16 text \(byte 4\)/,
      ],
      ['an empty file', 'empty.txt', Buffer.alloc(0), 400, /The file is empty\./],
      ['a whitespace-only file', 'blank.txt', utf8(' \n \n'), 400, /The file is empty\./],
      [
        'another extension',
        'notes.rtf',
        utf8('plain words'),
        400,
        /Keyloom takes \.txt, \.md or \.csv files\./,
      ],
      [
        'a file over the size limit',
        'big.txt',
        Buffer.alloc(LIMITS.maxFileBytes + 1, 0x61),
        413,
        /A file is larger than 64 kB, the limit per file\. Nothing was stored/,
      ],
    ];
    it.each(refused)(
      'refuses %s and stores nothing of the upload',
      async (_what, name, bytes, status, message) => {
        const before = await sampleCount(clientId);
        const res = await upload(owner, clientId, [
          { name: 'fine.txt', bytes: utf8(unique('A perfectly good file')) },
          { name, bytes },
        ]).expect(status);
        expect(res.body.message).toMatch(message);
        expect(res.body.statusCode).toBe(status);
        expect(await sampleCount(clientId)).toBe(before);
      },
    );

    it('refuses more files than the limit', async () => {
      const files = Array.from({ length: LIMITS.maxFiles + 1 }, (_, i) => ({
        name: `f${i}.txt`,
        bytes: utf8(unique(`file ${i}`)),
      }));
      const before = await sampleCount(clientId);
      const res = await upload(owner, clientId, files).expect(400);
      expect(res.body.message).toBe(
        `At most ${LIMITS.maxFiles} files can be uploaded at once. Nothing was stored; upload them in smaller batches.`,
      );
      expect(await sampleCount(clientId)).toBe(before);
    });

    it('refuses an upload that would take the client over its total limit', async () => {
      const id = await newClient(owner.id);
      const chunk = () => utf8(unique('x'.repeat(LIMITS.maxFileBytes - 100)));
      await upload(owner, id, [
        { name: 'a.txt', bytes: chunk() },
        { name: 'b.txt', bytes: chunk() },
        { name: 'c.txt', bytes: chunk() },
      ]).expect(201);
      const res = await upload(owner, id, [
        { name: 'd.txt', bytes: chunk() },
        { name: 'e.txt', bytes: chunk() },
      ]).expect(413);
      expect(res.body.message).toMatch(/over the 256 kB limit/);
      expect(await sampleCount(id)).toBe(3);
    });

    it('reports duplicate bytes instead of storing them twice', async () => {
      const bytes = utf8(unique('Same words twice'));
      const first = (await upload(owner, clientId, [{ name: 'one.txt', bytes }]).expect(201))
        .body as UploadResult;
      const res = await upload(owner, clientId, [
        { name: 'again.txt', bytes },
        { name: 'new.txt', bytes: utf8(unique('Something new')) },
      ]).expect(201);
      const result = res.body as UploadResult;
      expect(result.samples.map((s) => s.fileName)).toEqual(['new.txt']);
      expect(result.duplicates).toEqual([
        {
          fileName: 'again.txt',
          existingSampleId: first.samples[0].id,
          message: expect.stringContaining('uploaded before'),
        },
      ]);
      expect(await dataSource.getRepository(AuditEvent).countBy({ action: 'sample.duplicate-refused' })).toBe(
        1,
      );
    });

    it('stores nothing from an upload cut off halfway', async () => {
      const before = await sampleCount(clientId);
      const boundary = 'cut-off-boundary';
      const body =
        `--${boundary}\r\nContent-Disposition: form-data; name="sourceKind"\r\n\r\ndiary\r\n` +
        `--${boundary}\r\nContent-Disposition: form-data; name="files"; filename="whole.txt"\r\n\r\nA whole file\r\n` +
        `--${boundary}\r\nContent-Disposition: form-data; name="files"; filename="half.txt"\r\n\r\nThe connection dro`;
      const res = await owner.agent
        .post(`/api/clients/${clientId}/samples`)
        .set('X-CSRF-Token', owner.csrf)
        .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
        .send(body)
        .expect(400);
      expect(res.body.message).toBe('The upload was cut off or malformed. Nothing was stored; try again.');
      expect(await sampleCount(clientId)).toBe(before);
    });

    it('answers 409 without an active training consent', async () => {
      const id = await newClient(owner.id, false);
      const res = await upload(owner, id, [{ name: 'a.txt', bytes: utf8('words') }]).expect(409);
      expect(res.body.message).toBe(
        'This client has no active consent for model training. Record consent first.',
      );
    });

    it('answers 400 to a multipart upload without files, and to bad fields', async () => {
      await owner.agent
        .post(`/api/clients/${clientId}/samples`)
        .set('X-CSRF-Token', owner.csrf)
        .field('sourceKind', 'diary')
        .expect(400);
      const res = await upload(owner, clientId, [{ name: 'a.txt', bytes: utf8('x') }], {
        sourceKind: 'novel',
      }).expect(400);
      expect(res.body.issues[0].path).toBe('sourceKind');
    });
  });

  describe('roles × routes', () => {
    let sampleId: string;
    let flagId: string;
    beforeAll(async () => {
      const res = await upload(owner, clientId, [
        { name: 'roles.txt', bytes: utf8(unique('Call 07700 900456 soon')) },
      ]).expect(201);
      sampleId = (res.body as UploadResult).samples[0].id;
      flagId = ((await owner.agent.get(`/api/samples/${sampleId}`)).body as SampleDetail).flags[0].id;
    });

    const routes = (s: () => string, f: () => string) => [
      { name: 'GET list', call: (w: Signed) => w.agent.get(`/api/clients/${clientId}/samples`) },
      { name: 'GET one', call: (w: Signed) => w.agent.get(`/api/samples/${s()}`) },
      {
        name: 'POST upload',
        call: (w: Signed) => upload(w, clientId, [{ name: 'r.txt', bytes: utf8(unique('role test')) }]),
      },
      {
        name: 'POST flag',
        call: (w: Signed) =>
          w.agent
            .post(`/api/samples/${s()}/flags/${f()}`)
            .set('X-CSRF-Token', w.csrf)
            .send({ action: 'keep', reason: 'test' }),
      },
      {
        name: 'POST exclude',
        call: (w: Signed) =>
          w.agent.post(`/api/samples/${s()}/exclude`).set('X-CSRF-Token', w.csrf).send({ reason: 'test' }),
      },
    ];
    // Expected status per role, in the order of `routes`.
    const table: [string, () => Signed, number[]][] = [
      ['supervisor', () => supervisor, [200, 200, 403, 403, 403]],
      ['assigned carer', () => carer, [403, 403, 403, 403, 403]],
      ['admin', () => admin, [403, 403, 403, 403, 403]],
      ['another clinician', () => other, [404, 404, 404, 404, 404]],
    ];
    it.each(table)('%s gets the expected statuses', async (_who, who, statuses) => {
      const got: number[] = [];
      for (const route of routes(
        () => sampleId,
        () => flagId,
      ))
        got.push((await route.call(who())).status);
      expect(got).toEqual(statuses);
      const flag = await dataSource.getRepository(SampleFlag).findOneByOrFail({ id: flagId });
      expect(flag.status).toBe('open');
    });

    it('an unassigned carer and made-up ids get 404', async () => {
      const stranger = await sign('carer');
      await stranger.agent.get(`/api/clients/${clientId}/samples`).expect(404);
      await owner.agent.get('/api/samples/00000000-0000-4000-8000-000000000000').expect(404);
      await owner.agent.get('/api/clients/00000000-0000-4000-8000-000000000000/samples').expect(404);
    });

    it('supervisor sees the text and flags', async () => {
      const detail = (await supervisor.agent.get(`/api/samples/${sampleId}`).expect(200))
        .body as SampleDetail;
      expect(detail.flags[0].text).toBe('07700 900456');
      const list = (await supervisor.agent.get(`/api/clients/${clientId}/samples`).expect(200))
        .body as SampleSummary[];
      expect(list.some((s) => s.id === sampleId)).toBe(true);
    });
  });

  describe('flag decisions', () => {
    it('redaction replaces the span, moves later flags, recounts statistics', async () => {
      const text = unique('Ring Hannah on 07700 900789 or write to hannah.ashby@example.org about Kittiwake');
      const res = await upload(owner, clientId, [{ name: 'redact.txt', bytes: utf8(text) }]).expect(201);
      const id = (res.body as UploadResult).samples[0].id;
      const before = (await owner.agent.get(`/api/samples/${id}`).expect(200)).body as SampleDetail;
      const [phone, email] = before.flags;
      const after = (
        await owner.agent
          .post(`/api/samples/${id}/flags/${phone.id}`)
          .set('X-CSRF-Token', owner.csrf)
          .send({ action: 'redact' })
          .expect(200)
      ).body as SampleDetail;
      expect(after.text).not.toContain('07700');
      expect(after.text).toContain('Ring Hannah on ⟪phone⟫ or write');
      expect(after.words).toBe(before.words - 2); // "07700" and "900789" are gone; the token is not counted
      expect(after.topWords.some((w) => w.word === '900789')).toBe(false);
      const movedEmail = after.flags.find((f) => f.id === email.id);
      expect(after.text.slice(movedEmail?.start, movedEmail?.end)).toBe('hannah.ashby@example.org');
      const redacted = after.flags.find((f) => f.id === phone.id);
      expect(redacted).toMatchObject({ status: 'redacted', text: null, decidedBy: 'Test clinician' });
      expect(after.status).toBe('needs_review');
      // Deciding twice: 409.
      const again = await owner.agent
        .post(`/api/samples/${id}/flags/${phone.id}`)
        .set('X-CSRF-Token', owner.csrf)
        .send({ action: 'keep', reason: 'x' })
        .expect(409);
      expect(again.body.message).toBe('This flag was already decided.');
      // Keep needs a reason.
      const noReason = await owner.agent
        .post(`/api/samples/${id}/flags/${email.id}`)
        .set('X-CSRF-Token', owner.csrf)
        .send({ action: 'keep' })
        .expect(400);
      expect(noReason.body.issues).toEqual([{ path: 'reason', message: 'Say why this stays in the text.' }]);
      const kept = (
        await owner.agent
          .post(`/api/samples/${id}/flags/${email.id}`)
          .set('X-CSRF-Token', owner.csrf)
          .send({ action: 'keep', reason: 'Club address, public' })
          .expect(200)
      ).body as SampleDetail;
      expect(kept.status).toBe('ready');
      expect(kept.openFlags).toBe(0);
      const events = await dataSource.getRepository(AuditEvent).findBy({ subjectId: id });
      expect(events.map((e) => e.action).sort()).toEqual([
        'sample.flag-keep',
        'sample.flag-redact',
        'sample.upload',
      ]);
      expect(JSON.stringify(events.map((e) => e.details))).not.toContain('example.org');
    });

    it('excludes a sample once, with a reason', async () => {
      const res = await upload(owner, clientId, [
        { name: 'ex.txt', bytes: utf8(unique('Not mine, my sister wrote it')) },
      ]).expect(201);
      const id = (res.body as UploadResult).samples[0].id;
      await owner.agent
        .post(`/api/samples/${id}/exclude`)
        .set('X-CSRF-Token', owner.csrf)
        .send({})
        .expect(400);
      const summary = (
        await owner.agent
          .post(`/api/samples/${id}/exclude`)
          .set('X-CSRF-Token', owner.csrf)
          .send({ reason: 'Written by Hannah' })
          .expect(200)
      ).body as SampleSummary;
      expect(summary).toMatchObject({ status: 'excluded', excludedReason: 'Written by Hannah' });
      await owner.agent
        .post(`/api/samples/${id}/exclude`)
        .set('X-CSRF-Token', owner.csrf)
        .send({ reason: 'again' })
        .expect(409);
    });
  });

  describe('schema', () => {
    it('the migration matches the entities (no pending change for the sample tables)', async () => {
      const pending = await dataSource.driver.createSchemaBuilder().log();
      const ours = pending.upQueries
        .map((q) => q.query)
        .filter((q) => /language_samples|sample_flags/.test(q));
      expect(ours).toEqual([]);
    });
  });

  describe('demo seed', () => {
    it('loads corpora/demo for the demo client, idempotently, with one sample left to review', async () => {
      const runSeed = () =>
        dataSource.transaction(async (manager) => {
          for (const step of seedSteps) {
            await step.run({
              manager,
              env: validateEnv({ BCRYPT_COST: '4' }),
              resetPasswords: false,
              log: () => undefined,
            });
          }
        });
      await runSeed();
      await runSeed();
      const client = await dataSource.getRepository(Client).findOneByOrFail({ pseudonym: 'R. Ashby' });
      const samples = await dataSource
        .getRepository(Sample)
        .find({ where: { clientId: client.id }, relations: { flags: true } });
      expect(samples).toHaveLength(7);
      const words = samples.reduce((sum, s) => sum + s.words, 0);
      expect(words).toBeGreaterThan(2800);
      const review = samples.filter((s) => s.status === 'needs_review');
      expect(review.map((s) => s.fileName)).toEqual(['email-to-club-secretary.txt']);
      expect(review[0].flags?.map((f) => f.kind).sort()).toEqual(['email', 'phone', 'street_address']);
      const messages = samples.find((s) => s.fileName === 'messages-to-hannah.txt');
      expect(messages?.text).toContain('⟪url⟫');
      expect(messages?.text).not.toContain('https://');
      const csv = samples.find((s) => s.fileName === 'sailing-club-messages.csv');
      expect(csv?.text.startsWith('Morning all, is the access dinghy free')).toBe(true);
      expect(csv?.unknownWords.map((w) => w.word)).toContain('priya');
      // The seed also trains the demo version (PROFILE_FOLDS = 5 folds, about 15 s on 2 cores).
    }, 180_000);
  });

  describe('consent withdrawal', () => {
    it('deletes every sample and flag of the client', async () => {
      const id = await newClient(owner.id);
      await upload(owner, id, [
        { name: 'a.txt', bytes: utf8(unique('Phone 07700 900111')) },
        { name: 'b.txt', bytes: utf8(unique('Nothing personal')) },
      ]).expect(201);
      const consent = await dataSource.getRepository(Consent).findOneByOrFail({ clientId: id });
      const res = await owner.agent
        .post(`/api/clients/${id}/consents/${consent.id}/withdraw`)
        .set('X-CSRF-Token', owner.csrf)
        .send({ reason: 'Client asked' })
        .expect(200);
      expect(res.body.withdrawal.samplesDeleted ?? res.body.withdrawal.derived.samples).toBe(2);
      expect(await sampleCount(id)).toBe(0);
      const flags = await dataSource.query(
        'SELECT count(*)::int AS n FROM sample_flags f LEFT JOIN language_samples s ON s.id = f.sample_id WHERE s.id IS NULL',
      );
      expect(flags[0].n).toBe(0);
      const deleted = await dataSource
        .getRepository(AuditEvent)
        .findOneByOrFail({ action: 'sample.delete', clientId: id });
      expect(deleted.details).toMatchObject({ count: 2 });
      // Further uploads are refused.
      await upload(owner, id, [{ name: 'c.txt', bytes: utf8('more') }]).expect(409);
    });
  });
});
