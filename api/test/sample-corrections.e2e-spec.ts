// Correcting samples over HTTP against real PostgreSQL: deleting a sample uploaded by mistake (until a
// version trains on it), including a left-out sample again, and undoing a redaction (until a version
// trains on the sample). Phone numbers are from Ofcom's drama range (07700 900xxx).
import type { SampleDetail, SampleSummary, UploadResult } from '@keyloom/shared';
import { createHash, randomUUID } from 'node:crypto';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { type Caller, type Cast, newCast, newClient, newConsent, send, statusesOf } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

// More than the 500 characters a profile needs, so a version can start training on one sample.
const LONG =
  'We took the dinghy out past the harbour wall this morning and the wind was kind to us all the way. ' +
  'Pepper sat in the bow and barked at every gull that came near, which the gulls did not mind at all. ' +
  'After lunch I rang my sister on 07700 900123 to tell her about the seals on the sandbank by the point. ' +
  'She wants to come down on Friday and bring the children, so we will need the bigger boat from the club. ' +
  'In the evening there was jazz at the club and I stayed for the whole second set, which I never do.\n';

describe('sample corrections (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;
  let clientId: string;

  const get = (who: Caller, path: string) => send(t.http, who, 'get', path);
  const post = (who: Caller, path: string, body?: object) => send(t.http, who, 'post', path, body ?? {});
  const del = (who: Caller, path: string, body?: object) => send(t.http, who, 'delete', path, body ?? {});

  async function paste(text: string, title = 'Diary'): Promise<SampleSummary> {
    const res = await post(cast.owner, `/api/clients/${clientId}/samples`, {
      title,
      text: `${text} ${randomUUID()}\n`,
      sourceKind: 'diary',
    }).expect(201);
    return (res.body as UploadResult).samples[0];
  }

  const detail = async (id: string) =>
    (await get(cast.owner, `/api/samples/${id}`).expect(200)).body as SampleDetail;

  /** Configures a version on `sampleIds` and starts its training through the API. */
  async function startTraining(sampleIds: string[]): Promise<number> {
    const res = await post(cast.owner, `/api/clients/${clientId}/profile-versions`, {
      settings: {},
      sampleIds,
    }).expect(201);
    const version = res.body as { id: string; number: number };
    await post(cast.owner, `/api/profile-versions/${version.id}/train`).expect(200);
    return version.number;
  }

  const events = (action: string, subjectId: string) =>
    t.dataSource.getRepository(AuditEvent).findBy({ action, subjectId });

  const statuses = (make: (who: Caller) => PromiseLike<{ status: number }>) => statusesOf(cast, make);

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    cast = await newCast(t.http, t.dataSource);
    clientId = (await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Linwood')).id;
    await newConsent(t.http, cast.owner, clientId);
  });
  afterAll(async () => {
    await t.app.close();
  });

  describe('delete', () => {
    it('deletes a sample no version trained on (204, then 404), audited with a hash of the reason', async () => {
      // Long enough for a draft (at least 500 characters of writing).
      const sample = await paste(`Wrong client entirely. ${'We watched the boats come in. '.repeat(18)}`);
      // A draft that never trained freezes it too: the draft loses its copy.
      const draft = await post(cast.owner, `/api/clients/${clientId}/profile-versions`, {
        settings: {},
        sampleIds: [sample.id],
      }).expect(201);
      const reason = 'Uploaded to the wrong client.';
      await del(cast.owner, `/api/samples/${sample.id}`, { reason }).expect(204);
      await get(cast.owner, `/api/samples/${sample.id}`).expect(404);
      const list = (await get(cast.owner, `/api/clients/${clientId}/samples`).expect(200))
        .body as SampleSummary[];
      expect(list.map((s) => s.id)).not.toContain(sample.id);
      const frozen: { n: number }[] = await t.dataSource.query(
        `SELECT jsonb_array_length(samples) AS n FROM profile_versions WHERE id = $1`,
        [(draft.body as { id: string }).id],
      );
      expect(frozen[0].n).toBe(0);
      const [event] = await events('sample.remove', sample.id);
      expect(event.details).toEqual({
        reasonSha256: createHash('sha256').update(reason).digest('hex'),
        sha256: sample.sha256,
        byteSize: sample.byteSize,
        flags: 0,
        draftIds: [(draft.body as { id: string }).id],
      });
      expect(JSON.stringify(event.details)).not.toContain('wrong client');
    });

    it('refuses (409, naming the version) once a version trained on it; the sample stays', async () => {
      const sample = await paste(LONG.replace('on 07700 900123 ', ''));
      expect(sample.status).toBe('ready');
      const number = await startTraining([sample.id]);
      const res = await del(cast.owner, `/api/samples/${sample.id}`, { reason: 'Mistake.' }).expect(409);
      expect((res.body as { message: string }).message).toBe(
        `Version ${number} was trained on it: leave it out of future versions instead.`,
      );
      await get(cast.owner, `/api/samples/${sample.id}`).expect(200);
      expect(await events('sample.remove', sample.id)).toEqual([]);
    });

    it('needs a reason (400) and answers 404 for an unknown id', async () => {
      const sample = await paste('Needs a reason.');
      await del(cast.owner, `/api/samples/${sample.id}`, { reason: '  ' }).expect(400);
      await del(cast.owner, `/api/samples/${sample.id}`, {}).expect(400);
      await del(cast.owner, `/api/samples/${randomUUID()}`, { reason: 'x' }).expect(404);
      await get(cast.owner, `/api/samples/${sample.id}`).expect(200);
    });

    it('only the owning clinician may delete (roles table)', async () => {
      const sample = await paste('Roles for delete.');
      const got = await statuses((who) =>
        who === cast.owner
          ? Promise.resolve({ status: 0 })
          : del(who, `/api/samples/${sample.id}`, { reason: 'x' }),
      );
      // owner (last), other clinician 404, supervisor 403, assigned carer 403, unassigned carer 404 (out of
      // sight), admin 403, no session 401.
      expect(got).toEqual([0, 404, 403, 403, 404, 403, 401]);
      await get(cast.owner, `/api/samples/${sample.id}`).expect(200);
      await del(cast.owner, `/api/samples/${sample.id}`, { reason: 'x' }).expect(204);
    });
  });

  describe('include again', () => {
    it('reverses leaving out; the reason shows in the list while left out; 409 when not left out', async () => {
      const sample = await paste('Nothing personal here.');
      expect(sample.status).toBe('ready');
      await post(cast.owner, `/api/samples/${sample.id}/include`).expect(409);
      await post(cast.owner, `/api/samples/${sample.id}/exclude`, {
        reason: 'Someone else wrote it.',
      }).expect(200);
      const list = (await get(cast.owner, `/api/clients/${clientId}/samples`).expect(200))
        .body as SampleSummary[];
      expect(list.find((s) => s.id === sample.id)?.excludedReason).toBe('Someone else wrote it.');
      const res = await post(cast.owner, `/api/samples/${sample.id}/include`).expect(200);
      expect(res.body).toMatchObject({ id: sample.id, status: 'ready', excludedReason: null });
      await post(cast.owner, `/api/samples/${sample.id}/include`).expect(409);
      const [event] = await events('sample.include', sample.id);
      expect(event.details).toEqual({ openFlags: 0 });
    });

    it('a sample with open flags comes back as needing review', async () => {
      const sample = await paste('Ring me on 07700 900456.');
      await post(cast.owner, `/api/samples/${sample.id}/exclude`, { reason: 'Not sure.' }).expect(200);
      const res = await post(cast.owner, `/api/samples/${sample.id}/include`).expect(200);
      expect(res.body).toMatchObject({ status: 'needs_review', openFlags: 1 });
    });

    it('only the owning clinician may include again (roles table), unknown id 404', async () => {
      const sample = await paste('Roles for include.');
      await post(cast.owner, `/api/samples/${sample.id}/exclude`, { reason: 'x' }).expect(200);
      const got = await statuses((who) => post(who, `/api/samples/${sample.id}/include`));
      expect(got).toEqual([200, 404, 403, 403, 404, 403, 401]);
      await post(cast.owner, `/api/samples/${randomUUID()}/include`).expect(404);
    });
  });

  describe('undo a redaction', () => {
    it('restores the original text, reopens the flag and moves later flags back', async () => {
      const sample = await paste('Ring 07700 900321 or write to kit@example.org today.');
      const before = await detail(sample.id);
      const [phone, email] = before.flags;
      await post(cast.owner, `/api/samples/${sample.id}/flags/${phone.id}`, { action: 'redact' }).expect(200);
      const redacted = await detail(sample.id);
      expect(redacted.text).toContain('⟪phone⟫');
      expect(redacted.text).not.toContain('07700 900321');
      const res = await post(cast.owner, `/api/samples/${sample.id}/flags/${phone.id}/undo`).expect(200);
      const undone = res.body as SampleDetail;
      expect(undone.text).toBe(before.text);
      expect(undone.status).toBe('needs_review');
      expect(undone.flags.map((f) => [f.id, f.status, f.start, f.end, f.text])).toEqual(
        before.flags.map((f) => [f.id, f.status, f.start, f.end, f.text]),
      );
      expect(undone.text.slice(email.start, email.end)).toBe('kit@example.org');
      await post(cast.owner, `/api/samples/${sample.id}/flags/${phone.id}/undo`).expect(409);
      const [event] = await events('sample.flag-undo-redact', sample.id);
      expect(event.details).toEqual({ flagId: phone.id, kind: 'phone' });
      expect(JSON.stringify(event.details)).not.toContain('07700');
    });

    it('refuses (409) once a version started training on the sample, and the original is gone', async () => {
      const sample = await paste(LONG);
      const [flag] = (await detail(sample.id)).flags;
      await post(cast.owner, `/api/samples/${sample.id}/flags/${flag.id}`, { action: 'redact' }).expect(200);
      const kept = async () => {
        const rows: { original_text: string | null }[] = await t.dataSource.query(
          `SELECT original_text FROM sample_flags WHERE id = $1`,
          [flag.id],
        );
        return rows[0].original_text;
      };
      expect(await kept()).toBe('07700 900123');
      await startTraining([sample.id]);
      expect(await kept()).toBeNull();
      const res = await post(cast.owner, `/api/samples/${sample.id}/flags/${flag.id}/undo`).expect(409);
      expect((res.body as { message: string }).message).toMatch(/trained on this sample after the redaction/);
      expect((await detail(sample.id)).text).toContain('⟪phone⟫');
    });

    it('unknown sample or flag 404, an open flag 409, roles table', async () => {
      const sample = await paste('Call 07700 900654 soon.');
      const [flag] = (await detail(sample.id)).flags;
      await post(cast.owner, `/api/samples/${sample.id}/flags/${flag.id}/undo`).expect(409);
      await post(cast.owner, `/api/samples/${randomUUID()}/flags/${flag.id}/undo`).expect(404);
      await post(cast.owner, `/api/samples/${sample.id}/flags/${randomUUID()}/undo`).expect(404);
      await post(cast.owner, `/api/samples/${sample.id}/flags/${flag.id}`, { action: 'redact' }).expect(200);
      const got = await statuses((who) => post(who, `/api/samples/${sample.id}/flags/${flag.id}/undo`));
      expect(got).toEqual([200, 404, 403, 403, 404, 403, 401]);
    });
  });
});
