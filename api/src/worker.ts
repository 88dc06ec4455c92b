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
import { installProcessGuards } from './jobs/process-guards';
import {
  readBaseModelFile,
  readBaseWordsFile,
  runProfileTraining,
  type TrainingRuntime,
} from './profile-versions/profile-training';
import { requeueDeadTrainings } from './profile-versions/training-recovery';
import { sharedBytes, TrainingThreads } from './profile-versions/training-threads';
import {
  createSmtpSender,
  requeueWaitingRecipients,
  startSummaryMailWork,
} from './summaries/summary-mail-worker';

/** How often the worker re-queues summary e-mails whose job was lost (e.g. queued while pg-boss was down). */
const REQUEUE_EVERY_MS = 5 * 60_000;

/** How often the worker looks for trainings whose worker died, at most (and half the stale time). */
const RECOVERY_EVERY_MS = 10_000;

// `node api/dist/worker.js`: the job process beside the web process. It trains and evaluates
// profile versions from the pg-boss queue, TRAINING_CONCURRENCY jobs at a time, with PROFILE_FOLDS
// folds, each in a worker thread (training-threads.ts) so this event loop stays free for
// heartbeats, PostgreSQL and the progress-summary e-mails (MAIL_CONCURRENCY at a time, over
// SMTP_*). It also re-queues trainings whose worker died (training-recovery.ts). Several workers
// (on one machine or many) may share one database; pg-boss hands each job to one of them (its
// fetch takes jobs with SELECT … FOR UPDATE SKIP LOCKED, docs/references.md §6). Each logs and
// stores WORKER_NAME with every training job's result (pg-boss's job output). Queue and database errors
// are logged, never fatal (jobs/process-guards.ts). SIGTERM/SIGINT: stop taking jobs, let a
// running one finish (up to 60 s), exit.
async function main(): Promise<void> {
  const logger = new Logger('Worker');
  installProcessGuards(logger);
  const env = validateEnv(process.env);
  const options = dataSourceOptions(env.DATABASE_URL);
  // Logging as the app's (no 'error': a failed save would log the model bytes and the report).
  const dataSource = new DataSource({
    ...options,
    extra: {
      ...(options.extra as object),
      max: 2 + env.TRAINING_CONCURRENCY + env.MAIL_CONCURRENCY,
      application_name: 'keyloom-worker',
    },
  });
  await dataSource.initialize();
  const audit = new AuditService(dataSource.getRepository(AuditEvent));
  const started = Date.now();
  // Read once; every training thread deserializes these same bytes, whose hash each version stores.
  const baseModel = readBaseModelFile();
  const baseWords = readBaseWordsFile();
  const threads = new TrainingThreads(sharedBytes(baseModel.bytes), sharedBytes(baseWords.bytes));
  const runtime: TrainingRuntime = {
    base: null,
    baseModelSha256: baseModel.sha256,
    baseWordsSha256: baseWords.sha256,
    folds: env.PROFILE_FOLDS,
    trainer: threads.trainer,
  };
  logger.log(
    `Base model and vocabulary read in ${Date.now() - started} ms (sha256 ${baseModel.sha256.slice(0, 12)}…, ` +
      `${baseWords.sha256.slice(0, 12)}…)`,
  );

  const boss = createJobBoss(env.DATABASE_URL, { supervise: true });
  boss.on('error', (error) => logger.error(`pg-boss: ${error.message}`));
  await startJobBoss(boss);
  const worker = env.WORKER_NAME;
  // pg-boss 10 has no per-worker concurrency option: each work() call is one polling loop taking
  // batchSize jobs at a time, so N calls with batchSize 1 run up to N jobs at once (docs/references.md §6).
  for (let i = 0; i < env.TRAINING_CONCURRENCY; i++) {
    await boss.work<ProfileTrainingJobData>(
      PROFILE_TRAINING_QUEUE,
      { batchSize: 1, pollingIntervalSeconds: 1 },
      async ([job]) => {
        const t0 = Date.now();
        logger.log(`Job ${job.id} (version ${job.data.versionId}): started on ${worker}`);
        const outcome = await runProfileTraining(dataSource, audit, job.data.versionId, job.id, runtime);
        logger.log(`Job ${job.id} (version ${job.data.versionId}): ${outcome} in ${Date.now() - t0} ms`);
        return { outcome, worker };
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
    env.MAIL_CONCURRENCY,
  );
  const staleMs = env.TRAINING_STALE_SECONDS * 1000;
  let recovering = false;
  const recover = () => {
    if (recovering) return;
    recovering = true;
    requeueDeadTrainings(dataSource, boss, audit, staleMs)
      .then(({ requeued, failed }) => {
        for (const id of requeued) logger.log(`Version ${id}: its worker stopped; training queued again`);
        for (const id of failed) logger.log(`Version ${id}: interrupted too often; marked failed`);
      })
      .catch((error: unknown) =>
        logger.error(
          `Re-queueing interrupted trainings: ${error instanceof Error ? error.message : String(error)}`,
        ),
      )
      .finally(() => {
        recovering = false;
      });
  };
  recover();
  const recovery = setInterval(recover, Math.min(RECOVERY_EVERY_MS, staleMs / 2));
  recovery.unref();
  const requeue = setInterval(() => {
    requeueWaitingRecipients(boss, dataSource).catch((error: unknown) =>
      logger.error(`Re-queueing summary e-mails: ${error instanceof Error ? error.message : String(error)}`),
    );
  }, REQUEUE_EVERY_MS);
  requeue.unref();
  logger.log(
    `Waiting for ${PROFILE_TRAINING_QUEUE} jobs as ${worker} (concurrency ${env.TRAINING_CONCURRENCY}, ` +
      `${env.PROFILE_FOLDS} folds; e-mails ${env.MAIL_CONCURRENCY} at a time)`,
  );

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.log(`${signal}: finishing the running job, then stopping`);
    clearInterval(recovery);
    boss
      .stop({ graceful: true, wait: true, timeout: 60_000 })
      .then(() => threads.close())
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
