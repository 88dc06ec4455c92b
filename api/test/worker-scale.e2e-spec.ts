// Scale-out: TWO worker processes (`node api/dist/worker.js`, each with its own WORKER_NAME) on the
// one test database share the profile-training queue. Several trainings queued at once through the
// API must each run exactly once, and both workers must take some. pg-boss hands a job to one worker
// by fetching it with SELECT … FOR UPDATE SKIP LOCKED and marking it active in the same statement
// (pg-boss documentation, docs/references.md §6).
//
// What "exactly once" is measured by, three ways: (1) the "started on <worker>" line each worker
// logs before it runs a job: one line per job over both logs; (2) pg-boss's own record: every job
// completed with retry_count 0 and the worker's name in its stored output; (3) one profile.trained
// audit event per version, under that job's id.
// Checked to fail with a broken lock: with pg-boss's fetch (node_modules/pg-boss/src/plans.js,
// fetchNextJob) changed from `state < 'active' … FOR UPDATE SKIP LOCKED` to `state <= 'active'`
// without the lock, the second worker fetched jobs the first was running: the 4 jobs were started
// 10 times over both logs and this test failed on (1); pg-boss restored afterwards.
// Both workers start at once on a freshly reset database: before job-queue.ts retried queue creation
// on a deadlock, one of them exited at start with "deadlock detected" and this test failed there.
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import { PROFILE_TRAINING_QUEUE } from '../src/jobs/job-queue';
import { type Cast, newCast, newClient, newConsent, send } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { alive, inventedText, READY, startWorker, waitFor, waitForLog, type Worker } from './worker-helpers';

/** Trainings queued at once; each about 6,000 characters with 2 folds (a second or two). */
const TRAININGS = 4;
const NAMES = ['scale-test-a', 'scale-test-b'];

describe('two job workers on one database', () => {
  let t: TestApp;
  let cast: Cast;
  const workers: Worker[] = [];

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
    cast = await newCast(t.http, t.dataSource);
  }, 60_000);

  afterAll(async () => {
    for (const worker of workers) if (alive(worker)) worker.child.kill('SIGKILL');
    await Promise.all(workers.map((w) => w.exit));
    await t?.app.close();
  });

  it('every queued training runs exactly once, and both workers take some', async () => {
    const client = await newClient(t.http, cast.owner, cast.assignedCarer, 'S. Brackwater');
    await newConsent(t.http, cast.owner, client.id);
    await send(t.http, cast.owner, 'post', `/api/clients/${client.id}/samples`, {
      title: 'Diary',
      text: inventedText(6_000, 41),
      sourceKind: 'diary',
    }).expect(201);
    const versions: string[] = [];
    for (let i = 0; i < TRAININGS; i++) {
      const created = (
        await send(t.http, cast.owner, 'post', `/api/clients/${client.id}/profile-versions`, {
          settings: {},
        }).expect(201)
      ).body as ProfileVersionDto;
      versions.push(created.id);
    }

    for (const name of NAMES) workers.push(startWorker({ WORKER_NAME: name, MAIL_CONCURRENCY: '2' }));
    await Promise.all(workers.map((w) => waitForLog(w, READY, 60_000)));
    for (const [i, worker] of workers.entries())
      expect(worker.output()).toContain(`${READY} as ${NAMES[i]} (concurrency 1,`);

    for (const id of versions)
      await send(t.http, cast.owner, 'post', `/api/profile-versions/${id}/train`).expect(200);

    type Row = { id: string; status: string; job_id: string };
    const rows = await waitFor('every version to be trained', 90_000, async () => {
      const found: Row[] = await t.dataSource.query(
        'SELECT id, status, job_id FROM profile_versions WHERE id = ANY($1)',
        [versions],
      );
      const failed = found.find((r) => r.status === 'failed');
      if (failed) throw new Error(`Version ${failed.id} failed`);
      return found.every((r) => r.status === 'trained') ? found : undefined;
    });
    expect(rows).toHaveLength(TRAININGS);
    const jobIds = rows.map((r) => r.job_id);
    expect(new Set(jobIds).size).toBe(TRAININGS);

    // (1) One "started on" line per job over both logs. The test database is shared with the other
    // HTTP suites, so the workers may also pick up a training another suite left queued (or one the
    // start-up recovery re-queues): those are allowed, but no job of any kind may start twice.
    const all = workers.flatMap((w, i) =>
      [...w.output().matchAll(/Job (\S+) \(version \S+\): started on (\S+)/g)].map((m) => ({
        job: m[1],
        on: m[2],
        logOf: NAMES[i],
      })),
    );
    expect(new Set(all.map((s) => s.job)).size).toBe(all.length);
    const started = all.filter((s) => jobIds.includes(s.job));
    expect(started.map((s) => s.job).sort()).toEqual([...jobIds].sort());
    for (const s of started) expect(s.on).toBe(s.logOf);
    // Both workers took work (any job counts: the scale-out property is that the queue feeds both).
    const perWorker = NAMES.map((name) => all.filter((s) => s.on === name).length);
    const took = workers.flatMap((w) => [...w.output().matchAll(/: trained in (\d+) ms/g)].map((m) => m[1]));
    console.log(
      `Trainings taken per worker (${NAMES.join(', ')}): ${perWorker.join(', ')}; each took ${took.join(', ')} ms`,
    );
    for (const count of perWorker) expect(count).toBeGreaterThanOrEqual(1);

    // (2) pg-boss: each job completed on its first attempt, its result naming the worker that logged it.
    type JobRow = {
      id: string;
      state: string;
      retry_count: number;
      output: { outcome: string; worker: string };
    };
    const jobs = await waitFor('pg-boss to record every job completed', 10_000, async () => {
      const found: JobRow[] = await t.dataSource.query(
        'SELECT id, state, retry_count, output FROM pgboss.job WHERE name = $1 AND id = ANY($2)',
        [PROFILE_TRAINING_QUEUE, jobIds],
      );
      return found.length === TRAININGS && found.every((j) => j.state === 'completed') ? found : undefined;
    });
    for (const job of jobs) {
      expect(job.retry_count).toBe(0);
      expect(job.output).toEqual({
        outcome: 'trained',
        worker: started.find((s) => s.job === job.id)?.on,
      });
    }

    // (3) One profile.trained audit event per version, under the job that trained it.
    const audited: { subject_id: string; job_id: string }[] = await t.dataSource.query(
      `SELECT subject_id, details->>'jobId' AS job_id FROM audit_events
        WHERE action = 'profile.trained' AND subject_id = ANY($1)`,
      [versions],
    );
    expect(audited.map((a) => a.subject_id).sort()).toEqual([...versions].sort());
    for (const a of audited) expect(a.job_id).toBe(rows.find((r) => r.id === a.subject_id)?.job_id);
    for (const worker of workers) expect(alive(worker)).toBe(true);
  }, 150_000);
});
