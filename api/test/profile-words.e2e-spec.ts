// The word-aware list over HTTP against real PostgreSQL: a trained version keeps the client's word
// model; its export (layout 4) and the test keyboard's model download (layout 3) carry it; the base
// vocabulary download (auth, bytes, ETag, 304, 404); a version trained before the word-aware list
// (word_model null) still exports as layout 2 and verifies. Training is kept small (2 folds, a
// 400-character keystroke sample).
import {
  deserializeBaseWords,
  PROFILE_FILE_SIGNED_VERSION,
  PROFILE_FILE_SIGNED_WORDS_VERSION,
  PROFILE_FILE_VERSION,
  PROFILE_FILE_WORDS_VERSION,
  verifyProfileFile,
  WordNgramModel,
} from '@keyloom/shared';
import { createHash } from 'node:crypto';
import { gunzipSync } from 'node:zlib';
import type request from 'supertest';
import { AuditService } from '../src/audit/audit.service';
import {
  loadTrainingRuntime,
  readBaseWordsFile,
  runProfileTraining,
  type TrainingRuntime,
} from '../src/profile-versions/profile-training';
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import { type Caller, type Cast, castOrder, newCast, newClient, newConsent, send } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

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

/** supertest parser that keeps the raw bytes of a binary body. */
function binary(res: request.Response, done: (error: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');
/** The layout version, read by hand: u16 little-endian at offset 4 (shared/src/engine/README.md). */
const layoutOf = (file: Uint8Array) => Buffer.from(file).readUInt16LE(4);

type VerifyAnswer = {
  valid: boolean;
  vocabularyWords: number;
  modelBytes: number;
  header: Record<string, unknown>;
};

describe('word-aware list (HTTP)', () => {
  let t: TestApp;
  let cast: Cast;
  let clientId: string;
  let runtime: TrainingRuntime;
  let audit: AuditService;
  let version: ProfileVersionDto;
  const baseWordsSha256 = readBaseWordsFile().sha256;

  const get = (who: Caller, path: string) => send(t.http, who, 'get', path);
  const post = (who: Caller, path: string, body?: object) => send(t.http, who, 'post', path, body ?? {});
  const bytesOf = (who: Caller, path: string) => get(who, path).buffer(true).parse(binary);
  const verify = async (file: Uint8Array) =>
    (
      await send(t.http, cast.owner, 'post', '/api/profile-exports/verify')
        .attach('file', Buffer.from(file), 'profile.klprofile')
        .expect(200)
    ).body as VerifyAnswer;

  async function trained(): Promise<ProfileVersionDto> {
    const draft = (
      await post(cast.owner, `/api/clients/${clientId}/profile-versions`, { settings: {} }).expect(201)
    ).body as ProfileVersionDto;
    await post(cast.owner, `/api/profile-versions/${draft.id}/train`).expect(200);
    const rows: { job_id: string }[] = await t.dataSource.query(
      'SELECT job_id FROM profile_versions WHERE id = $1',
      [draft.id],
    );
    expect(await runProfileTraining(t.dataSource, audit, draft.id, rows[0].job_id, runtime)).toBe('trained');
    return (await get(cast.owner, `/api/profile-versions/${draft.id}`).expect(200)).body as ProfileVersionDto;
  }

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    audit = t.app.get(AuditService);
    cast = await newCast(t.http, t.dataSource);
    clientId = (await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Quillfeather')).id;
    await newConsent(t.http, cast.owner, clientId);
    for (const [i, text] of TEXTS.entries()) {
      await post(cast.owner, `/api/clients/${clientId}/samples`, {
        title: `Sample ${i + 1}`,
        text,
        sourceKind: 'diary',
      }).expect(201);
    }
    runtime = { ...loadTrainingRuntime(FOLDS), ksSampleChars: KS_CHARS, progressIntervalMs: 50 };
    version = await trained();
  });
  afterAll(async () => {
    await t.app.close();
  });

  it('stores the client’s word model, its weights and the base vocabulary’s hash with the version', async () => {
    const rows: {
      word_model: Buffer | null;
      word_weights: Record<string, number> | null;
      base_words_sha256: string | null;
    }[] = await t.dataSource.query(
      'SELECT word_model, word_weights, base_words_sha256 FROM profile_versions WHERE id = $1',
      [version.id],
    );
    const row = rows[0];
    expect(row.word_model).not.toBeNull();
    expect(WordNgramModel.fromBytes(new Uint8Array(row.word_model as Buffer)).has('slipway')).toBe(true);
    const weights = row.word_weights as Record<string, number>;
    expect(Object.keys(weights).sort()).toEqual(['base', 'cache', 'lexicon', 'personal']);
    // Mixture weights sum to 1 (mixture-weights.ts).
    expect(Object.values(weights).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 6);
    expect(row.base_words_sha256).toBe(baseWordsSha256);
  });

  it('exports a trained version as layout 4 whose vocabulary holds a word of its samples', async () => {
    const file = (await bytesOf(cast.owner, `/api/profile-versions/${version.id}/export`).expect(200))
      .body as Buffer;
    expect(layoutOf(file)).toBe(PROFILE_FILE_SIGNED_WORDS_VERSION);
    const contents = verifyProfileFile(new Uint8Array(file));
    expect(contents.words).not.toBeNull();
    const words = WordNgramModel.fromBytes(contents.words as Uint8Array);
    // Words only the client's samples have ("slipway", "tiller") and an everyday one.
    for (const word of ['slipway', 'tiller', 'club']) expect(words.has(word)).toBe(true);
    expect(contents.header.wordWeights).toEqual(
      expect.objectContaining({ personal: expect.any(Number), base: expect.any(Number) }),
    );
    // The file names the base vocabulary its words were trained beside, as the database does.
    expect(contents.header.baseWordsSha256).toBe(baseWordsSha256);
    const answer = await verify(file);
    expect(answer.valid).toBe(true);
    expect(answer.vocabularyWords).toBe(contents.vocabularyWords);
    expect(answer.vocabularyWords).toBeGreaterThan(50);
  });

  it('the test keyboard’s download carries the words (layout 3) and names the base vocabulary', async () => {
    const res = await bytesOf(cast.assignedCarer, `/api/profile-versions/${version.id}/model`).expect(200);
    expect(res.headers['x-keyloom-base-words']).toBe(baseWordsSha256);
    const file = gunzipSync(res.body as Buffer);
    expect(layoutOf(file)).toBe(PROFILE_FILE_WORDS_VERSION);
    const contents = verifyProfileFile(new Uint8Array(file));
    expect(WordNgramModel.fromBytes(contents.words as Uint8Array).has('tiller')).toBe(true);
  });

  describe('GET /api/base-words/:sha256', () => {
    it('any signed-in user; gunzips to the file with that sha256; immutable; other hashes 404', async () => {
      const path = `/api/base-words/${baseWordsSha256}`;
      expect(await Promise.all(castOrder.map(async (key) => (await get(cast[key], path)).status))).toEqual([
        200, 200, 200, 200, 200, 200, 401,
      ]);
      const res = await bytesOf(cast.assignedCarer, path).expect(200);
      expect(res.headers['content-type']).toBe('application/octet-stream');
      // gzip's magic bytes 1f 8b and method 8 (RFC 1952); node:zlib as the reference decoder.
      expect([...(res.body as Buffer).subarray(0, 3)]).toEqual([0x1f, 0x8b, 8]);
      const raw = gunzipSync(res.body as Buffer);
      expect(sha256(raw)).toBe(baseWordsSha256);
      expect(res.headers.etag).toBe(`"${baseWordsSha256}"`);
      expect(res.headers['x-keyloom-base-words']).toBe(baseWordsSha256);
      expect(Number(res.headers['x-keyloom-uncompressed-bytes'])).toBe(raw.length);
      expect(res.headers['cache-control']).toBe('private, max-age=31536000, immutable');
      // The bytes are the base vocabulary: the base corpus's words and the word list.
      const base = deserializeBaseWords(new Uint8Array(raw));
      expect(base.ngram.has('the')).toBe(true);
      expect(base.lexicon?.idOf('because')).toBeGreaterThanOrEqual(0);
      const again = await get(cast.owner, path).set('If-None-Match', String(res.headers.etag)).expect(304);
      expect(again.headers.etag).toBe(res.headers.etag);
      const gone = await get(cast.owner, `/api/base-words/${'b'.repeat(64)}`).expect(404);
      expect(gone.body.message).toBe(
        'The base vocabulary this version was trained with is no longer on this server.',
      );
      console.log(`base vocabulary download: ${raw.length} bytes, gzip ${(res.body as Buffer).length} bytes`);
    });
  });

  it('a version trained before the word-aware list (no word model) exports as layout 2 and verifies', async () => {
    const old = await trained();
    await t.dataSource.query(
      'UPDATE profile_versions SET word_model = NULL, word_weights = NULL, base_words_sha256 = NULL WHERE id = $1',
      [old.id],
    );
    const file = (await bytesOf(cast.owner, `/api/profile-versions/${old.id}/export`).expect(200))
      .body as Buffer;
    expect(layoutOf(file)).toBe(PROFILE_FILE_SIGNED_VERSION);
    const answer = await verify(file);
    expect(answer.valid).toBe(true);
    expect(answer.vocabularyWords).toBe(0);
    expect(answer.modelBytes).toBe(old.modelBytes);
    expect(answer.header).not.toHaveProperty('wordWeights');
    expect(answer.header).not.toHaveProperty('baseWordsSha256');
    // The keyboard's download: layout 1, and the server's base vocabulary to offer words from.
    const res = await bytesOf(cast.owner, `/api/profile-versions/${old.id}/model`).expect(200);
    expect(layoutOf(gunzipSync(res.body as Buffer))).toBe(PROFILE_FILE_VERSION);
    expect(res.headers['x-keyloom-base-words']).toBe(baseWordsSha256);
  });
});
