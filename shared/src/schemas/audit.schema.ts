import { z } from 'zod';
import { isoDateField, pageQuerySchema, safeText } from './common';

// Every action the audit log records, in plain words for the audit page. The API's AuditAction type is
// the keys of this object, so a new action cannot be recorded without its words.
export const auditActionLabels = {
  'auth.sign-in': 'Signed in',
  'auth.sign-out': 'Signed out',
  'auth.sign-in-failed': 'Sign-in refused',
  'auth.sign-in-locked': 'Sign-in held back after failed attempts',
  'auth.password-change': 'Changed their own password',
  'user.create': 'Added a staff account',
  'user.update': 'Changed a staff account',
  'clinic-settings.update': 'Changed the clinic details',
  'client.create': 'Opened a client record',
  'client.update': 'Changed a client record',
  'assignment.create': 'Assigned a carer',
  'assignment.delete': 'Removed a carer',
  'consent.create': 'Recorded consent',
  'consent.withdraw': 'Recorded a consent withdrawal',
  'consent.void': 'Voided a consent record made in error',
  'consent.document-upload': 'Attached a scanned consent form',
  'contact.create': 'Added a family contact',
  'contact.update': 'Changed a family contact',
  'contact.delete': 'Deleted a family contact',
  'contact.summaries-consent': 'Recorded the family’s new consent to summaries',
  'sample.upload': 'Uploaded a language sample',
  'sample.paste': 'Stored pasted text',
  'sample.duplicate-refused': 'Refused a duplicate upload',
  'sample.flag-redact': 'Redacted personal data',
  'sample.flag-keep': 'Kept flagged text',
  'sample.exclude': 'Left a sample out',
  'sample.include': 'Included a left-out sample again',
  'sample.flag-undo-redact': 'Undid a redaction',
  'sample.remove': 'Deleted a sample (with a reason)',
  'sample.delete': 'Deleted a sample (consent withdrawn)',
  'profile.create': 'Configured a profile version',
  'profile.update': 'Edited a draft version',
  'profile.delete-draft': 'Deleted a draft version',
  'profile.train': 'Started training a version',
  'profile.cancel': 'Cancelled training',
  'profile.trained': 'A version finished training',
  'profile.failed': 'Training failed',
  'profile.sign-off': 'Signed a version off',
  'profile.report-problem': 'Reported a problem with a version',
  'profile.approve': 'Approved a version',
  'profile.send-back': 'Sent a version back',
  'profile.retire': 'Retired a version',
  'profile.reactivate': 'Made the previous version active again',
  'profile.export': 'Exported a profile file',
  'profile.model-download': 'Opened a version on the test keyboard',
  'profile.delete': 'Deleted a version (consent withdrawn)',
  'report.version-pdf': 'Downloaded a version report (PDF)',
  'report.client-pdf': 'Downloaded a client report (PDF)',
  'vocabulary.update': 'Changed a client’s vocabulary list',
  'vocabulary.export': 'Exported a version’s vocabulary',
  'trial.create': 'Logged a trial on the test keyboard',
  'trial.delete': 'Deleted trials (consent withdrawn)',
  'practice-phrase.create': 'Added a practice phrase',
  'practice-phrase.delete': 'Removed a practice phrase',
  'summary.create': 'Drafted a progress summary',
  'summary.update': 'Edited a draft progress summary',
  'summary.delete-draft': 'Deleted a draft progress summary',
  'summary.send': 'Sent a progress summary',
  'summary.resend': 'Sent a progress summary again',
  'summary.sent': 'A summary e-mail was delivered',
  'summary.failed': 'A summary e-mail failed',
  'summary.stop': 'A family member stopped summaries',
} as const;
export type AuditAction = keyof typeof auditActionLabels;

export const AUDIT_DATE_RANGE_MESSAGE = 'The “To” day must be the same as or after the “From” day.';

// The filters of GET /api/audit and GET /api/audit.csv (supervisor, admin).
const auditFilterFields = {
  clientId: z.uuid().optional(),
  userId: z.uuid().optional(),
  // An exact action ("sample.upload") or a prefix ending in "." ("sample.").
  action: safeText().trim().max(80).optional(),
  from: isoDateField.optional(),
  to: isoDateField.optional(),
};

// ISO days compare as strings; a reversed range is refused rather than answered with no events.
const dateRangeInOrder = (query: { from?: string; to?: string }) =>
  !query.from || !query.to || query.from <= query.to;
const dateRangeCheck = { message: AUDIT_DATE_RANGE_MESSAGE, path: ['to'] };

// GET /api/audit.csv: every matching event, no paging.
export const auditFilterSchema = z.object(auditFilterFields).refine(dateRangeInOrder, dateRangeCheck);
export type AuditFilter = z.infer<typeof auditFilterSchema>;

// GET /api/audit: the filters and one page of events, newest first.
export const auditQuerySchema = pageQuerySchema
  .extend(auditFilterFields)
  .refine(dateRangeInOrder, dateRangeCheck);
export type AuditQuery = z.infer<typeof auditQuerySchema>;

export const auditEventSchema = z.object({
  id: z.string(),
  at: z.string(),
  actorId: z.uuid().nullable(),
  actorEmail: z.string().nullable(),
  // The actor's name now (null for Keyloom itself or a refused sign-in).
  actorName: z.string().nullable(),
  action: z.string(),
  subjectType: z.string().nullable(),
  subjectId: z.string().nullable(),
  clientId: z.uuid().nullable(),
  clientPseudonym: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
  ip: z.string().nullable(),
  // The event in plain words, names instead of ids (the same words as the CSV export).
  sentence: z.string(),
});
export type AuditEventView = z.infer<typeof auditEventSchema>;

export const auditPageSchema = z.object({
  items: z.array(auditEventSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type AuditPage = z.infer<typeof auditPageSchema>;
