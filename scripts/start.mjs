// npm start: install what is missing, start PostgreSQL and the fake mail server, build, migrate,
// seed and (re)start the app in the background. Safe to run again at any time.
import { apiEnvironment, ensureLocalServices } from './lib/local-services.mjs';
import { buildAll, buildCorpora, migrateAndSeed, startApp, startWorker } from './lib/app.mjs';
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
  await step('app', async () => {
    const pid = await startApp({ name: 'app', env, host: settings.host, port: settings.port });
    return `app started (pid ${pid}), health check answered`;
  });
  await step('worker', async () => {
    const pid = await startWorker({ name: 'worker', env });
    return `job worker started (pid ${pid}), training profile versions and sending summary e-mails`;
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
  Logs in .run/ (app.log, worker.log, maildev.log, postgres-app.log). Stop everything with: npm stop`);
