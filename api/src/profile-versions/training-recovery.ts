import { randomUUID } from 'node:crypto';
import type PgBoss from 'pg-boss';
import type { DataSource } from 'typeorm';
import type { AuditService } from '../audit/audit.service';
import { PROFILE_TRAINING_QUEUE, type ProfileTrainingJobData } from '../jobs/job-queue';
import { event, updateCount } from './profile-training';
import type { StoredVersionEvent } from './profile-version.entity';

// Picking up trainings whose worker died (killed, out of memory, machine restarted). pg-boss 10
// would only notice when the job expires, and the expiry is per job and fixed when it is sent (not
// extended by our heartbeats), so it is kept long enough for the largest training. Instead every
// worker, at start and then every few seconds, looks for versions still `training` whose job is
// not simply waiting in the queue and whose heartbeat (written every 0.5 s by the running
// worker's main thread, which no longer runs the engine) is older than TRAINING_STALE_SECONDS.
// Each one is queued again under a new job id, stage `interrupted` ("interrupted, retrying"),
// from scratch: the old job id no longer matches the row, so whatever the old job might still
// write is refused, and the final save happens once.

/** The stage of a version whose worker died and whose training was queued again. */
export const INTERRUPTED_STAGE = 'interrupted';

/** The history comment of each automatic retry (also how they are counted). */
export const INTERRUPTED_COMMENT = 'Interrupted: the job worker stopped. Training again from the start.';

/** Automatic retries of one version before it is marked failed (a version that kills its worker every time). */
export const MAX_AUTOMATIC_RETRIES = 2;

export const tooManyInterruptionsMessage = (count: number): string =>
  `Training was interrupted ${count} times because the job worker stopped. Train again to retry.`;

type DeadTraining = { id: string; client_id: string; job_id: string | null; history: StoredVersionEvent[] };

/**
 * Versions in `training` whose job is dead: no heartbeat (nor job start) for `staleMs`, and the
 * job is not waiting in the queue (`created`/`retry`) — it is `active` under a dead worker, or
 * finished, cancelled or missing while the row still says training.
 */
export async function findDeadTrainings(dataSource: DataSource, staleMs: number): Promise<DeadTraining[]> {
  return dataSource.query(
    `SELECT v.id, v.client_id, v.job_id, v.history
       FROM profile_versions v
       LEFT JOIN pgboss.job j ON j.name = $2 AND j.id::text = v.job_id
      WHERE v.status = 'training'
        AND GREATEST(COALESCE(v.heartbeat_at, v.updated_at), j.started_on) < now() - $1 * interval '1 millisecond'
        AND (j.state IS NULL OR j.state NOT IN ('created', 'retry'))`,
    [staleMs, PROFILE_TRAINING_QUEUE],
  );
}

export type RecoveryResult = { requeued: string[]; failed: string[] };

/** Queues every dead training again (or fails it after MAX_AUTOMATIC_RETRIES). Safe to run from several workers at once. */
export async function requeueDeadTrainings(
  dataSource: DataSource,
  boss: PgBoss,
  audit: AuditService,
  staleMs: number,
): Promise<RecoveryResult> {
  const result: RecoveryResult = { requeued: [], failed: [] };
  for (const dead of await findDeadTrainings(dataSource, staleMs)) {
    const subject = { type: 'profile-version', id: dead.id, clientId: dead.client_id };
    const retries = dead.history.filter((e) => e.comment === INTERRUPTED_COMMENT).length;
    // Guarded by the job id read above: when another worker got there first, nothing changes.
    const unchanged = `id = $1 AND job_id IS NOT DISTINCT FROM $2 AND status = 'training'`;
    if (retries >= MAX_AUTOMATIC_RETRIES) {
      const message = tooManyInterruptionsMessage(retries + 1);
      const done = await dataSource.transaction(async (tx) => {
        const count = await updateCount(
          tx,
          `UPDATE profile_versions SET status = 'failed', stage = NULL, error = $3, updated_at = now(),
             history = history || $4::jsonb WHERE ${unchanged}`,
          [dead.id, dead.job_id, message, event('failed', message)],
        );
        if (count > 0)
          await audit.record(null, 'profile.failed', subject, { jobId: dead.job_id, error: message }, tx);
        return count > 0;
      });
      if (done) result.failed.push(dead.id);
    } else {
      const jobId = randomUUID();
      const done = await dataSource.transaction(async (tx) => {
        const count = await updateCount(
          tx,
          `UPDATE profile_versions SET stage = $3, progress = 0, error = NULL, job_id = $4, heartbeat_at = now(),
             updated_at = now(), history = history || $5::jsonb WHERE ${unchanged}`,
          [dead.id, dead.job_id, INTERRUPTED_STAGE, jobId, event('training', INTERRUPTED_COMMENT)],
        );
        if (count > 0) {
          await audit.record(
            null,
            'profile.train',
            subject,
            { jobId, retry: true, replacedJobId: dead.job_id, interrupted: true },
            tx,
          );
        }
        return count > 0;
      });
      if (!done) continue;
      // The dead job would only end at its expiry; cancel it so nothing retries it later.
      if (dead.job_id) await boss.cancel(PROFILE_TRAINING_QUEUE, dead.job_id).catch(() => undefined);
      // Should this fail, the row's job is missing and the next sweep queues it again.
      await boss.send(PROFILE_TRAINING_QUEUE, { versionId: dead.id } satisfies ProfileTrainingJobData, {
        id: jobId,
      });
      result.requeued.push(dead.id);
    }
  }
  return result;
}
