// The test keyboard's API over HTTP against real PostgreSQL: the version's model download
// (byte-identical, ETag, 304), the base model download, trials (replayed and measured by the API,
// idempotent re-uploads), practice phrases, the sign-off gate and report-problem, consent withdrawal.
// Training is kept small (2 folds, a 400-character keystroke sample) so the suite stays fast.
import {
  type AuditPage,
  computeTrialMeasures,
  type PracticePhrase,
  type ProfileReport,
  type Trial,
  type TrialEvent,
  type UploadResult,
  verifyProfileFile,
} from '@keyloom/shared';
import { createHash, randomUUID } from 'node:crypto';
import { gunzipSync } from 'node:zlib';
import type request from 'supertest';
import { AuditEvent } from '../src/audit/audit-event.entity';
import { AuditService } from '../src/audit/audit.service';
import { loadTrainingRuntime, type TrainingRuntime } from '../src/profile-versions/profile-training';
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import { type Caller, type Cast, castOrder, newCast, newClient, newConsent, send } from './caseload-helpers';
import { TrialsService } from '../src/trials/trials.service';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { directSettings, postTrial, trainInProcess, trialBody, typedEvents } from './trial-helpers';

// Invented for these tests (the demo scenario's voice: a sailing club, a dog, jazz piano).
const TEXTS = [
  'Went down to the club early and helped to lay the marks for the evening race. The tide was turning ' +
    'and the wind was light from the north. Pepper waited on the slipway and watched every boat go out. ' +
    'After the race we sat on the terrace and talked about the winter series and the new committee. ' +
    'At home I played the slow ballad twice and the middle section finally sounded right to me.',
  'Me: can you bring the spare tiller on Saturday?\nHannah: yes, and the new gloves for you.\n' +
    'Me: thank you. Pepper wants to come too.\nHannah: of course, he always comes.\n' +
    'Me: the forecast says the wind will pick up after lunch.\nHannah: then we start early, nine at the club.\n' +
    'Me: good, I will practise the piano in the evening.',
];
const FOLDS = 2;
const KS_CHARS = 400;

type Version = ProfileVersionDto;

/** supertest parser that keeps the raw bytes of a binary body. */
function binary(res: request.Response, done: (error: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

describe('test keyboard (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;
  let clientId: string;
  let consentId: string;
  let runtime: TrainingRuntime;
  let audit: AuditService;
  let version: Version; // trained, shared by most tests (never signed off)

  const get = (who: Caller, path: string) => send(t.http, who, 'get', path);
  const post = (who: Caller, path: string, body?: object) => send(t.http, who, 'post', path, body ?? {});
  const del = (who: Caller, path: string) => send(t.http, who, 'delete', path);

  async function statuses(make: (who: Caller) => request.Test): Promise<number[]> {
    const out: number[] = [];
    for (const key of castOrder) out.push((await make(cast[key])).status);
    return out;
  }

  const auditCount = (action: string, subjectId: string) =>
    t.dataSource.getRepository(AuditEvent).countBy({ action, subjectId });

  async function draft(): Promise<Version> {
    const res = await post(cast.owner, `/api/clients/${clientId}/profile-versions`, { settings: {} }).expect(
      201,
    );
    return res.body as Version;
  }

  async function trained(): Promise<Version> {
    const v = await draft();
    expect(await trainInProcess(t, audit, cast.owner, v.id, runtime)).toBe('trained');
    return (await get(cast.owner, `/api/profile-versions/${v.id}`).expect(200)).body as Version;
  }

  const model = (who: Caller, id: string) =>
    get(who, `/api/profile-versions/${id}/model`).buffer(true).parse(binary);

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    audit = t.app.get(AuditService);
    cast = await newCast(t.http, t.dataSource);
    clientId = (await newClient(t.http, cast.owner, cast.assignedCarer, 'L. Marwood')).id;
    consentId = (await newConsent(t.http, cast.owner, clientId)).id;
    for (const [i, text] of TEXTS.entries()) {
      const res = await post(cast.owner, `/api/clients/${clientId}/samples`, {
        title: `Sample ${i + 1}`,
        text,
        sourceKind: 'diary',
      }).expect(201);
      expect((res.body as UploadResult).samples[0]).toMatchObject({ status: 'ready' });
    }
    runtime = { ...loadTrainingRuntime(FOLDS), ksSampleChars: KS_CHARS, progressIntervalMs: 50 };
    version = await trained();
  });
  afterAll(async () => {
    await t.app.close();
  });

  describe('GET /api/profile-versions/:id/model', () => {
    it('readers only; the same bytes every time; ETag = sha256 of the gzip; If-None-Match → 304', async () => {
      expect(await statuses((who) => get(who, `/api/profile-versions/${version.id}/model`))).toEqual([
        200, 404, 200, 200, 404, 403, 401,
      ]);
      const first = await model(cast.owner, version.id).expect(200);
      const bytes = first.body as Buffer;
      expect(first.headers['content-type']).toBe('application/octet-stream');
      expect(first.headers['cache-control']).toBe('private, no-cache');
      expect(first.headers.etag).toBe(`"${sha256(bytes)}"`);
      expect(first.headers['x-keyloom-base-model']).toBe(version.baseModelSha256);
      // gzip's magic bytes 1f 8b and method 8 (RFC 1952).
      expect([...bytes.subarray(0, 3)]).toEqual([0x1f, 0x8b, 8]);
      const file = gunzipSync(bytes); // node:zlib as the reference decoder
      expect(Number(first.headers['x-keyloom-uncompressed-bytes'])).toBe(file.length);
      const contents = verifyProfileFile(new Uint8Array(file));
      expect(contents.header).toMatchObject({
        format: 'keyloom-profile',
        version: { id: version.id, number: version.number, status: 'trained' },
        baseWeight: version.baseWeight,
        baseModelSha256: version.baseModelSha256,
        exportedBy: 'Keyloom',
        exportedAt: version.trainedAt,
        approvedBy: null,
        approvedAt: null,
      });
      expect(contents.header.settings).toMatchObject({ slots: version.settings.slots, caseFold: false });
      const stored: { model: Buffer }[] = await t.dataSource.query(
        'SELECT model FROM profile_versions WHERE id = $1',
        [version.id],
      );
      expect(Buffer.from(contents.model).equals(stored[0].model)).toBe(true);

      const again = await model(cast.assignedCarer, version.id).expect(200);
      expect((again.body as Buffer).equals(bytes)).toBe(true);
      expect(again.headers.etag).toBe(first.headers.etag);
      const fresh = await get(cast.owner, `/api/profile-versions/${version.id}/model`)
        .set('If-None-Match', String(first.headers.etag))
        .expect(304);
      expect(fresh.headers.etag).toBe(first.headers.etag);
      await get(cast.owner, `/api/profile-versions/${version.id}/model`)
        .set('If-None-Match', `"${'0'.repeat(64)}"`)
        .expect(200);
      // 200s only are audited (owner 3×, supervisor, carer 2×), not the 304.
      expect(await auditCount('profile.model-download', version.id)).toBe(6);
      // A number of the demo-size check: printed for the report, not asserted as a speed target.
      console.log(`model download: ${file.length} bytes, gzip ${bytes.length} bytes`);
    });

    it('a version without a model: 409; unknown id: 404', async () => {
      const d = await draft();
      const res = await model(cast.owner, d.id).expect(409);
      expect(JSON.parse((res.body as Buffer).toString('utf8'))).toMatchObject({
        message: 'This version has no trained model yet.',
      });
      await model(cast.owner, randomUUID()).expect(404);
    });
  });

  describe('GET /api/base-models/:sha256', () => {
    it('any signed-in user; gunzips to the file with that sha256; immutable; other hashes 404', async () => {
      const path = `/api/base-models/${version.baseModelSha256}`;
      expect(await statuses((who) => get(who, path))).toEqual([200, 200, 200, 200, 200, 200, 401]);
      const res = await get(cast.assignedCarer, path).buffer(true).parse(binary).expect(200);
      const raw = gunzipSync(res.body as Buffer);
      expect(sha256(raw)).toBe(version.baseModelSha256);
      expect(res.headers['x-keyloom-base-model']).toBe(version.baseModelSha256);
      expect(res.headers.etag).toBe(`"${version.baseModelSha256}"`);
      expect(Number(res.headers['x-keyloom-uncompressed-bytes'])).toBe(raw.length);
      expect(res.headers['cache-control']).toBe('private, max-age=31536000, immutable');
      await get(cast.owner, path).set('If-None-Match', String(res.headers.etag)).expect(304);
      const gone = await get(cast.owner, `/api/base-models/${'a'.repeat(64)}`).expect(404);
      expect(gone.body.message).toBe(
        'The base model this version was trained with is no longer on this server.',
      );
      console.log(`base model download: ${raw.length} bytes, gzip ${(res.body as Buffer).length} bytes`);
    });
  });

  describe('POST and GET /api/profile-versions/:id/trials', () => {
    const trials = (id: string) => `/api/profile-versions/${id}/trials`;

    it('POST: owning clinician or assigned carer; supervisor and admin 403; CSRF token required', async () => {
      expect(await statuses((who) => postTrial(t.http, who, version.id))).toEqual([
        201, 404, 403, 201, 404, 403, 401,
      ]);
      await cast.owner.agent!.post(trials(version.id)).send(trialBody()).expect(403);
      await postTrial(t.http, cast.owner, randomUUID()).expect(404);
    });

    it('stores what the API measured from the log, never the browser’s figures', async () => {
      // MacKenzie (2002), "A note on calculating text entry speed": 43 characters in 20 s →
      // (43 − 1) / 20 × 60 / 5 = 25.2 wpm (docs/references.md §2). One key per character: KSPC 1 (MacKenzie 2002).
      const phrase = 'the quick brown fox jumps over the lazy dog';
      const events = typedEvents(phrase, 20_000);
      const body = {
        ...trialBody({ text: phrase, events, targetPhrase: phrase, phraseId: null, note: 'First go.' }),
        measures: { keystrokeSavings: 0.99, wpm: 500 }, // ignored
      };
      const res = await post(cast.assignedCarer, trials(version.id), body).expect(201);
      const trial = res.body as Trial;
      expect(trial.measures).toEqual(computeTrialMeasures(events, phrase));
      expect(trial.measures.wpm).toBeCloseTo(25.2, 6);
      expect(trial.measures).toMatchObject({
        characters: 43,
        keystrokes: 43,
        kspc: 1,
        keystrokeSavings: 0,
        errorRate: 0,
      });
      const report = version.metrics as unknown as ProfileReport;
      expect(trial.simulated).toEqual({
        keystrokeSavings: report.keystrokeSavings['5'],
        wpm: report.rates.wpmWith,
        slots: 5,
      });
      expect(trial).toMatchObject({
        versionId: version.id,
        versionNumber: version.number,
        clientId,
        by: { id: cast.assignedCarer.id, name: 'assigned carer', role: 'carer' },
        targetPhrase: phrase,
        text: phrase,
        note: 'First go.',
        settings: directSettings,
      });
      expect(await auditCount('trial.create', trial.id)).toBe(1);
    });

    it('keeps the scanning pattern, the suggestion place and two-switch move/select steps; refuses an unknown pattern', async () => {
      const settings = {
        ...directSettings,
        selectionMode: 'scanning' as const,
        scanIntervalMs: 900,
        scanPattern: 'step-two-switch' as const,
        suggestionsScanned: 'last' as const,
      };
      const events: TrialEvent[] = [
        { t: 0, type: 'switch', value: 'move' },
        { t: 400, type: 'switch', value: 'select' },
        { t: 800, type: 'switch', value: 'select' },
        { t: 800, type: 'letter', value: 's' },
      ];
      const res = await post(
        cast.assignedCarer,
        trials(version.id),
        trialBody({ settings, events, text: 's' }),
      );
      expect(res.status).toBe(201);
      const trial = res.body as Trial;
      expect(trial.settings).toEqual(settings);
      expect(trial.measures).toMatchObject({ switchActivations: 3, keystrokes: 1 });
      const listed = (await get(cast.owner, trials(version.id)).expect(200)).body as Trial[];
      expect(listed.find((x) => x.id === trial.id)?.settings).toEqual(settings);
      const bad = { ...settings, scanPattern: 'round-robin' };
      await post(cast.assignedCarer, trials(version.id), trialBody({ settings: bad as never })).expect(400);
      const tooShort = { ...settings, scanPattern: 'step-one-switch', scanAcceptMs: 100 };
      await post(cast.assignedCarer, trials(version.id), trialBody({ settings: tooShort as never })).expect(
        400,
      );
    });

    it('keeps the capital, number-key, spacing and dwell settings (stored and listed); refuses them out of range', async () => {
      const dwell = {
        ...directSettings,
        selectionMode: 'dwell' as const,
        dwellMs: 700,
        largeTargets: true,
        autoCapital: false,
        keySpacing: 'large' as const,
        dwellRefractoryMs: 1200,
        dwellSound: true,
      };
      const direct = {
        ...directSettings,
        autoCapital: true,
        numberKeysPick: true,
        keySpacing: 'medium' as const,
      };
      for (const settings of [dwell, direct]) {
        const res = await post(cast.assignedCarer, trials(version.id), trialBody({ settings })).expect(201);
        const trial = res.body as Trial;
        expect(trial.settings).toEqual(settings);
        const listed = (await get(cast.owner, trials(version.id)).expect(200)).body as Trial[];
        expect(listed.find((x) => x.id === trial.id)?.settings).toEqual(settings);
      }
      for (const bad of [
        { ...dwell, dwellRefractoryMs: 2001 },
        { ...dwell, dwellRefractoryMs: -1 },
        { ...dwell, keySpacing: 'huge' },
        { ...direct, numberKeysPick: 'yes' },
      ]) {
        const res = await post(cast.assignedCarer, trials(version.id), trialBody({ settings: bad as never }));
        expect(res.status).toBe(400);
        expect(typeof res.body.message).toBe('string');
      }
    });

    it('still takes settings of the old shape, without the optional fields, and returns them as sent', async () => {
      const old = { ...directSettings };
      expect(Object.keys(old)).not.toContain('autoCapital');
      const res = await post(cast.assignedCarer, trials(version.id), trialBody({ settings: old })).expect(
        201,
      );
      expect((res.body as Trial).settings).toEqual(old);
    });

    it('keeps a trial typed on the layout ordered by the model; refuses an unknown layout', async () => {
      const settings = { ...directSettings, layout: 'model-ordered' as const };
      const res = await post(cast.assignedCarer, trials(version.id), trialBody({ settings }));
      expect(res.status).toBe(201);
      expect((res.body as Trial).settings).toEqual(settings);
      const listed = (await get(cast.owner, trials(version.id)).expect(200)).body as Trial[];
      expect(listed.find((x) => x.id === (res.body as Trial).id)?.settings.layout).toBe('model-ordered');
      const bad = { ...directSettings, layout: 'by-frequency' };
      const refused = await post(
        cast.assignedCarer,
        trials(version.id),
        trialBody({ settings: bad as never }),
      );
      expect(refused.status).toBe(400);
    });

    it('measures a trial with suggestions, corrections and switch steps as computeTrialMeasures does', async () => {
      const events: TrialEvent[] = [
        { t: 0, type: 'offer', words: ['i', 'the'] },
        { t: 300, type: 'switch' },
        { t: 400, type: 'letter', value: 'p' },
        { t: 450, type: 'offer', words: ['pepper', 'please'] },
        { t: 900, type: 'letter', value: 'x' },
        { t: 1000, type: 'backspace' },
        { t: 1500, type: 'suggestion', value: 'pepper', slot: 0 },
        { t: 1600, type: 'offer', words: [] },
        { t: 2000, type: 'punctuation', value: '?' },
      ];
      const body = trialBody({
        text: 'pepper? ', // the question mark takes the place of the space the suggestion left
        events,
        settings: { ...directSettings, selectionMode: 'scanning', scanIntervalMs: 800, slots: 3 },
      });
      const trial = (await post(cast.owner, trials(version.id), body).expect(201)).body as Trial;
      expect(trial.measures).toEqual(computeTrialMeasures(events, null));
      // Derived by hand: 8 characters for 5 selections → KS = 1 − 5/8.
      expect(trial.measures).toMatchObject({
        characters: 8,
        keystrokes: 5,
        switchActivations: 1,
        suggestionsOffered: 2,
        suggestionsTaken: 1,
        errorsCorrected: 1,
        keystrokeSavings: 0.375,
      });
      expect(trial.simulated.slots).toBe(3);
      expect(trial.simulated.keystrokeSavings).toBe(
        (version.metrics as unknown as ProfileReport).keystrokeSavings['3'],
      );
    });

    it('refuses bad bodies with a message (400)', async () => {
      const bad = async (body: object) =>
        (await post(cast.owner, trials(version.id), body).expect(400)).body as {
          message: string;
          issues?: { path: string; message: string }[];
        };
      expect((await bad({ ...trialBody(), events: [] })).issues).toContainEqual({
        path: 'events',
        message: 'The trial has no key presses.',
      });
      expect((await bad({ ...trialBody(), localTrialId: 'abc' })).issues).toContainEqual({
        path: 'localTrialId',
        message: 'The trial needs an id made by the browser.',
      });
      expect(
        (await bad({ ...trialBody(), settings: { ...directSettings, slots: 11 } })).issues?.[0].path,
      ).toBe('settings.slots');
      expect(
        (await bad(trialBody({ startedAt: '2026-12-02T10:00:05Z', finishedAt: '2026-12-02T10:00:00Z' })))
          .message,
      ).toBe('The trial cannot finish before it started.');
      const replay = await bad(
        trialBody({ text: 'ab', events: [...typedEvents('ab', 10), { t: 20, type: 'letter', value: 'xy' }] }),
      );
      expect(replay.message).toBe(
        'Step 3 of the trial log: A letter step must insert exactly one character, not "xy".',
      );
      expect((await bad(trialBody({ text: 'hi pepper!' }))).message).toBe(
        'The trial log does not give the text sent.',
      );
      const backwards = await bad(
        trialBody({
          text: 'ab',
          events: [
            { t: 50, type: 'letter', value: 'a' },
            { t: 10, type: 'letter', value: 'b' },
          ],
        }),
      );
      expect(backwards.message).toBe('Step 2 of the trial log is timed before the step before it.');
      const rows: { n: string }[] = await t.dataSource.query(
        'SELECT count(*) AS n FROM trials WHERE text = $1',
        ['hi pepper!'],
      );
      expect(Number(rows[0].n)).toBe(0);
    });

    it('accepts and measures a log with shift, symbols, new line, delete word, undo pick and a pause; refuses an undo with no pick (400)', async () => {
      const events: TrialEvent[] = [
        { t: 0, type: 'shift', value: 'once' },
        { t: 100, type: 'letter', value: 'P' },
        { t: 200, type: 'letter', value: 'e' },
        { t: 300, type: 'suggestion', value: 'people', slot: 0 },
        { t: 400, type: 'undo_pick' },
        { t: 500, type: 'letter', value: 'p' },
        { t: 600, type: 'space' },
        { t: 700, type: 'pause' },
        { t: 5_000, type: 'resume' },
        { t: 5_100, type: 'letter', value: 'x' },
        { t: 5_200, type: 'delete_word' },
        { t: 5_300, type: 'newline' },
        { t: 5_400, type: 'layer', value: 'symbols' },
        { t: 5_500, type: 'letter', value: '9' },
        { t: 5_600, type: 'punctuation', value: '!' },
        { t: 5_700, type: 'layer', value: 'letters' },
      ];
      const body = trialBody({ text: 'Pep \n9!', events });
      const trial = (await post(cast.owner, trials(version.id), body).expect(201)).body as Trial;
      expect(trial.text).toBe('Pep \n9!');
      expect(trial.measures).toEqual(computeTrialMeasures(events, null));
      // Derived by hand: "Pep \n9!" is 7 characters; 14 selections (16 steps less pause and resume).
      expect(trial.measures).toMatchObject({ characters: 7, keystrokes: 14, suggestionsTaken: 1 });
      // Paused time is not typing time (derived by hand): 0 → 5 700 ms less the pause 700 → 5 000
      // (4 300 ms) leaves 1 400 ms; (7 − 1) / 1.4 s × 60 / 5 = 51.428571 wpm (with the pause: 12.631579).
      expect(trial.measures).toMatchObject({ durationMs: 1_400, pausedMs: 4_300 });
      expect(trial.measures.wpm).toBeCloseTo(51.428571, 5);

      const refused = await post(
        cast.owner,
        trials(version.id),
        trialBody({
          text: 'pe',
          events: [...typedEvents('pe', 100), { t: 200, type: 'undo_pick' }],
        }),
      ).expect(400);
      expect((refused.body as { message: string }).message).toBe(
        'Step 3 of the trial log: An undo pick step comes with no suggestion pick to undo.',
      );
    });

    it('the same trial again → 200 with the stored one; two at once → one row; its id on another version → 409', async () => {
      const body = trialBody();
      const first = (await post(cast.assignedCarer, trials(version.id), body).expect(201)).body as Trial;
      const again = (await post(cast.assignedCarer, trials(version.id), body).expect(200)).body as Trial;
      expect(again).toEqual(first);
      const race = trialBody();
      const both = await Promise.all([
        post(cast.assignedCarer, trials(version.id), race),
        post(cast.assignedCarer, trials(version.id), race),
      ]);
      expect(both.map((r) => r.status).sort()).toEqual([200, 201]);
      expect((both[0].body as Trial).id).toBe((both[1].body as Trial).id);
      for (const id of [body.localTrialId, race.localTrialId]) {
        const rows: { n: string }[] = await t.dataSource.query(
          'SELECT count(*) AS n FROM trials WHERE local_trial_id = $1',
          [id],
        );
        expect(Number(rows[0].n)).toBe(1);
      }
      expect(await auditCount('trial.create', first.id)).toBe(1);
      // The losing side of a race, made certain: the look-up before the insert misses the stored row,
      // so the insert hits the unique index and the stored trial is answered (200), not a 500.
      const trialsService: unknown = t.app.get(TrialsService);
      const service = trialsService as {
        stored: (localTrialId: string, versionId: string) => Promise<Trial | null>;
      };
      const miss = jest.spyOn(service, 'stored').mockResolvedValueOnce(null);
      try {
        const lost = await post(cast.assignedCarer, trials(version.id), body).expect(200);
        expect((lost.body as Trial).id).toBe(first.id);
        expect(miss).toHaveBeenCalledTimes(2);
      } finally {
        miss.mockRestore();
      }
      const other = await trained();
      const clash = await post(cast.assignedCarer, trials(other.id), body).expect(409);
      expect(clash.body.message).toBe(
        'This trial id was already used for another version. Start a new trial to try this one.',
      );
    });

    it('a version without a model: 409', async () => {
      const d = await draft();
      const res = await postTrial(t.http, cast.owner, d.id).expect(409);
      expect(res.body.message).toBe('This version has no trained model yet.');
    });

    it('GET: readers; newest first; no logs', async () => {
      const v = await trained();
      const a = (await postTrial(t.http, cast.owner, v.id).expect(201)).body as Trial;
      const b = (await postTrial(t.http, cast.assignedCarer, v.id).expect(201)).body as Trial;
      expect(await statuses((who) => get(who, trials(v.id)))).toEqual([200, 404, 200, 200, 404, 403, 401]);
      const list = (await get(cast.supervisor, trials(v.id)).expect(200)).body as Trial[];
      expect(list.map((x) => x.id)).toEqual([b.id, a.id]);
      expect(JSON.stringify(list)).not.toContain('"events"');
      expect(list[0]).toMatchObject({ by: { role: 'carer' }, versionNumber: v.number });
      await get(cast.owner, trials(randomUUID())).expect(404);
    });
  });

  describe('sign-off and report-problem need a trial', () => {
    it('sign-off: 409 before any trial, 200 after', async () => {
      const v = await trained();
      const path = `/api/profile-versions/${v.id}/sign-off`;
      const before = await post(cast.assignedCarer, path, { comment: 'Fine.' }).expect(409);
      expect(before.body.message).toBe(
        'Try this version on the test keyboard at least once before signing it off.',
      );
      await postTrial(t.http, cast.assignedCarer, v.id).expect(201);
      const after = (
        await post(cast.assignedCarer, path, { comment: 'Typed his shopping list with it.' }).expect(200)
      ).body as Version;
      expect(after.status).toBe('signed_off');
      // A signed-off version keeps its download bytes (the header only holds training-time fields).
      const signed = await model(cast.owner, v.id).expect(200);
      expect(verifyProfileFile(new Uint8Array(gunzipSync(signed.body as Buffer))).header.version.status).toBe(
        'trained',
      );
      // And it can still be tried.
      await postTrial(t.http, cast.owner, v.id).expect(201);
    });

    it('report-problem: assigned carer only, after a trial; trained → sent_back with the reason', async () => {
      const v = await trained();
      const path = `/api/profile-versions/${v.id}/report-problem`;
      const notCarer = castOrder.filter((k) => k !== 'assignedCarer');
      const got: number[] = [];
      for (const k of notCarer) got.push((await post(cast[k], path, { reason: 'x' })).status);
      expect(got).toEqual([403, 403, 403, 404, 403, 401]);
      await cast.assignedCarer.agent!.post(path).send({ reason: 'x' }).expect(403); // no CSRF token
      const before = await post(cast.assignedCarer, path, { reason: 'Too slow.' }).expect(409);
      expect(before.body.message).toBe(
        'Try this version on the test keyboard at least once before signing it off.',
      );
      await postTrial(t.http, cast.assignedCarer, v.id).expect(201);
      const empty = await post(cast.assignedCarer, path, { reason: '  ' }).expect(400);
      expect(empty.body.issues).toContainEqual({
        path: 'reason',
        message: 'Say what went wrong in the trial.',
      });
      const reason = 'It keeps offering boat names he never uses.';
      const back = (await post(cast.assignedCarer, path, { reason }).expect(200)).body as Version;
      expect(back).toMatchObject({ status: 'sent_back', sentBackReason: reason });
      expect(back.history.at(-1)).toMatchObject({
        status: 'sent_back',
        by: 'assigned carer',
        comment: `Problem reported after a trial: ${reason}`,
      });
      expect(await auditCount('profile.report-problem', v.id)).toBe(1);
      expect((await post(cast.assignedCarer, path, { reason }).expect(409)).body.message).toBe(
        'This version was already sent back.',
      );
      // A sent-back version takes no new trials.
      expect((await postTrial(t.http, cast.assignedCarer, v.id).expect(409)).body.message).toBe(
        'Only a version that is ready for trial, signed off or active can be tried; this one is sent back.',
      );
    });

    it('keeps the sign-off comment and the reported problem out of the audit log', async () => {
      const log = JSON.stringify(
        (await get(cast.admin, `/api/audit?clientId=${clientId}&action=profile.&pageSize=200`).expect(200))
          .body,
      );
      expect(log).toContain('profile.sign-off');
      expect(log).toContain('profile.report-problem');
      expect(log).not.toMatch(/shopping list|boat names/);
    });
  });

  describe('practice phrases', () => {
    const phrases = () => `/api/clients/${clientId}/practice-phrases`;

    it('GET: Keyloom’s own then the client’s, oldest first; readers only', async () => {
      expect(await statuses((who) => get(who, phrases()))).toEqual([200, 404, 200, 200, 404, 403, 401]);
      await post(cast.owner, phrases(), { text: 'pepper needs his walk' }).expect(201);
      await post(cast.owner, phrases(), { text: '  the jib is in the shed  ' }).expect(201);
      const list = (await get(cast.assignedCarer, phrases()).expect(200)).body as PracticePhrase[];
      expect(list[0]).toEqual({
        id: 'kl-01',
        text: 'can you open the window a little',
        source: 'keyloom',
        addedBy: null,
        createdAt: null,
      });
      const own = list.filter((p) => p.source === 'client');
      expect(own.map((p) => p.text)).toEqual(['pepper needs his walk', 'the jib is in the shed']);
      expect(own[0].addedBy).toBe('clinician owner');
      expect(list.slice(0, -2).every((p) => p.source === 'keyloom')).toBe(true);
    });

    // Carers are turned away by role (403) before their assignment is looked at, as on every clinician-only route.
    it('POST: owning clinician only; repeats (ignoring case, also of Keyloom’s own) and bad text refused', async () => {
      let n = 0;
      expect(await statuses((who) => post(who, phrases(), { text: `phrase number ${++n}` }))).toEqual([
        201, 404, 403, 403, 403, 403, 401,
      ]);
      await cast.owner.agent!.post(phrases()).send({ text: 'no token here' }).expect(403);
      expect(
        (await post(cast.owner, phrases(), { text: 'PEPPER needs his walk' }).expect(409)).body.message,
      ).toBe('That phrase is already in the list.');
      await post(cast.owner, phrases(), { text: 'What time is it now?' }).expect(409);
      expect((await post(cast.owner, phrases(), { text: 'x' }).expect(400)).body.issues).toContainEqual({
        path: 'text',
        message: 'Write a phrase of at least 2 characters.',
      });
      await post(cast.owner, phrases(), {}).expect(400);
      await post(cast.owner, `/api/clients/${randomUUID()}/practice-phrases`, { text: 'nobody' }).expect(404);
      expect(
        await t.dataSource.getRepository(AuditEvent).countBy({ action: 'practice-phrase.create', clientId }),
      ).toBe(3);
    });

    it('keeps phrase text out of the audit log when a phrase is added and removed (supervisor, admin)', async () => {
      const text = 'my brother Tom is in ward nine';
      const added = (await post(cast.owner, phrases(), { text }).expect(201)).body as PracticePhrase;
      await del(cast.owner, `${phrases()}/${added.id}`).expect(204);
      for (const who of ['supervisor', 'admin'] as const) {
        const page = (
          await get(cast[who], `/api/audit?clientId=${clientId}&action=practice-phrase.&pageSize=200`).expect(
            200,
          )
        ).body as AuditPage;
        const mine = page.items.filter((e) => e.subjectId === added.id);
        expect(mine.map((e) => e.action).sort()).toEqual([
          'practice-phrase.create',
          'practice-phrase.delete',
        ]);
        expect(mine.map((e) => e.details)).toEqual([
          { characters: text.length },
          { characters: text.length },
        ]);
        expect(JSON.stringify(page)).not.toMatch(/ward nine|brother Tom/);
      }
    });

    it('at most 200 of the client’s own', async () => {
      const other = (await newClient(t.http, cast.owner, undefined, 'K. Bramley')).id;
      await t.dataSource.query(
        `INSERT INTO practice_phrases (client_id, text) SELECT $1, 'filler ' || g FROM generate_series(1, 199) g`,
        [other],
      );
      await post(cast.owner, `/api/clients/${other}/practice-phrases`, { text: 'the two hundredth' }).expect(
        201,
      );
      const full = await post(cast.owner, `/api/clients/${other}/practice-phrases`, {
        text: 'one too many',
      }).expect(409);
      expect(full.body.message).toBe(
        'A client can have at most 200 practice phrases of their own. Remove one first.',
      );
    });

    it('DELETE: owning clinician, the client’s own only', async () => {
      const made = async () =>
        (await post(cast.owner, phrases(), { text: `to remove ${randomUUID().slice(0, 8)}` }).expect(201))
          .body as PracticePhrase;
      const p = await made();
      const path = `${phrases()}/${p.id}`;
      const others: number[] = [];
      for (const k of castOrder.filter((key) => key !== 'owner'))
        others.push((await del(cast[k], path)).status);
      expect(others).toEqual([404, 403, 403, 403, 403, 401]);
      await cast.owner.agent!.delete(path).expect(403); // no CSRF token
      await del(cast.owner, path).expect(204);
      await del(cast.owner, path).expect(404);
      expect((await del(cast.owner, `${phrases()}/kl-03`).expect(409)).body.message).toBe(
        'Keyloom’s own practice phrases cannot be removed.',
      );
      await del(cast.owner, `${phrases()}/not-an-id`).expect(404);
      const list = (await get(cast.owner, phrases()).expect(200)).body as PracticePhrase[];
      expect(list.map((x) => x.id)).not.toContain(p.id);
      expect(await auditCount('practice-phrase.delete', p.id)).toBe(1);
    });
  });

  describe('consent withdrawal', () => {
    const count = async (table: string) =>
      (
        await t.dataSource.query<{ n: number }[]>(
          `SELECT count(*)::int AS n FROM ${table} WHERE client_id = $1`,
          [clientId],
        )
      )[0].n;

    it('keeps every trial, version, sample and phrase when only a summaries consent is withdrawn', async () => {
      const summariesOnly = (
        await post(cast.owner, `/api/clients/${clientId}/consents`, {
          givenBy: 'client',
          scopes: ['summaries'],
          givenOn: '2026-10-01',
        }).expect(201)
      ).body as { id: string };
      // The first consent covers both scopes; make it a training-only one for this scenario.
      await t.dataSource.query(`UPDATE consents SET scopes = ARRAY['training'] WHERE id = $1`, [consentId]);
      const before = {
        samples: await count('language_samples'),
        profile_versions: await count('profile_versions'),
        trials: await count('trials'),
        practice_phrases: await count('practice_phrases'),
      };
      expect(before.trials).toBeGreaterThan(5);
      expect(before.practice_phrases).toBeGreaterThan(0);
      const res = await post(cast.owner, `/api/clients/${clientId}/consents/${summariesOnly.id}/withdraw`, {
        reason: 'family asked to stop e-mails',
      }).expect(200);
      expect(res.body.withdrawal).toMatchObject({
        samplesDeleted: 0,
        derived: { sampleFlags: 0, profileVersions: 0, trials: 0, practicePhrases: 0 },
        keptScopes: [],
      });
      expect({
        samples: await count('language_samples'),
        profile_versions: await count('profile_versions'),
        trials: await count('trials'),
        practice_phrases: await count('practice_phrases'),
      }).toEqual(before);
    });

    it('deletes the client’s own phrases (counted) and, with the versions, their trials', async () => {
      const before: { n: string }[] = await t.dataSource.query(
        'SELECT count(*) AS n FROM trials WHERE client_id = $1',
        [clientId],
      );
      expect(Number(before[0].n)).toBeGreaterThan(5);
      const own = (
        (await get(cast.owner, `/api/clients/${clientId}/practice-phrases`).expect(200))
          .body as PracticePhrase[]
      ).filter((p) => p.source === 'client');
      const res = await post(cast.owner, `/api/clients/${clientId}/consents/${consentId}/withdraw`, {
        reason: 'The client asked.',
      }).expect(200);
      expect(JSON.stringify(res.body)).toContain(`"practicePhrases":${own.length}`);
      // Every kind of row is counted, trials too (they go by cascade with their versions).
      expect(res.body.withdrawal).toMatchObject({
        samplesDeleted: TEXTS.length,
        derived: { trials: Number(before[0].n), practicePhrases: own.length },
      });
      expect(res.body.withdrawal.derived.profileVersions).toBeGreaterThan(0);
      const after: { n: string }[] = await t.dataSource.query(
        'SELECT count(*) AS n FROM trials WHERE client_id = $1',
        [clientId],
      );
      expect(Number(after[0].n)).toBe(0);
      const list = (await get(cast.owner, `/api/clients/${clientId}/practice-phrases`).expect(200))
        .body as PracticePhrase[];
      expect(list.every((p) => p.source === 'keyloom')).toBe(true);
    });
  });
});
