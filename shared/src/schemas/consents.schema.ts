import { z } from 'zod';
import { isoDateField, optionalText, pastDateField, safeText } from './common';
import { emailField } from './email';

// What a consent covers: training a model on the client's writing, and sending
// progress summaries to the family contacts who agreed to receive them.
export const consentScopes = ['training', 'summaries'] as const;
export const consentScopeSchema = z.enum(consentScopes);
export type ConsentScope = z.infer<typeof consentScopeSchema>;

export const consentScopeLabels: Record<ConsentScope, string> = {
  training: 'Training a personal model on the client’s writing',
  summaries: 'Sending progress summaries to named family contacts',
};

export const consentGivers = ['client', 'representative'] as const;

export const FUTURE_CONSENT_MESSAGE = 'The date consent was given cannot be in the future.';

// POST /api/clients/:id/consents. `givenBy` is "client" or "representative";
// a representative needs a name and their relationship to the client.
export const createConsentSchema = z
  .object({
    givenBy: z.enum(consentGivers, { error: 'Say who gave consent.' }),
    representativeName: optionalText(120, 'Keep the name under 120 characters.', { multiline: false }),
    representativeRelationship: optionalText(80, 'Keep the relationship under 80 characters.', {
      multiline: false,
    }),
    scopes: z
      .array(consentScopeSchema)
      .min(1, { error: 'Choose at least one thing the consent covers.' })
      .transform((scopes) => [...new Set(scopes)]),
    givenOn: pastDateField(FUTURE_CONSENT_MESSAGE),
    expiresOn: isoDateField.nullable().optional(),
    notes: optionalText(2000, 'Keep the notes under 2000 characters.'),
  })
  .superRefine((value, ctx) => {
    if (value.givenBy === 'representative') {
      if (!value.representativeName) {
        ctx.addIssue({
          code: 'custom',
          path: ['representativeName'],
          message: 'Enter the representative’s name.',
        });
      }
      if (!value.representativeRelationship) {
        ctx.addIssue({
          code: 'custom',
          path: ['representativeRelationship'],
          message: 'Enter how the representative is related to the client.',
        });
      }
    }
    if (value.expiresOn && value.expiresOn <= value.givenOn) {
      ctx.addIssue({
        code: 'custom',
        path: ['expiresOn'],
        message: 'The expiry must be after the date consent was given.',
      });
    }
  });
export type CreateConsentInput = z.infer<typeof createConsentSchema>;

// POST /api/clients/:id/consents/:consentId/withdraw — cannot be undone.
export const withdrawConsentSchema = z.object({
  reason: safeText({ error: 'Say why consent was withdrawn (for the record).', multiline: true })
    .trim()
    .min(1, { error: 'Say why consent was withdrawn (for the record).' })
    .max(2000),
});
export type WithdrawConsentInput = z.infer<typeof withdrawConsentSchema>;

// POST /api/clients/:id/consents/:consentId/void — the record was made in error (wrong person, wrong
// scope, wrong date). Kept, struck through, with the reason; it no longer counts as consent.
export const voidConsentSchema = z.object({
  reason: safeText({ error: 'Say why this record is void (for the record).', multiline: true })
    .trim()
    .min(1, { error: 'Say why this record is void (for the record).' })
    .max(2000, { error: 'Keep the reason under 2000 characters.' }),
});
export type VoidConsentInput = z.infer<typeof voidConsentSchema>;

export const consentRecordStatuses = ['active', 'expired', 'withdrawn', 'voided'] as const;

// What a withdrawal removed, kept with the consent record as the trace that it happened.
// Data is removed only for a scope of the withdrawn consent that no other consent in force still
// covers: withdrawing a summaries-only consent never deletes the samples a training consent allows.
export const withdrawalReportSchema = z.object({
  samplesDeleted: z.number().int(),
  // Rows deleted besides the samples, one count per kind (sampleFlags, profileVersions, trials,
  // practicePhrases…), zeros included.
  derived: z.record(z.string(), z.number().int()),
  // Things stopped rather than deleted (queued summary e-mails that will not be sent).
  cancelled: z.record(z.string(), z.number().int()).optional(),
  // Scopes of this consent that another consent in force still covers: nothing of theirs is deleted.
  keptScopes: z.array(consentScopeSchema).optional(),
});
export type WithdrawalReport = z.infer<typeof withdrawalReportSchema>;

// GET /api/clients/:id/consents/:consentId/withdrawal-preview — what withdrawing would do now,
// counted in the same way as the withdrawal itself, before the clinician confirms.
export const withdrawalPreviewSchema = z.object({
  consentId: z.uuid(),
  report: withdrawalReportSchema,
  // For each scope of the consent: the other consents in force that still cover it (empty: its
  // data goes).
  scopes: z.array(
    z.object({
      scope: consentScopeSchema,
      coveredBy: z.array(z.object({ id: z.uuid(), givenOn: z.string(), expiresOn: z.string().nullable() })),
    }),
  ),
});
export type WithdrawalPreview = z.infer<typeof withdrawalPreviewSchema>;

export const consentSchema = z.object({
  id: z.uuid(),
  clientId: z.uuid(),
  givenBy: z.enum(consentGivers),
  representativeName: z.string().nullable(),
  representativeRelationship: z.string().nullable(),
  scopes: z.array(consentScopeSchema),
  givenOn: z.string(),
  expiresOn: z.string().nullable(),
  notes: z.string().nullable(),
  status: z.enum(consentRecordStatuses),
  recordedBy: z.string(),
  createdAt: z.string(),
  withdrawnAt: z.string().nullable(),
  withdrawnBy: z.string().nullable(),
  withdrawalReason: z.string().nullable(),
  withdrawal: withdrawalReportSchema.nullable(),
  // Set when the record was voided as made in error: when, by whom, why, and what that deleted.
  voidedAt: z.string().nullable(),
  voidedBy: z.string().nullable(),
  voidReason: z.string().nullable(),
  voidReport: withdrawalReportSchema.nullable(),
  // The scanned consent form, if one was uploaded (PDF, PNG or JPEG).
  document: z.object({ fileName: z.string(), mimeType: z.string(), byteSize: z.number().int() }).nullable(),
});
export type Consent = z.infer<typeof consentSchema>;

// Family contacts (no account): summaries go only to those who consented.
export const createContactSchema = z.object({
  name: safeText({ error: 'Enter a name.' }).trim().min(1, { error: 'Enter a name.' }).max(120),
  relationship: safeText({ error: 'Enter the relationship.' })
    .trim()
    .min(1, { error: 'Enter the relationship.' })
    .max(80),
  email: emailField,
  consentToSummaries: z.boolean(),
});
export type CreateContactInput = z.infer<typeof createContactSchema>;
export const updateContactSchema = createContactSchema
  .partial()
  .refine((value) => Object.keys(value).length > 0, { error: 'Nothing to change.' });
export type UpdateContactInput = z.infer<typeof updateContactSchema>;

export const contactSchema = z.object({
  id: z.uuid(),
  clientId: z.uuid(),
  name: z.string(),
  relationship: z.string(),
  email: z.string(),
  consentToSummaries: z.boolean(),
  // Set when this contact's address is stopped for the client: someone used the stop link of a summary
  // e-mail sent to it (whichever contact carried the address then). Only the family's new consent,
  // recorded by the clinician, clears it.
  unsubscribedAt: z.string().nullable(),
  // The family's latest renewed consent to summaries after a stop: the day and who gave it.
  summariesConsentGivenOn: z.string().nullable(),
  summariesConsentGivenBy: z.string().nullable(),
  createdAt: z.string(),
});
export type Contact = z.infer<typeof contactSchema>;

// POST /api/clients/:id/contacts/:contactId/summaries-consent — the family asked again for summaries
// after the stop link was used: the clinician records when and who said so; summaries go again.
export const renewSummariesConsentSchema = z.object({
  givenOn: pastDateField('The date the family gave consent cannot be in the future.'),
  givenBy: safeText({ error: 'Say who gave consent.' })
    .trim()
    .min(1, { error: 'Say who gave consent.' })
    .max(120, { error: 'Keep the name under 120 characters.' }),
});
export type RenewSummariesConsentInput = z.infer<typeof renewSummariesConsentSchema>;
