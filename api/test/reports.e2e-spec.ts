// The printed reports over HTTP against real PostgreSQL: a trained version's report and a client's
// report over a period, as JSON for the print view and as PDFs. The PDFs are read back with pdfjs-dist
// (Mozilla's PDF reader, scripts/pdf-text.mjs), not with pdfkit that wrote them; page sizes against
// ISO 216 A4 (595 × 842 pt) and ANSI US Letter (612 × 792 pt). Training is kept small (2 folds).
import {
  type ClientReport,
  type ProfileReport,
  reportCautions,
  type UploadResult,
  versionFigures,
  type VersionReport,
} from '@keyloom/shared';
import { randomUUID } from 'node:crypto';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { AuditService } from '../src/audit/audit.service';
import { loadTrainingRuntime } from '../src/profile-versions/profile-training';
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import { NOT_TRAINED_REPORT_MESSAGE } from '../src/reports/reports.service';
import { type Caller, type Cast, newCast, newClient, newConsent, send, statusesOf } from './caseload-helpers';
import { binaryBody, newUser, signIn } from './factories';
import { readPdf, pdfText } from './pdf-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { postTrial, trainInProcess, typedEvents } from './trial-helpers';

// Invented for these tests (the demo scenario's voice: a sailing club, a dog, jazz piano).
const TEXTS = [
  'Went down to the club early and helped to lay the marks for the evening race. The tide was turning ' +
    'and the wind was light from the north. Pepper waited on the slipway and watched every boat go out. ' +
    'After the race we sat on the terrace and talked about the winter series and the new committee.',
  'Me: can you bring the spare tiller on Saturday?\nHannah: yes, and the new gloves for you.\n' +
    'Me: thank you. Pepper wants to come too.\nHannah: of course, he always comes.\n' +
    'Me: the forecast says the wind will pick up after lunch.\nHannah: then we start early, nine at the club.',
];
const CLINIC = {
  name: 'Willowmere Speech and Access Clinic',
  // 01632 960xxx: the UK range Ofcom keeps for drama, so the number reaches nobody.
  phone: '01632 960 418',
  address: '4 Orchard Row\nWillowmere\nWM1 4ZZ',
  email: '',
  website: '',
};

describe('printed reports (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;
  let clientId: string;
  let trained: ProfileVersionDto;
  let draft: ProfileVersionDto;

  const get = (who: Caller, path: string) => send(t.http, who, 'get', path);
  const pdf = (who: Caller, path: string) => get(who, path).buffer(true).parse(binaryBody);

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    cast = await newCast(t.http, t.dataSource);
    const admin = await newUser(t.dataSource, { role: 'admin', name: 'Clinic Admin' });
    const adminSession = await signIn(t.http, admin);
    await adminSession.agent
      .put('/api/clinic-settings')
      .set('X-CSRF-Token', adminSession.csrf)
      .send(CLINIC)
      .expect(200);
    clientId = (await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Ashby')).id;
    await newConsent(t.http, cast.owner, clientId);
    for (const [i, text] of TEXTS.entries()) {
      const res = await send(t.http, cast.owner, 'post', `/api/clients/${clientId}/samples`, {
        title: `Diary ${i + 1}`,
        text,
        sourceKind: 'diary',
      }).expect(201);
      expect((res.body as UploadResult).samples[0]).toMatchObject({ status: 'ready' });
    }
    const create = () =>
      send(t.http, cast.owner, 'post', `/api/clients/${clientId}/profile-versions`, { settings: {} }).expect(
        201,
      );
    const first = (await create()).body as ProfileVersionDto;
    const runtime = { ...loadTrainingRuntime(2), ksSampleChars: 400, progressIntervalMs: 50 };
    expect(await trainInProcess(t, t.app.get(AuditService), cast.owner, first.id, runtime)).toBe('trained');
    trained = (await get(cast.owner, `/api/profile-versions/${first.id}`).expect(200))
      .body as ProfileVersionDto;
    // A trial long enough to count (20 characters or more) at a plausible pace: 49 characters in
    // about three minutes, near the version's estimate for a direct-selection client.
    const phrase = 'hi pepper, the sea was calm at the harbour today';
    await postTrial(t.http, cast.assignedCarer, trained.id, {
      text: phrase,
      events: typedEvents(phrase, 170_000),
      finishedAt: '2026-12-02T10:03:00.000Z',
    }).expect(201);
    draft = (await create()).body as ProfileVersionDto;
  }, 120_000);
  afterAll(async () => {
    await t.app.close();
  });

  describe('GET /api/profile-versions/:id/report.pdf', () => {
    it('owning clinician and supervisor only: carers and admins 403, another clinician 404, no session 401', async () => {
      expect(
        await statusesOf(cast, (who) => get(who, `/api/profile-versions/${trained.id}/report.pdf`)),
      ).toEqual([200, 404, 200, 403, 403, 403, 401]);
      await get(cast.owner, `/api/profile-versions/${randomUUID()}/report.pdf`).expect(404);
      const untrained = await get(cast.owner, `/api/profile-versions/${draft.id}/report.pdf`).expect(409);
      expect((untrained.body as { message: string }).message).toBe(NOT_TRAINED_REPORT_MESSAGE);
      await get(cast.owner, `/api/profile-versions/${trained.id}/report.pdf?paper=a3`).expect(400);
    });

    it('an A4 PDF that names the clinic, the client, the version, its figures in the shared words and every caution', async () => {
      const res = await pdf(cast.owner, `/api/profile-versions/${trained.id}/report.pdf`).expect(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      expect(res.headers['content-disposition']).toBe(
        `attachment; filename="keyloom-r-ashby-version-${trained.number}.pdf"`,
      );
      const pages = readPdf(res.body as Buffer);
      expect(pages.length).toBeGreaterThanOrEqual(1);
      for (const page of pages) expect([page.width, page.height]).toEqual([595, 842]);
      const text = pdfText(pages);
      const figures = versionFigures(trained.metrics as unknown as ProfileReport);
      const savings = figures.find((f) => f.key === 'keystrokeSavings');
      expect(savings?.value).toMatch(/^\d+\.\d%$/);
      for (const words of [
        CLINIC.name,
        CLINIC.phone,
        'R. Ashby',
        `Version ${trained.number}`,
        `Keystroke savings: ${savings?.value}`,
        'Hit rate',
        'clinician owner', // who created and trained it
        '1 trial; mean measured words per minute',
        'Diary 1',
        ...reportCautions,
      ]) {
        expect(text).toContain(words);
      }
      expect(pages.at(-1)?.text).toContain(`Page ${pages.length} of ${pages.length}`);
    });

    it('?paper=letter prints on US Letter; each download is audited', async () => {
      const before = await t.dataSource
        .getRepository(AuditEvent)
        .countBy({ action: 'report.version-pdf', subjectId: trained.id });
      const res = await pdf(
        cast.supervisor,
        `/api/profile-versions/${trained.id}/report.pdf?paper=letter`,
      ).expect(200);
      for (const page of readPdf(res.body as Buffer)) expect([page.width, page.height]).toEqual([612, 792]);
      const events = await t.dataSource
        .getRepository(AuditEvent)
        .find({ where: { action: 'report.version-pdf', subjectId: trained.id }, order: { at: 'ASC' } });
      expect(events).toHaveLength(before + 1);
      expect(events.at(-1)).toMatchObject({ actorId: cast.supervisor.id, clientId });
      expect(events.at(-1)?.details).toMatchObject({ number: trained.number, paper: 'letter' });
    });
  });

  it('the OpenAPI document lists the four routes, the PDFs as application/pdf', async () => {
    const json = await get(cast.supervisor, '/api/docs-json').expect(200);
    const paths = (
      json.body as { paths: Record<string, { get?: { responses?: Record<string, { content?: object }> } }> }
    ).paths;
    for (const path of [
      '/api/profile-versions/{id}/report',
      '/api/profile-versions/{id}/report.pdf',
      '/api/clients/{id}/report',
      '/api/clients/{id}/report.pdf',
    ]) {
      expect(paths[path]?.get).toBeDefined();
    }
    expect(
      Object.keys(paths['/api/clients/{id}/report.pdf']?.get?.responses?.['200']?.content ?? {}),
    ).toEqual(['application/pdf']);
  });

  describe('GET /api/profile-versions/:id/report', () => {
    it('the print view’s data: the same figures, trail without comments, samples and cautions', async () => {
      expect(await statusesOf(cast, (who) => get(who, `/api/profile-versions/${trained.id}/report`))).toEqual(
        [200, 404, 200, 403, 403, 403, 401],
      );
      const report = (await get(cast.owner, `/api/profile-versions/${trained.id}/report`).expect(200))
        .body as VersionReport;
      expect(report.figures).toEqual(versionFigures(trained.metrics as unknown as ProfileReport));
      expect(report.client.pseudonym).toBe('R. Ashby');
      expect(report.clinic).toEqual({ name: CLINIC.name, phone: CLINIC.phone, address: CLINIC.address });
      expect(report.trail.map((s) => s.step)).toEqual([
        'Trained',
        'Signed off by the carer',
        'Approved by the supervisor',
      ]);
      expect(report.trials.count).toBe(1);
      expect(report.samples.map((s) => s.title).sort()).toEqual(['Diary 1', 'Diary 2']);
      expect(report.chart?.svg.startsWith('<svg')).toBe(true);
      expect(report.cautions).toEqual([...reportCautions]);
      // "3 Dec 2026": day, short month, year.
      expect(report.printedOn).toMatch(/^\d{1,2} [A-Z][a-z]{2,3} \d{4}$/);
    });
  });

  describe('GET /api/clients/:id/report(.pdf)', () => {
    it('the last 90 days by default; the trained version in the table; a reversed period 400', async () => {
      expect(await statusesOf(cast, (who) => get(who, `/api/clients/${clientId}/report`))).toEqual([
        200, 404, 200, 403, 403, 403, 401,
      ]);
      const report = (await get(cast.owner, `/api/clients/${clientId}/report`).expect(200))
        .body as ClientReport;
      const days = (Date.parse(report.period.to) - Date.parse(report.period.from)) / 86_400_000;
      expect(days).toBe(89);
      expect(report.versions.map((v) => v.number)).toEqual([trained.number]);
      expect(report.charts.length).toBeGreaterThanOrEqual(1);
      await get(cast.owner, `/api/clients/${clientId}/report?from=2026-12-04&to=2026-11-01`).expect(400);
      await get(cast.owner, `/api/clients/${clientId}/report?from=2026-02-30`).expect(400);
      const empty = (
        await get(cast.owner, `/api/clients/${clientId}/report?from=2020-01-01&to=2020-03-31`).expect(200)
      ).body as ClientReport;
      expect(empty.versions).toEqual([]);
    });

    it('a PDF with the period, the versions’ figures and the cautions; Letter on request; audited', async () => {
      const res = await pdf(cast.supervisor, `/api/clients/${clientId}/report.pdf?paper=letter`).expect(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      expect(res.headers['content-disposition']).toMatch(
        /^attachment; filename="keyloom-r-ashby-\d{4}-\d{2}-\d{2}-to-\d{4}-\d{2}-\d{2}\.pdf"$/,
      );
      const pages = readPdf(res.body as Buffer);
      for (const page of pages) expect([page.width, page.height]).toEqual([612, 792]);
      const text = pdfText(pages);
      const savings = versionFigures(trained.metrics as unknown as ProfileReport).find(
        (f) => f.key === 'keystrokeSavings',
      );
      for (const words of [
        CLINIC.name,
        'R. Ashby',
        'Client report',
        String(savings?.value),
        ...reportCautions,
      ]) {
        expect(text).toContain(words);
      }
      await pdf(cast.assignedCarer, `/api/clients/${clientId}/report.pdf`).expect(403);
      await pdf(cast.owner, `/api/clients/${randomUUID()}/report.pdf`).expect(404);
      expect(
        await t.dataSource
          .getRepository(AuditEvent)
          .countBy({ action: 'report.client-pdf', subjectId: clientId }),
      ).toBe(1);
    });
  });

  describe('trials the reports leave out', () => {
    it('leaves a too-short trial out of the count, with the family summaries’ note, in the JSON and the PDF', async () => {
      // A row as the test keyboard's POST stores it (only the columns the report reads matter).
      await t.dataSource.query(
        `INSERT INTO trials (local_trial_id, profile_version_id, client_id, user_name, user_role,
                             started_at, finished_at, text, settings, events, measures, simulated)
         VALUES ($1, $2, $3, 'Hannah', 'carer', now() - interval '2 minutes', now(), 'hi', '{}', '[]', $4, '{}')`,
        [
          randomUUID(),
          trained.id,
          clientId,
          JSON.stringify({ characters: 6, keystrokeSavings: 0.9, wpm: 30 }),
        ],
      );
      const note = `Version ${trained.number}: 1 trial shorter than 20 characters was left out of the trial figures (too short to measure).`;
      const report = (await get(cast.owner, `/api/profile-versions/${trained.id}/report`).expect(200))
        .body as VersionReport;
      expect(report.trials.count).toBe(1);
      expect(report.trials.notes).toEqual([note]);
      const text = pdfText(
        readPdf(
          (await pdf(cast.owner, `/api/profile-versions/${trained.id}/report.pdf`).expect(200))
            .body as Buffer,
        ),
      );
      expect(text).toContain('1 trial; mean measured words per minute');
      expect(text).toContain('too short to measure');
    });
  });
});
