// Progress summaries against real PostgreSQL and the fake mail server: the mail job's
// delivery step, called in-process as the worker calls it — sent and read back from the fake server's
// API, SMTP down then up → delivered once, two jobs at once → one e-mail, a permanent SMTP refusal →
// failed, consent gone while queued → withheld; then the routes (summaries, preview, resend, stop link).
import { randomBytes, randomUUID } from 'node:crypto';
import { createServer } from 'node:net';
import { createTransport } from 'nodemailer';
import type PgBoss from 'pg-boss';
import type { Summary as SummaryDto, SummaryPreview } from '@keyloom/shared';
import { createJobBoss } from '../src/jobs/job-queue';
import { ProfileVersion } from '../src/profile-versions/profile-version.entity';
import { createSmtpSender, startSummaryMailWork } from '../src/summaries/summary-mail-worker';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { todayIso } from '../src/consents/consent-status';
import { AuditService } from '../src/audit/audit.service';
import { FamilyContact } from '../src/contacts/family-contact.entity';
import {
  CLIENT_CONSENT_WITHHELD_MESSAGE,
  deliverSummaryEmail,
  type MailSender,
  SUMMARY_MAIL_QUEUE,
  SUMMARY_MAIL_QUEUE_OPTIONS,
  TransientMailError,
  WITHHELD_MESSAGE,
} from '../src/summaries/summary-delivery';
import { SummaryRecipient } from '../src/summaries/summary-recipient.entity';
import { summarySubject, summaryText, type VersionFigures } from '../src/summaries/summary-text';
import { Summary } from '../src/summaries/summary.entity';
import { type Cast, castOrder, newCast, newClient, newConsent, send } from './caseload-helpers';
import { sentSummaryTo } from './summary-helpers';
import { createTestApp, resetDatabase, type TestApp, testDatabaseUrl } from './test-app';
import { PNG } from 'pngjs';

type InboxMail = {
  id: string;
  subject: string;
  messageId?: string;
  to: { address: string; name: string }[];
  text: string;
  html: string;
  attachments?: { generatedFileName: string; contentType: string; contentId?: string }[];
};

const mailApi = (): string => {
  const url = process.env.MAIL_API_URL;
  if (!url) throw new Error('Set MAIL_API_URL to the fake mail server API (npm test does).');
  return url;
};

async function inboxFor(address: string): Promise<InboxMail[]> {
  const res = await fetch(mailApi());
  const all = (await res.json()) as InboxMail[];
  return all.filter((mail) => mail.to.some((to) => to.address === address));
}

/** A loopback port nobody listens on: the "SMTP server is down" case. */
async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  if (typeof address !== 'object' || address === null) throw new Error('no port');
  return address.port;
}

const smtpTransport = (port: number) =>
  createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true, connectionTimeout: 2_000 });

// Figures as the versions' stored metrics would give them (invented demo values).
const FIGURES: VersionFigures[] = [
  {
    number: 1,
    status: 'retired',
    date: '2026-10-03',
    slots: 5,
    keystrokeSavings: 0.31,
    wpmWithout: 1.9,
    wpmWith: 2.2,
  },
  {
    number: 2,
    status: 'active',
    date: '2026-11-03',
    slots: 5,
    keystrokeSavings: 0.42,
    wpmWithout: 1.9,
    wpmWith: 2.72,
  },
];
const SETTINGS = {
  from: 'Keyloom at Willowmere <keyloom@willowmere.example>',
  appUrl: 'http://127.0.0.1:3000',
};

describe('summary e-mail delivery (mail job)', () => {
  let t: TestApp;
  let audit: AuditService;
  let clientId: string;
  let cast: Cast;
  let boss: PgBoss;

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    audit = new AuditService(t.dataSource.getRepository(AuditEvent));
    cast = await newCast(t.http, t.dataSource);
    // The web process queues onto this queue; until startJobBoss creates it (next step of the issue),
    // the test creates it as the worker will.
    boss = createJobBoss(testDatabaseUrl(), { supervise: false });
    await boss.start();
    await boss.createQueue(SUMMARY_MAIL_QUEUE, SUMMARY_MAIL_QUEUE_OPTIONS);
    clientId = (await newClient(t.http, cast.owner, undefined, 'R. Ashby')).id;
    // Delivery re-checks the client's consent too, so this client has one covering summaries.
    await newConsent(t.http, cast.owner, clientId);
  });

  afterAll(async () => {
    await boss.stop({ graceful: false, wait: true, close: true });
    await t.app.close();
  });

  /** A stored summary with one queued recipient at a fresh address. */
  async function queuedRecipient(forClient = clientId): Promise<SummaryRecipient> {
    const email = `family-${randomBytes(6).toString('hex')}@family.example`;
    const contact = await t.dataSource.getRepository(FamilyContact).save({
      clientId: forClient,
      name: 'Ann Ashby',
      relationship: 'sister',
      email,
      consentToSummaries: true,
      unsubscribedAt: null,
    });
    const period = { clientName: 'R. Ashby', from: '2026-10-01', to: '2026-11-30' };
    const summary = await t.dataSource.getRepository(Summary).save({
      clientId: forClient,
      periodFrom: period.from,
      periodTo: period.to,
      versionIds: [],
      note: '',
      subject: summarySubject(period),
      text: summaryText({ ...period, clinicName: 'Willowmere', versions: FIGURES, note: '' }),
      figures: FIGURES,
      state: 'sent',
      createdById: null,
    });
    return t.dataSource.getRepository(SummaryRecipient).save({
      summaryId: summary.id,
      contactId: contact.id,
      name: contact.name,
      email,
      idempotencyKey: randomUUID(),
      stopToken: randomBytes(32).toString('base64url'),
    });
  }

  const reload = (id: string) => t.dataSource.getRepository(SummaryRecipient).findOneByOrFail({ id });

  it('sends the stored content with both charts and the stop link, read back from the fake server', async () => {
    const row = await queuedRecipient();
    const outcome = await deliverSummaryEmail(
      t.dataSource,
      audit,
      smtpTransport(Number(process.env.SMTP_PORT ?? 1025)),
      SETTINGS,
      row.id,
      false,
    );
    expect(outcome).toBe('sent');
    const mails = await inboxFor(row.email);
    expect(mails).toHaveLength(1);
    const mail = mails[0];
    expect(mail.subject).toBe('Progress summary for R. Ashby, 1 October to 30 November 2026');
    // The figures in the text are the stored ones, in words.
    expect(mail.text).toContain('about 3 in 10 key presses saved');
    expect(mail.text).toContain('about 4 in 10 key presses saved, roughly 3 words a minute with suggestions');
    expect(mail.text).toContain(`http://127.0.0.1:3000/api/summaries/stop/${row.stopToken}`);
    expect(
      (mail.attachments ?? []).map((a) => [a.generatedFileName.endsWith('.png'), a.contentType]),
    ).toEqual([
      [true, 'image/png'],
      [true, 'image/png'],
    ]);
    // maildev's JSON shows the HTML with each cid: image resolved to a data: URI, so both images
    // were found by Content-ID; the raw message names them.
    expect(mail.html.match(/<img src="data:image\/png;base64,/g)).toHaveLength(2);
    // Each chart decodes as a PNG (pngjs, a general PNG decoder) at twice the size the <img> states.
    const images = [
      ...mail.html.matchAll(/<img src="data:image\/png;base64,([^"]+)" width="(\d+)" height="(\d+)"/g),
    ];
    expect(images).toHaveLength(2);
    for (const [, data, width, height] of images) {
      const png = PNG.sync.read(Buffer.from(data, 'base64'));
      expect([png.width, png.height]).toEqual([2 * Number(width), 2 * Number(height)]);
      expect(Number(width)).toBeLessThanOrEqual(600);
    }
    const raw = await (await fetch(`${mailApi()}/${mail.id}/download`)).text();
    expect(raw).toMatch(/^Content-ID: <savings-chart@keyloom>/m);
    expect(raw).toMatch(/^Content-ID: <speed-chart@keyloom>/m);
    const stored = await reload(row.id);
    expect([stored.status, stored.attempts, stored.sentAt !== null]).toEqual(['sent', 1, true]);
    expect(stored.messageId).toBe(`<${row.idempotencyKey}@willowmere.example>`);
  });

  it('keeps the e-mail queued while SMTP is down and delivers it once when it is back', async () => {
    const row = await queuedRecipient();
    const down = smtpTransport(await closedPort());
    await expect(
      deliverSummaryEmail(t.dataSource, audit, down, SETTINGS, row.id, false),
    ).rejects.toBeInstanceOf(TransientMailError);
    const waiting = await reload(row.id);
    expect([waiting.status, waiting.attempts]).toEqual(['queued', 1]);
    expect(waiting.lastError).toMatch(/ECONNREFUSED|connect/i);

    const up = smtpTransport(Number(process.env.SMTP_PORT ?? 1025));
    expect(await deliverSummaryEmail(t.dataSource, audit, up, SETTINGS, row.id, false)).toBe('sent');
    // A retry of the same job after success (e.g. the worker died before acknowledging it).
    expect(await deliverSummaryEmail(t.dataSource, audit, up, SETTINGS, row.id, false)).toBe('already-done');
    expect(await inboxFor(row.email)).toHaveLength(1);
    expect((await reload(row.id)).attempts).toBe(2);
  });

  it('sends one e-mail when two jobs for the same recipient run at once', async () => {
    const row = await queuedRecipient();
    const up = smtpTransport(Number(process.env.SMTP_PORT ?? 1025));
    const outcomes = await Promise.all([
      deliverSummaryEmail(t.dataSource, audit, up, SETTINGS, row.id, false),
      deliverSummaryEmail(t.dataSource, audit, up, SETTINGS, row.id, false),
    ]);
    expect(outcomes.sort()).toEqual(['already-done', 'sent']);
    expect(await inboxFor(row.email)).toHaveLength(1);
  });

  it('withholds a queued e-mail when the contact stopped summaries while it waited', async () => {
    const row = await queuedRecipient();
    await t.dataSource
      .getRepository(FamilyContact)
      .update({ id: row.contactId ?? '' }, { unsubscribedAt: new Date() });
    const up = smtpTransport(Number(process.env.SMTP_PORT ?? 1025));
    expect(await deliverSummaryEmail(t.dataSource, audit, up, SETTINGS, row.id, false)).toBe('withheld');
    const stored = await reload(row.id);
    expect([stored.status, stored.lastError]).toEqual(['failed', WITHHELD_MESSAGE]);
    expect(await inboxFor(row.email)).toHaveLength(0);
  });

  it('withholds the queued e-mails at once when the client’s consent to summaries is withdrawn', async () => {
    const other = (await newClient(t.http, cast.owner, undefined, 'T. Fairweather')).id;
    const consent = await newConsent(t.http, cast.owner, other);
    const row = await queuedRecipient(other);
    const res = await send(
      t.http,
      cast.owner,
      'post',
      `/api/clients/${other}/consents/${consent.id}/withdraw`,
      {
        reason: 'The client asked to stop everything.',
      },
    ).expect(200);
    expect(res.body.withdrawal.cancelled).toEqual({ summaryEmails: 1 });
    const stored = await reload(row.id);
    expect([stored.status, stored.lastError]).toEqual(['failed', CLIENT_CONSENT_WITHHELD_MESSAGE]);
    // The job that was queued for it finds it done and sends nothing.
    const up = smtpTransport(Number(process.env.SMTP_PORT ?? 1025));
    expect(await deliverSummaryEmail(t.dataSource, audit, up, SETTINGS, row.id, false)).toBe('already-done');
    expect(await inboxFor(row.email)).toHaveLength(0);
  });

  it('withholds a queued e-mail when the client’s consent to summaries expired while it waited', async () => {
    const other = (await newClient(t.http, cast.owner, undefined, 'U. Lapsed')).id;
    const consent = await newConsent(t.http, cast.owner, other, '2026-01-05');
    const row = await queuedRecipient(other);
    const now = new Date();
    const yesterday = todayIso(new Date(now.getFullYear(), now.getMonth(), now.getDate() - 1));
    await t.dataSource.query(`UPDATE consents SET expires_on = $2 WHERE id = $1`, [consent.id, yesterday]);
    const up = smtpTransport(Number(process.env.SMTP_PORT ?? 1025));
    expect(await deliverSummaryEmail(t.dataSource, audit, up, SETTINGS, row.id, false)).toBe('withheld');
    const stored = await reload(row.id);
    expect([stored.status, stored.lastError]).toEqual(['failed', CLIENT_CONSENT_WITHHELD_MESSAGE]);
    expect(await inboxFor(row.email)).toHaveLength(0);
  });

  it('marks a permanent refusal (SMTP 550) failed at once, and a transient one failed on the last attempt', async () => {
    const refused: MailSender = {
      sendMail: () =>
        Promise.reject(Object.assign(new Error('550 mailbox unavailable'), { responseCode: 550 })),
    };
    const row = await queuedRecipient();
    expect(await deliverSummaryEmail(t.dataSource, audit, refused, SETTINGS, row.id, false)).toBe('failed');
    const failed = await reload(row.id);
    expect([failed.status, failed.attempts, failed.lastError]).toEqual([
      'failed',
      1,
      '550 mailbox unavailable',
    ]);

    const busy: MailSender = {
      sendMail: () => Promise.reject(Object.assign(new Error('421 try later'), { responseCode: 421 })),
    };
    const second = await queuedRecipient();
    await expect(
      deliverSummaryEmail(t.dataSource, audit, busy, SETTINGS, second.id, false),
    ).rejects.toBeInstanceOf(TransientMailError);
    expect(await deliverSummaryEmail(t.dataSource, audit, busy, SETTINGS, second.id, true)).toBe('failed');
    const events = await t.dataSource
      .getRepository(AuditEvent)
      .find({ where: { action: 'summary.failed', clientId } });
    expect(events.filter((event) => event.details.withheld !== true)).toHaveLength(2);
  });

  describe('routes (HTTP)', () => {
    let httpClientId: string;
    let consenting: string;
    let refusing: string;
    let versionId: string;

    beforeAll(async () => {
      httpClientId = (await newClient(t.http, cast.owner, undefined, 'R. Ashby')).id;
      await newConsent(t.http, cast.owner, httpClientId);
      const contact = async (name: string, consentToSummaries: boolean) =>
        (
          (
            await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/contacts`, {
              name,
              relationship: 'sister',
              email: `${name.toLowerCase()}-${randomBytes(4).toString('hex')}@family.example`,
              consentToSummaries,
            }).expect(201)
          ).body as { id: string }
        ).id;
      consenting = await contact('Hannah', true);
      refusing = await contact('Miles', false);
      // A trained and approved version with stored metrics (invented values), inside the period.
      const version = await t.dataSource.getRepository(ProfileVersion).save({
        clientId: httpClientId,
        number: 1,
        status: 'active',
        settings: {
          order: 5,
          escape: 'C',
          exclusion: true,
          baseWeight: 'auto',
          slots: 5,
          caseFold: false,
          access: { method: 'switch' },
        },
        samples: [],
        metrics: { keystrokeSavings: { '5': 0.42 }, rates: { wpmWithout: 1.9, wpmWith: 2.72 } },
        trainedAt: new Date('2026-11-02T10:00:00Z'),
        approvedAt: new Date('2026-11-03T10:00:00Z'),
        history: [],
      });
      versionId = version.id;
    });

    const body = (contactIds: string[]) => ({
      from: '2026-10-01',
      to: '2026-11-30',
      contactIds,
      note: 'Well done.',
    });

    /** A draft to the contacts, then sent as it stands: the summary as sent. */
    async function draftAndSend(contactIds: string[], extra: object = {}): Promise<SummaryDto> {
      const draft = (
        await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/summaries`, {
          ...body(contactIds),
          ...extra,
        }).expect(201)
      ).body as SummaryDto;
      return (await send(t.http, cast.owner, 'post', `/api/summaries/${draft.id}/send`).expect(200))
        .body as SummaryDto;
    }

    it('refuses a contact without consent to summaries (400) and a carer (403)', async () => {
      const res = await send(
        t.http,
        cast.owner,
        'post',
        `/api/clients/${httpClientId}/summaries`,
        body([consenting, refusing]),
      ).expect(400);
      expect(JSON.stringify(res.body)).toContain('Miles cannot receive summaries');
      await send(
        t.http,
        cast.assignedCarer,
        'post',
        `/api/clients/${httpClientId}/summaries`,
        body([consenting]),
      ).expect(403);
    });

    it('drafts a summary, edits it, sends the edited text verbatim, delivers it, then honours the stop link', async () => {
      // The clinic's details (invented; 01632 96xxxx is a range kept for fiction) and the name the
      // family uses for the client.
      await t.dataSource.query(
        `INSERT INTO clinic_settings (id, name, phone, address) VALUES (1, $1, $2, $3)
         ON CONFLICT (id) DO UPDATE SET name = $1, phone = $2, address = $3`,
        ['Willowmere Community Communication Clinic', '01632 960 418', '4 Harbour Row\nWillowmere WM1 2AB'],
      );
      await t.dataSource.query(`UPDATE clients SET preferred_name = 'Rory' WHERE id = $1`, [httpClientId]);
      const draft = (
        await send(
          t.http,
          cast.owner,
          'post',
          `/api/clients/${httpClientId}/summaries`,
          body([consenting]),
        ).expect(201)
      ).body as SummaryDto;
      // A draft: nothing queued, the generated text to edit.
      expect([draft.status, draft.recipients, draft.contactIds, draft.textEdited]).toEqual([
        'draft',
        [],
        [consenting],
        false,
      ]);
      expect(draft.subject).toBe('Progress summary for Rory, 1 October to 30 November 2026');
      // Signed by the clinician with their role, the clinic's name, address and phone from its settings.
      expect(draft.text).toContain('call the clinic on 01632 960 418');
      expect(draft.text.split('\n\n').at(-1)).toBe(
        'clinician owner, clinician\nWillowmere Community Communication Clinic\n4 Harbour Row\nWillowmere WM1 2AB\nPhone: 01632 960 418',
      );
      expect(draft.notes).toEqual([]);
      expect(draft.text).toContain(
        'Version 1 (approved, in use, 3 November 2026): about 4 in 10 key presses saved',
      );
      expect(draft.text).toContain('Well done.');
      expect(await t.dataSource.getRepository(SummaryRecipient).countBy({ summaryId: draft.id })).toBe(0);
      // The clinician's own words replace the text; the subject too.
      const edited = `Dear Hannah,\n\nRory used the new suggestions all month.\n\n${draft.text}`;
      const patched = (
        await send(t.http, cast.owner, 'patch', `/api/summaries/${draft.id}`, {
          text: edited,
          subject: 'Rory’s typing in October and November',
        }).expect(200)
      ).body as SummaryDto;
      expect([patched.status, patched.text, patched.textEdited]).toEqual(['draft', edited, true]);
      // Fields left out keep what the draft holds: the approved version stays in it.
      expect(draft.versionIds).toEqual([versionId]);
      expect(patched.versionIds).toEqual([versionId]);
      // Only the owning clinician edits; a carer, a supervisor and nobody are refused.
      await send(t.http, cast.supervisor, 'patch', `/api/summaries/${draft.id}`, { text: 'x' }).expect(403);
      await send(t.http, cast.assignedCarer, 'patch', `/api/summaries/${draft.id}`, { text: 'x' }).expect(
        403,
      );
      await send(t.http, cast.otherClinician, 'patch', `/api/summaries/${draft.id}`, { text: 'x' }).expect(
        404,
      );
      await send(t.http, cast.anonymous, 'patch', `/api/summaries/${draft.id}`, { text: 'x' }).expect(401);
      await send(t.http, cast.owner, 'patch', `/api/summaries/${draft.id}`, { text: '' }).expect(400);
      // The e-mail as the family will get it, HTML and plain text.
      const message = (
        await send(t.http, cast.owner, 'get', `/api/summaries/${draft.id}/message`).expect(200)
      ).body as { html: string; text: string; subject: string; headers: Record<string, string> };
      expect(message.text).toContain('Rory used the new suggestions all month.');
      expect(message.html).toContain('<title>Rory’s typing in October and November</title>');
      expect(message.headers['List-Unsubscribe-Post']).toBe('List-Unsubscribe=One-Click');

      const created = (await send(t.http, cast.owner, 'post', `/api/summaries/${draft.id}/send`).expect(200))
        .body as SummaryDto;
      expect(created.status).toBe('sending');
      expect(created.text).toBe(edited);
      expect(created.recipients.map((r) => [r.status, r.round])).toEqual([['queued', 1]]);
      // Sent: it never changes, and is not sent twice by this route.
      await send(t.http, cast.owner, 'post', `/api/summaries/${draft.id}/send`).expect(409);
      await send(t.http, cast.owner, 'patch', `/api/summaries/${draft.id}`, { text: 'x' }).expect(409);
      await send(t.http, cast.owner, 'delete', `/api/summaries/${draft.id}`).expect(409);
      const [row] = await t.dataSource.getRepository(SummaryRecipient).findBy({ summaryId: created.id });
      // The job is on the pg-boss queue under the id stored with the row.
      expect((await boss.getJobById(SUMMARY_MAIL_QUEUE, row.jobId ?? ''))?.data).toEqual({
        recipientId: row.id,
      });

      // The worker's step, run in-process.
      const up = smtpTransport(Number(process.env.SMTP_PORT ?? 1025));
      expect(await deliverSummaryEmail(t.dataSource, audit, up, SETTINGS, row.id, false)).toBe('sent');
      const sent = (await send(t.http, cast.owner, 'get', `/api/summaries/${created.id}`).expect(200))
        .body as SummaryDto;
      expect([sent.status, sent.recipients[0].status, sent.recipients[0].stopped]).toEqual([
        'sent',
        'sent',
        false,
      ]);
      const [mail] = await inboxFor(row.email);
      // The edited text, verbatim, in the message the fake server received.
      expect(mail.text).toContain(edited);
      expect(mail.subject).toBe('Rory’s typing in October and November');
      expect(mail.html).toContain('Rory used the new suggestions all month.');
      // RFC 8058 / RFC 2369: the one-click stop headers beside the link, in the message as received.
      const source = await (await fetch(`${mailApi()}/${mail.id}/source`)).text();
      expect(source).toMatch(/^List-Unsubscribe-Post: List-Unsubscribe=One-Click\r?$/m);
      expect(source).toMatch(
        new RegExp(`^List-Unsubscribe:\\s*<[^>]*/api/summaries/stop/${row.stopToken}>`, 'm'),
      );

      // The stop link, without a session. Opening it (as a mail scanner would) changes nothing.
      const stopPath = `/api/summaries/stop/${row.stopToken}`;
      expect(mail.text).toContain(stopPath);
      const page = await send(t.http, cast.anonymous, 'get', stopPath).expect(200);
      expect(page.text).toContain('<form method="post" action="' + row.stopToken + '">');
      expect(page.text).toContain('Stop these e-mails');
      const unchanged = (await send(t.http, cast.owner, 'get', `/api/summaries/${created.id}`).expect(200))
        .body as SummaryDto;
      expect(unchanged.recipients[0].stopped).toBe(false);
      // The button's POST: no session, no CSRF token (RFC 8058 one-click body), and idempotent.
      const stopped = await send(t.http, cast.anonymous, 'post', stopPath)
        .type('form')
        .send('List-Unsubscribe=One-Click')
        .expect(200);
      expect(stopped.text).toContain(
        'You will get no more progress e-mails about Rory from Willowmere Community Communication Clinic.',
      );
      await send(t.http, cast.anonymous, 'post', stopPath).expect(200);
      expect((await send(t.http, cast.anonymous, 'get', stopPath).expect(200)).text).toContain(
        'Progress e-mails stopped',
      );
      await send(t.http, cast.anonymous, 'get', `/api/summaries/stop/${'x'.repeat(43)}`).expect(404);
      await send(t.http, cast.anonymous, 'post', `/api/summaries/stop/${'x'.repeat(43)}`).expect(404);
      // Other POSTs without a token are still refused by the CSRF guard (403).
      await send(t.http, cast.anonymous, 'post', '/api/auth/login', { email: 'a@b.example' }).expect(403);
      const events = await t.dataSource
        .getRepository(AuditEvent)
        .find({ where: { action: 'summary.stop', clientId: httpClientId } });
      expect(events).toHaveLength(1);
      const after = (await send(t.http, cast.owner, 'get', `/api/summaries/${created.id}`).expect(200))
        .body as SummaryDto;
      expect(after.recipients[0].stopped).toBe(true);
      // Honoured next time: no re-send to them, and a new summary refuses them.
      await send(t.http, cast.owner, 'post', `/api/summaries/${created.id}/resend`).expect(409);
      await send(
        t.http,
        cast.owner,
        'post',
        `/api/clients/${httpClientId}/summaries`,
        body([consenting]),
      ).expect(400);
      const list = (
        await send(t.http, cast.owner, 'get', `/api/clients/${httpClientId}/summaries`).expect(200)
      ).body as SummaryDto[];
      expect(list.map((s) => s.id)).toEqual([created.id]);
    });

    it('names the clinic and the preferred name on the stop page, and stops every contact of the client at that address', async () => {
      // The clinic's details as an admin saved them (invented; 01632 960xxx is Ofcom's drama range).
      await send(t.http, cast.admin, 'put', '/api/clinic-settings', {
        name: 'Larchfield <Speech> & Access',
        phone: '01632 960 731',
        address: '12 Quarry Row\nLarchfield',
      }).expect(200);
      const client = await newClient(t.http, cast.owner, undefined, 'S. Marlowe');
      await send(t.http, cast.owner, 'patch', `/api/clients/${client.id}`, { preferredName: 'Sam' }).expect(
        200,
      );
      const other = await newClient(t.http, cast.owner, undefined, 'T. Marlowe');
      const address = `ann-${randomBytes(4).toString('hex')}@family.example`;
      const contacts = t.dataSource.getRepository(FamilyContact);
      const contact = (clientId: string, email: string, legacyDuplicateEmail = false) =>
        contacts.save({
          clientId,
          name: 'Ann Marlowe',
          relationship: 'aunt',
          email,
          consentToSummaries: true,
          unsubscribedAt: null,
          legacyDuplicateEmail,
        });
      const written = await contact(client.id, address);
      // The same address in other case on an older duplicate record of the same client (the unique
      // index leaves those alone), another address of the same client, the same address at another client.
      const duplicate = await contact(client.id, address.toUpperCase(), true);
      const elsewhere = await contact(client.id, `other-${address}`);
      const otherClients = await contact(other.id, address);
      const recipient = await sentSummaryTo(t.dataSource, client.id, written);
      const stopPath = `/api/summaries/stop/${recipient.stopToken}`;

      const page = (await send(t.http, cast.anonymous, 'get', stopPath).expect(200)).text;
      // The clinic's name is text, escaped like every other value on the page.
      expect(page).toContain('<header>Larchfield &lt;Speech&gt; &amp; Access</header>');
      expect(page).toContain(
        'You will get no more progress e-mails about Sam from Larchfield &lt;Speech&gt; &amp; Access. ' +
          'To start them again, contact the clinic on <a href="tel:01632960731">01632 960 731</a>.',
      );
      expect(page).not.toContain('<Speech>');

      const done = (await send(t.http, cast.anonymous, 'post', stopPath).expect(200)).text;
      expect(done).toContain('<h1>Progress e-mails stopped</h1>');
      expect(done).toContain('You will get no more progress e-mails about Sam from');
      const stoppedOf = async (id: string) =>
        (await contacts.findOneByOrFail({ id })).unsubscribedAt !== null;
      expect({
        written: await stoppedOf(written.id),
        duplicate: await stoppedOf(duplicate.id),
        elsewhere: await stoppedOf(elsewhere.id),
        otherClients: await stoppedOf(otherClients.id),
      }).toEqual({ written: true, duplicate: true, elsewhere: false, otherClients: false });

      // An unknown link still names the clinic and how to reach it.
      const unknown = (
        await send(t.http, cast.anonymous, 'get', `/api/summaries/stop/${'y'.repeat(43)}`).expect(404)
      ).text;
      expect(unknown).toContain('contact the clinic on <a href="tel:01632960731">01632 960 731</a>.');
    });

    it('leaves a sent-back version out by default; chosen, it is labelled as not approved; comments only when ticked', async () => {
      // A version the supervisor sent back, inside the period, with the supervisor's reason and a
      // carer's sign-off comment (invented values).
      const sentBack = await t.dataSource.getRepository(ProfileVersion).save({
        clientId: httpClientId,
        number: 2,
        status: 'sent_back',
        settings: {
          order: 5,
          escape: 'C',
          exclusion: true,
          baseWeight: 'auto',
          slots: 5,
          caseFold: false,
          access: { method: 'switch' },
        },
        samples: [],
        metrics: { keystrokeSavings: { '5': 0.3 }, rates: { wpmWithout: 1.9, wpmWith: 65 } },
        trainedAt: new Date('2026-11-10T10:00:00Z'),
        signedOffById: cast.assignedCarer.id,
        signOffComment: 'odd half-words like harb and pian',
        sentBackReason: 'Too many half-words.',
        history: [],
      });
      const period = { from: '2026-10-01', to: '2026-11-30', note: '' };
      const byDefault = (
        await send(
          t.http,
          cast.owner,
          'post',
          `/api/clients/${httpClientId}/summaries/preview`,
          period,
        ).expect(200)
      ).body as SummaryPreview;
      expect(byDefault.versionIds).toEqual([versionId]);
      expect(byDefault.text).not.toContain('Version 2');
      const chosen = (
        await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/summaries/preview`, {
          ...period,
          versionIds: [versionId, sentBack.id],
        }).expect(200)
      ).body as SummaryPreview;
      expect(chosen.text).toContain('Version 2 (not approved: sent back for changes, 10 November 2026)');
      expect(chosen.text).not.toContain('half-words');
      await t.dataSource.getRepository(ProfileVersion).delete({ id: sentBack.id });
    });

    it('refuses to send without a client consent that covers summaries (409)', async () => {
      const other = (await newClient(t.http, cast.owner, undefined, 'T. Fairweather')).id;
      const res = await send(t.http, cast.owner, 'post', `/api/clients/${other}/contacts`, {
        name: 'Jo',
        relationship: 'brother',
        email: 'jo@family.example',
        consentToSummaries: true,
      }).expect(201);
      await send(
        t.http,
        cast.owner,
        'post',
        `/api/clients/${other}/summaries`,
        body([(res.body as { id: string }).id]),
      ).expect(409);
    });

    it('lets pg-boss hand the queued e-mail to the worker step, which delivers it once', async () => {
      const res = await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/contacts`, {
        name: 'Pat',
        relationship: 'father',
        email: `pat-${randomBytes(4).toString('hex')}@family.example`,
        consentToSummaries: true,
      }).expect(201);
      const created = await draftAndSend([(res.body as { id: string }).id]);
      const sender = createSmtpSender({
        host: '127.0.0.1',
        port: Number(process.env.SMTP_PORT ?? 1025),
        secure: false,
      });
      await startSummaryMailWork(boss, t.dataSource, audit, sender, SETTINGS, { log: () => undefined });
      try {
        const id = created.recipients[0].id;
        for (let i = 0; i < 100 && (await reload(id)).status === 'queued'; i++) {
          await new Promise((resolve) => setTimeout(resolve, 200));
        }
        expect((await reload(id)).status).toBe('sent');
        expect(await inboxFor(created.recipients[0].email)).toHaveLength(1);
      } finally {
        await boss.offWork(SUMMARY_MAIL_QUEUE);
      }
    });

    it('lets the same people read summaries as read the contacts, and only the owner send (role × route)', async () => {
      const read: number[] = [];
      const contacts: number[] = [];
      const write: number[] = [];
      for (const key of castOrder) {
        const who = cast[key];
        read.push((await send(t.http, who, 'get', `/api/clients/${httpClientId}/summaries`)).status);
        contacts.push((await send(t.http, who, 'get', `/api/clients/${httpClientId}/contacts`)).status);
        // A valid body naming a contact of nobody: the owner gets 400 from the contact check, the others
        // are stopped before it (404 out of sight, 403 wrong role, 401 no session).
        write.push(
          (await send(t.http, who, 'post', `/api/clients/${httpClientId}/summaries`, body([randomUUID()])))
            .status,
        );
      }
      expect(read).toEqual(contacts);
      // owner, other clinician, supervisor, assigned carer, unassigned carer, admin, no session.
      expect(write).toEqual([400, 404, 403, 403, 403, 403, 401]);
    });

    it('previews the text and charts from the stored metrics without storing anything', async () => {
      const listPath = `/api/clients/${httpClientId}/summaries`;
      const before = ((await send(t.http, cast.owner, 'get', listPath).expect(200)).body as SummaryDto[])
        .length;
      const preview = (
        await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/summaries/preview`, {
          from: '2026-10-01',
          to: '2026-11-30',
          note: 'Draft note.',
        }).expect(200)
      ).body as SummaryPreview;
      expect(preview.text).toContain(
        'Version 1 (approved, in use, 3 November 2026): about 4 in 10 key presses saved',
      );
      expect(preview.text).toContain('Draft note.');
      expect(preview.charts.map((c) => c.name)).toEqual(['keystroke-savings.png', 'typing-speed.png']);
      expect(preview.charts[0].alt).toContain('version 1: 42%');
      const png = Buffer.from(preview.charts[0].pngBase64, 'base64');
      expect(png.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a'); // PNG signature (PNG spec 5.2)
      // A period without versions: no charts.
      const empty = (
        await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/summaries/preview`, {
          from: '2025-01-01',
          to: '2025-01-31',
        }).expect(200)
      ).body as SummaryPreview;
      expect([empty.versionIds, empty.charts]).toEqual([[], []]);
      await send(t.http, cast.supervisor, 'post', `/api/clients/${httpClientId}/summaries/preview`, {
        from: '2026-10-01',
        to: '2026-11-30',
      }).expect(403);
      expect(
        ((await send(t.http, cast.owner, 'get', listPath).expect(200)).body as SummaryDto[]).length,
      ).toBe(before);
    });
    it('adds the carer’s trials in the period to the text and the stored figures (means of trials.measures)', async () => {
      // Rows as the test keyboard's POST stores them (only the columns the summary reads matter).
      const trial = (finishedAt: string, measures: object) =>
        t.dataSource.query(
          `INSERT INTO trials (local_trial_id, profile_version_id, client_id, user_name, user_role,
                               started_at, finished_at, text, settings, events, measures, simulated)
           VALUES ($1, $2, $3, 'Hannah', 'carer', $4::timestamptz - interval '2 minutes', $4, 'hi pepper',
                   '{}', '[]', $5, '{}')`,
          [randomUUID(), versionId, httpClientId, finishedAt, JSON.stringify(measures)],
        );
      await trial('2026-11-10T10:00:00Z', { characters: 120, keystrokeSavings: 0.25, wpm: 1.8 });
      await trial('2026-11-12T10:00:00Z', { characters: 90, keystrokeSavings: 0.35, wpm: 2.2 });
      await trial('2026-11-13T10:00:00Z', { characters: 40, keystrokeSavings: null, wpm: null }); // no time
      await trial('2026-11-14T10:00:00Z', { characters: 6, keystrokeSavings: 0.9, wpm: 30 }); // too short
      await trial('2026-12-05T10:00:00Z', { characters: 200, keystrokeSavings: 0.9, wpm: 9 }); // after the period
      // The carer's sign-off comment is quoted after the trials (the user named by the cast's label).
      await t.dataSource.query(
        `UPDATE profile_versions SET signed_off_by_id = $2, sign_off_comment = $3 WHERE id = $1`,
        [versionId, cast.assignedCarer.id, 'He liked the sailing words.'],
      );
      const period = { from: '2026-10-01', to: '2026-11-30', note: '' };
      const preview = (
        await send(
          t.http,
          cast.owner,
          'post',
          `/api/clients/${httpClientId}/summaries/preview`,
          period,
        ).expect(200)
      ).body as SummaryPreview;
      // Means over the measured trials in the period: (0.25 + 0.35) / 2 = 0.30, (1.8 + 2.2) / 2 = 2.0
      // (derived); the 6-character trial is left out.
      expect(preview.text).toContain(
        'In 3 tries on the test keyboard, about 3 in 10 key presses were saved, at roughly 2 words a minute.',
      );
      // A staff comment is never quoted unless ticked.
      expect(preview.text).not.toContain('sailing words');
      const ticked = (
        await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/summaries/preview`, {
          ...period,
          includeComments: [{ versionId, kind: 'sign-off' }],
        }).expect(200)
      ).body as SummaryPreview;
      expect(ticked.text).toContain('assigned carer tried it and wrote: “He liked the sailing words.”');
      const contact = (
        await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/contacts`, {
          name: 'Rosa',
          relationship: 'mother',
          email: `rosa-${randomBytes(4).toString('hex')}@family.example`,
          consentToSummaries: true,
        }).expect(201)
      ).body as { id: string };
      const created = (
        await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/summaries`, {
          ...period,
          contactIds: [contact.id],
        }).expect(201)
      ).body as SummaryDto;
      expect(created.text).toBe(preview.text);
      expect(created.notes).toEqual(
        expect.arrayContaining([
          'Version 1: 1 trial shorter than 20 characters was left out of the trial figures (too short to measure).',
        ]),
      );
      expect(created.availableComments).toEqual([
        expect.objectContaining({ versionId, kind: 'sign-off', text: 'He liked the sailing words.' }),
      ]);
      // Ticking the comment on the draft writes the generated text again (it was not edited).
      const withComment = (
        await send(t.http, cast.owner, 'patch', `/api/summaries/${created.id}`, {
          includeComments: [{ versionId, kind: 'sign-off' }],
        }).expect(200)
      ).body as SummaryDto;
      expect(withComment.text).toBe(ticked.text);
      const stored = await t.dataSource.getRepository(Summary).findOneByOrFail({ id: created.id });
      const tried = stored.figures[0]?.trials;
      expect(tried?.count).toBe(3);
      expect(tried?.keystrokeSavings).toBeCloseTo(0.3, 10);
      expect(tried?.wpm).toBeCloseTo(2.0, 10);
    });

    it('leaves out a trial speed more than twice the estimate, and tells the clinician why', async () => {
      // One more trial in the period, 100 characters at 30 words a minute (invented): the mean of the
      // three measured speeds is (1.8 + 2.2 + 30) / 3 ≈ 11.3, over twice the estimate of 2.72 (derived).
      await t.dataSource.query(
        `INSERT INTO trials (local_trial_id, profile_version_id, client_id, user_name, user_role,
                             started_at, finished_at, text, settings, events, measures, simulated)
         VALUES ($1, $2, $3, 'Hannah', 'carer', '2026-11-20T09:58:00Z', '2026-11-20T10:00:00Z', 'hi pepper',
                 '{}', '[]', $4, '{}')`,
        [
          randomUUID(),
          versionId,
          httpClientId,
          JSON.stringify({ characters: 100, keystrokeSavings: 0.3, wpm: 30 }),
        ],
      );
      const contact = (
        await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/contacts`, {
          name: 'Tess',
          relationship: 'cousin',
          email: `tess-${randomBytes(4).toString('hex')}@family.example`,
          consentToSummaries: true,
        }).expect(201)
      ).body as { id: string };
      const draft = (
        await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/summaries`, {
          from: '2026-10-01',
          to: '2026-11-30',
          contactIds: [contact.id],
        }).expect(201)
      ).body as SummaryDto;
      expect(draft.text).toContain('In 4 tries on the test keyboard, about 3 in 10 key presses were saved.');
      expect(draft.text).not.toMatch(/tries on the test keyboard[^.]*words a minute/);
      expect(draft.notes).toEqual(
        expect.arrayContaining([
          expect.stringMatching(
            /^Version 1: the measured trial speed \(11\.3 words a minute\) is more than 2 times the estimate \(2\.7\)/,
          ),
        ]),
      );
      await send(t.http, cast.owner, 'delete', `/api/summaries/${draft.id}`).expect(204);
    });

    describe('exactly once: Idempotency-Key and one round at a time', () => {
      const up = () => smtpTransport(Number(process.env.SMTP_PORT ?? 1025));

      async function newContact(name: string): Promise<{ id: string; email: string }> {
        const email = `${name.toLowerCase()}-${randomBytes(4).toString('hex')}@family.example`;
        const res = await send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/contacts`, {
          name,
          relationship: 'aunt',
          email,
          consentToSummaries: true,
        }).expect(201);
        return { id: (res.body as { id: string }).id, email };
      }

      /** Runs the worker's step for every queued e-mail to the contact; the rounds of their rows. */
      async function deliverQueued(contactId: string): Promise<number[]> {
        const rows = await t.dataSource.getRepository(SummaryRecipient).findBy({ contactId });
        for (const row of rows.filter((r) => r.status === 'queued')) {
          expect(await deliverSummaryEmail(t.dataSource, audit, up(), SETTINGS, row.id, false)).toBe('sent');
        }
        return rows.map((r) => r.round).sort((a, b) => a - b);
      }

      /** POST a draft summary to one contact as the owner, with an Idempotency-Key when given. */
      const sendSummary = (contactId: string, key?: string, extra: object = {}) => {
        const req = send(t.http, cast.owner, 'post', `/api/clients/${httpClientId}/summaries`, {
          ...body([contactId]),
          ...extra,
        });
        return key === undefined ? req : req.set('Idempotency-Key', key);
      };
      /** POST …/send for a draft, with an Idempotency-Key when given. */
      const sendDraft = (id: string, key?: string) => {
        const req = send(t.http, cast.owner, 'post', `/api/summaries/${id}/send`);
        return key === undefined ? req : req.set('Idempotency-Key', key);
      };

      const statusCounts = (statuses: number[]) =>
        statuses.reduce<Record<number, number>>(
          (counts, s) => ({ ...counts, [s]: (counts[s] ?? 0) + 1 }),
          {},
        );

      it('makes one summary and sends one e-mail for 20 identical sends at once with one Idempotency-Key', async () => {
        const contact = await newContact('Ines');
        // A structured-field string (RFC 8941), as the draft's examples send it.
        const key = `"${randomUUID()}"`;
        const responses = await Promise.all(Array.from({ length: 20 }, () => sendSummary(contact.id, key)));
        const counts = statusCounts(responses.map((r) => r.status));
        // The first 201; the others either still saw it running (409) or got its result (201).
        expect(Object.keys(counts).sort()).toEqual(
          Object.keys(counts).filter((s) => s === '201' || s === '409'),
        );
        const ids = new Set(responses.filter((r) => r.status === 201).map((r) => (r.body as SummaryDto).id));
        expect(ids.size).toBe(1);
        const [summaryId] = [...ids];
        for (const r of responses.filter((res) => res.status === 409)) {
          expect((r.body as { message: string }).message).toMatch(/still being processed/);
        }
        expect(await t.dataSource.getRepository(Summary).countBy({ id: summaryId })).toBe(1);
        expect(await deliverQueued(contact.id)).toEqual([]);
        // 20 sends of the draft at once with one key: one round, one e-mail; the rest 409 or the result.
        const sendKey = `"${randomUUID()}"`;
        const sends = await Promise.all(Array.from({ length: 20 }, () => sendDraft(summaryId, sendKey)));
        const sendCounts = statusCounts(sends.map((r) => r.status));
        expect(Object.keys(sendCounts).every((code) => code === '200' || code === '409')).toBe(true);
        expect(sendCounts[200]).toBeGreaterThanOrEqual(1);
        expect(await deliverQueued(contact.id)).toEqual([1]);
        expect(await inboxFor(contact.email)).toHaveLength(1);
        // Without a key, a second send of a sent summary: 409, nothing sent.
        await sendDraft(summaryId).expect(409);

        // A retry after the first finished: the first result (201, same summary), nothing sent again.
        const again = await sendSummary(contact.id, key).expect(201);
        expect((again.body as SummaryDto).id).toBe(summaryId);
        // The same key with another body: 422, as the draft says; nothing stored.
        const other = await sendSummary(contact.id, key, { note: 'Other.' }).expect(422);
        expect((other.body as { message: string }).message).toMatch(/different request/);
        expect(await deliverQueued(contact.id)).toEqual([1]);
        expect(await inboxFor(contact.email)).toHaveLength(1);
        // Keys are per user: another clinician's same key is not the owner's (and they may not send: 404).
        await send(
          t.http,
          cast.otherClinician,
          'post',
          `/api/clients/${httpClientId}/summaries`,
          body([contact.id]),
        )
          .set('Idempotency-Key', key)
          .expect(404);
        // A malformed key is refused with a plain message.
        const bad = await sendSummary(contact.id, '"unterminated').expect(400);
        expect((bad.body as { message: string }).message).toMatch(/Idempotency-Key header must be/);
      });

      it('adds one round for 20 resends at once and answers the others 409, never 500', async () => {
        const contact = await newContact('Omar');
        const created = await draftAndSend([contact.id]);
        expect(await deliverQueued(contact.id)).toEqual([1]);
        const resendPath = `/api/summaries/${created.id}/resend`;
        const responses = await Promise.all(
          Array.from({ length: 20 }, () => send(t.http, cast.owner, 'post', resendPath)),
        );
        expect(statusCounts(responses.map((r) => r.status))).toEqual({ 200: 1, 409: 19 });
        for (const r of responses.filter((res) => res.status === 409)) {
          expect((r.body as { message: string }).message).toMatch(/still going out/);
        }
        expect(await deliverQueued(contact.id)).toEqual([1, 2]);
        expect(await inboxFor(contact.email)).toHaveLength(2);

        // With a key: the retry of the same resend answers its result and adds no round.
        const key = `"${randomUUID()}"`;
        const first = await send(t.http, cast.owner, 'post', resendPath)
          .set('Idempotency-Key', key)
          .expect(200);
        const retry = await send(t.http, cast.owner, 'post', resendPath)
          .set('Idempotency-Key', key)
          .expect(200);
        expect((retry.body as SummaryDto).id).toBe((first.body as SummaryDto).id);
        expect(await deliverQueued(contact.id)).toEqual([1, 2, 3]);
        expect(await inboxFor(contact.email)).toHaveLength(3);
      });
    });
  });
});
