// The Keyloom app itself: build, base-model corpus, migrations and seed, and the API process
// (which also serves the built web app).
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { shown, StepError } from './output.mjs';
import { repoRoot, runPath } from './paths.mjs';
import { portInUse, waitForHttp } from './ports.mjs';
import { isAlive, livePid, runChecked, sleep, startDetached, stopNamed } from './processes.mjs';

const apiDist = join(repoRoot, 'api', 'dist');
const mainJs = join(apiDist, 'main.js');
const workerJs = join(apiDist, 'worker.js');
const superviseJs = join(repoRoot, 'scripts', 'supervise.mjs');

/** .run/<name>.log, emptied: these logs hold the latest run only. */
function freshLog(name) {
  const logFile = runPath(`${name}.log`);
  writeFileSync(logFile, '');
  return logFile;
}

/** `npm run <script>` at the repo root, output to .run/<logName>.log. */
function npmRun(script, logName, env = process.env) {
  const logFile = freshLog(logName);
  return runChecked(`npm run ${script}`, 'npm', ['run', script], { cwd: repoRoot, env, logFile });
}

/** Build shared, client and api (`npm run build`). */
export async function buildAll() {
  await npmRun('build', 'build');
  return 'built shared, client and api';
}

/** Build only what the API needs (shared + api), e.g. for `npm run dev`. */
export async function buildApi() {
  const logFile = freshLog('build');
  await runChecked('api build', 'npm', ['run', 'build', '-w', '@keyloom/api'], { cwd: repoRoot, logFile });
  return 'built shared and api';
}

export const corporaScript = join(repoRoot, 'corpora', 'src', 'build-base.ts');

/** Build the base-model cache (`npm run corpora`) when its builder exists. */
export async function buildCorpora() {
  if (!existsSync(corporaScript)) return `base corpus skipped (${shown(corporaScript)} not written yet)`;
  await npmRun('corpora', 'corpora');
  return 'base-model corpus ready (npm run corpora)';
}

/**
 * Run the migrations and the idempotent demo seed against env.DATABASE_URL.
 * @param {NodeJS.ProcessEnv} env full environment for the two commands
 * @param {string} logName log file name in .run/
 */
export async function migrateAndSeed(env, logName = 'migrate') {
  const logFile = freshLog(logName);
  for (const script of ['migrate', 'seed']) {
    const file = join(apiDist, 'db', `${script}.js`);
    if (!existsSync(file)) throw new StepError(`${shown(file)} is missing (did the api build run?)`);
    await runChecked(script === 'migrate' ? 'migrations' : 'seed', process.execPath, [file], {
      cwd: repoRoot,
      env,
      logFile,
    });
  }
  return 'database migrated and demo clinic seeded';
}

/** Refuses to start when the API is not built or the port is taken. */
async function checkCanStartApp(host, port) {
  if (!existsSync(mainJs)) throw new StepError(`${shown(mainJs)} is missing (did the api build run?)`);
  if (await portInUse(port, host)) {
    throw new StepError(`port ${port} on ${host} is taken by another program (set PORT to use another)`);
  }
}

/** Waits until GET /api/health answers 200 while `stillRunning()`; throws a StepError naming the log. */
async function waitForHealth({ host, port, stillRunning, logFile, what }) {
  const health = `http://${host}:${port}/api/health`;
  const ready = await waitForHttp(health, { timeoutMs: 60_000, stillRunning });
  if (ready === 'ok') return;
  throw new StepError(
    ready === 'exited' ? `${what} exited during start-up` : `${health} did not answer 200 within 60 s`,
    logFile,
  );
}

/**
 * Start `node api/dist/main.js` detached (pid .run/<name>.pid, log .run/<name>.log) after
 * stopping the one we started before, and wait until GET /api/health answers 200.
 * @param {{name: string, env: NodeJS.ProcessEnv, host: string, port: number}} options
 * @returns {Promise<number>} the PID
 */
export async function startApp({ name, env, host, port }) {
  await stopApp(name);
  await checkCanStartApp(host, port);
  const logFile = runPath(`${name}.log`);
  // The log is a file: no colour codes in it.
  const pid = startDetached(name, process.execPath, [mainJs], {
    cwd: repoRoot,
    env: { ...env, NO_COLOR: '1' },
    logFile,
  });
  try {
    await waitForHealth({ host, port, stillRunning: () => isAlive(pid), logFile, what: 'the app' });
  } catch (error) {
    await stopApp(name);
    throw error;
  }
  return pid;
}

/** Stop the app started under this name (graceful SIGTERM); returns the PID or null. */
export function stopApp(name) {
  return stopNamed(name, ['api/dist/main.js'], 15_000);
}

/** The line the worker logs once it takes jobs (api/src/worker.ts). */
const WORKER_READY = 'Waiting for profile-training jobs';

/** Waits until the worker's log (from `logStart`) says it takes jobs; throws a StepError otherwise. */
async function waitForWorkerReady({ logFile, logStart, stillRunning }) {
  // Reading the base model takes about a second; allow for a busy machine.
  const deadline = Date.now() + 60_000;
  for (;;) {
    const log = existsSync(logFile) ? readFileSync(logFile, 'utf8') : '';
    if (log.slice(logStart).includes(WORKER_READY)) return;
    if (!stillRunning()) throw new StepError('the worker exited during start-up', logFile);
    if (Date.now() > deadline) throw new StepError('the worker did not report ready within 60 s', logFile);
    await sleep(200);
  }
}

const logLength = (logFile) => (existsSync(logFile) ? readFileSync(logFile, 'utf8').length : 0);

/**
 * Start the job worker `node api/dist/worker.js` detached (pid .run/<name>.pid, log .run/<name>.log)
 * after stopping the one we started before, and wait until it logs that it takes jobs.
 * @param {{name: string, env: NodeJS.ProcessEnv}} options
 * @returns {Promise<number>} the PID
 */
export async function startWorker({ name, env }) {
  await stopWorker(name);
  if (!existsSync(workerJs)) throw new StepError(`${shown(workerJs)} is missing (did the api build run?)`);
  const logFile = runPath(`${name}.log`);
  const logStart = logLength(logFile);
  const pid = startDetached(name, process.execPath, [workerJs], {
    cwd: repoRoot,
    env: { ...env, NO_COLOR: '1' },
    logFile,
  });
  try {
    await waitForWorkerReady({ logFile, logStart, stillRunning: () => isAlive(pid) });
  } catch (error) {
    await stopWorker(name);
    throw error;
  }
  return pid;
}

/** Stop the worker started under this name: SIGTERM lets a running job finish (up to 60 s). */
export function stopWorker(name) {
  return stopNamed(name, ['api/dist/worker.js'], 65_000);
}

/**
 * Start the app and the worker under scripts/supervise.mjs (detached; pid .run/supervisor.pid, log
 * .run/supervisor.log), which starts either again when it exits. Stops a supervisor, app and worker
 * left from before, then waits for the health check and the worker's ready line.
 * @param {{env: NodeJS.ProcessEnv, host: string, port: number}} options
 * @returns {Promise<{supervisor: number, app: number|null, worker: number|null}>} the PIDs
 */
export async function startSupervised({ env, host, port }) {
  await stopSupervised();
  await stopWorker('worker');
  await stopApp('app');
  await checkCanStartApp(host, port);
  if (!existsSync(workerJs)) throw new StepError(`${shown(workerJs)} is missing (did the api build run?)`);
  const appLog = runPath('app.log');
  const workerLog = runPath('worker.log');
  const workerLogStart = logLength(workerLog);
  const supervisor = startDetached('supervisor', process.execPath, [superviseJs], {
    cwd: repoRoot,
    env: { ...env, NO_COLOR: '1' },
    logFile: runPath('supervisor.log'),
  });
  const stillRunning = () => isAlive(supervisor);
  try {
    await waitForHealth({ host, port, stillRunning, logFile: appLog, what: 'the supervisor' });
    await waitForWorkerReady({ logFile: workerLog, logStart: workerLogStart, stillRunning });
  } catch (error) {
    await stopSupervised();
    throw error;
  }
  return {
    supervisor,
    app: livePid('app', ['api/dist/main.js']),
    worker: livePid('worker', ['api/dist/worker.js']),
  };
}

/**
 * Stop the supervisor (it stops the app and the worker, letting a running job finish first).
 * @returns {Promise<number|null>} its PID, or null when none ran
 */
export function stopSupervised() {
  return stopNamed('supervisor', ['scripts/supervise.mjs'], 75_000);
}
