// Profile versions over HTTP against real PostgreSQL: configure, train through the same
// job handler the worker runs (called in-process here), progress, failure, cancel, retry, the
// sign-off → approval path for every role, concurrent approval, export + verify, withdrawal.
// One test lets pg-boss itself deliver a job to a handler. Training inputs are kept small
// (about 3,000 characters, 2 folds, a 400-character keystroke sample) so the suite stays fast.
import {
  type ProfileReport,
  type ProfileSettings,
  type SampleSummary,
  trainAndEvaluateProfile,
  type UploadResult,
} from '@keyloom/shared';
import { createHmac, randomBytes, randomUUID } from 'node:crypto';
import { crc32 as zlibCrc32 } from 'node:zlib';
import type PgBoss from 'pg-boss';
import request from 'supertest';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { AuditService } from '../src/audit/audit.service';
import {
  createJobBoss,
  PROFILE_TRAINING_QUEUE,
  type ProfileTrainingJobData,
  startJobBoss,
} from '../src/jobs/job-queue';
import { JobQueueService } from '../src/jobs/job-queue.service';
import {
  loadTrainingRuntime,
  runProfileTraining,
  type TrainingOutcome,
  type TrainingRuntime,
} from '../src/profile-versions/profile-training';
import type { FrozenSample } from '../src/profile-versions/profile-version.entity';
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import { newUser, signIn } from './factories';
import { type Caller, type Cast, castOrder, newCast, newClient, newConsent, send } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp, testDatabaseUrl } from './test-app';
import { postTrial } from './trial-helpers';

// Invented for these tests (the demo scenario's voice: sailing, jazz piano, a dog); not from any corpus.
const TEXTS = [
  'Took the dinghy out past the harbour wall this morning. The wind came round to the west and the water ' +
    'was flat for an hour. Pepper sat in the bow and barked at every gull. Hannah says the regatta starts ' +
    'at ten on Saturday and we should be at the club by nine to rig the boat. I want to sail the new course ' +
    'with the downwind leg close to the shore. Back home I practised the slow blues for Thursday, the left ' +
    'hand still drags in the turnaround but it is better than last week.',
  'Hannah: are you coming to the club on Sunday?\nMe: yes, with Pepper. Bring the jazz scores please.\n' +
    'Hannah: the new jib sheet came, I left it in the shed.\nMe: thank you. The wind looks good for Sunday.\n' +
    'Hannah: the regatta committee sent the start times, first gun at ten.\nMe: we will be there at nine.\n' +
    'Hannah: do you want coffee before?\nMe: yes, the café by the harbour opens at eight.',
  'Played at the club on Thursday, three tunes, a slow blues and two ballads. The piano was out of tune in ' +
    'the top octave but nobody minded. Pepper slept under the bench the whole time. Afterwards we walked ' +
    'along the harbour and watched the boats come in. The wind was getting up from the south west and I ' +
    'thought about the regatta and where we can gain on the downwind leg. Hannah bought the drinks and ' +
    'asked me to play at her birthday in the spring.',
  'Rough night, shoulders ached. In the morning Pepper and I sat on the deck and watched the boats go out. ' +
    'Later I wrote to the club secretary about the winter training sessions and the new buoyancy aids. ' +
    'The harbour master says the slipway will be closed for repairs next month, so we will launch from ' +
    'the beach. Practised the ballad again in the afternoon, slower this time, and it sounded warmer.',
];

// The same tiny evaluation for every in-process run: 2 folds, 400-character keystroke sample.
const FOLDS = 2;
const KS_CHARS = 400;

type Version = ProfileVersionDto;

describe('profile versions (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;
  let clientId: string;
  let consentId: string;
  let sampleIds: string[];
  let runtime: TrainingRuntime;
  let audit: AuditService;
  let secondSupervisor: Caller;

  const get = (who: Caller, path: string) => send(t.http, who, 'get', path);
  const post = (who: Caller, path: string, body?: object) => send(t.http, who, 'post', path, body ?? {});

  async function paste(owner: Caller, id: string, title: string, text: string): Promise<SampleSummary> {
    const res = await post(owner, `/api/clients/${id}/samples`, { title, text, sourceKind: 'diary' }).expect(
      201,
    );
    return (res.body as UploadResult).samples[0];
  }

  async function create(body: object = { settings: {} }, id = clientId, who = cast.owner): Promise<Version> {
    const res = await post(who, `/api/clients/${id}/profile-versions`, body).expect(201);
    return res.body as Version;
  }

  async function jobIdOf(versionId: string): Promise<string> {
    const rows: { job_id: string | null }[] = await t.dataSource.query(
      'SELECT job_id FROM profile_versions WHERE id = $1',
      [versionId],
    );
    return rows[0]?.job_id ?? '';
  }

  /** POST train as the owner, then run the worker's handler in-process. */
  async function train(versionId: string, rt: TrainingRuntime = runtime): Promise<TrainingOutcome> {
    await post(cast.owner, `/api/profile-versions/${versionId}/train`).expect(200);
    return runProfileTraining(t.dataSource, audit, versionId, await jobIdOf(versionId), rt);
  }

  async function version(id: string, who: Caller = cast.owner): Promise<Version> {
    return (await get(who, `/api/profile-versions/${id}`).expect(200)).body as Version;
  }

  async function trained(): Promise<Version> {
    const v = await create();
    expect(await train(v.id)).toBe('trained');
    return version(v.id);
  }

  async function signedOff(): Promise<Version> {
    const v = await trained();
    await postTrial(t.http, cast.assignedCarer, v.id).expect(201);
    await post(cast.assignedCarer, `/api/profile-versions/${v.id}/sign-off`, {
      comment: 'Tried it for a week.',
    }).expect(200);
    return version(v.id);
  }

  const auditCount = (action: string, subjectId: string) =>
    t.dataSource.getRepository(AuditEvent).countBy({ action, subjectId });

  /** Statuses of one request per caller of the cast, in castOrder. */
  async function statuses(make: (who: Caller) => request.Test): Promise<number[]> {
    const out: number[] = [];
    for (const key of castOrder) out.push((await make(cast[key])).status);
    return out;
  }

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    audit = t.app.get(AuditService);
    cast = await newCast(t.http, t.dataSource);
    const client = await newClient(t.http, cast.owner, cast.assignedCarer, 'P. Ashcombe');
    clientId = client.id;
    consentId = (await newConsent(t.http, cast.owner, clientId)).id;
    sampleIds = [];
    for (const [i, text] of TEXTS.entries())
      sampleIds.push((await paste(cast.owner, clientId, `Sample ${i + 1}`, text)).id);
    runtime = { ...loadTrainingRuntime(FOLDS), ksSampleChars: KS_CHARS, progressIntervalMs: 10 };
    const user = await newUser(t.dataSource, { role: 'supervisor', name: 'second supervisor' });
    secondSupervisor = {
      label: 'second supervisor',
      role: 'supervisor',
      id: user.id,
      ...(await signIn(t.http, user)),
    };
  });
  afterAll(async () => {
    await t.app.close();
  });

  describe('configure (draft)', () => {
    it('freezes settings (access from the client record) and the ready samples; numbers count up', async () => {
      const a = await create({ settings: { order: 4, slots: 3 }, note: 'First try' });
      const b = await create();
      expect(b.number).toBe(a.number + 1);
      expect(a).toMatchObject({
        status: 'draft',
        progress: 0,
        metrics: null,
        modelBytes: null,
        note: 'First try',
      });
      expect(a.settings).toEqual({
        order: 4,
        escape: 'C',
        exclusion: true,
        baseWeight: 'auto',
        slots: 3,
        caseFold: false,
        access: { method: 'switch', scanIntervalMs: 1200 },
        // The client's vocabulary list, frozen: nothing saved yet, so empty.
        vocabulary: { additions: [], blocks: [] },
      });
      expect(a.samples.map((s) => s.id).sort()).toEqual([...sampleIds].sort());
      expect(a.samples.every((s) => /^[0-9a-f]{64}$/.test(s.sha256))).toBe(true);
      expect(JSON.stringify(a)).not.toContain('harbour'); // the frozen texts are never sent
      expect(a.history).toEqual([expect.objectContaining({ status: 'draft', by: 'clinician owner' })]);
      expect(await auditCount('profile.create', a.id)).toBe(1);
    });

    it('POST: only the owning clinician (role × route)', async () => {
      const got = await statuses((who) =>
        post(who, `/api/clients/${clientId}/profile-versions`, { settings: {} }),
      );
      expect(got).toEqual([201, 404, 403, 403, 403, 403, 401]);
    });

    it('GET list and one: owner, supervisor, assigned carer; admin 403; others 404', async () => {
      const v = await create();
      expect(await statuses((who) => get(who, `/api/clients/${clientId}/profile-versions`))).toEqual([
        200, 404, 200, 200, 404, 403, 401,
      ]);
      expect(await statuses((who) => get(who, `/api/profile-versions/${v.id}`))).toEqual([
        200, 404, 200, 200, 404, 403, 401,
      ]);
      await get(cast.owner, `/api/profile-versions/${randomUUID()}`).expect(404);
    });

    it('describes every field of a version in the OpenAPI document, as the API sends them', async () => {
      const v = await create();
      const doc = await request(t.http).get('/api/docs-json').expect(200);
      type OpenApiContent = { content: { 'application/json': { schema: { properties: object } } } };
      const body = doc.body as {
        paths: Record<string, Record<string, { responses: Record<string, OpenApiContent> }>>;
      };
      const described =
        body.paths['/api/profile-versions/{id}'].get.responses['200'].content['application/json'].schema
          .properties;
      expect(Object.keys(described)).toEqual(
        expect.arrayContaining(['signedOffBy', 'baseModelSha256', 'baseWeight']),
      );
      expect(Object.keys(described).sort()).toEqual(Object.keys(v).sort());
    });

    it('refuses bad settings, foreign or excluded samples, and a client without consent', async () => {
      const base = `/api/clients/${clientId}/profile-versions`;
      await post(cast.owner, base, { settings: { order: 13 } }).expect(400);
      await post(cast.owner, base, { settings: { escape: 'Z' } }).expect(400);
      const foreign = await post(cast.owner, base, { settings: {}, sampleIds: [randomUUID()] }).expect(400);
      expect(foreign.body.message).toMatch(/not this client's/);
      const noConsent = await newClient(t.http, cast.owner, undefined, 'N. Oconsent');
      const res = await post(cast.owner, `/api/clients/${noConsent.id}/profile-versions`, {
        settings: {},
      }).expect(409);
      expect(res.body.message).toMatch(/no active consent/);
    });
  });

  describe('train (job handler in-process)', () => {
    it('trains, stores report + model in one go, audits; metrics equal the engine run again on the frozen inputs', async () => {
      const v = await create({ settings: { order: 3 } });
      const outcome = await train(v.id);
      expect(outcome).toBe('trained');
      const done = await version(v.id);
      expect(done).toMatchObject({ status: 'trained', progress: 1, stage: null, error: null });
      expect(done.modelBytes).toBeGreaterThan(100);
      expect(done.trainedAt).not.toBeNull();
      expect(done.history.map((h) => h.status)).toEqual(['draft', 'training', 'trained']);
      expect(await auditCount('profile.train', v.id)).toBe(1);
      expect(await auditCount('profile.trained', v.id)).toBe(1);

      // The engine again, on what the row froze (the "stored metrics equal the engine's").
      const rows: { samples: FrozenSample[]; settings: ProfileSettings; metrics: ProfileReport }[] =
        await t.dataSource.query('SELECT samples, settings, metrics FROM profile_versions WHERE id = $1', [
          v.id,
        ]);
      const stored = rows[0].metrics;
      const again = await trainAndEvaluateProfile({
        documents: rows[0].samples.map((s) => ({ id: s.id, text: s.text })),
        settings: rows[0].settings,
        base: runtime.base,
        baseWords: runtime.baseWords,
        folds: stored.folds,
        ksSampleChars: stored.ksSampleChars,
      });
      // Everything but `timings` (ms, different each run) must be equal.
      const withoutTimings = (r: ProfileReport): Partial<ProfileReport> => ({ ...r, timings: undefined });
      expect(withoutTimings(stored)).toEqual(
        withoutTimings(JSON.parse(JSON.stringify(again.report)) as ProfileReport),
      );
      expect(stored.folds).toBe(FOLDS);
      expect(stored.chars).toBe(TEXTS.reduce((n, s) => n + [...s].length, 0));
      expect(done.metrics).toMatchObject({ bpcIdeal: stored.bpcIdeal, order: 3 });
      // Scan steps per character on each of the test keyboard's layouts, as the API answers them.
      const byLayout = (done.metrics as ProfileReport).scanStepsByLayout;
      expect(Object.keys(byLayout ?? {}).sort()).toEqual(['alphabetical', 'model-ordered', 'typewriter']);
      expect(byLayout?.['model-ordered']).toBeGreaterThan(1);
      expect(byLayout?.['model-ordered']).toBeLessThanOrEqual(byLayout?.alphabetical ?? 0);
    });

    it('trains the frozen set even after a sample is excluded later', async () => {
      const v = await create();
      const extra = await paste(cast.owner, clientId, 'Later excluded', TEXTS[0].toUpperCase());
      await post(cast.owner, `/api/samples/${sampleIds[0]}/exclude`, { reason: 'test' }).expect(200);
      expect(await train(v.id)).toBe('trained');
      const done = await version(v.id);
      expect((done.metrics as ProfileReport).documents).toBe(TEXTS.length);
      expect(done.samples.map((s) => s.id)).not.toContain(extra.id);
      // A new version takes what is ready now: sample 1 gone, the new one in.
      const next = await create();
      expect(next.samples.map((s) => s.id)).toContain(extra.id);
      expect(next.samples.map((s) => s.id)).not.toContain(sampleIds[0]);
    });

    it('shows progress rising while the job runs', async () => {
      const v = await create();
      await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(200);
      expect(await version(v.id)).toMatchObject({ status: 'training', progress: 0, stage: 'queued' });
      const seen: number[] = [];
      const run = runProfileTraining(t.dataSource, audit, v.id, await jobIdOf(v.id), runtime);
      let finished = false;
      void run.finally(() => {
        finished = true;
      });
      while (!finished) {
        const now = await version(v.id);
        if (now.status === 'training') seen.push(now.progress);
        await new Promise((r) => setTimeout(r, 5));
      }
      expect(await run).toBe('trained');
      const between = seen.filter((p) => p > 0 && p < 1);
      expect(between.length).toBeGreaterThan(0);
      for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
    });

    it('POST train: only the owning clinician; twice → 409; a trained version never trains again', async () => {
      const v = await create();
      const others = castOrder.filter((k) => k !== 'owner');
      const got: number[] = [];
      for (const k of others) got.push((await post(cast[k], `/api/profile-versions/${v.id}/train`)).status);
      expect(got).toEqual([404, 403, 403, 403, 403, 401]);
      await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(200);
      const again = await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(409);
      expect(again.body.message).toBe('This version is already training.');
      // The job really is in pg-boss's queue, waiting.
      expect(await t.app.get(JobQueueService).state(PROFILE_TRAINING_QUEUE, await jobIdOf(v.id))).toBe(
        'created',
      );
      expect(await runProfileTraining(t.dataSource, audit, v.id, await jobIdOf(v.id), runtime)).toBe(
        'trained',
      );
      const res = await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(409);
      expect(res.body.message).toMatch(/already trained/);
    });

    it('fails with the engine message, then can be retried', async () => {
      const v = await create();
      // Settings the schema accepts but the engine refuses cannot be made over HTTP, so the job is
      // given an impossible fold count instead: the engine's ProfileInputError reaches the version.
      expect(await train(v.id, { ...runtime, folds: 50 })).toBe('failed');
      const failed = await version(v.id);
      expect(failed).toMatchObject({ status: 'failed', stage: null });
      expect(failed.error).toMatch(/folds must be 2\.\.10/);
      expect(failed.metrics).toBeNull();
      expect(await auditCount('profile.failed', v.id)).toBe(1);
      expect(await train(v.id)).toBe('trained');
      expect((await version(v.id)).error).toBeNull();
    });

    it('refuses under 500 characters at training too (a draft stored before creation checked it): 400', async () => {
      const v = await create();
      const text = 'Pepper and I went to the harbour. The wind was kind today.';
      // A draft from before the creation check: its frozen samples hold too little writing.
      await t.dataSource.query(
        `UPDATE profile_versions SET samples = jsonb_build_array(samples->0 || jsonb_build_object('text', $2::text))
          WHERE id = $1`,
        [v.id, text],
      );
      const res = await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(400);
      expect(res.body.message).toBe(
        `A profile needs at least 500 characters of writing; the chosen samples have ${text.length}. Add more samples.`,
      );
      expect((await version(v.id)).status).toBe('draft');
    });

    it('cancel: owner only; a queued job is dropped, a running one stops, nothing is saved', async () => {
      const v = await create();
      await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(200);
      const queuedJob = await jobIdOf(v.id);
      const others = castOrder.filter((k) => k !== 'owner');
      const got: number[] = [];
      for (const k of others) got.push((await post(cast[k], `/api/profile-versions/${v.id}/cancel`)).status);
      expect(got).toEqual([404, 403, 403, 403, 403, 401]);
      const cancelled = (await post(cast.owner, `/api/profile-versions/${v.id}/cancel`).expect(200))
        .body as Version;
      expect(cancelled).toMatchObject({
        status: 'draft',
        progress: 0,
        error: 'Cancelled by clinician owner.',
      });
      expect(await t.app.get(JobQueueService).state(PROFILE_TRAINING_QUEUE, queuedJob)).toBe('cancelled');
      expect(await runProfileTraining(t.dataSource, audit, v.id, queuedJob, runtime)).toBe('stale');
      const twice = await post(cast.owner, `/api/profile-versions/${v.id}/cancel`).expect(409);
      expect(twice.body.message).toBe('This version is not training; there is nothing to cancel.');

      // Running: cancel once the job has started writing progress.
      await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(200);
      const run = runProfileTraining(t.dataSource, audit, v.id, await jobIdOf(v.id), runtime);
      for (let i = 0; i < 2000 && (await version(v.id)).stage === 'queued'; i++)
        await new Promise((r) => setTimeout(r, 2));
      await post(cast.owner, `/api/profile-versions/${v.id}/cancel`).expect(200);
      expect(['cancelled', 'stale']).toContain(await run);
      const after = await version(v.id);
      expect(after).toMatchObject({ status: 'draft', metrics: null, modelBytes: null });
      expect(await auditCount('profile.cancel', v.id)).toBe(2);
      expect(await auditCount('profile.trained', v.id)).toBe(0);
    });

    it('when the job cannot be queued: 503, the version is failed with the reason and can be retried', async () => {
      const v = await create();
      const queue = t.app.get(JobQueueService);
      const spy = jest.spyOn(queue, 'send').mockRejectedValueOnce(new Error('connection refused'));
      try {
        const res = await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(503);
        expect(res.body.message).toMatch(/could not be queued \(connection refused\)/);
      } finally {
        spy.mockRestore();
      }
      expect(await version(v.id)).toMatchObject({ status: 'failed', stage: null });
      expect(await train(v.id)).toBe('trained');
    });

    it('a version left training by a dead job (worker killed) can be trained again', async () => {
      const v = await create();
      await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(200);
      // The job vanished (e.g. pg-boss archive dropped it): no live job → retryable.
      await t.dataSource.query(`UPDATE profile_versions SET job_id = $2 WHERE id = $1`, [v.id, randomUUID()]);
      await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(200);
      // A job pg-boss still calls active but whose heartbeat stopped 5 minutes ago: retryable too.
      const boss = createJobBoss(testDatabaseUrl(), { supervise: false });
      await startJobBoss(boss);
      try {
        // Earlier tests left queued jobs (their versions were trained in-process); take them all.
        const jobs = await boss.fetch<ProfileTrainingJobData>(PROFILE_TRAINING_QUEUE, { batchSize: 100 });
        const job = jobs.find((j) => j.data.versionId === v.id);
        if (!job) throw new Error('the queued job was not fetched');
        await t.dataSource.query(
          `UPDATE profile_versions SET heartbeat_at = now() - interval '5 minutes' WHERE id = $1`,
          [v.id],
        );
        expect(await t.app.get(JobQueueService).state(PROFILE_TRAINING_QUEUE, job.id)).toBe('active');
        await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(200);
        // The old job, if it ever finished, could not save: the row waits for the new one.
        expect(await runProfileTraining(t.dataSource, audit, v.id, job.id, runtime)).toBe('stale');
      } finally {
        await boss.stop({ graceful: false, wait: true });
      }
      expect(await runProfileTraining(t.dataSource, audit, v.id, await jobIdOf(v.id), runtime)).toBe(
        'trained',
      );
    });
  });

  describe('sign-off, approval, send-back', () => {
    it('sign-off: only the assigned carer; twice and out of order → 409', async () => {
      const v = await trained();
      const path = `/api/profile-versions/${v.id}/sign-off`;
      const notCarer = castOrder.filter((k) => k !== 'assignedCarer');
      const got: number[] = [];
      for (const k of notCarer) got.push((await post(cast[k], path, { comment: 'ok' })).status);
      expect(got).toEqual([403, 403, 403, 404, 403, 401]);
      await post(cast.assignedCarer, path, { comment: ' ' }).expect(400);
      // Not before the version was tried on the test keyboard.
      const untried = await post(cast.assignedCarer, path, { comment: 'Looks fine.' }).expect(409);
      expect(untried.body.message).toBe(
        'Try this version on the test keyboard at least once before signing it off.',
      );
      await postTrial(t.http, cast.assignedCarer, v.id).expect(201);
      const ok = (
        await post(cast.assignedCarer, path, { comment: 'Used it at the café; quicker.' }).expect(200)
      ).body as Version;
      expect(ok).toMatchObject({
        status: 'signed_off',
        signedOffBy: 'assigned carer',
        signOffComment: 'Used it at the café; quicker.',
      });
      const twice = await post(cast.assignedCarer, path, { comment: 'again' }).expect(409);
      expect(twice.body.message).toBe('This version is already signed off.');
      const draft = await create();
      const early = await post(cast.assignedCarer, `/api/profile-versions/${draft.id}/sign-off`, {
        comment: 'x',
      }).expect(409);
      expect(early.body.message).toBe(
        'Only a version that is ready for trial can be signed off; this one is draft.',
      );
      expect(await auditCount('profile.sign-off', v.id)).toBe(1);
    });

    it('approve: only a supervisor; retires the previous active version; twice → 409', async () => {
      const first = await signedOff();
      const path = `/api/profile-versions/${first.id}/approve`;
      const notSupervisor = castOrder.filter((k) => k !== 'supervisor');
      const got: number[] = [];
      for (const k of notSupervisor) got.push((await post(cast[k], path, { comment: 'ok' })).status);
      expect(got).toEqual([403, 403, 403, 403, 403, 401]);
      await post(cast.supervisor, path, {}).expect(400);
      const active = (await post(cast.supervisor, path, { comment: 'Good trial.' }).expect(200))
        .body as Version;
      expect(active).toMatchObject({
        status: 'active',
        approvedBy: 'supervisor',
        approvalComment: 'Good trial.',
      });
      expect(active.approvedAt).not.toBeNull();
      const twice = await post(cast.supervisor, path, { comment: 'again' }).expect(409);
      expect(twice.body.message).toBe('This version is already approved and active.');

      const second = await signedOff();
      await post(cast.supervisor, `/api/profile-versions/${second.id}/approve`, {
        comment: 'Better.',
      }).expect(200);
      const retired = await version(first.id);
      expect(retired.status).toBe('retired');
      expect(retired.history.at(-1)).toMatchObject({
        status: 'retired',
        comment: `Replaced by version ${second.number}.`,
      });
      expect(await auditCount('profile.retire', first.id)).toBe(1);
      expect(await auditCount('profile.approve', second.id)).toBe(1);
      // The log names both versions.
      const approval = (
        await get(cast.supervisor, `/api/audit?action=profile.approve&clientId=${clientId}`).expect(200)
      ).body.items[0] as { sentence: string };
      expect(approval.sentence).toMatch(
        new RegExp(`approved version ${second.number} of .*’s profile, retiring version ${active.number}$`),
      );
      const list = (await get(cast.owner, `/api/clients/${clientId}/profile-versions`).expect(200))
        .body as Version[];
      expect(list.filter((x) => x.status === 'active').map((x) => x.id)).toEqual([second.id]);
      // Out of order: a trained version that no carer signed off.
      const unsigned = await trained();
      const early = await post(cast.supervisor, `/api/profile-versions/${unsigned.id}/approve`, {
        comment: 'x',
      }).expect(409);
      expect(early.body.message).toBe(
        'Only a version signed off by a carer can be approved; this one is ready for trial.',
      );
    });

    it('two approvals at once: exactly one wins', async () => {
      const v = await signedOff();
      const path = `/api/profile-versions/${v.id}/approve`;
      const results = await Promise.all([
        post(cast.supervisor, path, { comment: 'Yes.' }),
        post(secondSupervisor, path, { comment: 'Also yes.' }),
      ]);
      expect(results.map((r) => r.status).sort()).toEqual([200, 409]);
      expect(await auditCount('profile.approve', v.id)).toBe(1);
      // Two versions of one client at once: one active afterwards, never two.
      const [a, b] = [await signedOff(), await signedOff()];
      const both = await Promise.all([
        post(cast.supervisor, `/api/profile-versions/${a.id}/approve`, { comment: 'a' }),
        post(secondSupervisor, `/api/profile-versions/${b.id}/approve`, { comment: 'b' }),
      ]);
      expect(both.map((r) => r.status)).toEqual([200, 200]);
      const rows: { n: string }[] = await t.dataSource.query(
        `SELECT count(*) AS n FROM profile_versions WHERE client_id = $1 AND status = 'active'`,
        [clientId],
      );
      expect(Number(rows[0].n)).toBe(1);
    });

    it('nobody approves their own work', async () => {
      const v = await signedOff();
      await t.dataSource.query('UPDATE profile_versions SET created_by_id = $2 WHERE id = $1', [
        v.id,
        cast.supervisor.id,
      ]);
      const res = await post(cast.supervisor, `/api/profile-versions/${v.id}/approve`, {
        comment: 'mine',
      }).expect(403);
      expect(res.body.message).toBe(
        'Nobody approves their own work: you created or signed off this version.',
      );
      await post(secondSupervisor, `/api/profile-versions/${v.id}/approve`, { comment: 'fine' }).expect(200);
    });

    it('send back: only a supervisor, with a reason; then neither approval nor a second send-back', async () => {
      const v = await signedOff();
      const path = `/api/profile-versions/${v.id}/send-back`;
      const notSupervisor = castOrder.filter((k) => k !== 'supervisor');
      const got: number[] = [];
      for (const k of notSupervisor) got.push((await post(cast[k], path, { reason: 'x' })).status);
      expect(got).toEqual([403, 403, 403, 403, 403, 401]);
      await post(cast.supervisor, path, { reason: '' }).expect(400);
      const back = (await post(cast.supervisor, path, { reason: 'Too few diary samples.' }).expect(200))
        .body as Version;
      expect(back).toMatchObject({ status: 'sent_back', sentBackReason: 'Too few diary samples.' });
      expect((await post(cast.supervisor, path, { reason: 'again' }).expect(409)).body.message).toBe(
        'This version was already sent back.',
      );
      await post(cast.supervisor, `/api/profile-versions/${v.id}/approve`, { comment: 'x' }).expect(409);
      await post(cast.assignedCarer, `/api/profile-versions/${v.id}/sign-off`, { comment: 'x' }).expect(409);
      await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(409);
      expect(await auditCount('profile.send-back', v.id)).toBe(1);
    });
  });

  describe('export and verify', () => {
    /** GET the export as the owner, the body kept as bytes. */
    const download = (versionId: string) =>
      get(cast.owner, `/api/profile-versions/${versionId}/export`)
        .buffer(true)
        .parse((r, done) => {
          const chunks: Buffer[] = [];
          r.on('data', (c: Buffer) => chunks.push(c));
          r.on('end', () => done(null, Buffer.concat(chunks)));
        });

    it('exports a .klprofile that verifies; carers and admins may not export; a draft has nothing to export', async () => {
      const v = await trained();
      const res = await download(v.id).expect(200);
      const file = res.body as Buffer;
      expect(res.headers['content-disposition']).toMatch(/filename="keyloom-p-ashcombe-v\d+\.klprofile"/);
      expect(file.subarray(0, 4).toString('latin1')).toBe('KLPF');
      // The last four bytes: CRC-32 of all before, as node:zlib computes it (general-purpose reference).
      expect(file.readUInt32LE(file.length - 4)).toBe(zlibCrc32(file.subarray(0, file.length - 4)));
      expect(await statuses((who) => get(who, `/api/profile-versions/${v.id}/export`))).toEqual([
        200, 404, 200, 403, 403, 403, 401,
      ]);
      expect(await auditCount('profile.export', v.id)).toBe(3); // owner twice, supervisor once

      const verify = (bytes: Buffer, who: Caller = cast.owner) =>
        send(t.http, who, 'post', '/api/profile-exports/verify').attach('file', bytes, 'profile.klprofile');
      const ok = (await verify(file).expect(200)).body as {
        valid: boolean;
        modelBytes: number;
        header: { version: { number: number }; client: { pseudonym: string }; baseWeight: number };
      };
      expect(ok.valid).toBe(true);
      expect(ok.modelBytes).toBe(v.modelBytes);
      expect(ok.header.version.number).toBe(v.number);
      expect(ok.header.client.pseudonym).toBe('P. Ashcombe');
      expect(ok.header.baseWeight).toBe(v.baseWeight);

      const damaged = Buffer.from(file);
      damaged[Math.floor(file.length / 2)] ^= 0x01;
      expect((await verify(damaged).expect(400)).body.message).toMatch(/checksum does not match/);
      expect((await verify(file.subarray(0, file.length - 100)).expect(400)).body.message).toMatch(
        /cut short/,
      );
      expect((await verify(Buffer.from('just some text\n')).expect(400)).body.message).toMatch(
        /not a Keyloom profile/,
      );
      await verify(file, cast.assignedCarer).expect(403);
      await send(t.http, cast.owner, 'post', '/api/profile-exports/verify').expect(400);

      const draft = await create();
      const none = await get(cast.owner, `/api/profile-versions/${draft.id}/export`).expect(409);
      expect(none.body.message).toBe('This version has no trained model yet; train it first.');
    });

    /** The export as bytes. */
    const exported = async (versionId: string): Promise<Buffer> =>
      (await download(versionId).expect(200)).body as Buffer;

    type Check = { valid: boolean; intact: boolean; authenticity: string; header: { approvedBy: string } };
    const check = async (bytes: Buffer, status = 200) =>
      (
        await send(t.http, cast.owner, 'post', '/api/profile-exports/verify')
          .attach('file', bytes, 'profile.klprofile')
          .expect(status)
      ).body as Check;

    // The file's parts, read by hand from the layout documented in shared/src/engine/README.md (not with
    // the engine's reader), as someone editing the file with a hex editor would.
    function parts(file: Buffer) {
      const layout = file.readUInt16LE(4);
      const headerLength = file.readUInt32LE(6);
      const modelAt = 10 + headerLength;
      let modelEnd = modelAt + 4 + file.readUInt32LE(modelAt);
      // Layouts 3 and 4: the word model's length and bytes follow the model.
      if (layout === 3 || layout === 4) modelEnd += 4 + file.readUInt32LE(modelEnd);
      return {
        layout,
        header: JSON.parse(file.subarray(10, modelAt).toString('utf8')) as Record<string, unknown>,
        modelPart: file.subarray(modelAt, modelEnd), // the model (and word model), each after its length
        signature: file.subarray(modelEnd, file.length - 4),
      };
    }

    /** Joins the parts and appends the CRC-32 of all before it, as node:zlib computes it. */
    function assemble(layout: number, header: object, modelPart: Buffer, signature: Buffer): Buffer {
      const json = Buffer.from(JSON.stringify(header), 'utf8');
      const fixed = Buffer.alloc(10);
      fixed.write('KLPF', 0, 'latin1');
      fixed.writeUInt16LE(layout, 4);
      fixed.writeUInt32LE(json.length, 6);
      const body = Buffer.concat([fixed, json, modelPart, signature]);
      const crc = Buffer.alloc(4);
      crc.writeUInt32LE(zlibCrc32(body));
      return Buffer.concat([body, crc]);
    }

    describe('signature: made by this clinic, or not', () => {
      let file: Buffer;
      let pieces: ReturnType<typeof parts>;
      // The bytes the signature covers: all before the 32-byte signature and the 4-byte CRC.
      const signedEnd = () => file.length - 4 - 32;

      beforeAll(async () => {
        file = await exported((await trained()).id);
        pieces = parts(file);
      });

      it('signs an export with HMAC-SHA-256 under the key kept in app_settings, and says so', async () => {
        const own = await check(file);
        expect([own.valid, own.intact, own.authenticity]).toEqual([true, true, 'this-clinic']);
        // RFC 2104 HMAC as node:crypto computes it, over every byte before the signature.
        const [{ value }] = await t.dataSource.query<{ value: string }[]>(
          `SELECT value FROM app_settings WHERE name = 'export-signing-key'`,
        );
        const key = Buffer.from(value, 'base64');
        expect(key).toHaveLength(32);
        expect(pieces.layout).toBe(4); // signed, with the client's word model
        const expected = createHmac('sha256', key).update(file.subarray(0, signedEnd())).digest();
        expect(pieces.signature.equals(expected)).toBe(true);
      });

      it('says a file whose header was edited to claim approval (CRC recomputed) is not signed by this clinic', async () => {
        const forgedHeader = {
          ...pieces.header,
          version: { ...(pieces.header.version as object), status: 'active' },
          approvedBy: 'Chief Supervisor (forged)',
        };
        const forged = await check(assemble(pieces.layout, forgedHeader, pieces.modelPart, pieces.signature));
        expect(forged.valid).toBe(false);
        expect([forged.intact, forged.authenticity]).toEqual([true, 'other']);
        expect(forged.header.approvedBy).toBe('Chief Supervisor (forged)');
      });

      it('says a file signed with another key is not signed by this clinic', async () => {
        const { layout, header, modelPart } = pieces;
        const body = assemble(layout, header, modelPart, Buffer.alloc(32)).subarray(0, signedEnd());
        const otherSignature = createHmac('sha256', randomBytes(32)).update(body).digest();
        const foreign = await check(assemble(layout, header, modelPart, otherSignature));
        expect(foreign.valid).toBe(false);
        expect(foreign.authenticity).toBe('other');
      });

      it('reads a file in the unsigned layout (exported before signing) and says it is not signed', async () => {
        // Layout 3: the unsigned layout of a file with a word model (as 1 is of one without).
        const unsigned = await check(assemble(3, pieces.header, pieces.modelPart, Buffer.alloc(0)));
        expect(unsigned.valid).toBe(false);
        expect([unsigned.intact, unsigned.authenticity]).toEqual([true, 'unsigned']);
      });

      it('reports damage (a changed signature or header byte, CRC not fixed) as damage, 400', async () => {
        for (const at of [file.length - 10, 12]) {
          const damaged = Buffer.from(file);
          damaged[at] ^= 0x01;
          const answer = (await check(damaged, 400)) as unknown as { message: string };
          expect(answer.message).toMatch(/checksum does not match/);
        }
      });
    });
  });

  describe('pg-boss delivers the job', () => {
    let worker: PgBoss | null = null;
    afterEach(async () => {
      await worker?.stop({ graceful: true, wait: true });
      worker = null;
    });

    it('a queued train request reaches a worker handler, which trains the version', async () => {
      const v = await create();
      const handled: string[] = [];
      worker = createJobBoss(testDatabaseUrl(), { supervise: false });
      await startJobBoss(worker);
      await worker.work<ProfileTrainingJobData>(
        PROFILE_TRAINING_QUEUE,
        { batchSize: 1, pollingIntervalSeconds: 0.5 },
        async ([job]) => {
          // Jobs other tests queued and ran in-process are stale here; only ours is trained.
          if (job.data.versionId !== v.id) return;
          handled.push(job.id);
          await runProfileTraining(t.dataSource, audit, job.data.versionId, job.id, runtime);
        },
      );
      await post(cast.owner, `/api/profile-versions/${v.id}/train`).expect(200);
      let now = await version(v.id);
      for (let i = 0; i < 300 && now.status === 'training'; i++) {
        await new Promise((r) => setTimeout(r, 100));
        now = await version(v.id);
      }
      expect(now.status).toBe('trained');
      expect(handled).toEqual([await jobIdOf(v.id)]);
    });
  });

  describe('consent withdrawal', () => {
    it('deletes every version of the client, counted in the report and audited', async () => {
      await trained();
      const before = (await get(cast.owner, `/api/clients/${clientId}/profile-versions`).expect(200))
        .body as Version[];
      expect(before.length).toBeGreaterThan(3);
      const res = await post(cast.owner, `/api/clients/${clientId}/consents/${consentId}/withdraw`, {
        reason: 'The client asked.',
      }).expect(200);
      expect(JSON.stringify(res.body)).toContain(`"profileVersions":${before.length}`);
      const after = (await get(cast.owner, `/api/clients/${clientId}/profile-versions`).expect(200))
        .body as Version[];
      expect(after).toEqual([]);
      const events = await t.dataSource
        .getRepository(AuditEvent)
        .findBy({ action: 'profile.delete', clientId });
      expect(events).toHaveLength(1);
      expect(events[0].details).toMatchObject({ count: before.length });
    });
  });
});
