import type { Client, Consent, Contact, WithdrawalPreview } from '@keyloom/shared';
import { createHash, randomUUID } from 'node:crypto';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { todayIso } from '../src/consents/consent-status';
import { FamilyContact } from '../src/contacts/family-contact.entity';
import { ContactAddresses1764980000002 } from '../src/migrations/1764980000002-contact-addresses';
import { SummaryRecipient } from '../src/summaries/summary-recipient.entity';
import { type Cast, castOrder, newCast, newClient, send } from './caseload-helpers';
import { sentSummaryTo } from './summary-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

// Correcting what was recorded wrongly: consent records voided as made in error, and family contacts
// (unique addresses, deletion, a stop that stays with the address).
describe('corrections: voiding consent, family contact addresses (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    cast = await newCast(t.http, t.dataSource);
  });
  afterAll(async () => {
    await t.app.close();
  });

  const consentsPath = (clientId: string) => `/api/clients/${clientId}/consents`;
  const record = async (clientId: string, scopes: ('training' | 'summaries')[], givenOn: string) =>
    (
      await send(t.http, cast.owner, 'post', consentsPath(clientId), {
        givenBy: 'client',
        scopes,
        givenOn,
      }).expect(201)
    ).body as Consent;
  const addSamples = async (clientId: string, count: number) => {
    for (let i = 0; i < count; i += 1) {
      await send(t.http, cast.owner, 'post', `/api/clients/${clientId}/samples`, {
        sourceKind: 'messages',
        title: `Message ${i + 1}`,
        text: `Message ${i + 1}: the lighthouse keeper waved at us from the rocks after the storm.`,
      }).expect(201);
    }
  };
  const samplesOf = async (clientId: string) =>
    ((await send(t.http, cast.owner, 'get', `/api/clients/${clientId}`).expect(200)).body as Client)
      .sampleCount;
  const voidPath = (clientId: string, consentId: string) => `${consentsPath(clientId)}/${consentId}/void`;
  const preview = async (clientId: string, consentId: string) =>
    (
      await send(
        t.http,
        cast.owner,
        'get',
        `${consentsPath(clientId)}/${consentId}/withdrawal-preview`,
      ).expect(200)
    ).body as WithdrawalPreview;

  describe('voiding a consent record made in error', () => {
    it('keeps the data while another consent in force covers it, and records who, when and why', async () => {
      const target = await newClient(t.http, cast.owner, undefined, 'V. Voidkeeps');
      const right = await record(target.id, ['training', 'summaries'], '2026-09-14');
      const wrong = await record(target.id, ['training'], '2026-10-01');
      await addSamples(target.id, 2);

      const before = await preview(target.id, wrong.id);
      expect(before.report).toMatchObject({ samplesDeleted: 0, keptScopes: ['training'] });
      expect(before.scopes).toEqual([
        { scope: 'training', coveredBy: [{ id: right.id, givenOn: '2026-09-14', expiresOn: null }] },
      ]);

      const reason = 'Recorded for the wrong client.';
      const voided = (
        await send(t.http, cast.owner, 'post', voidPath(target.id, wrong.id), { reason }).expect(200)
      ).body as Consent;
      expect(voided).toMatchObject({
        status: 'voided',
        voidedBy: 'clinician owner',
        voidReason: reason,
        voidReport: { samplesDeleted: 0, keptScopes: ['training'] },
        withdrawnAt: null,
      });
      expect(voided.voidedAt).not.toBeNull();
      expect(await samplesOf(target.id)).toBe(2);

      // Voided stays in the list (struck through by the client app), with its reason.
      const list = (await send(t.http, cast.supervisor, 'get', consentsPath(target.id)).expect(200))
        .body as Consent[];
      expect(list.find((c) => c.id === wrong.id)).toMatchObject({ status: 'voided', voidReason: reason });

      const [event] = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'consent.void', subjectId: wrong.id });
      expect(event).toMatchObject({ clientId: target.id, actorId: cast.owner.id });
      expect(event.details).toMatchObject({
        samplesDeleted: 0,
        keptScopes: ['training'],
        // The reason itself stays on the record; the log ties to it by its hash.
        reasonSha256: createHash('sha256').update(reason).digest('hex'),
      });
    });

    it('voiding the only consent deletes what it covered, as the dry run listed; a second void is 409', async () => {
      const target = await newClient(t.http, cast.owner, undefined, 'O. Onlyconsent');
      const only = await record(target.id, ['training'], '2026-09-14');
      await addSamples(target.id, 3);

      const dryRun = await preview(target.id, only.id);
      expect(dryRun.report).toMatchObject({ samplesDeleted: 3, keptScopes: [] });
      expect(dryRun.scopes).toEqual([{ scope: 'training', coveredBy: [] }]);
      expect(await samplesOf(target.id)).toBe(3);

      const voided = (
        await send(t.http, cast.owner, 'post', voidPath(target.id, only.id), {
          reason: 'The date and the scope were both typed wrongly.',
        }).expect(200)
      ).body as Consent;
      expect(voided.voidReport).toEqual(dryRun.report);
      expect(await samplesOf(target.id)).toBe(0);
      const summary = (await send(t.http, cast.owner, 'get', `/api/clients/${target.id}`).expect(200))
        .body as Client;
      expect(summary).toMatchObject({ consentStatus: 'none', trainingConsent: false });

      const again = await send(t.http, cast.owner, 'post', voidPath(target.id, only.id), {
        reason: 'Again.',
      }).expect(409);
      expect(again.body.message).toBe('This consent record was already voided.');
      // Neither withdrawn nor previewed once voided.
      await send(t.http, cast.owner, 'post', `${consentsPath(target.id)}/${only.id}/withdraw`, {
        reason: 'x',
      }).expect(409);
      await send(
        t.http,
        cast.owner,
        'get',
        `${consentsPath(target.id)}/${only.id}/withdrawal-preview`,
      ).expect(409);
    });

    it('only the owning clinician may void (403/404/401 for the others); a reason is required', async () => {
      const target = await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Rolecheck');
      const given = await record(target.id, ['training'], '2026-09-14');
      const statuses: number[] = [];
      for (const who of castOrder.filter((w) => w !== 'owner')) {
        const res = await send(t.http, cast[who], 'post', voidPath(target.id, given.id), { reason: 'No.' });
        statuses.push(res.status);
      }
      // other clinician, supervisor, assigned carer, unassigned carer, admin, no session
      expect(statuses).toEqual([404, 403, 403, 403, 403, 401]);
      const bad = await send(t.http, cast.owner, 'post', voidPath(target.id, given.id), {
        reason: '  ',
      }).expect(400);
      expect((bad.body.issues as { path: string }[]).map((i) => i.path)).toContain('reason');
      await send(t.http, cast.owner, 'post', voidPath(target.id, randomUUID()), { reason: 'x' }).expect(404);
      const after = (await send(t.http, cast.owner, 'get', consentsPath(target.id)).expect(200))
        .body as Consent[];
      expect(after[0]).toMatchObject({ id: given.id, status: 'active', voidedAt: null });
    });

    it('a withdrawn record cannot be voided (409); a voided one is not counted by a later withdrawal', async () => {
      const target = await newClient(t.http, cast.owner, undefined, 'W. Withdrawfirst');
      const first = await record(target.id, ['training'], '2026-09-14');
      const second = await record(target.id, ['training'], '2026-10-01');
      await addSamples(target.id, 2);
      // The second was recorded in error: voided, it keeps nothing, so withdrawing the first deletes.
      await send(t.http, cast.owner, 'post', voidPath(target.id, second.id), {
        reason: 'Duplicate entry.',
      }).expect(200);
      const withdrawn = await send(
        t.http,
        cast.owner,
        'post',
        `${consentsPath(target.id)}/${first.id}/withdraw`,
        {
          reason: 'The client asked.',
        },
      ).expect(200);
      expect((withdrawn.body as Consent).withdrawal).toMatchObject({ samplesDeleted: 2, keptScopes: [] });
      await send(t.http, cast.owner, 'post', voidPath(target.id, first.id), { reason: 'x' }).expect(409);
    });

    it('refuses a "given on" date in the future with 400 and a plain message', async () => {
      const target = await newClient(t.http, cast.owner, undefined, 'F. Futuredate');
      const today = todayIso();
      const tomorrow = new Date(`${today}T12:00:00Z`);
      tomorrow.setUTCDate(tomorrow.getUTCDate() + 1);
      const res = await send(t.http, cast.owner, 'post', consentsPath(target.id), {
        givenBy: 'client',
        scopes: ['training'],
        givenOn: tomorrow.toISOString().slice(0, 10),
      }).expect(400);
      expect(res.body.issues).toContainEqual({
        path: 'givenOn',
        message: 'The date consent was given cannot be in the future.',
      });
    });
  });

  describe('family contacts', () => {
    let client: Client;
    const base = () => `/api/clients/${client.id}/contacts`;
    const addContact = (body: Partial<Contact> & { email: string }) =>
      send(t.http, cast.owner, 'post', base(), {
        name: 'Ann Ashby',
        relationship: 'sister',
        consentToSummaries: true,
        ...body,
      });

    beforeAll(async () => {
      client = await newClient(t.http, cast.owner, undefined, 'R. Ashby');
      await record(client.id, ['training', 'summaries'], '2026-09-14');
    });

    /** A summary sent to `contact` (its recipient row, with a stop token). */
    const sentTo = (contact: Contact) => sentSummaryTo(t.dataSource, client.id, contact);
    /** The stop link of a summary sent to `contact`, used (as the family member would). */
    const useStopLink = async (contact: Contact) => {
      const recipient = await sentTo(contact);
      await send(t.http, cast.anonymous, 'post', `/api/summaries/stop/${recipient.stopToken}`).expect(200);
    };

    it('refuses a second contact with the same address in another case: 409 naming the client', async () => {
      await addContact({ email: 'ann.ashby@family.example' }).expect(201);
      const res = await addContact({ name: 'Ann A.', email: 'Ann.Ashby@Family.EXAMPLE' }).expect(409);
      expect(res.body.message).toBe(
        'R. Ashby already has a contact with this address: ann.ashby@family.example. Change that contact instead.',
      );
      const other = (await addContact({ name: 'Bob Ashby', email: 'bob@family.example' }).expect(201))
        .body as Contact;
      // Nor by changing another contact's address onto it.
      await send(t.http, cast.owner, 'patch', `${base()}/${other.id}`, {
        email: 'ANN.ashby@family.example',
      }).expect(409);
      const list = (await send(t.http, cast.owner, 'get', base()).expect(200)).body as Contact[];
      expect(list.map((c) => c.email).sort()).toEqual(['ann.ashby@family.example', 'bob@family.example']);
      // The database refuses it too (a unique index on client and lower-cased address).
      await expect(
        t.dataSource.query(
          `INSERT INTO family_contacts (client_id, name, relationship, email, consent_to_summaries)
           VALUES ($1, 'x', 'y', 'ANN.ASHBY@family.example', false)`,
          [client.id],
        ),
      ).rejects.toThrow(/UQ_family_contacts_client_email/);
    });

    it('deletes a contact (owner only), audited; a summary already sent keeps its record', async () => {
      const contact = (
        await addContact({ name: 'Cy Ashby', email: 'cy@family.example', consentToSummaries: false }).expect(
          201,
        )
      ).body as Contact;
      const recipient = await sentTo(contact);
      const statuses: number[] = [];
      for (const who of castOrder.filter((w) => w !== 'owner')) {
        statuses.push((await send(t.http, cast[who], 'delete', `${base()}/${contact.id}`)).status);
      }
      expect(statuses).toEqual([404, 403, 403, 403, 403, 401]);
      await send(t.http, cast.owner, 'delete', `${base()}/${contact.id}`).expect(204);
      await send(t.http, cast.owner, 'delete', `${base()}/${contact.id}`).expect(404);
      const list = (await send(t.http, cast.owner, 'get', base()).expect(200)).body as Contact[];
      expect(list.map((c) => c.id)).not.toContain(contact.id);
      const kept = await t.dataSource.getRepository(SummaryRecipient).findOneByOrFail({ id: recipient.id });
      expect(kept).toMatchObject({
        contactId: null,
        name: 'Cy Ashby',
        email: 'cy@family.example',
        status: 'sent',
      });
      const [event] = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'contact.delete', subjectId: contact.id });
      expect(event).toMatchObject({ clientId: client.id, actorId: cast.owner.id });
      expect(event.details).toEqual({ summariesKept: 1, consentToSummaries: false, stopped: false });
    });

    it('a stopped address stays stopped: not by editing, nor by another contact carrying it', async () => {
      const dana = (await addContact({ name: 'Dana Ashby', email: 'dana@family.example' }).expect(201))
        .body as Contact;
      await useStopLink(dana);
      const stopped = (await send(t.http, cast.owner, 'get', base()).expect(200)).body as Contact[];
      expect(stopped.find((c) => c.id === dana.id)?.unsubscribedAt).not.toBeNull();

      // Editing: unticking then ticking again is refused; a change of case keeps the stop.
      await send(t.http, cast.owner, 'patch', `${base()}/${dana.id}`, { consentToSummaries: false }).expect(
        200,
      );
      const ticked = await send(t.http, cast.owner, 'patch', `${base()}/${dana.id}`, {
        consentToSummaries: true,
      }).expect(409);
      expect(ticked.body.message).toMatch(/used the stop link/);
      const recased = (
        await send(t.http, cast.owner, 'patch', `${base()}/${dana.id}`, {
          email: 'DANA@family.example',
        }).expect(200)
      ).body as Contact;
      expect(recased.unsubscribedAt).not.toBeNull();

      // Deleted and added again (as another contact), the address is still stopped.
      await send(t.http, cast.owner, 'delete', `${base()}/${dana.id}`).expect(204);
      await addContact({ name: 'D. Ashby', email: 'Dana@Family.example' }).expect(409);
      const again = (
        await addContact({
          name: 'D. Ashby',
          email: 'dana@family.example',
          consentToSummaries: false,
        }).expect(201)
      ).body as Contact;
      expect(again.unsubscribedAt).not.toBeNull();
      await send(t.http, cast.owner, 'patch', `${base()}/${again.id}`, { consentToSummaries: true }).expect(
        409,
      );
      // Moving another contact onto the stopped address brings the stop with it.
      const eve = (await addContact({ name: 'Eve Ashby', email: 'eve@family.example' }).expect(201))
        .body as Contact;
      await send(t.http, cast.owner, 'delete', `${base()}/${again.id}`).expect(204);
      const moved = (
        await send(t.http, cast.owner, 'patch', `${base()}/${eve.id}`, {
          email: 'dana@family.example',
        }).expect(200)
      ).body as Contact;
      expect(moved.unsubscribedAt).not.toBeNull();
      // The summaries route refuses it as a recipient (it checks the stop on the contact).
      const row = await t.dataSource.getRepository(FamilyContact).findOneByOrFail({ id: eve.id });
      expect(row.unsubscribedAt).not.toBeNull();
    });

    it('the family’s new consent, recorded by the clinician with its date and giver, turns summaries on', async () => {
      const fay = (await addContact({ name: 'Fay Ashby', email: 'fay@family.example' }).expect(201))
        .body as Contact;
      // Renewing an address that was never stopped: 409.
      await send(t.http, cast.owner, 'post', `${base()}/${fay.id}/summaries-consent`, {
        givenOn: '2026-11-02',
        givenBy: 'Fay Ashby',
      }).expect(409);
      await useStopLink(fay);
      const renewPath = `${base()}/${fay.id}/summaries-consent`;
      // Only the owning clinician; a date and who gave it are required; not in the future.
      const statuses: number[] = [];
      for (const who of castOrder.filter((w) => w !== 'owner')) {
        statuses.push(
          (await send(t.http, cast[who], 'post', renewPath, { givenOn: '2026-11-02', givenBy: 'Fay Ashby' }))
            .status,
        );
      }
      expect(statuses).toEqual([404, 403, 403, 403, 403, 401]);
      const missing = await send(t.http, cast.owner, 'post', renewPath, { givenOn: '2999-01-01' }).expect(
        400,
      );
      expect((missing.body.issues as { path: string }[]).map((i) => i.path).sort()).toEqual([
        'givenBy',
        'givenOn',
      ]);

      const renewed = (
        await send(t.http, cast.owner, 'post', renewPath, {
          givenOn: '2026-11-02',
          givenBy: 'Fay Ashby',
        }).expect(200)
      ).body as Contact;
      expect(renewed).toMatchObject({
        consentToSummaries: true,
        unsubscribedAt: null,
        summariesConsentGivenOn: '2026-11-02',
        summariesConsentGivenBy: 'Fay Ashby',
      });
      const [event] = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'contact.summaries-consent', subjectId: fay.id });
      expect(event).toMatchObject({ clientId: client.id, actorId: cast.owner.id });
      expect(event.details).toMatchObject({ givenOn: '2026-11-02' });
      expect(JSON.stringify(event.details)).not.toMatch(/Fay|family\.example/);
      const stops = await t.dataSource.query<{ n: number }[]>(
        `SELECT count(*)::int AS n FROM summary_stops WHERE client_id = $1 AND email_key = 'fay@family.example'`,
        [client.id],
      );
      expect(stops[0].n).toBe(0);
    });
  });

  describe('migration ContactAddresses1764980000002 over contacts that already share addresses', () => {
    it('does not fail: keeps every row, marks the later duplicates, copies stops to the address', async () => {
      const migration = new ContactAddresses1764980000002();
      const runner = t.dataSource.createQueryRunner();
      const target = await newClient(t.http, cast.owner, undefined, 'M. Migrated');
      try {
        await migration.down(runner);
        // As the old code allowed: three contacts on one address (any case), one of them stopped.
        for (const [index, [name, email, stopped]] of [
          ['Older', 'same@family.example', false],
          ['Newer', 'SAME@family.example', true],
          ['Newest', 'Same@Family.example', false],
          ['Apart', 'apart@family.example', false],
        ].entries()) {
          await runner.query(
            `INSERT INTO family_contacts (client_id, name, relationship, email, consent_to_summaries, unsubscribed_at, created_at)
             VALUES ($1, $2, 'cousin', $3, true, $4, now() + ($5 || ' seconds')::interval)`,
            [target.id, name, email, stopped ? new Date('2026-10-01T08:00:00Z') : null, String(index)],
          );
        }
        await migration.up(runner);
      } finally {
        await runner.release();
      }
      const rows = await t.dataSource.query<
        { name: string; legacy_duplicate_email: boolean; unsubscribed_at: Date | null }[]
      >(
        `SELECT name, legacy_duplicate_email, unsubscribed_at FROM family_contacts WHERE client_id = $1 ORDER BY created_at`,
        [target.id],
      );
      const byName = Object.fromEntries(rows.map((row) => [row.name, row]));
      expect(rows).toHaveLength(4);
      expect(byName.Older.legacy_duplicate_email).toBe(false);
      expect(byName.Apart.legacy_duplicate_email).toBe(false);
      // The oldest contact of the address keeps it; the later ones are marked, not changed.
      expect(byName.Newer.legacy_duplicate_email).toBe(true);
      expect(byName.Newest.legacy_duplicate_email).toBe(true);
      // The stop now holds for every contact on that address, and for the address itself.
      for (const name of ['Older', 'Newer', 'Newest']) expect(byName[name].unsubscribed_at).not.toBeNull();
      expect(byName.Apart.unsubscribed_at).toBeNull();
      const stops = await t.dataSource.query<{ email_key: string }[]>(
        `SELECT email_key FROM summary_stops WHERE client_id = $1`,
        [target.id],
      );
      expect(stops).toEqual([{ email_key: 'same@family.example' }]);
      // The API still refuses one more contact on that address.
      await send(t.http, cast.owner, 'post', `/api/clients/${target.id}/contacts`, {
        name: 'Fourth',
        relationship: 'cousin',
        email: 'same@family.example',
        consentToSummaries: false,
      }).expect(409);
    });
  });
});
