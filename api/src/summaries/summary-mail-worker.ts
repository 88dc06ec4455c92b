import type { Logger } from '@nestjs/common';
import { createTransport } from 'nodemailer';
import type PgBoss from 'pg-boss';
import type { DataSource } from 'typeorm';
import type { AuditService } from '../audit/audit.service';
import {
  deliverSummaryEmail,
  type DeliverySettings,
  type MailSender,
  SUMMARY_MAIL_QUEUE,
  SUMMARY_MAIL_QUEUE_OPTIONS,
  type SummaryMailJobData,
} from './summary-delivery';
import { SummaryRecipient } from './summary-recipient.entity';

// The worker's side of summary e-mails, ready to be called from api/src/worker.ts (one line there:
// `await startSummaryMailWork(boss, dataSource, audit, transport, settings, logger)`), and the
// SMTP transport made from the SMTP_* settings.

export type SmtpSettings = { host: string; port: number; secure: boolean; user?: string; pass?: string };

/** nodemailer over SMTP; on the loopback fake server without TLS, elsewhere with STARTTLS when offered. */
export function createSmtpSender(smtp: SmtpSettings): MailSender {
  const loopback = smtp.host === '127.0.0.1' || smtp.host === 'localhost' || smtp.host === '::1';
  return createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    ignoreTLS: loopback && !smtp.secure,
    auth: smtp.user ? { user: smtp.user, pass: smtp.pass ?? '' } : undefined,
    connectionTimeout: 10_000,
  });
}

/**
 * Queues again every recipient still 'queued' (e.g. the web process could not reach pg-boss when the
 * summary was made). Safe to repeat: pg-boss ignores a job id it already holds, and the delivery
 * sends only while the row is queued. @returns how many rows were looked at
 */
export async function requeueWaitingRecipients(boss: PgBoss, dataSource: DataSource): Promise<number> {
  const waiting = await dataSource.getRepository(SummaryRecipient).find({ where: { status: 'queued' } });
  for (const row of waiting) {
    await boss.send(SUMMARY_MAIL_QUEUE, { recipientId: row.id } satisfies SummaryMailJobData, {
      ...(row.jobId ? { id: row.jobId } : {}),
    });
  }
  return waiting.length;
}

/**
 * Creates the queue, re-queues waiting rows and starts taking summary e-mail jobs, `concurrency` at
 * a time (one pg-boss work() loop of batch size 1 each). @returns the pg-boss worker ids
 */
export async function startSummaryMailWork(
  boss: PgBoss,
  dataSource: DataSource,
  audit: AuditService,
  sender: MailSender,
  settings: DeliverySettings,
  logger: Pick<Logger, 'log'>,
  concurrency = 1,
): Promise<string[]> {
  await boss.createQueue(SUMMARY_MAIL_QUEUE, SUMMARY_MAIL_QUEUE_OPTIONS);
  const requeued = await requeueWaitingRecipients(boss, dataSource);
  if (requeued > 0) logger.log(`Re-queued ${requeued} waiting summary e-mails`);
  const handler: PgBoss.WorkWithMetadataHandler<SummaryMailJobData> = async ([job]) => {
    const finalAttempt = job.retryCount >= job.retryLimit;
    const outcome = await deliverSummaryEmail(
      dataSource,
      audit,
      sender,
      settings,
      job.data.recipientId,
      finalAttempt,
    );
    logger.log(`Summary e-mail ${job.data.recipientId}: ${outcome}`);
    return { outcome };
  };
  const ids: string[] = [];
  for (let i = 0; i < concurrency; i++) {
    ids.push(
      await boss.work<SummaryMailJobData>(
        SUMMARY_MAIL_QUEUE,
        { batchSize: 1, pollingIntervalSeconds: 1, includeMetadata: true },
        handler,
      ),
    );
  }
  return ids;
}
