import type PgBoss from 'pg-boss';
import type { SendMailOptions } from 'nodemailer';
import type { DataSource, EntityManager } from 'typeorm';
import type { AuditService, AuditSubject } from '../audit/audit.service';
import { coversScope, todayIso } from '../consents/consent-status';
import { Consent } from '../consents/consent.entity';
import { FamilyContact } from '../contacts/family-contact.entity';
import { buildSummaryMessage } from './summary-message';
import { SummaryRecipient } from './summary-recipient.entity';
import { Summary } from './summary.entity';

// Sending one summary e-mail to one recipient, run by the worker from the pg-boss queue.
//
// Exactly once per recipient: the job locks the recipient row (SELECT … FOR UPDATE) for the whole
// SMTP conversation and sends only while the row is 'queued'; the same transaction marks it 'sent'.
// A second job for the same row (a retry, a duplicate, a second worker) waits for the lock and then
// finds it sent. The one gap left, a crash after the SMTP server accepted the message and before the
// commit, is covered by the Message-ID: it is the recipient's idempotency key, so the resent copy
// carries the same id and receiving servers may drop it.

/** The queue of summary e-mails; data: SummaryMailJobData. */
export const SUMMARY_MAIL_QUEUE = 'summary-mail';

/** What a mail job carries: only the recipient row (the content is stored with the summary). */
export type SummaryMailJobData = { recipientId: string };

/**
 * Retries while the SMTP server is unreachable: 12 retries with exponential back-off from 10 s
 * (pg-boss doubles the delay; about 11 hours in all), then the recipient is shown as failed. A job
 * whose worker died is retried after 2 minutes. Common practice, no source.
 */
export const SUMMARY_MAIL_QUEUE_OPTIONS: PgBoss.Queue = {
  name: SUMMARY_MAIL_QUEUE,
  retryLimit: 12,
  retryDelay: 10,
  retryBackoff: true,
  expireInSeconds: 120,
  retentionDays: 30,
};

/** The part of a nodemailer transport the job uses (a fake in tests). */
export type MailSender = { sendMail(message: SendMailOptions): Promise<{ messageId?: string }> };

export type DeliverySettings = { from: string; appUrl: string };

export type DeliveryOutcome = 'sent' | 'already-done' | 'failed' | 'withheld' | 'missing';

export const WITHHELD_MESSAGE = 'Not sent: the contact stopped summaries or no longer consents.';
export const CLIENT_CONSENT_WITHHELD_MESSAGE =
  'Not sent: the client’s consent no longer covers progress summaries (withdrawn or expired).';

/**
 * Marks a queued recipient failed without sending it, with the reason shown to the clinician, and
 * audits it as withheld. Used at send time and when a consent withdrawal releases the summaries scope.
 */
export async function withholdRecipient(
  manager: EntityManager,
  audit: AuditService,
  row: Pick<SummaryRecipient, 'id' | 'round'>,
  subject: AuditSubject,
  lastError: string,
): Promise<void> {
  await manager.getRepository(SummaryRecipient).update({ id: row.id }, { status: 'failed', lastError });
  await audit.record(
    null,
    'summary.failed',
    subject,
    { recipientId: row.id, round: row.round, withheld: true },
    manager,
  );
}

/** Thrown for a failure worth retrying; pg-boss retries the job. */
export class TransientMailError extends Error {}

/**
 * Whether an SMTP failure is permanent: a 5xx reply (RFC 5321 §4.2.1, "permanent negative
 * completion") or an address nodemailer refuses. Connection failures and 4xx replies are transient.
 */
export function isPermanentMailError(error: unknown): boolean {
  if (typeof error !== 'object' || error === null) return false;
  const { responseCode, code } = error as { responseCode?: unknown; code?: unknown };
  if (typeof responseCode === 'number') return responseCode >= 500 && responseCode < 600;
  return code === 'EENVELOPE';
}

/** The absolute stop link for a recipient's token. @param appUrl APP_URL without a trailing slash needed */
export function stopUrl(appUrl: string, token: string): string {
  return `${appUrl.replace(/\/+$/, '')}/api/summaries/stop/${encodeURIComponent(token)}`;
}

const describeError = (error: unknown): string =>
  (error instanceof Error ? error.message : String(error)).replace(/\s+/g, ' ').slice(0, 500);

/**
 * Sends the e-mail of one recipient row if it is still queued.
 * @param finalAttempt true on the queue's last retry: a transient failure then marks the row failed
 * @returns 'sent', 'already-done' (sent or failed before), 'failed' (permanent, or out of retries),
 *   'withheld' (the contact stopped summaries or withdrew consent meanwhile, or the client's consent
 *   no longer covers summaries; marked failed),
 *   'missing' (row deleted, e.g. with its client); throws TransientMailError to be retried
 */
export async function deliverSummaryEmail(
  dataSource: DataSource,
  audit: AuditService,
  sender: MailSender,
  settings: DeliverySettings,
  recipientId: string,
  finalAttempt: boolean,
): Promise<DeliveryOutcome> {
  const outcome = await dataSource.transaction(async (manager): Promise<DeliveryOutcome | 'retry'> => {
    const recipients = manager.getRepository(SummaryRecipient);
    const row = await recipients.findOne({ where: { id: recipientId }, lock: { mode: 'pessimistic_write' } });
    if (!row) return 'missing';
    if (row.status !== 'queued') return 'already-done';
    const summary = await manager.getRepository(Summary).findOneByOrFail({ id: row.summaryId });
    const subject = { type: 'summary', id: summary.id, clientId: summary.clientId };
    // Consent is checked again at send time: a stop link used, or consent withdrawn, while the e-mail
    // waited (e.g. SMTP down) must be honoured.
    const contact = row.contactId
      ? await manager.getRepository(FamilyContact).findOneBy({ id: row.contactId })
      : null;
    const contactRefuses = !contact || !contact.consentToSummaries || contact.unsubscribedAt !== null;
    // The client's own consent too: a withdrawal (or expiry) after the summary was queued wins.
    const clientRefuses =
      !contactRefuses &&
      !coversScope(
        await manager.getRepository(Consent).findBy({ clientId: summary.clientId }),
        'summaries',
        todayIso(),
      );
    if (contactRefuses || clientRefuses) {
      const lastError = contactRefuses ? WITHHELD_MESSAGE : CLIENT_CONSENT_WITHHELD_MESSAGE;
      await withholdRecipient(manager, audit, row, subject, lastError);
      return 'withheld';
    }
    const message = buildSummaryMessage({
      from: settings.from,
      to: { name: row.name, email: row.email },
      subject: summary.subject,
      text: summary.text,
      figures: summary.figures,
      idempotencyKey: row.idempotencyKey,
      stopUrl: stopUrl(settings.appUrl, row.stopToken),
    });
    const attempts = row.attempts + 1;
    try {
      const info = await sender.sendMail(message);
      await recipients.update(
        { id: row.id },
        { status: 'sent', attempts, sentAt: new Date(), lastError: null, messageId: info.messageId ?? null },
      );
      await audit.record(
        null,
        'summary.sent',
        subject,
        { recipientId: row.id, round: row.round, attempts },
        manager,
      );
      return 'sent';
    } catch (error) {
      const lastError = describeError(error);
      if (isPermanentMailError(error) || finalAttempt) {
        await recipients.update({ id: row.id }, { status: 'failed', attempts, lastError });
        await audit.record(
          null,
          'summary.failed',
          subject,
          { recipientId: row.id, round: row.round, attempts },
          manager,
        );
        return 'failed';
      }
      await recipients.update({ id: row.id }, { attempts, lastError });
      return 'retry';
    }
  });
  // Thrown after the commit, so the attempt count and the error are kept for the clinician to see.
  if (outcome === 'retry') throw new TransientMailError(`Mail not sent yet; will retry.`);
  return outcome;
}
