// npm test (and CI via .ci/run): build, type-check, lint and every test suite, against a test
// PostgreSQL cluster and fake mail server of its own on free ports, so it runs next to `npm start`
// and from a second clone at the same time. Always stops what it started.
//   npm test                         everything
//   npm test -- --only shared,client a subset (set-up the subset does not need is skipped)
import { existsSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  buildCorpora,
  corporaScript,
  migrateAndSeed,
  startApp,
  startWorker,
  stopApp,
  stopWorker,
} from './lib/app.mjs';
import { chromiumPath, ensureChromium } from './lib/chromium.mjs';
import { ensureMaildevInstalled, startMaildev, stopMaildev } from './lib/maildev.mjs';
import { ensureNpmTree } from './lib/npm-deps.mjs';
import { bold, done, failed, green, red, seconds, shown, step, warn, yellow } from './lib/output.mjs';
import { repoRoot, runDir, runPath } from './lib/paths.mjs';
import { freePort } from './lib/ports.mjs';
import {
  clusterPlace,
  describeCluster,
  ensurePostgresInstalled,
  ensureRoleAndDatabases,
  startCluster,
  stopCluster,
} from './lib/postgres.mjs';
import { run } from './lib/processes.mjs';
import { databaseUrl } from './lib/settings.mjs';

const browserScript = join(repoRoot, 'e2e', 'run-browser-tests.mjs');
const demoPassword = process.env.DEMO_PASSWORD || 'keyloom-demo';
const testRole = { role: 'keyloom_test', password: 'keyloom_test' };

/**
 * The suites, in run order. `needs` lists set-up (below) that must succeed first.
 * @type {{name: string, title: string, command: string[], needs: string[], env?: () => NodeJS.ProcessEnv, skip?: () => string}[]}
 */
const suites = [
  { name: 'build', title: 'build (shared, client, api)', command: ['npm', 'run', 'build'], needs: [] },
  {
    name: 'corpora',
    title: 'base corpus (npm run corpora)',
    command: ['npm', 'run', 'corpora'],
    needs: [],
    skip: () => (existsSync(corporaScript) ? '' : `${shown(corporaScript)} not written yet`),
  },
  { name: 'typecheck', title: 'type-check', command: ['npm', 'run', 'typecheck'], needs: ['build'] },
  { name: 'lint', title: 'lint', command: ['npm', 'run', 'lint'], needs: [] },
  {
    name: 'shared',
    title: 'shared tests (engine; corpora: the tests that need Brown, the base model or the demo samples)',
    command: ['npm', 'test', '-w', '@keyloom/shared', '-w', '@keyloom/corpora'],
    needs: [],
  },
  { name: 'client', title: 'client tests', command: ['npm', 'test', '-w', '@keyloom/client'], needs: [] },
  { name: 'api-unit', title: 'api unit tests', command: ['npm', 'test', '-w', '@keyloom/api'], needs: [] },
  {
    name: 'api-http',
    title: 'api HTTP tests',
    // API_HTTP_ONLY=<pattern>: only the spec files whose path matches (jest's testPathPattern).
    command: [
      'npm',
      'run',
      'test:e2e',
      '-w',
      '@keyloom/api',
      ...(process.env.API_HTTP_ONLY ? ['--', process.env.API_HTTP_ONLY] : []),
    ],
    needs: ['build', 'database', 'mail'],
    env: () => ({
      DATABASE_URL: state.database.httpUrl,
      BCRYPT_COST: '4',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(state.mail.smtpPort),
      MAIL_API_URL: state.mail.apiUrl,
    }),
  },
  {
    name: 'browser',
    title: 'browser tests',
    command: ['node', browserScript],
    needs: ['build', 'corpora', 'database', 'mail', 'chromium', 'app'],
    env: () => ({
      APP_URL: state.app.url,
      MAIL_API_URL: state.mail.apiUrl,
      MAIL_WEB_URL: state.mail.webUrl,
      DEMO_PASSWORD: demoPassword,
      CHROMIUM_PATH: chromiumPath,
    }),
    skip: () => (existsSync(browserScript) ? '' : `${shown(browserScript)} does not exist yet`),
  },
];

// ---- arguments ---------------------------------------------------------------------------------

function selectedSuites(argv) {
  const index = argv.findIndex((arg) => arg === '--only' || arg.startsWith('--only='));
  if (argv.includes('--help') || argv.includes('-h')) {
    console.log(`usage: npm test [-- --only ${suites.map((s) => s.name).join(',')}]`);
    process.exit(0);
  }
  if (index === -1) return suites.map((suite) => suite.name);
  const value = argv[index].includes('=') ? argv[index].split('=')[1] : argv[index + 1];
  const names = (value ?? '')
    .split(',')
    .map((name) => name.trim())
    .filter(Boolean);
  const unknown = names.filter((name) => !suites.some((suite) => suite.name === name));
  if (names.length === 0 || unknown.length > 0) {
    console.error(`--only takes a comma-separated list of: ${suites.map((suite) => suite.name).join(', ')}`);
    process.exit(2);
  }
  return names;
}

// ---- state and clean-up -----------------------------------------------------------------------

/** What this run started, so clean-up stops exactly that. */
const state = {
  /** @type {ReturnType<typeof describeCluster> | null} */ cluster: null,
  /** @type {{httpUrl: string, e2eUrl: string} | null} */ database: null,
  /** @type {{smtpPort: number, webPort: number, apiUrl: string, webUrl: string} | null} */ mail: null,
  /** @type {{url: string} | null} */ app: null,
  mailStarted: false,
  appStarted: false,
  workerStarted: false,
  /** @type {import('node:child_process').ChildProcess | null} */ child: null,
};

/** @type {{name: string, result: 'passed'|'failed'|'skipped', ms: number, note: string}[]} */
const results = [];

/** @type {Promise<void> | null} */
let cleaning = null;
/** Stop everything this run started (once; later calls wait for the same clean-up). */
function cleanUp() {
  cleaning ??= stopStarted();
  return cleaning;
}

async function stopStarted() {
  /** @type {{label: string, stop: () => Promise<unknown>, message: (outcome: unknown) => string}[]} */
  const tasks = [
    {
      label: 'test worker',
      stop: async () => (state.workerStarted ? stopWorker('test-worker') : null),
      message: (pid) => `test worker stopped (pid ${pid})`,
    },
    {
      label: 'test app',
      stop: async () => (state.appStarted ? stopApp('test-app') : null),
      message: (pid) => `test app stopped (pid ${pid})`,
    },
    {
      label: 'test mail server',
      stop: async () => (state.mailStarted ? stopMaildev('test-maildev') : null),
      message: (pid) => `test mail server stopped (pid ${pid})`,
    },
    {
      label: 'test PostgreSQL cluster',
      stop: async () => (state.cluster && (await stopCluster(state.cluster)) ? true : null),
      message: () => `test PostgreSQL cluster ${state.cluster ? clusterPlace(state.cluster) : ''} stopped`,
    },
  ];
  for (const { label, stop, message } of tasks) {
    try {
      const outcome = await stop();
      if (outcome !== null) done(message(outcome));
    } catch (error) {
      failed(`stopping ${label}`, error);
    }
  }
}

let interrupted = false;
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(signal, () => {
    if (interrupted) return;
    interrupted = true;
    console.log(`\n${signal}: stopping what npm test started…`);
    results.push({ name: 'interrupted', result: 'failed', ms: 0, note: `by ${signal}` });
    state.child?.kill('SIGTERM');
    // The main flow prints the summary once the running step returns; this is the fallback
    // when that step does not return (e.g. an apt-get that ignored the signal).
    cleanUp().finally(() =>
      setTimeout(() => {
        console.log(
          `${results.filter((r) => r.result === 'passed').length} passed, ${results.filter((r) => r.result === 'failed').length} failed`,
        );
        process.exit(130);
      }, 5000).unref(),
    );
  });
}

// ---- set-up needed by some suites (each runs at most once) -----------------------------------

/** @type {Map<string, Promise<void>>} */
const setups = new Map();

/** @type {Record<string, () => Promise<void>>} */
const setupSteps = {
  build: () => runSuiteOnce('build'),
  corpora: () => runSuiteOnce('corpora'),
  async database() {
    await step('PostgreSQL', ensurePostgresInstalled);
    const cluster = describeCluster('test', await freePort());
    state.cluster = cluster;
    await step('test PostgreSQL cluster', async () => {
      const what = await startCluster(cluster);
      await ensureRoleAndDatabases(cluster, {
        ...testRole,
        databases: ['keyloom_test', 'keyloom_e2e'],
        fresh: true,
      });
      return `test PostgreSQL cluster ${clusterPlace(cluster)} ${what} on 127.0.0.1:${cluster.port}, databases keyloom_test and keyloom_e2e fresh`;
    });
    state.database = {
      httpUrl: databaseUrl(cluster.port, { ...testRole, name: 'keyloom_test' }),
      e2eUrl: databaseUrl(cluster.port, { ...testRole, name: 'keyloom_e2e' }),
    };
  },
  async mail() {
    await step('fake mail packages', ensureMaildevInstalled);
    const smtpPort = await freePort();
    const webPort = await freePort();
    const mailDir = join(runDir, 'test-mail');
    rmSync(mailDir, { recursive: true, force: true });
    state.mailStarted = true;
    await step('test mail server', () => startMaildev({ name: 'test-maildev', smtpPort, webPort, mailDir }));
    state.mail = {
      smtpPort,
      webPort,
      apiUrl: `http://127.0.0.1:${webPort}/api/email`,
      webUrl: `http://127.0.0.1:${webPort}`,
    };
  },
  async chromium() {
    await step('Chromium', ensureChromium);
  },
  async app() {
    const database = /** @type {NonNullable<typeof state.database>} */ (state.database);
    const mail = /** @type {NonNullable<typeof state.mail>} */ (state.mail);
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    const env = {
      ...process.env,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: String(port),
      DATABASE_URL: database.e2eUrl,
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(mail.smtpPort),
      APP_URL: url,
      BCRYPT_COST: '4',
      LOGIN_RATE_LIMIT: '50',
      DEMO_PASSWORD: demoPassword,
    };
    await step('migrate and seed keyloom_e2e', async () => {
      await migrateAndSeed(env, 'test-migrate');
      return 'keyloom_e2e migrated and seeded';
    });
    state.appStarted = true;
    await step('test app', async () => {
      const pid = await startApp({ name: 'test-app', env, host: '127.0.0.1', port });
      return `test app started (pid ${pid}) at ${url}`;
    });
    state.workerStarted = true;
    await step('test worker', async () => {
      const pid = await startWorker({ name: 'test-worker', env });
      return `test worker started (pid ${pid})`;
    });
    state.app = { url };
  },
};

/** Run a set-up step once; later callers share its outcome. */
function setUp(name) {
  if (!setups.has(name)) setups.set(name, setupSteps[name]());
  return /** @type {Promise<void>} */ (setups.get(name));
}

// ---- suites -----------------------------------------------------------------------------------

/** @type {Map<string, Promise<boolean>>} */
const suiteRuns = new Map();

/** Run a suite at most once (build and corpora are also set-up for other suites). */
async function runSuiteOnce(name) {
  if (!suiteRuns.has(name)) suiteRuns.set(name, runSuite(name));
  const passed = await /** @type {Promise<boolean>} */ (suiteRuns.get(name));
  if (!passed) throw new Error(`${name} did not pass`);
}

/** Run one suite with a banner, its output shown and saved to .run/test/<name>.log. */
async function runSuite(name) {
  const suite = /** @type {(typeof suites)[number]} */ (suites.find((s) => s.name === name));
  const whySkip = suite.skip?.() ?? '';
  if (whySkip) {
    warn(yellow(bold(`${suite.title} SKIPPED: ${whySkip}`)));
    results.push({ name, result: 'skipped', ms: 0, note: whySkip });
    return true;
  }
  for (const need of suite.needs) {
    try {
      await setUp(need);
    } catch (error) {
      const note = `not run: ${need} failed`;
      console.log(
        `${red('✗')} ${suite.title}: ${note}${error instanceof Error ? ` (${error.message})` : ''}`,
      );
      results.push({ name, result: 'failed', ms: 0, note });
      return false;
    }
  }
  if (interrupted) return false;
  const logFile = runPath('test', `${name}.log`);
  writeFileSync(logFile, '');
  const [command, ...args] = suite.command;
  console.log(
    `\n${bold(`━━ ${suite.title} ━━`)} ${[command, ...args].map((a) => (a.startsWith('/') ? shown(a) : a)).join(' ')}`,
  );
  const env = { ...process.env, ...(suite.env?.() ?? {}) };
  if (!suite.env) delete env.DATABASE_URL; // suites without a database must not reach a developer's one
  if (name !== 'build' && name !== 'corpora' && name !== 'lint' && name !== 'typecheck')
    env.NODE_ENV = 'test';
  if (process.stdout.isTTY) env.FORCE_COLOR = '1';
  const started = Date.now();
  const { code } = await run(command, args, {
    cwd: repoRoot,
    env,
    logFile,
    echo: true,
    onChild: (child) => (state.child = child),
  });
  state.child = null;
  const ms = Date.now() - started;
  const passed = code === 0;
  results.push({
    name,
    result: passed ? 'passed' : 'failed',
    ms,
    note: passed ? '' : `exit ${code}, log ${shown(logFile)}`,
  });
  console.log(
    passed
      ? `${green('✓')} ${suite.title} passed (${seconds(ms)})`
      : `${red('✗')} ${suite.title} FAILED (exit ${code}, ${seconds(ms)}); log: ${shown(logFile)}`,
  );
  return passed;
}

// ---- main -------------------------------------------------------------------------------------

const startedAt = Date.now();
const selection = selectedSuites(process.argv.slice(2));
console.log(bold(`Keyloom tests: ${selection.join(', ')}`));

try {
  await step('npm packages', () => ensureNpmTree(repoRoot, 'npm packages'));
  for (const suite of suites) {
    if (interrupted) break;
    if (selection.includes(suite.name)) {
      // build and corpora may have run already as set-up for an earlier suite
      if (suite.name === 'build' || suite.name === 'corpora') await runSuiteOnce(suite.name).catch(() => {});
      else await runSuite(suite.name);
    }
  }
} catch (error) {
  results.push({
    name: 'set-up',
    result: 'failed',
    ms: 0,
    note: error instanceof Error ? error.message : String(error),
  });
} finally {
  await cleanUp();
}

const passedCount = results.filter((r) => r.result === 'passed').length;
const failedCount = results.filter((r) => r.result === 'failed').length;
const nameWidth = Math.max(5, ...results.map((r) => r.name.length));
console.log(`\n${bold('suite'.padEnd(nameWidth))}  ${bold('result ')}  ${bold('seconds')}`);
for (const r of results) {
  const label = { passed: green('passed '), failed: red('FAILED '), skipped: yellow('skipped') }[r.result];
  const secs = (r.ms / 1000).toFixed(1).padStart(7);
  console.log(`${r.name.padEnd(nameWidth)}  ${label}  ${secs}${r.note ? `  ${r.note}` : ''}`);
}
console.log(
  `${'total'.padEnd(nameWidth)}           ${((Date.now() - startedAt) / 1000).toFixed(1).padStart(7)}`,
);
console.log(`${passedCount} passed, ${failedCount} failed`);
process.exit(interrupted ? 130 : failedCount === 0 ? 0 : 1);
