// The job worker as a real process (`node api/dist/worker.js`, from the build that `npm test`
// makes before this suite) against the test database: a worker killed with SIGKILL in the middle
// of a training is replaced and the version still ends trained; a database error in the job
// handler's path (pg-boss's complete() rejected, connections terminated) does not end the process;
// the built thread trainer leaves the event loop free where the in-process engine stalls it; the
// supervisor (scripts/supervise.mjs) starts a killed worker again and stops everything on SIGTERM.
// The training samples are about 40,000 characters so a training lasts a few seconds.
import { spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import type PgBoss from 'pg-boss';
import { createJobBoss, PROFILE_TRAINING_QUEUE, startJobBoss } from '../src/jobs/job-queue';
import type { ProfileVersionDto } from '../src/profile-versions/profile-version.mapper';
import {
  engineSettings,
  inProcessTrainer,
  loadTrainingRuntime,
  readBaseModelFile,
  readBaseWordsFile,
  type Trainer,
  type TrainerInput,
} from '../src/profile-versions/profile-training';
import { INTERRUPTED_COMMENT, INTERRUPTED_STAGE } from '../src/profile-versions/training-recovery';
import type * as TrainingThreadsModule from '../src/profile-versions/training-threads';
import { type Cast, newCast, newClient, newConsent, send } from './caseload-helpers';
import { createTestApp, resetDatabase, type TestApp, testDatabaseUrl } from './test-app';
import {
  alive,
  inventedText,
  READY,
  sleep,
  startWorker as startWorkerWith,
  waitFor,
  waitForLog,
  type Worker,
  WORKER_JS,
} from './worker-helpers';

const REPO = join(__dirname, '..', '..');
const SUPERVISE = join(REPO, 'scripts', 'supervise.mjs');
// The thread pool as built: its thread body is the compiled training-thread.js beside it.
const THREADS_JS = join(__dirname, '..', 'dist', 'profile-versions', 'training-threads.js');
/** Seconds without a heartbeat before a training counts as dead (30 in production). */
const STALE_SECONDS = 2;

/** The longest time this event loop went without running a 10 ms timer while `work` ran (ms). */
async function longestStall<T>(work: () => Promise<T>): Promise<{ stall: number; value: T }> {
  let last = Date.now();
  let stall = 0;
  const timer = setInterval(() => {
    const now = Date.now();
    stall = Math.max(stall, now - last);
    last = now;
  }, 10);
  try {
    const value = await work();
    stall = Math.max(stall, Date.now() - last);
    return { stall, value };
  } finally {
    clearInterval(timer);
  }
}

const startWorker = () => startWorkerWith({ TRAINING_STALE_SECONDS: String(STALE_SECONDS) });

describe('job worker process', () => {
  let t: TestApp;
  let cast: Cast;
  let clientId: string;
  let boss: PgBoss;
  const workers: Worker[] = [];

  const launch = async (): Promise<Worker> => {
    const worker = startWorker();
    workers.push(worker);
    await waitForLog(worker, READY, 60_000);
    return worker;
  };

  type Row = { status: string; stage: string | null; progress: number; job_id: string | null };
  const row = async (id: string): Promise<Row> => {
    const rows: Row[] = await t.dataSource.query(
      'SELECT status, stage, progress, job_id FROM profile_versions WHERE id = $1',
      [id],
    );
    if (!rows[0]) throw new Error(`No version ${id}`);
    return rows[0];
  };
  const version = async (id: string): Promise<ProfileVersionDto> =>
    (await send(t.http, cast.owner, 'get', `/api/profile-versions/${id}`).expect(200))
      .body as ProfileVersionDto;

  beforeAll(async () => {
    if (!existsSync(WORKER_JS))
      throw new Error(`${WORKER_JS} is missing: build the API first (npm run build).`);
    await resetDatabase();
    // The API under test uses the same stale time as the workers.
    t = await createTestApp({ trainingStaleSeconds: STALE_SECONDS });
    cast = await newCast(t.http, t.dataSource);
    clientId = (await newClient(t.http, cast.owner, cast.assignedCarer, 'W. Harrow')).id;
    await newConsent(t.http, cast.owner, clientId);
    boss = createJobBoss(testDatabaseUrl(), { supervise: false });
    boss.on('error', () => undefined);
    await startJobBoss(boss);
  }, 60_000);

  afterAll(async () => {
    for (const worker of workers) if (alive(worker)) worker.child.kill('SIGKILL');
    await Promise.all(workers.map((w) => w.exit));
    await boss?.stop({ graceful: false, wait: true }).catch(() => undefined);
    await t?.app.close();
  });

  it('a worker killed mid-training is replaced: the version shows "interrupted", is queued again and ends trained', async () => {
    for (const [i, seed] of [11, 29].entries()) {
      await send(t.http, cast.owner, 'post', `/api/clients/${clientId}/samples`, {
        title: `Long diary ${i + 1}`,
        text: inventedText(20_000, seed),
        sourceKind: 'diary',
      }).expect(201);
    }
    const created = (
      await send(t.http, cast.owner, 'post', `/api/clients/${clientId}/profile-versions`, {
        settings: {},
      }).expect(201)
    ).body as ProfileVersionDto;

    const first = await launch();
    await send(t.http, cast.owner, 'post', `/api/profile-versions/${created.id}/train`).expect(200);
    const firstJob = (await row(created.id)).job_id;
    // Mid-training: past preparing, some progress written by the running job.
    const killedAt = await waitFor('the training to get going', 60_000, async () => {
      const r = await row(created.id);
      if (r.status !== 'training') throw new Error(`The version left training too early: ${r.status}`);
      return r.stage !== 'queued' && r.stage !== 'preparing' && r.progress >= 0.05 ? r : undefined;
    });
    first.child.kill('SIGKILL');
    expect(await first.exit).toBeNull(); // killed by the signal, no exit code

    // With no worker alive, once the heartbeat is stale the API shows "interrupted" at 0 %, not a frozen figure.
    const shown = await waitFor('the API to show the training as interrupted', 15_000, async () => {
      const v = await version(created.id);
      return v.stage === INTERRUPTED_STAGE ? v : undefined;
    });
    expect(shown).toMatchObject({ status: 'training', stage: INTERRUPTED_STAGE, progress: 0 });
    expect(killedAt.progress).toBeGreaterThan(0);

    // A new worker finds the dead training, queues it again and trains it.
    const second = await launch();
    const done = await waitFor('the version to be trained', 90_000, async () => {
      const r = await row(created.id);
      if (r.status === 'failed')
        throw new Error(`Training failed: ${JSON.stringify(await version(created.id))}`);
      return r.status === 'trained' ? r : undefined;
    });
    expect(done).toMatchObject({ status: 'trained', stage: null, progress: 1 });
    const trained = await version(created.id);
    expect(trained.metrics).not.toBeNull();
    expect(trained.modelBytes).toBeGreaterThan(0);
    expect(trained.history.map((e) => e.comment)).toContain(INTERRUPTED_COMMENT);
    expect((await row(created.id)).job_id).not.toBe(firstJob);
    expect(second.output()).toContain(`Version ${created.id}: its worker stopped; training queued again`);
    expect(alive(second)).toBe(true);
  }, 180_000);

  it('a database error in the job handler path (complete() rejected, connections dropped) does not end the worker', async () => {
    const worker = workers.find(alive) ?? (await launch());
    // Make PostgreSQL refuse to mark this queue's jobs completed, as a dropped connection would.
    await t.dataSource.query(`
      CREATE OR REPLACE FUNCTION pgboss.refuse_completion() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        IF NEW.state = 'completed' AND NEW.name = '${PROFILE_TRAINING_QUEUE}' THEN
          RAISE EXCEPTION 'simulated database failure while completing a job';
        END IF;
        RETURN NEW;
      END $$`);
    await t.dataSource.query(
      'CREATE TRIGGER refuse_completion BEFORE UPDATE ON pgboss.job FOR EACH ROW EXECUTE FUNCTION pgboss.refuse_completion()',
    );
    try {
      // A job for a version that does not exist: the handler answers 'stale' and pg-boss calls complete().
      const refused = await boss.send(PROFILE_TRAINING_QUEUE, { versionId: randomUUID() });
      await waitForLog(worker, `Job ${refused}`, 30_000);
      await waitForLog(worker, 'simulated database failure while completing a job', 10_000);
    } finally {
      await t.dataSource.query('DROP TRIGGER refuse_completion ON pgboss.job');
      await t.dataSource.query('DROP FUNCTION pgboss.refuse_completion()');
    }
    // Every connection of the worker (its TypeORM pool and pg-boss's) is cut by the server.
    const cut: unknown[] = await t.dataSource.query(
      `SELECT pg_terminate_backend(pid) FROM pg_stat_activity
        WHERE datname = current_database() AND application_name LIKE 'keyloom-worker%'`,
    );
    expect(cut.length).toBeGreaterThan(0);
    await sleep(1500);
    expect(alive(worker)).toBe(true);

    // Still taking jobs on new connections.
    const later = await boss.send(PROFILE_TRAINING_QUEUE, { versionId: randomUUID() });
    await waitForLog(worker, `Job ${later}`, 30_000);
    expect(alive(worker)).toBe(true);
  }, 90_000);

  it('training in a thread leaves the event loop free; the same training in-process stalls it', async () => {
    const { bytes } = readBaseModelFile();
    const words = readBaseWordsFile();
    // eslint-disable-next-line @typescript-eslint/no-require-imports -- the built module, so its thread file exists
    const { TrainingThreads, sharedBytes } = require(THREADS_JS) as typeof TrainingThreadsModule;
    const threads = new TrainingThreads(sharedBytes(bytes), sharedBytes(words.bytes));
    const input: TrainerInput = {
      documents: [
        { id: 'a', text: inventedText(20_000, 5) },
        { id: 'b', text: inventedText(20_000, 7) },
      ],
      settings: engineSettings({
        order: 5,
        escape: 'D',
        exclusion: true,
        baseWeight: 'auto',
        slots: 5,
        caseFold: false,
        access: { method: 'direct' },
      }),
      folds: 2,
    };
    const run = (trainer: Trainer) =>
      longestStall(() =>
        trainer(
          input,
          () => undefined,
          () => false,
        ),
      );
    try {
      const inThread = await run(threads.trainer);
      const runtime = loadTrainingRuntime(2);
      const inProcess = await run(inProcessTrainer(runtime.base, runtime.baseWords ?? null));
      // Same input, same engine: the same model either way.
      expect(Buffer.from(inThread.value.modelBytes).equals(Buffer.from(inProcess.value.modelBytes))).toBe(
        true,
      );
      // The thread had the base vocabulary too: the same word model and mixture weights.
      expect(inThread.value.wordModelBytes).not.toBeNull();
      expect(
        Buffer.from(inThread.value.wordModelBytes ?? []).equals(
          Buffer.from(inProcess.value.wordModelBytes ?? []),
        ),
      ).toBe(true);
      expect(inThread.value.wordWeights).toEqual(inProcess.value.wordWeights);
      console.log(
        `Longest event-loop stall while training 40,000 characters: in a thread ${inThread.stall} ms, in-process ${inProcess.stall} ms`,
      );
      expect(inProcess.stall).toBeGreaterThan(300);
      expect(inThread.stall * 3).toBeLessThan(inProcess.stall);
    } finally {
      await threads.close();
    }
  }, 120_000);

  it('the supervisor starts the worker again after it is killed, and stops app and worker on SIGTERM', async () => {
    const prefix = `supervise-test-${process.pid}-`;
    const file = (name: string) => join(REPO, '.run', `${prefix}${name}`);
    const pidOf = (name: string): number | undefined => {
      const path = file(`${name}.pid`);
      return existsSync(path) ? Number(readFileSync(path, 'utf8')) : undefined;
    };
    const isRunning = (pid: number) => {
      try {
        process.kill(pid, 0);
        return true;
      } catch {
        return false;
      }
    };
    const logOf = (name: string) =>
      existsSync(file(`${name}.log`)) ? readFileSync(file(`${name}.log`), 'utf8') : '';
    const port = await new Promise<number>((resolve) => {
      const server = createServer().listen(0, '127.0.0.1', () => {
        const address = server.address();
        server.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
      });
    });
    const supervisor = spawn(process.execPath, [SUPERVISE, `--prefix=${prefix}`], {
      env: {
        ...process.env,
        NODE_ENV: 'test',
        NO_COLOR: '1',
        HOST: '127.0.0.1',
        PORT: String(port),
        PROFILE_FOLDS: '2',
      },
      stdio: 'ignore',
    });
    const exited = new Promise<number | null>((resolve) => supervisor.on('exit', (code) => resolve(code)));
    try {
      const first = await waitFor('the supervised worker to take jobs', 60_000, () =>
        logOf('worker').split(READY).length === 2 ? pidOf('worker') : undefined,
      );
      const app = await waitFor('the supervised app', 60_000, () => pidOf('app'));
      process.kill(first, 'SIGKILL');
      const second = await waitFor('a new worker taking jobs', 60_000, () => {
        const pid = pidOf('worker');
        return pid !== undefined && pid !== first && logOf('worker').split(READY).length === 3
          ? pid
          : undefined;
      });
      expect(isRunning(second)).toBe(true);
      expect(isRunning(first)).toBe(false);

      supervisor.kill('SIGTERM');
      expect(await exited).toBe(0);
      expect(isRunning(second)).toBe(false);
      expect(isRunning(app)).toBe(false);
    } finally {
      if (supervisor.exitCode === null && supervisor.signalCode === null) supervisor.kill('SIGKILL');
      for (const name of ['app.pid', 'app.log', 'worker.pid', 'worker.log'])
        rmSync(file(name), { force: true });
    }
  }, 120_000);
});
