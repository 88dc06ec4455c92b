import { Injectable, Logger, type OnApplicationShutdown } from '@nestjs/common';
import type PgBoss from 'pg-boss';
import { AppConfig } from '../config/app-config';
import { createJobBoss, startJobBoss } from './job-queue';

/**
 * The web process's side of the job queue: it sends and cancels jobs and reads their state; it
 * never runs them (the worker process, api/dist/worker.js, does). pg-boss starts on first use, so
 * a process that never queues anything never opens its connections.
 */
@Injectable()
export class JobQueueService implements OnApplicationShutdown {
  private readonly logger = new Logger('JobQueue');
  private boss: Promise<PgBoss> | null = null;

  constructor(private readonly config: AppConfig) {}

  private started(): Promise<PgBoss> {
    if (!this.boss) {
      const boss = createJobBoss(this.config.databaseUrl, { supervise: false });
      boss.on('error', (error) => this.logger.error(`pg-boss: ${error.message}`));
      this.boss = startJobBoss(boss).then(
        () => boss,
        (error: unknown) => {
          this.boss = null; // the next call tries again (e.g. after a database restart)
          throw error;
        },
      );
    }
    return this.boss;
  }

  /** Queues a job under the given id (so the caller can store the id before the job exists). */
  async send(queue: string, data: object, id: string): Promise<void> {
    const boss = await this.started();
    await boss.send(queue, data, { id });
  }

  /** Cancels a job that has not finished; unknown or finished jobs are left as they are. */
  async cancel(queue: string, id: string): Promise<void> {
    const boss = await this.started();
    await boss.cancel(queue, id);
  }

  /** The job's state ('created', 'retry', 'active', 'completed', 'cancelled', 'failed') or null when unknown. */
  async state(queue: string, id: string): Promise<string | null> {
    const boss = await this.started();
    const job = await boss.getJobById(queue, id, { includeArchive: true });
    return job?.state ?? null;
  }

  async onApplicationShutdown(): Promise<void> {
    if (!this.boss) return;
    const boss = await this.boss.catch(() => null);
    this.boss = null;
    await boss?.stop({ graceful: false, wait: true, close: true });
  }
}
