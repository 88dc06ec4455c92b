import type { EntityManager } from 'typeorm';
import type { AuditService } from '../audit/audit.service';
import type { WithdrawalHook } from '../consents/withdrawal-hooks';
import { CLIENT_CONSENT_WITHHELD_MESSAGE, withholdRecipient } from './summary-delivery';
import { SummaryRecipient } from './summary-recipient.entity';
import { Summary } from './summary.entity';

const queuedOf = (clientId: string, manager: EntityManager) =>
  manager
    .getRepository(SummaryRecipient)
    .createQueryBuilder('recipient')
    .innerJoin(Summary, 'summary', 'summary.id = recipient.summaryId')
    .where('summary.clientId = :clientId AND recipient.status = :queued', { clientId, queued: 'queued' });

/**
 * The 'summaryEmails' withdrawal hook: when no consent in force covers summaries any more, the
 * client's e-mails still waiting in the queue are withheld at once, exactly as the mail job would
 * withhold them at send time (same status, message and audit event); the job then finds them done.
 * Summaries already sent stay as the record of what the family received.
 */
export function summaryEmailsWithdrawalHook(audit: AuditService): WithdrawalHook {
  return {
    scope: 'summaries',
    effect: 'cancel',
    count: (clientId, manager) => queuedOf(clientId, manager).getCount(),
    remove: async (clientId, manager) => {
      // Locks the recipient rows only; a row the mail job is sending is waited for, then skipped as sent.
      const rows = await queuedOf(clientId, manager)
        .orderBy('recipient.id')
        .setLock('pessimistic_write', undefined, ['recipient'])
        .getMany();
      for (const row of rows) {
        const subject = { type: 'summary', id: row.summaryId, clientId };
        await withholdRecipient(manager, audit, row, subject, CLIENT_CONSENT_WITHHELD_MESSAGE);
      }
    },
  };
}
