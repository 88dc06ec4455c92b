import { z } from 'zod';
import { isoDateField, safeText } from './common';

// Progress summaries e-mailed to the client's family contacts: composed as a draft the clinician
// edits, then sent.

/** A staff comment a summary may quote, named by its version: the carer's sign-off or the supervisor's approval. */
export const summaryCommentKinds = ['sign-off', 'approval'] as const;
export const summaryCommentRefSchema = z.object({
  versionId: z.uuid(),
  kind: z.enum(summaryCommentKinds),
});
export type SummaryCommentRef = z.infer<typeof summaryCommentRefSchema>;

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
  // Staff comments are quoted only when ticked here, one by one.
  includeComments: z.array(summaryCommentRefSchema).max(100).default([]),
};
// ISO dates compare correctly as strings.
const periodInOrder = (input: { from: string; to: string }) => input.from <= input.to;
const periodMessage = { error: 'The period must end on or after its start.', path: ['to'] };

// POST /api/clients/:id/summaries: creates a draft with the generated text. An empty `versionIds`
// means every version approved in the period (active or retired since); other versions only when
// chosen. `contactIds` must name contacts of this client who consented to summaries.
export const createSummarySchema = z.object(summaryFields).refine(periodInOrder, periodMessage);
export type CreateSummaryInput = z.infer<typeof createSummarySchema>;

// PATCH /api/summaries/:id (drafts only): each field sent replaces the draft's. Changing the versions,
// the ticked comments or the note writes the text again only while the clinician has not edited it;
// `regenerate: true` replaces an edited text with the generated one.
export const updateSummarySchema = z.object({
  subject: safeText()
    .trim()
    .min(1, { error: 'Enter a subject.' })
    .max(200, { error: 'Keep the subject under 200 characters.' })
    .optional(),
  text: safeText({ multiline: true })
    .trim()
    .min(1, { error: 'The e-mail needs some text.' })
    .max(20000, { error: 'Keep the text under 20,000 characters.' })
    .optional(),
  // No defaults here: a field left out keeps what the draft holds.
  versionIds: z.array(z.uuid()).max(50).optional(),
  contactIds: summaryFields.contactIds.optional(),
  note: safeText({ multiline: true })
    .trim()
    .max(4000, { error: 'Keep the note under 4000 characters.' })
    .optional(),
  includeComments: z.array(summaryCommentRefSchema).max(100).optional(),
  regenerate: z.boolean().optional(),
});
export type UpdateSummaryInput = z.infer<typeof updateSummarySchema>;

// POST /api/clients/:id/summaries/preview: the same without recipients; nothing is stored or sent.
export const summaryPreviewRequestSchema = z
  .object({
    from: summaryFields.from,
    to: summaryFields.to,
    versionIds: summaryFields.versionIds,
    note: summaryFields.note,
    includeComments: summaryFields.includeComments,
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

// GET /api/summaries/:id/message: the e-mail exactly as a family member receives it (the HTML and
// plain-text parts and the headers), for the first recipient or an example one.
export const summaryMessagePreviewSchema = z.object({
  subject: z.string(),
  to: z.string(),
  from: z.string(),
  text: z.string(),
  html: z.string(),
  headers: z.record(z.string(), z.string()),
  charts: summaryPreviewSchema.shape.charts,
});
export type SummaryMessagePreview = z.infer<typeof summaryMessagePreviewSchema>;

// One e-mail to one recipient: waiting in the job queue, handed to the SMTP server, or given up.
export const summaryRecipientStatuses = ['queued', 'sent', 'failed'] as const;
export const summaryRecipientStatusSchema = z.enum(summaryRecipientStatuses);
export type SummaryRecipientStatus = z.infer<typeof summaryRecipientStatusSchema>;

// The summary as a whole: 'draft' until sent; 'sending' while any recipient is queued, then 'sent',
// 'partly_failed' or 'failed'.
export const summaryStatuses = ['draft', 'sending', 'sent', 'partly_failed', 'failed'] as const;
export const summaryStatusSchema = z.enum(summaryStatuses);
export type SummaryStatus = z.infer<typeof summaryStatusSchema>;

export const summaryStatusLabels: Record<SummaryStatus, string> = {
  draft: 'Draft, not sent',
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
  // The plain-language text: as sent, or the draft's current text.
  text: z.string(),
  status: summaryStatusSchema,
  createdBy: z.string().nullable(),
  createdAt: z.string(),
  recipients: z.array(summaryRecipientSchema),
  // The draft's chosen recipients (after sending: who it was sent to first).
  contactIds: z.array(z.uuid()),
  includeComments: z.array(summaryCommentRefSchema),
  // The clinician changed the generated text (then changing versions or comments keeps their text).
  textEdited: z.boolean(),
  // The staff comments the summary could quote, each ticked or not.
  availableComments: z.array(
    summaryCommentRefSchema.extend({
      versionNumber: z.number().int(),
      by: z.string(),
      text: z.string(),
    }),
  ),
  // For the clinician only, never sent: what was left out and why.
  notes: z.array(z.string()),
  sentAt: z.string().nullable(),
  sentBy: z.string().nullable(),
});
export type Summary = z.infer<typeof summarySchema>;

/** Whole-summary status from its recipients' statuses. */
export function summaryStatusOf(recipients: readonly SummaryRecipientStatus[]): SummaryStatus {
  if (recipients.some((status) => status === 'queued')) return 'sending';
  const failed = recipients.filter((status) => status === 'failed').length;
  if (failed === 0) return 'sent';
  return failed === recipients.length ? 'failed' : 'partly_failed';
}
