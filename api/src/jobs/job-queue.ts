import PgBoss from 'pg-boss';
import { SUMMARY_MAIL_QUEUE, SUMMARY_MAIL_QUEUE_OPTIONS } from '../summaries/summary-delivery';

/** The queue of profile-version training jobs; data: ProfileTrainingJobData. */
export const PROFILE_TRAINING_QUEUE = 'profile-training';

/** What a training job carries: only the version id (the inputs are frozen in its row). */
export type ProfileTrainingJobData = { versionId: string };

/**
 * Retry and expiry of training jobs. A job that throws (e.g. PostgreSQL restarted under it) is
 * retried once after 10 s; a worker killed mid-job leaves the job 'active' until it expires after
 * 5 minutes (a 200,000-character version takes well under one), then pg-boss retries it.
 */
export const PROFILE_TRAINING_QUEUE_OPTIONS: PgBoss.Queue = {
  name: PROFILE_TRAINING_QUEUE,
  retryLimit: 1,
  retryDelay: 10,
  expireInSeconds: 300,
  retentionDays: 7,
};

/** Job states in which the job may still run (or is running): a new train request must wait. */
export const LIVE_JOB_STATES: readonly string[] = ['created', 'retry', 'active'];

/**
 * A pg-boss instance on the app database (schema "pgboss"). `supervise` runs pg-boss's
 * maintenance (expiry, archiving): the worker does it, the web process does not.
 */
export function createJobBoss(databaseUrl: string, { supervise }: { supervise: boolean }): PgBoss {
  return new PgBoss({
    connectionString: databaseUrl,
    application_name: supervise ? 'keyloom-worker-queue' : 'keyloom-api-queue',
    max: 4,
    supervise,
    schedule: false,
    migrate: true,
  });
}

/** Starts the boss and makes sure the training queue exists (pg-boss 10 needs it before send/work). */
export async function startJobBoss(boss: PgBoss): Promise<void> {
  await boss.start();
  // Idempotent (INSERT … ON CONFLICT DO NOTHING inside pg-boss), so every process may call it.
  await boss.createQueue(PROFILE_TRAINING_QUEUE, PROFILE_TRAINING_QUEUE_OPTIONS);
  await boss.createQueue(SUMMARY_MAIL_QUEUE, SUMMARY_MAIL_QUEUE_OPTIONS);
}
