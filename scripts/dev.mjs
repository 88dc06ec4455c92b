// npm run dev: the same set-up as npm start (packages, PostgreSQL, mail, migrate, seed), then the
// API, the job worker and the Vite dev server (http://127.0.0.1:5173, /api proxied to the API) in the
// foreground. Ctrl-C stops all three; PostgreSQL and the mail server keep running until `npm stop`.
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { buildApi, migrateAndSeed, stopApp, stopSupervised, stopWorker } from './lib/app.mjs';
import { apiEnvironment, ensureLocalServices } from './lib/local-services.mjs';
import { bold, dim, done, step, warn } from './lib/output.mjs';
import { repoRoot } from './lib/paths.mjs';
import { portInUse } from './lib/ports.mjs';
import { appSettings, demoAccounts } from './lib/settings.mjs';

const settings = appSettings();
const vitePort = 5173;

/** Vite's CLI: hoisted to the root node_modules, or kept in client/node_modules. */
function viteEntry() {
  const candidates = [
    join(repoRoot, 'client', 'node_modules', 'vite', 'bin', 'vite.js'),
    join(repoRoot, 'node_modules', 'vite', 'bin', 'vite.js'),
  ];
  const found = candidates.find((path) => existsSync(path));
  if (!found) throw new Error('vite is not installed (client/node_modules or node_modules)');
  return found;
}

/** Start a child in the foreground with its output prefixed, e.g. "[api] …". */
function foreground(label, command, args, { cwd, env }) {
  const child = spawn(command, args, { cwd, env, stdio: ['ignore', 'pipe', 'pipe'] });
  for (const stream of [child.stdout, child.stderr]) {
    createInterface({ input: stream }).on('line', (line) => console.log(`${dim(`[${label}]`)} ${line}`));
  }
  return child;
}

let env;
try {
  console.log(bold('Keyloom: development mode'));
  const { databaseUrl } = await ensureLocalServices(settings);
  env = apiEnvironment(settings, databaseUrl);
  await step('build', buildApi);
  await step('migrate and seed', () => migrateAndSeed(env));
  const supervisor = await stopSupervised();
  if (supervisor !== null)
    done(`stopped the supervisor npm start had running (pid ${supervisor}) with its app and worker`);
  const previous = await stopApp('app');
  if (previous !== null) done(`stopped the app npm start had running (pid ${previous}); dev runs its own`);
  const previousWorker = await stopWorker('worker');
  if (previousWorker !== null) {
    done(`stopped the job worker npm start had running (pid ${previousWorker}); dev runs its own`);
  }
  for (const [port, name] of [
    [settings.port, 'PORT'],
    [vitePort, 'the Vite dev server'],
  ]) {
    if (await portInUse(Number(port))) throw new Error(`port ${port} is already taken (${name})`);
  }
} catch (error) {
  if (!(error instanceof Error && error.name === 'StepError')) console.log(String(error));
  console.log('\nDevelopment set-up failed (see above).');
  process.exit(1);
}

const api = foreground('api', process.execPath, [join(repoRoot, 'api', 'dist', 'main.js')], {
  cwd: repoRoot,
  env,
});
const worker = foreground('worker', process.execPath, [join(repoRoot, 'api', 'dist', 'worker.js')], {
  cwd: repoRoot,
  env,
});
const web = foreground('web', process.execPath, [viteEntry(), '--port', String(vitePort), '--strictPort'], {
  cwd: join(repoRoot, 'client'),
  env: { ...process.env, API_PORT: String(settings.port) },
});

console.log(`
${bold(`Dev server: http://127.0.0.1:${vitePort}`)}  (API ${settings.appUrl}, mail inbox http://127.0.0.1:${settings.mailWebPort})
  Demo sign-ins, password ${settings.demoPassword}: ${demoAccounts.map(([email]) => email).join(', ')}
  The API runs from api/dist: after changing api/ code press Ctrl-C and run npm run dev again.
  The job worker (profile training) runs beside the API, its lines marked [worker].
  Ctrl-C stops all three; npm stop also stops PostgreSQL and the mail server.
`);

let stopping = false;
function stopAll(reason) {
  if (stopping) return;
  stopping = true;
  if (reason) warn(reason);
  for (const child of [api, worker, web]) if (child.exitCode === null) child.kill('SIGTERM');
  // The worker may finish a running job first (up to 60 s, see api/src/worker.ts).
  setTimeout(() => {
    for (const child of [api, worker, web]) if (child.exitCode === null) child.kill('SIGKILL');
  }, 65_000).unref();
}

for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(signal, () => stopAll(''));
let running = 3;
let crashed = false;
for (const [label, child] of Object.entries({ api, worker, web })) {
  child.on('exit', (code, signal) => {
    running -= 1;
    if (!stopping) {
      crashed = true;
      stopAll(`${label} exited (${signal ?? `code ${code}`}); stopping the others`);
    }
    if (running === 0) {
      done(
        'stopped the API, the job worker and the Vite dev server (PostgreSQL and mail keep running; npm stop stops them)',
      );
      process.exit(crashed ? 1 : 0);
    }
  });
}
