// npm start: install what is missing, start PostgreSQL and the fake mail server, build, migrate,
// seed and (re)start the app and the job worker in the background under a supervisor that restarts
// them when they exit (scripts/supervise.mjs). Safe to run again at any time.
import { apiEnvironment, ensureLocalServices } from './lib/local-services.mjs';
import { buildAll, buildCorpora, migrateAndSeed, startSupervised } from './lib/app.mjs';
import { bold, seconds, step } from './lib/output.mjs';
import { livePid } from './lib/processes.mjs';
import { appSettings, demoAccounts } from './lib/settings.mjs';

const started = Date.now();
const settings = appSettings();

try {
  console.log(bold('Keyloom: starting'));
  const { databaseUrl } = await ensureLocalServices(settings);
  const env = apiEnvironment(settings, databaseUrl);
  await step('build', buildAll);
  await step('base corpus', buildCorpora);
  await step('migrate and seed', () => migrateAndSeed(env));
  await step('app and worker', async () => {
    const pids = await startSupervised({ env, host: settings.host, port: settings.port });
    return (
      `app (pid ${pids.app}) and job worker (pid ${pids.worker}) started under a supervisor ` +
      `(pid ${pids.supervisor}) that restarts them if they stop; health check answered, worker taking jobs`
    );
  });
} catch {
  const previous = livePid('app', ['api/dist/main.js']);
  console.log(
    previous === null
      ? '\nKeyloom did not start (see above). `npm stop` stops whatever did start.'
      : `\nKeyloom was not restarted (see above); the app started earlier still runs (pid ${previous}) ` +
          'with the previous build. `npm stop` stops everything.',
  );
  process.exit(1);
}

const width = Math.max(...demoAccounts.map(([email]) => email.length));
console.log(`
${bold(`Keyloom is running at ${settings.appUrl}`)}   (ready in ${seconds(Date.now() - started)})
  Mail inbox:  http://127.0.0.1:${settings.mailWebPort}   (JSON: /api/email)
  Demo sign-ins, password ${bold(settings.demoPassword)}:
${demoAccounts.map(([email, role, name]) => `    ${email.padEnd(width)}  ${role.padEnd(10)} ${name}`).join('\n')}
  Logs in .run/ (app.log, worker.log, supervisor.log, maildev.log, postgres-app.log). Stop everything with: npm stop`);
