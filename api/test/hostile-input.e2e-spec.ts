// Hostile input over HTTP against real PostgreSQL: small requests that must not make the API allocate
// much (a forged profile file, an upload refused before its body is read), and the text, date and
// number inputs that must get a 400 with a plain message, never a 500 or a silent change.
// Memory is measured in this process, because supertest runs the app in it: the resident set size
// (process.memoryUsage().rss, Node.js documentation "process.memoryUsage()") sampled every 5 ms while
// a request runs; the figures are printed. The 50 MB bound is common practice, no source.
import { randomUUID } from 'node:crypto';
import { request as httpRequest, type IncomingMessage, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { crc32 } from 'node:zlib';
import type request from 'supertest';
import { AuditService } from '../src/audit/audit.service';
import { toApiError } from '../src/common/filters/api-exception.filter';
import { AppConfig } from '../src/config/app-config';
import {
  loadTrainingRuntime,
  runProfileTraining,
  type TrainingRuntime,
} from '../src/profile-versions/profile-training';
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import { UPLOAD_LENGTH_REQUIRED_MESSAGE } from '../src/samples/sample-files.interceptor';
import { type Caller, type Cast, newCast, newClient, newConsent, send } from './caseload-helpers';
import { binaryBody } from './factories';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { postTrial, typedEvents } from './trial-helpers';

const MB = 1024 * 1024;
const MEMORY_BOUND = 50 * MB;
const NUL_MESSAGE = 'Contains a character that cannot be stored (NUL).';
const SURROGATE_MESSAGE = 'Contains a broken character (unpaired surrogate).';
const DATE_RANGE_MESSAGE = 'Enter a date between 1 Jan 1900 and 31 Dec 2100.';

// Invented for these tests.
const TEXT =
  'Walked Pepper along the harbour wall before breakfast and met the ferry crew coming off the night ' +
  'boat. Practised the slow ballad twice after lunch; the left hand is steadier now. Hannah rang about ' +
  'the club supper on Friday and asked me to bring the folding chairs and the old race charts. In the ' +
  'evening the wind dropped and the moorings went quiet; I read the tide tables for the weekend and wrote ' +
  'to the secretary about the winter series, the new starting line and the spare tiller for the dinghy.';

/** Peak growth of this process's resident set while `work` runs (sampled every 5 ms). */
async function peakRssGrowth<T>(work: () => Promise<T>): Promise<{ result: T; growth: number }> {
  const before = process.memoryUsage().rss;
  let peak = before;
  const timer = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage().rss);
  }, 5);
  try {
    const result = await work();
    peak = Math.max(peak, process.memoryUsage().rss);
    return { result, growth: peak - before };
  } finally {
    clearInterval(timer);
  }
}

/** A supertest agent's cookies as one Cookie header (for requests sent with node:http). */
function cookieHeader(who: Caller): string {
  const agent = who.agent as unknown as {
    jar: { getCookies(access: object): { toValueString(): string }[] };
  };
  const cookies = agent.jar.getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false });
  return cookies.map((cookie) => cookie.toValueString()).join('; ');
}

type StreamedUpload = { status: number; body: string; sentWhenAnswered: number; totalBytes: number };

type UploadPlan = {
  method: 'POST' | 'PUT';
  path: string;
  field: string;
  files: number;
  fileBytes: number;
  /** Send Content-Length; otherwise the body is chunked, its size unknown in advance. */
  declareLength: boolean;
};

/**
 * Streams a multipart body of `files` files of `fileBytes` bytes each to `path` with node:http,
 * writing only as fast as the server reads (backpressure), and stops writing once the answer arrives.
 */
function streamUpload(
  server: Server,
  who: Caller,
  { method, path, field, files, fileBytes, declareLength }: UploadPlan,
): Promise<StreamedUpload> {
  const boundary = `hostile-${randomUUID()}`;
  const fieldsPart = `--${boundary}\r\nContent-Disposition: form-data; name="sourceKind"\r\n\r\ndiary\r\n`;
  const partHead = (i: number) =>
    `--${boundary}\r\nContent-Disposition: form-data; name="${field}"; filename="big-${i}.txt"\r\n` +
    'Content-Type: text/plain\r\n\r\n';
  const tail = `--${boundary}--\r\n`;
  const totalBytes =
    fieldsPart.length +
    Array.from({ length: files }, (_, i) => partHead(i).length + fileBytes + 2).reduce((a, b) => a + b, 0) +
    tail.length;
  const { port } = server.address() as AddressInfo;
  return new Promise((resolve, reject) => {
    let sent = 0;
    let answered: StreamedUpload | null = null;
    const req = httpRequest({
      host: '127.0.0.1',
      port,
      path,
      method,
      headers: {
        'Content-Type': `multipart/form-data; boundary=${boundary}`,
        Cookie: cookieHeader(who),
        'X-CSRF-Token': who.csrf,
        ...(declareLength ? { 'Content-Length': String(totalBytes) } : {}),
      },
    });
    req.on('response', (res: IncomingMessage) => {
      const sentWhenAnswered = sent;
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => {
        answered = {
          status: res.statusCode ?? 0,
          body: Buffer.concat(chunks).toString('utf8'),
          sentWhenAnswered,
          totalBytes,
        };
        req.destroy();
        resolve(answered);
      });
    });
    req.on('error', (error) => {
      if (!answered) reject(error);
    });
    const chunk = Buffer.alloc(256 * 1024, 0x61);
    const write = (data: Buffer | string): Promise<void> =>
      new Promise((done) => {
        sent += Buffer.byteLength(data);
        if (req.write(data)) done();
        else req.once('drain', done);
      });
    void (async () => {
      await write(fieldsPart);
      for (let i = 0; i < files && !req.destroyed; i++) {
        await write(partHead(i));
        for (let left = fileBytes; left > 0 && !req.destroyed; left -= chunk.length) {
          await write(left >= chunk.length ? chunk : chunk.subarray(0, left));
        }
        await write('\r\n');
      }
      if (!req.destroyed) req.end(tail);
    })().catch(() => undefined);
  });
}

describe('hostile input (HTTP)', () => {
  let t: TestApp;
  let listening: Server;
  let cast: Cast;
  let clientId: string;
  let consentId: string;
  let version: ProfileVersionDto;

  const post = (who: Caller, path: string, body: object) => send(t.http, who, 'post', path, body);
  const get = (who: Caller, path: string) => send(t.http, who, 'get', path);

  /** Asserts a 400 whose field problems, as "path: message", are exactly `expected`. */
  async function expectRefused(pending: request.Test, expected: string[]): Promise<void> {
    const res = await pending;
    expect(res.status).toBe(400);
    expect(problems(res)).toEqual(expected);
  }

  /** The 400's field problems as "path: message". */
  const problems = (res: request.Response) =>
    ((res.body as { issues?: { path: string; message: string }[] }).issues ?? []).map(
      (issue) => `${issue.path}: ${issue.message}`,
    );

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    listening = t.http.listen(0, '127.0.0.1');
    await new Promise((resolve) => listening.once('listening', resolve));
    cast = await newCast(t.http, t.dataSource);
    clientId = (await newClient(t.http, cast.owner, cast.assignedCarer, 'R. Hollin')).id;
    consentId = (await newConsent(t.http, cast.owner, clientId)).id;
    await post(cast.owner, `/api/clients/${clientId}/samples`, {
      title: 'Diary',
      text: TEXT,
      sourceKind: 'diary',
    }).expect(201);
    const runtime: TrainingRuntime = {
      ...loadTrainingRuntime(2),
      ksSampleChars: 200,
      progressIntervalMs: 50,
    };
    const draft = (
      await post(cast.owner, `/api/clients/${clientId}/profile-versions`, { settings: { order: 3 } }).expect(
        201,
      )
    ).body as ProfileVersionDto;
    await post(cast.owner, `/api/profile-versions/${draft.id}/train`, {}).expect(200);
    const rows: { job_id: string }[] = await t.dataSource.query(
      'SELECT job_id FROM profile_versions WHERE id = $1',
      [draft.id],
    );
    expect(
      await runProfileTraining(t.dataSource, t.app.get(AuditService), draft.id, rows[0].job_id, runtime),
    ).toBe('trained');
    version = (await get(cast.owner, `/api/profile-versions/${draft.id}`).expect(200))
      .body as ProfileVersionDto;
  });
  afterAll(async () => {
    await new Promise((resolve) => listening.close(resolve));
    await t.app.close();
  });

  describe('memory: small requests stay small', () => {
    it('answers a profile file whose model declares 400,000,000 contexts with 400, without the memory', async () => {
      const exported = await get(cast.owner, `/api/profile-versions/${version.id}/export`)
        .buffer(true)
        .parse(binaryBody)
        .expect(200);
      const file = Buffer.from(exported.body as Buffer);
      // The .klprofile layout: header length at 6, model length after the header, then the model,
      // whose context count sits at its byte 16; both CRC-32s recomputed so only the count is wrong.
      const modelAt = 10 + file.readUInt32LE(6) + 4;
      const modelLength = file.readUInt32LE(modelAt - 4);
      file.writeUInt32LE(400_000_000, modelAt + 16);
      const modelCrcAt = modelAt + modelLength - 4;
      file.writeUInt32LE(crc32(file.subarray(modelAt, modelCrcAt)), modelCrcAt);
      file.writeUInt32LE(crc32(file.subarray(0, file.length - 4)), file.length - 4);
      const trieBytes = modelLength - 28;

      const { result: res, growth } = await peakRssGrowth(() =>
        send(t.http, cast.owner, 'post', '/api/profile-exports/verify').attach(
          'file',
          file,
          'forged.klprofile',
        ),
      );
      console.log(
        `forged profile file: ${file.length} bytes, answered ${res.status}, API memory grew by ${(growth / MB).toFixed(1)} MB`,
      );
      expect(res.status).toBe(400);
      expect(res.body.message).toContain(
        `damaged: declares 400000000 contexts but holds only ${trieBytes} bytes`,
      );
      expect(growth).toBeLessThan(MEMORY_BOUND);
    });

    it('refuses a carer’s large upload with 403 before reading its body', async () => {
      // 8 files of 10 MB, sent chunked: 80 MB the API would hold in memory if it read them first.
      const { result, growth } = await peakRssGrowth(() =>
        streamUpload(listening, cast.assignedCarer, {
          method: 'POST',
          path: `/api/clients/${clientId}/samples`,
          field: 'files',
          files: 8,
          fileBytes: 10 * MB,
          declareLength: false,
        }),
      );
      console.log(
        `carer upload: ${(result.totalBytes / MB).toFixed(0)} MB body, answered ${result.status} after ` +
          `${(result.sentWhenAnswered / MB).toFixed(1)} MB were sent; API memory grew by ${(growth / MB).toFixed(1)} MB`,
      );
      expect(result.status).toBe(403);
      expect(JSON.parse(result.body)).toMatchObject({ message: 'Your role does not allow this.' });
      // Socket buffers let a few MB through before the answer; the body itself is never read.
      expect(result.sentWhenAnswered).toBeLessThan(16 * MB);
      expect(growth).toBeLessThan(MEMORY_BOUND);
    });

    it('refuses a consent form upload to another clinician’s client with 404 before reading it', async () => {
      // 30 MB: three times the form limit, so reading it at all would end in 413, not 404.
      const result = await streamUpload(listening, cast.otherClinician, {
        method: 'PUT',
        path: `/api/clients/${clientId}/consents/${consentId}/document`,
        field: 'file',
        files: 1,
        fileBytes: 30 * MB,
        declareLength: false,
      });
      console.log(
        `consent form to another clinician's client: ${(result.totalBytes / MB).toFixed(0)} MB body, answered ` +
          `${result.status} after ${(result.sentWhenAnswered / MB).toFixed(1)} MB were sent`,
      );
      expect(result.status).toBe(404);
      expect(JSON.parse(result.body)).toMatchObject({
        message: 'There is no client with that id in your caseload.',
      });
      expect(result.sentWhenAnswered).toBeLessThan(16 * MB);
    });

    it('refuses an owner’s upload declared larger than a client may hold, before reading it', async () => {
      const limits = t.app.get(AppConfig).sampleLimits;
      // Files under the per-file limit, but together over the client's total.
      const fileBytes = limits.maxFileBytes - MB;
      const files = Math.ceil((limits.maxClientBytes + 2 * MB) / fileBytes);
      const result = await streamUpload(listening, cast.owner, {
        method: 'POST',
        path: `/api/clients/${clientId}/samples`,
        field: 'files',
        files,
        fileBytes,
        declareLength: true,
      });
      console.log(
        `owner upload declared ${(result.totalBytes / MB).toFixed(0)} MB: answered ${result.status} after ` +
          `${(result.sentWhenAnswered / MB).toFixed(1)} MB were sent`,
      );
      expect(result.status).toBe(413);
      expect(JSON.parse(result.body).message).toMatch(
        /^The upload is larger than .* the most one upload can hold/,
      );
      expect(result.sentWhenAnswered).toBeLessThan(16 * MB);
    });

    it('refuses an owner’s chunked upload (size unknown in advance) with 411 before reading it', async () => {
      const result = await streamUpload(listening, cast.owner, {
        method: 'POST',
        path: `/api/clients/${clientId}/samples`,
        field: 'files',
        files: 12,
        fileBytes: 10 * MB,
        declareLength: false,
      });
      console.log(
        `owner chunked upload of ${(result.totalBytes / MB).toFixed(0)} MB: answered ${result.status} after ` +
          `${(result.sentWhenAnswered / MB).toFixed(1)} MB were sent`,
      );
      expect(result.status).toBe(411);
      expect(JSON.parse(result.body).message).toBe(UPLOAD_LENGTH_REQUIRED_MESSAGE);
      expect(result.sentWhenAnswered).toBeLessThan(16 * MB);
    });
  });

  // One row per hostile input: who sends what where, and the field problems the 400 must list.
  type Refusal = [what: string, send: () => request.Test, expected: string[]];
  const refusals = (): Refusal[] => {
    const samples = `/api/clients/${clientId}/samples`;
    const phrases = `/api/clients/${clientId}/practice-phrases`;
    const paste = (fields: object) =>
      post(cast.owner, samples, { title: 'Pasted', text: 'A few words.', sourceKind: 'diary', ...fields });
    return [
      [
        'a client pseudonym with NUL',
        () => post(cast.owner, '/api/clients', { pseudonym: 'Nul\u0000Client', accessMethod: 'direct' }),
        [`pseudonym: ${NUL_MESSAGE}`],
      ],
      [
        'a client pseudonym with a lone surrogate (not stored as U+FFFD)',
        () => post(cast.owner, '/api/clients', { pseudonym: 'Broken \ud800 name', accessMethod: 'direct' }),
        [`pseudonym: ${SURROGATE_MESSAGE}`],
      ],
      [
        'a staff name with NUL',
        () =>
          post(cast.admin, '/api/users', {
            email: `nul-${randomUUID().slice(0, 6)}@willowmere.example`,
            name: 'Ann\u0000Other',
            role: 'carer',
            password: 'a long enough passphrase',
          }),
        [`name: ${NUL_MESSAGE}`],
      ],
      [
        'a family contact name with NUL',
        () =>
          post(cast.owner, `/api/clients/${clientId}/contacts`, {
            name: 'Mar\u0000y',
            relationship: 'Sister',
            email: 'mary@example.org',
            consentToSummaries: true,
          }),
        [`name: ${NUL_MESSAGE}`],
      ],
      [
        'pasted sample text with NUL',
        () => paste({ text: 'Tea at four.\u0000Then the club.' }),
        [`text: ${NUL_MESSAGE}`],
      ],
      [
        'pasted sample text with a lone surrogate',
        () => paste({ text: 'Tea at four \udc00 then the club.' }),
        [`text: ${SURROGATE_MESSAGE}`],
      ],
      [
        'pasted sample text over 100 kB (105,000 bytes)',
        () => paste({ text: 'The tide was kind today. '.repeat(4200) }),
        ['text: Pasted text is limited to 100 kB; upload longer text as a file.'],
      ],
      [
        'a trial note with NUL',
        () => postTrial(t.http, cast.owner, version.id, { note: 'Tired\u0000today' }),
        [`note: ${NUL_MESSAGE}`],
      ],
      [
        'a practice phrase with NUL',
        () => post(cast.owner, phrases, { text: 'see you\u0000soon' }),
        [`text: ${NUL_MESSAGE}`],
      ],
      [
        'a practice phrase with a lone surrogate',
        () => post(cast.owner, phrases, { text: 'hello \ud800 there' }),
        [`text: ${SURROGATE_MESSAGE}`],
      ],
      [
        'a consent given on 0000-06-01',
        () =>
          post(cast.owner, `/api/clients/${clientId}/consents`, {
            givenBy: 'client',
            scopes: ['training'],
            givenOn: '0000-06-01',
          }),
        [`givenOn: ${DATE_RANGE_MESSAGE}`],
      ],
      [
        'a sample period starting 0000-06-01',
        () => paste({ periodStart: '0000-06-01' }),
        [`periodStart: ${DATE_RANGE_MESSAGE}`],
      ],
      [
        'a summary preview from 0000-01-01',
        () =>
          post(cast.owner, `/api/clients/${clientId}/summaries/preview`, {
            from: '0000-01-01',
            to: '2026-01-31',
          }),
        [`from: ${DATE_RANGE_MESSAGE}`],
      ],
      [
        'the audit log filtered from 0000-01-01',
        () => get(cast.supervisor, '/api/audit?from=0000-01-01'),
        [`from: ${DATE_RANGE_MESSAGE}`],
      ],
    ];
  };

  describe('text and dates: NUL, unpaired surrogates, year 0000 and oversized text refused with 400', () => {
    it('answers every hostile input with 400 and the field’s problem, and stores nothing', async () => {
      const clientsBefore = await t.dataSource.query('SELECT count(*)::int AS n FROM clients');
      const answers: string[] = [];
      for (const [what, sendIt, expected] of refusals()) {
        const res = await sendIt();
        answers.push(`${what}: ${res.status}`);
        if (res.status === 400) expect(problems(res)).toEqual(expected);
      }
      expect(answers).toEqual(refusals().map(([what]) => `${what}: 400`));
      expect(await t.dataSource.query('SELECT count(*)::int AS n FROM clients')).toEqual(clientsBefore);
    });

    it('refuses trial letters that are NUL or a lone surrogate', async () => {
      for (const [letter, message] of [
        ['\u0000', NUL_MESSAGE],
        ['\ud800', SURROGATE_MESSAGE],
      ]) {
        const events = [...typedEvents('hi', 1_000), { t: 1_500, type: 'letter' as const, value: letter }];
        const res = await postTrial(t.http, cast.owner, version.id, { text: `hi${letter}`, events });
        expect(res.status).toBe(400);
        expect(problems(res)).toContain(`events.2.value: ${message}`);
      }
    });
  });

  describe('numbers: arrays and objects refused with 400', () => {
    it('an access timing sent as an array, a profile order as an array of text', async () => {
      await expectRefused(
        post(cast.owner, '/api/clients', {
          pseudonym: 'Array Timing',
          accessMethod: 'direct',
          keyTimeMs: [1500],
        }),
        ['keyTimeMs: Enter the time per key in milliseconds.'],
      );
      await expectRefused(
        post(cast.owner, `/api/clients/${clientId}/profile-versions`, {
          settings: { order: ['5'] },
        }),
        ['settings.order: Choose a context order from 1 to 12.'],
      );
    });

    it('a page number sent twice (an array in the query string)', async () => {
      await expectRefused(get(cast.supervisor, '/api/audit?page=1&page=2'), [
        'page: Give the page as a whole number.',
      ]);
    });
  });

  describe('the last line of defence', () => {
    it('maps a real PostgreSQL data error (year 0 date, NUL in text) to 400, not 500', async () => {
      const errors: unknown[] = [];
      for (const [sql, value] of [
        ['SELECT $1::date', '0000-06-01'],
        ['SELECT $1::text', 'Nul\u0000Client'],
      ]) {
        await t.dataSource.query(sql, [value]).then(
          () => errors.push(null),
          (error: unknown) => errors.push(error),
        );
      }
      expect(errors.map((error) => toApiError(error).statusCode)).toEqual([400, 400]);
    });
  });
});
