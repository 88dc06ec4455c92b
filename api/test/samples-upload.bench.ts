// Benchmark (prints figures, asserts only correctness): a 20 MB upload through the real app and the
// preparation steps on their own. Not part of the e2e suite (its name does not end in .e2e-spec.ts).
// Run: DATABASE_URL=postgres://…/keyloom_…test… NODE_ENV=test BCRYPT_COST=4 \
//   npx jest --config test/jest-e2e.config.js --testRegex 'test/samples-upload\.bench\.ts$' --runInBand
import type { SampleDetail, UploadResult } from '@keyloom/shared';
import { readdirSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { performance } from 'node:perf_hooks';
import { Client } from '../src/clients/client.entity';
import { Consent } from '../src/consents/consent.entity';
import { loadLexiconWords } from '../src/samples/lexicon.service';
import { prepareFile } from '../src/samples/sample-ingest';
import { newUser, signIn } from './factories';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { demoSamplesDir } from '../src/config/data-paths';

const MB = 1024 * 1024;

// About 20 MB of the demo texts, repeated with a counter so the words are not all the same.
function twentyMegabytes(): Buffer {
  const dir = demoSamplesDir;
  const base = readdirSync(dir)
    .filter((f) => f.endsWith('.txt'))
    .map((f) => readFileSync(resolve(dir, f), 'utf8'))
    .join('\n');
  const parts: string[] = [];
  let size = 0;
  for (let i = 0; size < 20 * MB - 64 * 1024; i++) {
    const part = `${base}\nPart ${i}.\n`;
    parts.push(part);
    size += Buffer.byteLength(part);
  }
  return Buffer.from(parts.join(''), 'utf8');
}

describe('sample upload benchmark', () => {
  let t: TestApp;
  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.app.close();
  });

  it('uploads a 20 MB text file and prints the time of each step', async () => {
    const bytes = twentyMegabytes();
    const lexicon = loadLexiconWords().words;
    let start = performance.now();
    const prepared = prepareFile({ originalname: 'big.txt', buffer: bytes }, null, (w) => lexicon.has(w));
    const prepareMs = performance.now() - start;
    expect(prepared.byteSize).toBe(bytes.length);

    const user = await newUser(t.dataSource, { role: 'clinician' });
    const { agent, csrf } = await signIn(t.http, user);
    const client = await t.dataSource
      .getRepository(Client)
      .save(
        t.dataSource
          .getRepository(Client)
          .create({ pseudonym: 'Bench', accessMethod: 'direct', clinicianId: user.id }),
      );
    await t.dataSource.getRepository(Consent).insert({
      clientId: client.id,
      givenBy: 'client',
      scopes: ['training'],
      givenOn: '2020-01-01',
      recordedById: user.id,
    });
    start = performance.now();
    const res = await agent
      .post(`/api/clients/${client.id}/samples`)
      .set('X-CSRF-Token', csrf)
      .field('sourceKind', 'diary')
      .attach('files', bytes, 'big.txt')
      .expect(201);
    const uploadMs = performance.now() - start;
    const [sample] = (res.body as UploadResult).samples;
    start = performance.now();
    const detail = (await agent.get(`/api/samples/${sample.id}`).expect(200)).body as SampleDetail;
    const detailMs = performance.now() - start;
    const [first, second] = detail.flags;
    start = performance.now();
    const after = (
      await agent
        .post(`/api/samples/${sample.id}/flags/${first.id}`)
        .set('X-CSRF-Token', csrf)
        .send({ action: 'redact' })
        .expect(200)
    ).body as SampleDetail;
    const redactMs = performance.now() - start;
    const moved = after.flags.find((f) => f.id === second.id);
    expect(after.text.slice(moved?.start, moved?.end)).toBe(second.text);
    console.log(
      [
        `file: ${(bytes.length / MB).toFixed(1)} MB, ${sample.words} words, ${prepared.matches.length} flags`,
        `prepare (decode, normalise, statistics, detector, hash): ${prepareMs.toFixed(0)} ms`,
        `HTTP upload end to end (multer, prepare, one transaction): ${uploadMs.toFixed(0)} ms`,
        `GET /api/samples/:id (text + flags as JSON): ${detailMs.toFixed(0)} ms`,
        `redact the first flag (text rewritten, later flags moved, statistics recounted): ${redactMs.toFixed(0)} ms`,
      ].join('\n'),
    );
  });
});
