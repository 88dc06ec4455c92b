import PgBoss from 'pg-boss';
import { SUMMARY_MAIL_QUEUE, SUMMARY_MAIL_QUEUE_OPTIONS } from '../summaries/summary-delivery';

/** The queue of profile-version training jobs; data: ProfileTrainingJobData. */
export const PROFILE_TRAINING_QUEUE = 'profile-training';

/** What a training job carries: only the version id (the inputs are frozen in its row). */
export type ProfileTrainingJobData = { versionId: string };

/**
 * Retry and expiry of training jobs. A job that throws (e.g. PostgreSQL restarted under it) is
 * retried once after 10 s. A worker killed mid-job is not left to expiry: the other workers (and
 * the next one to start) find its version's heartbeat stale and queue it again
 * (profile-versions/training-recovery.ts). pg-boss 10 fixes a job's expiry when it is sent and
 * rejects the handler's promise when it passes (the running training would go on while a retry
 * starts), and heartbeats do not extend it; so the expiry is only a last resort, far above the
 * longest training (a 6 MB order-5 version, minutes): 12 hours (pg-boss allows less than 24).
 */
export const PROFILE_TRAINING_QUEUE_OPTIONS: PgBoss.Queue = {
  name: PROFILE_TRAINING_QUEUE,
  retryLimit: 1,
  retryDelay: 10,
  expireInSeconds: 12 * 3600,
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

/** PostgreSQL's SQLSTATE for "deadlock detected" (PostgreSQL documentation, Appendix A, class 40). */
const DEADLOCK_DETECTED = '40P01';

/**
 * Runs `step` again (up to 5 tries, 50–250 ms apart) when PostgreSQL ends it as a deadlock victim.
 * pg-boss 10's create_queue() takes no lock of its own: two processes creating the same new queue at
 * once (two workers started together on a fresh database) deadlock between the queue row and the
 * partition it attaches, and one of them fails. The victim's transaction is rolled back whole, so
 * the retry simply finds the queue made by the other.
 */
async function retryOnDeadlock(step: () => Promise<unknown>): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await step();
      return;
    } catch (error) {
      const code = (error as { code?: unknown } | null)?.code;
      if (code !== DEADLOCK_DETECTED || attempt >= 5) throw error;
      await new Promise((resolve) => setTimeout(resolve, 50 + Math.random() * 200));
    }
  }
}

/** Starts the boss and makes sure the training queue exists (pg-boss 10 needs it before send/work). */
export async function startJobBoss(boss: PgBoss): Promise<void> {
  await boss.start();
  // Idempotent (INSERT … ON CONFLICT DO NOTHING inside pg-boss), so every process may call it.
  await retryOnDeadlock(() =>
    boss.createQueue(PROFILE_TRAINING_QUEUE, { ...PROFILE_TRAINING_QUEUE_OPTIONS }),
  );
  // createQueue leaves an existing queue as it was: bring its retry/expiry up to date (new jobs only).
  await retryOnDeadlock(() =>
    boss.updateQueue(PROFILE_TRAINING_QUEUE, { ...PROFILE_TRAINING_QUEUE_OPTIONS }),
  );
  await retryOnDeadlock(() => boss.createQueue(SUMMARY_MAIL_QUEUE, SUMMARY_MAIL_QUEUE_OPTIONS));
}
