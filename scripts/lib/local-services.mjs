// The set-up shared by `npm start` and `npm run dev`: packages, the app's PostgreSQL cluster
// with its role and database, and the fake mail server.
import { join } from 'node:path';
import { startMaildev, ensureMaildevInstalled } from './maildev.mjs';
import { ensureNpmTree } from './npm-deps.mjs';
import { step } from './output.mjs';
import { repoRoot } from './paths.mjs';
import {
  clusterPlace,
  describeCluster,
  ensurePostgresInstalled,
  ensureRoleAndDatabases,
  startCluster,
} from './postgres.mjs';
import { databaseUrl } from './settings.mjs';

export const appClusterKind = 'app';
export const maildevName = 'maildev';

/**
 * Packages, PostgreSQL and maildev for the local app; prints one line per step.
 * @param {ReturnType<import('./settings.mjs').appSettings>} settings
 * @returns {Promise<{databaseUrl: string}>}
 */
export async function ensureLocalServices(settings) {
  await step('npm packages', () => ensureNpmTree(repoRoot, 'npm packages'));
  await step('PostgreSQL', ensurePostgresInstalled);
  const cluster = describeCluster(appClusterKind, settings.pgPort);
  await step('PostgreSQL cluster', async () => {
    const what = await startCluster(cluster);
    const { role, password, name } = settings.database;
    await ensureRoleAndDatabases(cluster, { role, password, databases: [name] });
    return `PostgreSQL cluster ${clusterPlace(cluster)} ${what} on 127.0.0.1:${cluster.port}, database ${name} ready`;
  });
  await step('fake mail packages', ensureMaildevInstalled);
  await step('fake mail server', () =>
    startMaildev({
      name: maildevName,
      smtpPort: settings.smtpPort,
      webPort: settings.mailWebPort,
      mailDir: join(repoRoot, 'tools', 'mail', '.mail'),
    }),
  );
  return { databaseUrl: databaseUrl(cluster.port, settings.database) };
}

/**
 * Environment for the API process and its migrate/seed commands.
 * @param {ReturnType<import('./settings.mjs').appSettings>} settings
 * @param {string} url DATABASE_URL
 */
export function apiEnvironment(settings, url) {
  return {
    ...process.env,
    NODE_ENV: 'development',
    HOST: settings.host,
    PORT: String(settings.port),
    DATABASE_URL: url,
    SMTP_HOST: process.env.SMTP_HOST || '127.0.0.1',
    SMTP_PORT: String(settings.smtpPort),
    APP_URL: process.env.APP_URL || settings.appUrl,
    DEMO_PASSWORD: settings.demoPassword,
  };
}
