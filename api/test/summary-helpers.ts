import { randomBytes, randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { SummaryRecipient } from '../src/summaries/summary-recipient.entity';
import { Summary } from '../src/summaries/summary.entity';

/**
 * A summary of `clientId` already sent to `contact`: its stored summary and recipient row (with a
 * fresh stop token), written straight to the database as the worker would leave them.
 */
export async function sentSummaryTo(
  dataSource: DataSource,
  clientId: string,
  contact: { id: string; name: string; email: string },
): Promise<SummaryRecipient> {
  const summary = await dataSource.getRepository(Summary).save({
    clientId,
    periodFrom: '2026-10-01',
    periodTo: '2026-11-30',
    versionIds: [],
    note: '',
    subject: 'Progress summary',
    text: 'Progress summary text.',
    figures: [],
    createdById: null,
  });
  return dataSource.getRepository(SummaryRecipient).save({
    summaryId: summary.id,
    contactId: contact.id,
    name: contact.name,
    email: contact.email,
    idempotencyKey: randomUUID(),
    stopToken: randomBytes(32).toString('base64url'),
    status: 'sent',
    sentAt: new Date(),
  });
}
