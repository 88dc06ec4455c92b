// A client's vocabulary over HTTP against real PostgreSQL: the current list (GET/PUT with revisions,
// roles, audit counts), versions freezing it, a version's listing (pages, search, sorts, filters,
// dates from the samples' periods), the misspelling review and the three exports, and the wiring into
// training (report and profile-file header). Training is kept small (2 folds, 400 keystroke characters).
import {
  type ClientVocabularyState,
  type MisspellingList,
  verifyProfileFile,
  type VocabularyPage,
  type VocabularyWord,
  wordPairsOf,
} from '@keyloom/shared';
import { parse } from 'csv-parse/sync';
import type request from 'supertest';
import { AuditService } from '../src/audit/audit.service';
import { loadTrainingRuntime, runProfileTraining } from '../src/profile-versions/profile-training';
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import { type Caller, type Cast, castOrder, newCast, newClient, newConsent, send } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

// Invented for these tests. The older sample (March) is uploaded second, so the frozen order
// (upload order) and the period order differ: "tide" is in both, "slipway" only in March's.
const MARCH =
  'Went down to the club early and helped to lay the marks for the evening race. The tide was turning ' +
  'and the wind was light from the north. The dog waited on the slipway and watched every boat go out. ' +
  'After the race we sat on the terrace and talked about the winter series and the new committee. ' +
  'At home I played the slow ballad twice and the middle section finally sounded right to me.';
const MAY =
  'The tide was high this morning and the club was quiet. I hope to recieve the new sails on friday. ' +
  'They said I would recieve a letter about the winter series too. When I recieve it I will read it ' +
  'on the terrace. The wind picked up after lunch, so we stayed in and I practised the piano until tea. ' +
  'Tomorrow the tide turns early and we start at nine with the new gloves and the spare tiller.';
const FOLDS = 2;
const KS_CHARS = 400;

/** supertest parser that keeps a body as text whatever its type. */
function text(res: request.Response, done: (error: Error | null, body: string) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks).toString('utf8')));
}

/** supertest parser that keeps the raw bytes of a binary body. */
function binary(res: request.Response, done: (error: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

const ADDITIONS = [{ text: 'Ben & Jerry’s' }, { text: 'marlinspike', weight: 3 }];
const BLOCKS = [{ word: 'slipway', replacement: 'ramp' }];

describe('client vocabulary (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;
  let clientId: string;
  let version: ProfileVersionDto;

  const get = (who: Caller, path: string) => send(t.http, who, 'get', path);
  const put = (who: Caller, path: string, body: object) => send(t.http, who, 'put', path, body);
  const post = (who: Caller, path: string, body?: object) => send(t.http, who, 'post', path, body ?? {});
  const listPath = () => `/api/clients/${clientId}/vocabulary`;
  const state = async () => (await get(cast.owner, listPath()).expect(200)).body as ClientVocabularyState;
  const page = async (query: string) =>
    (await get(cast.owner, `/api/profile-versions/${version.id}/vocabulary?${query}`).expect(200))
      .body as VocabularyPage;
  /** A version's export: 200, its content type and its download name (keyloom-v<number>-<file>). */
  const download = async (file: string, type: string): Promise<string> => {
    const res = await get(cast.owner, `/api/profile-versions/${version.id}/${file}`)
      .buffer(true)
      .parse(text)
      .expect(200);
    expect(res.headers['content-type']).toBe(type);
    expect(res.headers['content-disposition']).toBe(
      `attachment; filename="keyloom-v${version.number}-${file}"`,
    );
    return res.body as string;
  };
  /** Every word of the version's listing, in the default order (count, most first). */
  const everyWord = async (): Promise<VocabularyWord[]> => {
    const out: VocabularyWord[] = [];
    for (let p = 1; ; p++) {
      const one = await page(`pageSize=200&page=${p}`);
      out.push(...one.words);
      if (out.length >= one.total) return out;
    }
  };
  async function statuses(make: (who: Caller) => request.Test): Promise<Record<string, number>> {
    const out: Record<string, number> = {};
    for (const key of castOrder) out[key] = (await make(cast[key])).status;
    return out;
  }
  async function auditDetails(action: string): Promise<Record<string, unknown>[]> {
    const rows: { details: Record<string, unknown> }[] = await t.dataSource.query(
      'SELECT details FROM audit_events WHERE action = $1 AND client_id = $2 ORDER BY at',
      [action, clientId],
    );
    return rows.map((r) => r.details);
  }

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    cast = await newCast(t.http, t.dataSource);
    clientId = (await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Quillfeather')).id;
    await newConsent(t.http, cast.owner, clientId);
    for (const [title, body, periodStart, periodEnd] of [
      ['May notes', MAY, '2026-05-01', '2026-05-20'],
      ['March diary', MARCH, '2026-03-01', '2026-03-31'],
    ]) {
      await post(cast.owner, `/api/clients/${clientId}/samples`, {
        title,
        text: body,
        sourceKind: 'diary',
        periodStart,
        periodEnd,
      }).expect(201);
    }
    const ready: unknown[] = await t.dataSource.query(
      `SELECT id FROM language_samples WHERE client_id = $1 AND status = 'ready'`,
      [clientId],
    );
    expect(ready).toHaveLength(2);
  });
  afterAll(async () => {
    await t.app.close();
  });

  describe('the current list', () => {
    it('answers revision 0 and empty lists before anything is saved', async () => {
      expect(await state()).toEqual({
        clientId,
        revision: 0,
        vocabulary: { additions: [], blocks: [] },
        keptSpellings: [],
        updatedAt: null,
        updatedBy: null,
      });
    });

    it('lets the owning clinician and a supervisor read it; carers and admins 403; another clinician 404', async () => {
      expect(await statuses((who) => get(who, listPath()))).toEqual({
        owner: 200,
        otherClinician: 404,
        supervisor: 200,
        assignedCarer: 403,
        unassignedCarer: 403,
        admin: 403,
        anonymous: 401,
      });
    });

    it('lets only the owning clinician save it, and a refused save changes nothing', async () => {
      const body = { revision: 0, vocabulary: { additions: [{ text: 'intruder' }], blocks: [] } };
      const got = await statuses((who) =>
        who === cast.owner ? get(who, listPath()) : put(who, listPath(), body),
      );
      expect(got).toEqual({
        owner: 200,
        otherClinician: 404,
        supervisor: 403,
        assignedCarer: 403,
        unassignedCarer: 403,
        admin: 403,
        anonymous: 401,
      });
      expect((await state()).revision).toBe(0);
    });

    it('saves and reads back the same list, with who saved it', async () => {
      const saved = (
        await put(cast.owner, listPath(), {
          revision: 0,
          vocabulary: { additions: [{ text: 'Ben & Jerry’s' }], blocks: [{ word: 'slipway' }] },
          keptSpellings: [],
        }).expect(200)
      ).body as ClientVocabularyState;
      expect(saved).toMatchObject({
        clientId,
        revision: 1,
        vocabulary: { additions: [{ text: 'Ben & Jerry’s' }], blocks: [{ word: 'slipway' }] },
        keptSpellings: [],
        updatedBy: 'clinician owner',
      });
      expect(await state()).toEqual(saved);
    });

    it('refuses a stale revision with 409 and a plain message, keeping the list', async () => {
      const before = await state();
      const res = await put(cast.owner, listPath(), {
        revision: 0,
        vocabulary: { additions: [], blocks: [{ word: 'tide' }] },
      }).expect(409);
      expect((res.body as { message: string }).message).toMatch(/changed since you opened it/);
      expect(await state()).toEqual(before);
    });

    it('saves a double submission (the same revision twice at once) once', async () => {
      const body = { revision: 1, vocabulary: { additions: ADDITIONS, blocks: BLOCKS }, keptSpellings: [] };
      const answers = await Promise.all([
        put(cast.owner, listPath(), body),
        put(cast.owner, listPath(), body),
      ]);
      expect(answers.map((r) => r.status).sort()).toEqual([200, 409]);
      const now = await state();
      expect(now.revision).toBe(2);
      expect(now.vocabulary).toEqual({ additions: ADDITIONS, blocks: BLOCKS });
    });

    it('refuses a bad list with 400 and the schema’s message', async () => {
      const res = await put(cast.owner, listPath(), {
        revision: 2,
        vocabulary: { additions: [{ text: 'tide' }], blocks: [{ word: 'Tide' }] },
      }).expect(400);
      expect(JSON.stringify(res.body)).toContain('is also added: remove the addition or the block.');
      expect((await state()).revision).toBe(2);
    });

    it('audits each save with counts before and after, and no word', async () => {
      const events = await auditDetails('vocabulary.update');
      expect(events).toHaveLength(2);
      expect(events[0]).toEqual({
        revision: 1,
        before: { additions: 0, blocks: 0, kept: 0 },
        after: { additions: 1, blocks: 1, kept: 0 },
      });
      expect(events[1]).toEqual({
        revision: 2,
        before: { additions: 1, blocks: 1, kept: 0 },
        after: { additions: 2, blocks: 1, kept: 0 },
      });
      const all = JSON.stringify(events);
      for (const word of ['Jerry', 'slipway', 'marlinspike', 'ramp']) expect(all).not.toContain(word);
    });
  });

  describe('versions freeze the list', () => {
    it('a version created without settings.vocabulary takes the client’s list, and keeps it after a change', async () => {
      version = (
        await post(cast.owner, `/api/clients/${clientId}/profile-versions`, { settings: {} }).expect(201)
      ).body as ProfileVersionDto;
      expect(version.settings.vocabulary).toEqual({ additions: ADDITIONS, blocks: BLOCKS });
      await put(cast.owner, listPath(), {
        revision: 2,
        vocabulary: { additions: [], blocks: [{ word: 'terrace' }] },
      }).expect(200);
      const again = (await get(cast.owner, `/api/profile-versions/${version.id}`).expect(200))
        .body as ProfileVersionDto;
      expect(again.settings.vocabulary).toEqual({ additions: ADDITIONS, blocks: BLOCKS });
      // The creation's audit event holds counts, not the words.
      const created = await auditDetails('profile.create');
      expect(created[0]).toMatchObject({ settings: { vocabulary: { additions: 2, blocks: 1 } } });
      expect(JSON.stringify(created)).not.toContain('slipway');
      // Back to the frozen list for the misspelling tests below.
      await put(cast.owner, listPath(), {
        revision: 3,
        vocabulary: { additions: ADDITIONS, blocks: BLOCKS },
      }).expect(200);
    });

    it('a version created with settings.vocabulary uses the one sent', async () => {
      const sent = { additions: [{ text: 'spinnaker' }], blocks: [] };
      const other = (
        await post(cast.owner, `/api/clients/${clientId}/profile-versions`, {
          settings: { vocabulary: sent },
        }).expect(201)
      ).body as ProfileVersionDto;
      expect(other.settings.vocabulary).toEqual(sent);
      const bad = await post(cast.owner, `/api/clients/${clientId}/profile-versions`, {
        settings: { vocabulary: { additions: [], blocks: [{ word: 'two words' }] } },
      }).expect(400);
      expect(JSON.stringify(bad.body)).toMatch(/one word/i);
    });
  });

  describe('the listing', () => {
    it('pages through the words: page 2 holds the next ones, and the totals add up', async () => {
      const all = await everyWord();
      const first = await page('pageSize=10&page=1');
      const second = await page('pageSize=10&page=2');
      expect(first.total).toBe(all.length);
      expect(first.totalWords).toBe(all.length);
      expect(first.words.map((w) => w.key)).toEqual(all.slice(0, 10).map((w) => w.key));
      expect(second.words.map((w) => w.key)).toEqual(all.slice(10, 20).map((w) => w.key));
      expect(new Set(all.map((w) => w.key)).size).toBe(all.length);
    });

    it('finds keys starting with the text first, then keys containing it', async () => {
      const all = await everyWord();
      const found = await page('query=TE&pageSize=200');
      const starting = all.filter((w) => w.key.startsWith('te')).map((w) => w.key);
      const containing = all.filter((w) => !w.key.startsWith('te') && w.key.includes('te')).map((w) => w.key);
      expect(starting.length).toBeGreaterThan(0);
      expect(containing.length).toBeGreaterThan(0);
      expect(found.words.map((w) => w.key)).toEqual([...starting, ...containing]);
      expect(found.total).toBe(starting.length + containing.length);
    });

    it('sorts by count, word, first and last use, either way', async () => {
      const keys = (p: VocabularyPage) => p.words.map((w) => w.key);
      const byCount = await page('sort=count&pageSize=200');
      const counts = byCount.words.map((w) => w.count);
      expect(counts).toEqual([...counts].sort((a, b) => b - a));
      const byWord = await page('sort=word&pageSize=200');
      expect(keys(byWord)).toEqual([...keys(byWord)].sort());
      const byWordDesc = await page('sort=word&order=desc&pageSize=200');
      expect(keys(byWordDesc)).toEqual([...keys(byWord)].reverse());
      const dated = (p: VocabularyPage, field: 'firstUsed' | 'lastUsed') =>
        p.words.map((w) => w[field]).filter((d): d is string => d !== null);
      const first = dated(await page('sort=first&pageSize=200'), 'firstUsed');
      expect(first).toEqual([...first].sort());
      expect(new Set(first).size).toBe(2);
      const last = dated(await page('sort=last&order=desc&pageSize=200'), 'lastUsed');
      expect(last).toEqual([...last].sort().reverse());
      // Undated words (additions never written) come last in either order.
      const firstPage = await page('sort=first&order=desc&pageSize=200');
      expect(firstPage.words[firstPage.words.length - 1].firstUsed).toBeNull();
      expect(firstPage.words[0].firstUsed).toBe('2026-05-01');
    });

    it('dates a word by the samples’ periods, oldest sample first whatever the upload order', async () => {
      const all = await everyWord();
      const slipway = all.find((w) => w.key === 'slipway');
      const tide = all.find((w) => w.key === 'tide');
      expect(slipway).toMatchObject({ firstUsed: '2026-03-01', lastUsed: '2026-03-31' });
      expect(tide).toMatchObject({ count: 3, firstUsed: '2026-03-01', lastUsed: '2026-05-20' });
      expect(tide?.samples.map((s) => s.title)).toEqual(['March diary', 'May notes']);
    });

    it('filters additions (count 0 when never written), blocks (with the replacement) and words outside the base', async () => {
      const added = await page('show=added');
      expect(added.words.map((w) => w.key).sort()).toEqual([
        'ben & jerry’s'.replace('’', "'"),
        'marlinspike',
      ]);
      expect(added.words.find((w) => w.key === 'marlinspike')).toMatchObject({
        word: 'marlinspike',
        count: 0,
        added: true,
        blocked: false,
        samples: [],
        firstUsed: null,
      });
      const blocked = await page('show=blocked');
      expect(blocked.words).toEqual([
        expect.objectContaining({ key: 'slipway', count: 1, blocked: true, replacement: 'ramp' }),
      ]);
      const outside = await page('show=not_in_base&pageSize=200');
      expect(outside.words.length).toBeGreaterThan(0);
      expect(outside.words.every((w) => !w.inBase)).toBe(true);
      expect(outside.words.map((w) => w.key)).toContain('recieve');
      expect(outside.words.map((w) => w.key)).not.toContain('tide');
      expect(outside.total).toBeLessThan(outside.totalWords);
    });

    it('refuses a bad query with 400 and the schema’s message', async () => {
      const res = await get(cast.owner, `/api/profile-versions/${version.id}/vocabulary?sort=size`).expect(
        400,
      );
      expect(JSON.stringify(res.body)).toContain('Sort by count, word, first or last.');
      await get(cast.owner, `/api/profile-versions/${version.id}/vocabulary?pageSize=5`).expect(400);
      await get(cast.owner, `/api/profile-versions/${version.id}/vocabulary?page=0`).expect(400);
    });

    it('reads a version stored before vocabularies (settings without one) as having none', async () => {
      const old = (
        await post(cast.owner, `/api/clients/${clientId}/profile-versions`, { settings: {} }).expect(201)
      ).body as ProfileVersionDto;
      await t.dataSource.query(
        `UPDATE profile_versions SET settings = settings - 'vocabulary' WHERE id = $1`,
        [old.id],
      );
      const res = (await get(cast.owner, `/api/profile-versions/${old.id}/vocabulary?show=added`).expect(200))
        .body as VocabularyPage;
      expect(res.total).toBe(0);
      expect(res.totalWords).toBeGreaterThan(50);
    });
  });

  describe('every version route', () => {
    const routes = ['vocabulary', 'misspellings', 'vocabulary.csv', 'vocabulary.txt', 'word-pairs.csv'];

    it.each(routes)(
      '%s: owning clinician and supervisor; carers and admins 403; others 404; no session 401',
      async (route) => {
        expect(await statuses((who) => get(who, `/api/profile-versions/${version.id}/${route}`))).toEqual({
          owner: 200,
          otherClinician: 404,
          supervisor: 200,
          assignedCarer: 403,
          unassignedCarer: 403,
          admin: 403,
          anonymous: 401,
        });
      },
    );

    it.each(routes)('%s: an unknown version is 404, a malformed id 400', async (route) => {
      await get(cast.owner, `/api/profile-versions/00000000-0000-4000-8000-000000000000/${route}`).expect(
        404,
      );
      await get(cast.owner, `/api/profile-versions/not-a-uuid/${route}`).expect(400);
    });
  });

  describe('exports', () => {
    it('vocabulary.csv: the listing minus blocked words plus additions, as a download without the client’s name', async () => {
      const body = await download('vocabulary.csv', 'text/csv; charset=utf-8');
      expect(body.startsWith('\uFEFF')).toBe(true);
      const rows = parse<Record<string, string>>(body, { bom: true, columns: true });
      expect(Object.keys(rows[0])).toEqual(['word', 'count', 'source']);
      const all = await everyWord();
      const expected = all.filter((w) => !w.blocked).map((w) => w.word);
      expect(rows.map((r) => r.word).sort()).toEqual(expected.sort());
      expect(rows.find((r) => r.word === 'slipway')).toBeUndefined();
      expect(rows.find((r) => r.word === 'Ben & Jerry’s')).toEqual({
        word: 'Ben & Jerry’s',
        count: '0',
        source: 'added',
      });
      const tide = all.find((w) => w.key === 'tide');
      expect(rows.find((r) => r.word === 'tide')).toEqual({
        word: 'tide',
        count: String(tide?.count),
        source: 'March diary; May notes',
      });
      const counts = rows.map((r) => Number(r.count));
      expect(counts).toEqual([...counts].sort((a, b) => b - a));
    });

    it('vocabulary.txt: one word per line, the same words, no blocked one', async () => {
      const body = await download('vocabulary.txt', 'text/plain; charset=utf-8');
      const lines = body.split('\n').filter((l) => l !== '');
      const all = await everyWord();
      expect(lines).toHaveLength(all.filter((w) => !w.blocked).length);
      expect(lines).not.toContain('slipway');
      expect(lines).toContain('marlinspike');
    });

    it('word-pairs.csv: previous,word,count without pairs holding a blocked word', async () => {
      const body = await download('word-pairs.csv', 'text/csv; charset=utf-8');
      const rows = parse<Record<string, string>>(body, { bom: true, columns: true });
      expect(Object.keys(rows[0])).toEqual(['previous', 'word', 'count']);
      // The samples have "the slipway" (the engine counts it); the export leaves it out.
      const unfiltered = wordPairsOf(
        [
          { id: 'm', text: MARCH },
          { id: 'y', text: MAY },
        ],
        { caseFold: false },
      );
      expect(unfiltered.some((p) => p.word === 'slipway')).toBe(true);
      expect(rows.some((r) => r.word === 'slipway' || r.previous === 'slipway')).toBe(false);
      expect(rows.length).toBe(
        unfiltered.filter((p) => p.word !== 'slipway' && p.previous !== 'slipway').length,
      );
      expect(rows.find((r) => r.previous === 'the' && r.word === 'tide')).toEqual({
        previous: 'the',
        word: 'tide',
        count: '3',
      });
    });

    it('audits each export with the format and the row count, no word', async () => {
      const events = await auditDetails('vocabulary.export');
      const formats = events.map((e) => e.format);
      expect(formats).toEqual(expect.arrayContaining(['vocabulary.csv', 'vocabulary.txt', 'word-pairs.csv']));
      const csv = events.filter((e) => e.format === 'vocabulary.csv');
      const all = await everyWord();
      expect(csv[csv.length - 1]).toEqual({
        number: version.number,
        format: 'vocabulary.csv',
        rows: all.filter((w) => !w.blocked).length,
      });
      const json = JSON.stringify(events);
      for (const word of ['tide', 'Jerry', 'marlinspike', 'March diary']) expect(json).not.toContain(word);
    });
  });

  describe('misspellings', () => {
    it('lists "recieve" with "receive", and leaves it out once the list keeps it', async () => {
      const path = `/api/profile-versions/${version.id}/misspellings`;
      const before = (await get(cast.owner, path).expect(200)).body as MisspellingList;
      const recieve = before.candidates.find((c) => c.key === 'recieve');
      expect(recieve).toMatchObject({ word: 'recieve', count: 3 });
      expect(recieve?.corrections[0]).toMatchObject({ word: 'receive', distance: 1 });
      expect(recieve?.corrections[0].perMillion).toBeGreaterThan(1);
      const now = await state();
      await put(cast.owner, listPath(), {
        revision: now.revision,
        vocabulary: now.vocabulary,
        keptSpellings: ['recieve'],
      }).expect(200);
      const after = (await get(cast.owner, path).expect(200)).body as MisspellingList;
      expect(after.candidates.find((c) => c.key === 'recieve')).toBeUndefined();
      expect(after.candidates).toHaveLength(before.candidates.length - 1);
    });
  });

  describe('training with the frozen list', () => {
    it('the report counts the additions and blocks, and the profile file’s header carries them', async () => {
      const audit = t.app.get(AuditService);
      const runtime = { ...loadTrainingRuntime(FOLDS), ksSampleChars: KS_CHARS, progressIntervalMs: 50 };
      await post(cast.owner, `/api/profile-versions/${version.id}/train`).expect(200);
      const rows: { job_id: string }[] = await t.dataSource.query(
        'SELECT job_id FROM profile_versions WHERE id = $1',
        [version.id],
      );
      expect(await runProfileTraining(t.dataSource, audit, version.id, rows[0].job_id, runtime)).toBe(
        'trained',
      );
      const trained = (await get(cast.owner, `/api/profile-versions/${version.id}`).expect(200))
        .body as ProfileVersionDto;
      expect(trained.metrics).toMatchObject({ vocabulary: { added: 2, blocked: 1 } });
      const file = (
        await get(cast.owner, `/api/profile-versions/${version.id}/export`)
          .buffer(true)
          .parse(binary)
          .expect(200)
      ).body as Buffer;
      const header = verifyProfileFile(new Uint8Array(file)).header as { vocabulary?: unknown };
      expect(header.vocabulary).toEqual({ additions: ADDITIONS, blocks: BLOCKS });
    });
  });
});
