import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { DataSource } from 'typeorm';
import { AuditEvent } from './audit/audit-event.entity';
import { AuditService } from './audit/audit.service';
import { validateEnv } from './config/env.schema';
import { dataSourceOptions } from './database/data-source-options';
import {
  createJobBoss,
  PROFILE_TRAINING_QUEUE,
  type ProfileTrainingJobData,
  startJobBoss,
} from './jobs/job-queue';
import { loadTrainingRuntime, runProfileTraining } from './profile-versions/profile-training';
import {
  createSmtpSender,
  requeueWaitingRecipients,
  startSummaryMailWork,
} from './summaries/summary-mail-worker';

/** How often the worker re-queues summary e-mails whose job was lost (e.g. queued while pg-boss was down). */
const REQUEUE_EVERY_MS = 5 * 60_000;

// `node api/dist/worker.js`: the job process beside the web process. It trains and evaluates
// profile versions from the pg-boss queue, WORKER_CONCURRENCY jobs at a time, with PROFILE_FOLDS
// folds, and sends the progress-summary e-mails (one at a time, over SMTP_*). Several workers (on one machine or many) may share one database; pg-boss hands each job
// to one of them. SIGTERM/SIGINT: stop taking jobs, let a running one finish (up to 60 s), exit.
async function main(): Promise<void> {
  const logger = new Logger('Worker');
  const env = validateEnv(process.env);
  const options = dataSourceOptions(env.DATABASE_URL);
  // Logging as the app's (no 'error': a failed save would log the model bytes and the report).
  const dataSource = new DataSource({
    ...options,
    extra: {
      ...(options.extra as object),
      max: 2 + env.WORKER_CONCURRENCY,
      application_name: 'keyloom-worker',
    },
  });
  await dataSource.initialize();
  const audit = new AuditService(dataSource.getRepository(AuditEvent));
  const started = Date.now();
  const runtime = loadTrainingRuntime(env.PROFILE_FOLDS);
  logger.log(
    `Base model loaded in ${Date.now() - started} ms (sha256 ${runtime.baseModelSha256?.slice(0, 12)}…)`,
  );

  const boss = createJobBoss(env.DATABASE_URL, { supervise: true });
  boss.on('error', (error) => logger.error(`pg-boss: ${error.message}`));
  await startJobBoss(boss);
  for (let i = 0; i < env.WORKER_CONCURRENCY; i++) {
    await boss.work<ProfileTrainingJobData>(
      PROFILE_TRAINING_QUEUE,
      { batchSize: 1, pollingIntervalSeconds: 1 },
      async ([job]) => {
        const t0 = Date.now();
        const outcome = await runProfileTraining(dataSource, audit, job.data.versionId, job.id, runtime);
        logger.log(`Job ${job.id} (version ${job.data.versionId}): ${outcome} in ${Date.now() - t0} ms`);
        return { outcome };
      },
    );
  }
  await startSummaryMailWork(
    boss,
    dataSource,
    audit,
    createSmtpSender({
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: env.SMTP_SECURE,
      user: env.SMTP_USER,
      pass: env.SMTP_PASS,
    }),
    { from: env.MAIL_FROM, appUrl: env.APP_URL },
    logger,
  );
  const requeue = setInterval(() => {
    requeueWaitingRecipients(boss, dataSource).catch((error: unknown) =>
      logger.error(`Re-queueing summary e-mails: ${error instanceof Error ? error.message : String(error)}`),
    );
  }, REQUEUE_EVERY_MS);
  requeue.unref();
  logger.log(
    `Waiting for ${PROFILE_TRAINING_QUEUE} jobs (concurrency ${env.WORKER_CONCURRENCY}, ${env.PROFILE_FOLDS} folds)`,
  );

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.log(`${signal}: finishing the running job, then stopping`);
    boss
      .stop({ graceful: true, wait: true, timeout: 60_000 })
      .then(() => dataSource.destroy())
      .then(
        () => process.exit(0),
        (error: unknown) => {
          logger.error(error instanceof Error ? error.message : String(error));
          process.exit(1);
        },
      );
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));
}

main().catch((error: unknown) => {
  console.error(`worker: failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
