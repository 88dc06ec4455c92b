// The supervisor `npm start` leaves running: it starts `node api/dist/main.js` (the app) and
// `node api/dist/worker.js` (the job worker) and starts each one again whenever it exits, after
// 1 s, then 2, 4 … up to 30 s while it keeps failing quickly (the delay goes back to 1 s once a
// run has lasted a minute). Each child's pid is written to .run/app.pid / .run/worker.pid at every
// start and its output appended to .run/app.log / .run/worker.log; the supervisor's own lines go
// to .run/supervisor.log. SIGTERM or SIGINT (what `npm stop` sends): no more restarts, SIGTERM to
// both children, SIGKILL to a child still running after its grace time (worker 65 s, app 15 s:
// the worker finishes a running job first), then exit 0.
// `--prefix=NAME-` puts NAME- before those run-state file names (the process test uses it so it
// never touches the files of an app `npm start` runs). Plain Node, no dependencies; started
// detached by startSupervised() in scripts/lib/app.mjs.
import { spawn } from 'node:child_process';
import { closeSync, openSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { repoRoot, runPath } from './lib/paths.mjs';

const FIRST_DELAY_MS = 1_000;
const MAX_DELAY_MS = 30_000;
/** A run at least this long counts as healthy: the next restart waits FIRST_DELAY_MS again. */
const HEALTHY_RUN_MS = 60_000;

const prefix = (process.argv.find((arg) => arg.startsWith('--prefix=')) ?? '--prefix=').slice(
  '--prefix='.length,
);
if (!/^[\w-]*$/.test(prefix)) {
  console.error(`--prefix takes letters, digits, "_" and "-" only, not ${JSON.stringify(prefix)}`);
  process.exit(2);
}

const children = [
  { name: 'app', script: join(repoRoot, 'api', 'dist', 'main.js'), graceMs: 15_000 },
  { name: 'worker', script: join(repoRoot, 'api', 'dist', 'worker.js'), graceMs: 65_000 },
].map((spec) => ({
  ...spec,
  file: `${prefix}${spec.name}`,
  child: null,
  delay: FIRST_DELAY_MS,
  timer: null,
}));

let stopping = false;

const say = (line) => console.log(`${new Date().toISOString()} ${line}`);

function start(entry) {
  entry.timer = null;
  if (stopping) return;
  const log = openSync(runPath(`${entry.file}.log`), 'a');
  writeFileSync(
    log,
    `\n$ ${process.execPath} ${entry.script}   # ${new Date().toISOString()} (supervised)\n`,
  );
  const child = spawn(process.execPath, [entry.script], {
    cwd: repoRoot,
    env: process.env,
    stdio: ['ignore', log, log],
  });
  closeSync(log);
  const startedAt = Date.now();
  entry.child = child;
  child.on('error', (error) => say(`${entry.name}: cannot start: ${error.message}`));
  if (child.pid !== undefined) {
    writeFileSync(runPath(`${entry.file}.pid`), `${child.pid}\n`);
    say(`${entry.name}: started (pid ${child.pid})`);
  }
  child.on('exit', (code, signal) => {
    entry.child = null;
    if (stopping) return;
    const ran = Date.now() - startedAt;
    if (ran >= HEALTHY_RUN_MS) entry.delay = FIRST_DELAY_MS;
    say(
      `${entry.name}: exited (${signal ?? `code ${code}`}) after ${Math.round(ran / 1000)} s; restarting in ${entry.delay / 1000} s`,
    );
    entry.timer = setTimeout(() => start(entry), entry.delay);
    entry.delay = Math.min(MAX_DELAY_MS, entry.delay * 2);
  });
}

function waitForExit(child, ms) {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve(true);
    const timer = setTimeout(() => resolve(false), ms);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve(true);
    });
  });
}

async function stop(signal) {
  if (stopping) return;
  stopping = true;
  say(`${signal}: stopping the app and the worker`);
  await Promise.all(
    children.map(async (entry) => {
      if (entry.timer) clearTimeout(entry.timer);
      const child = entry.child;
      if (child) {
        child.kill('SIGTERM');
        if (!(await waitForExit(child, entry.graceMs))) {
          say(`${entry.name}: still running after ${entry.graceMs / 1000} s; killing it`);
          child.kill('SIGKILL');
          await waitForExit(child, 5_000);
        }
      }
      rmSync(runPath(`${entry.file}.pid`), { force: true });
    }),
  );
  say('stopped');
  process.exit(0);
}

process.on('SIGTERM', () => void stop('SIGTERM'));
process.on('SIGINT', () => void stop('SIGINT'));
for (const entry of children) start(entry);
