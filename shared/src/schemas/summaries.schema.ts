import { z } from 'zod';
import { isoDateField, safeText } from './common';

// Progress summaries e-mailed to the client's family contacts.

const summaryFields = {
  from: isoDateField,
  to: isoDateField,
  versionIds: z.array(z.uuid()).max(50).default([]),
  contactIds: z
    .array(z.uuid())
    .min(1, { error: 'Choose at least one family contact.' })
    .max(20, { error: 'Choose at most 20 family contacts.' }),
  note: safeText({ multiline: true })
    .trim()
    .max(4000, { error: 'Keep the note under 4000 characters.' })
    .default(''),
};
// ISO dates compare correctly as strings.
const periodInOrder = (input: { from: string; to: string }) => input.from <= input.to;
const periodMessage = { error: 'The period must end on or after its start.', path: ['to'] };

// POST /api/clients/:id/summaries. An empty `versionIds` means every version trained or approved in
// the period; `contactIds` must name contacts of this client who consented to summaries.
export const createSummarySchema = z.object(summaryFields).refine(periodInOrder, periodMessage);
export type CreateSummaryInput = z.infer<typeof createSummarySchema>;

// POST /api/clients/:id/summaries/preview: the same without recipients; nothing is stored or sent.
export const summaryPreviewRequestSchema = z
  .object({
    from: summaryFields.from,
    to: summaryFields.to,
    versionIds: summaryFields.versionIds,
    note: summaryFields.note,
  })
  .refine(periodInOrder, periodMessage);
export type SummaryPreviewRequest = z.infer<typeof summaryPreviewRequestSchema>;

export const summaryPreviewSchema = z.object({
  subject: z.string(),
  text: z.string(),
  versionIds: z.array(z.uuid()),
  // The charts as the e-mail carries them (PNG, base64), with the alt text that states every figure
  // and the size to show them at in CSS px (the PNG has twice as many pixels each way).
  charts: z.array(
    z.object({
      name: z.string(),
      alt: z.string(),
      pngBase64: z.string(),
      width: z.number().int().positive(),
      height: z.number().int().positive(),
    }),
  ),
});
export type SummaryPreview = z.infer<typeof summaryPreviewSchema>;

// One e-mail to one recipient: waiting in the job queue, handed to the SMTP server, or given up.
export const summaryRecipientStatuses = ['queued', 'sent', 'failed'] as const;
export const summaryRecipientStatusSchema = z.enum(summaryRecipientStatuses);
export type SummaryRecipientStatus = z.infer<typeof summaryRecipientStatusSchema>;

// The summary as a whole: 'sending' while any recipient is queued, then 'sent', 'partly_failed' or 'failed'.
export const summaryStatuses = ['sending', 'sent', 'partly_failed', 'failed'] as const;
export const summaryStatusSchema = z.enum(summaryStatuses);
export type SummaryStatus = z.infer<typeof summaryStatusSchema>;

export const summaryStatusLabels: Record<SummaryStatus, string> = {
  sending: 'Sending',
  sent: 'Sent',
  partly_failed: 'Some e-mails failed',
  failed: 'Not delivered',
};

export const summaryRecipientSchema = z.object({
  id: z.uuid(),
  contactId: z.uuid().nullable(),
  name: z.string(),
  email: z.string(),
  // 1 for the first send, 2… for each re-send.
  round: z.number().int(),
  status: summaryRecipientStatusSchema,
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  sentAt: z.string().nullable(),
  // The contact has since used the stop link (shown to the clinician).
  stopped: z.boolean(),
});
export type SummaryRecipient = z.infer<typeof summaryRecipientSchema>;

export const summarySchema = z.object({
  id: z.uuid(),
  clientId: z.uuid(),
  from: z.string(),
  to: z.string(),
  versionIds: z.array(z.uuid()),
  note: z.string(),
  subject: z.string(),
  // The plain-language text as sent.
  text: z.string(),
  status: summaryStatusSchema,
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  recipients: z.array(summaryRecipientSchema),
});
export type Summary = z.infer<typeof summarySchema>;

/** Whole-summary status from its recipients' statuses. */
export function summaryStatusOf(recipients: readonly SummaryRecipientStatus[]): SummaryStatus {
  if (recipients.some((status) => status === 'queued')) return 'sending';
  const failed = recipients.filter((status) => status === 'failed').length;
  if (failed === 0) return 'sent';
  return failed === recipients.length ? 'failed' : 'partly_failed';
}
