// The Keyloom app itself: build, base-model corpus, migrations and seed, and the API process
// (which also serves the built client).
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { shown, StepError } from './output.mjs';
import { repoRoot, runPath } from './paths.mjs';
import { portInUse, waitForHttp } from './ports.mjs';
import { isAlive, runChecked, sleep, startDetached, stopNamed } from './processes.mjs';

const apiDist = join(repoRoot, 'api', 'dist');
const mainJs = join(apiDist, 'main.js');
const workerJs = join(apiDist, 'worker.js');

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

export const corporaScript = join(repoRoot, 'corpora', 'build-base.ts');

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

/**
 * Start `node api/dist/main.js` detached (pid .run/<name>.pid, log .run/<name>.log) after
 * stopping the one we started before, and wait until GET /api/health answers 200.
 * @param {{name: string, env: NodeJS.ProcessEnv, host: string, port: number}} options
 * @returns {Promise<number>} the PID
 */
export async function startApp({ name, env, host, port }) {
  await stopApp(name);
  if (!existsSync(mainJs)) throw new StepError(`${shown(mainJs)} is missing (did the api build run?)`);
  if (await portInUse(port, host)) {
    throw new StepError(`port ${port} on ${host} is taken by another program (set PORT to use another)`);
  }
  const logFile = runPath(`${name}.log`);
  // The log is a file: no colour codes in it.
  const pid = startDetached(name, process.execPath, [mainJs], {
    cwd: repoRoot,
    env: { ...env, NO_COLOR: '1' },
    logFile,
  });
  const health = `http://${host}:${port}/api/health`;
  const ready = await waitForHttp(health, { timeoutMs: 60_000, stillRunning: () => isAlive(pid) });
  if (ready !== 'ok') {
    await stopApp(name);
    const why =
      ready === 'exited' ? 'the app exited during start-up' : `${health} did not answer 200 within 60 s`;
    throw new StepError(why, logFile);
  }
  return pid;
}

/** Stop the app started under this name (graceful SIGTERM); returns the PID or null. */
export function stopApp(name) {
  return stopNamed(name, ['api/dist/main.js'], 15_000);
}

/** The line the worker logs once it takes jobs (api/src/worker.ts). */
const WORKER_READY = 'Waiting for profile-training jobs';

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
  const logStart = existsSync(logFile) ? readFileSync(logFile, 'utf8').length : 0;
  const pid = startDetached(name, process.execPath, [workerJs], {
    cwd: repoRoot,
    env: { ...env, NO_COLOR: '1' },
    logFile,
  });
  // Loading the base model takes about a second; allow for a busy machine.
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (readFileSync(logFile, 'utf8').slice(logStart).includes(WORKER_READY)) return pid;
    if (!isAlive(pid)) throw new StepError('the worker exited during start-up', logFile);
    if (Date.now() > deadline) {
      await stopWorker(name);
      throw new StepError('the worker did not report ready within 60 s', logFile);
    }
    await sleep(200);
  }
}

/** Stop the worker started under this name: SIGTERM lets a running job finish (up to 60 s). */
export function stopWorker(name) {
  return stopNamed(name, ['api/dist/worker.js'], 65_000);
}
