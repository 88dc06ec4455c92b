import { Module } from '@nestjs/common';
import { JobQueueService } from './job-queue.service';

/** The job queue (pg-boss) for the web process: send, cancel, state. Jobs run in api/dist/worker.js. */
@Module({
  providers: [JobQueueService],
  exports: [JobQueueService],
})
export class JobsModule {}
