// npm stop: stop the app, the fake mail server and the app's PostgreSQL cluster that npm start
// started. Idempotent: when nothing runs it says so and exits 0.
import { stopApp, stopSupervised, stopWorker } from './lib/app.mjs';
import { appClusterKind, maildevName } from './lib/local-services.mjs';
import { stopMaildev } from './lib/maildev.mjs';
import { done, failed } from './lib/output.mjs';
import { clusterPlace, describeCluster, stopCluster } from './lib/postgres.mjs';
import { appSettings } from './lib/settings.mjs';

const settings = appSettings();
let stoppedAny = false;
let failures = 0;

async function attempt(label, fn) {
  const started = Date.now();
  try {
    const message = await fn();
    if (message) {
      stoppedAny = true;
      done(message, Date.now() - started);
    }
  } catch (error) {
    failures += 1;
    failed(`stopping ${label}`, error);
  }
}

// First the supervisor, so nothing starts the app or the worker again; it stops both.
await attempt('supervisor', async () => {
  const pid = await stopSupervised();
  return pid === null ? '' : `supervisor stopped (pid ${pid}) with the app and the job worker`;
});
// An app or worker from before the supervisor (or left by a killed one).
await attempt('worker', async () => {
  const pid = await stopWorker('worker');
  return pid === null ? '' : `job worker stopped (pid ${pid})`;
});
await attempt('app', async () => {
  const pid = await stopApp('app');
  return pid === null ? '' : `app stopped (pid ${pid})`;
});
await attempt('fake mail server', async () => {
  const pid = await stopMaildev(maildevName);
  return pid === null ? '' : `fake mail server stopped (pid ${pid})`;
});
await attempt('PostgreSQL', async () => {
  const cluster = describeCluster(appClusterKind, settings.pgPort);
  return (await stopCluster(cluster)) ? `PostgreSQL cluster ${clusterPlace(cluster)} stopped` : '';
});

if (!stoppedAny && failures === 0) done('nothing was running');
process.exit(failures === 0 ? 0 : 1);
