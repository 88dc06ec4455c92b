import { z } from 'zod';
import { safeText } from './common';
import { profileSettingsSchema } from './profile-settings.schema';
import { clientVocabularySchema } from './vocabulary.schema';

// POST /api/clients/:id/profile-versions: settings (access defaults to the client record's; the added
// and blocked words to the client's current list) and the samples to train on (default: every sample
// that is ready). The exact sample set and word list are frozen with the version. `baseOnly: true`
// makes a base-only version instead: general English alone, no samples (for a client with too
// little writing); it is trained, tried, signed off and approved like any other.
export const createProfileVersionSchema = z.object({
  settings: profileSettingsSchema
    .omit({ vocabulary: true })
    .partial({ access: true })
    .extend({ vocabulary: clientVocabularySchema.optional() }),
  sampleIds: z.array(z.uuid()).min(1, { error: 'Choose at least one sample.' }).optional(),
  note: safeText({ multiline: true }).trim().max(1000).optional(),
  baseOnly: z.boolean().optional(),
});
export type CreateProfileVersionInput = z.infer<typeof createProfileVersionSchema>;

// PATCH /api/profile-versions/:id (drafts only): the fields the create takes, each optional; a field
// that is sent replaces what the draft holds (settings and samples are frozen again, as at creation).
// Whether a version is base-only is fixed when it is created.
export const updateProfileVersionSchema = createProfileVersionSchema
  .omit({ baseOnly: true })
  .partial({ settings: true });
export type UpdateProfileVersionInput = z.infer<typeof updateProfileVersionSchema>;

export const profileVersionStatuses = [
  'draft',
  'training',
  'trained',
  'failed',
  'signed_off',
  'active',
  'retired',
  'sent_back',
] as const;
export const profileVersionStatusSchema = z.enum(profileVersionStatuses);
export type ProfileVersionStatus = z.infer<typeof profileVersionStatusSchema>;

export const profileVersionStatusLabels: Record<ProfileVersionStatus, string> = {
  draft: 'Draft',
  training: 'Training',
  trained: 'Ready for trial',
  failed: 'Failed',
  signed_off: 'Signed off by carer',
  active: 'Active profile',
  retired: 'Retired',
  sent_back: 'Sent back',
};

export const profileStages = [
  'queued',
  'interrupted',
  'preparing',
  'training',
  'cross-validating',
  'simulating',
  'saving',
] as const;

// POST /api/profile-versions/:id/sign-off and /approve take a comment; /send-back a reason.
const requiredText = (message: string) =>
  safeText({ error: message, multiline: true }).trim().min(1, { error: message }).max(2000);
export const signOffSchema = z.object({ comment: requiredText('Add a comment about the trial.') });
export const approveSchema = z.object({ comment: requiredText('Add a comment for the record.') });
export const sendBackSchema = z.object({ reason: requiredText('Say what needs to change.') });
export type SignOffInput = z.infer<typeof signOffSchema>;
export type ApproveInput = z.infer<typeof approveSchema>;
export type SendBackInput = z.infer<typeof sendBackSchema>;
// POST /api/profile-versions/:id/retire: why the active version is taken out of use.
export const retireSchema = z.object({ reason: requiredText('Say why this version is retired.') });
export type RetireInput = z.infer<typeof retireSchema>;

// A step of the version's history: who moved it, when, and what they said.
export const profileVersionEventSchema = z.object({
  status: profileVersionStatusSchema,
  at: z.string(),
  by: z.string().nullable(),
  comment: z.string().nullable(),
});

export const profileVersionSchema = z.object({
  id: z.uuid(),
  clientId: z.uuid(),
  // 1, 2, 3… per client.
  number: z.number().int(),
  note: z.string().nullable(),
  status: profileVersionStatusSchema,
  // 0..1 while training; the stage names the step.
  progress: z.number(),
  stage: z.string().nullable(),
  error: z.string().nullable(),
  settings: profileSettingsSchema,
  samples: z.array(
    z.object({ id: z.uuid(), title: z.string(), sha256: z.string(), characters: z.number().int() }),
  ),
  // General English alone, no personal writing (no samples; metrics stay null: nothing of the
  // client's is held out to measure it on, so the trial on the test keyboard measures it).
  baseOnly: z.boolean(),
  // The engine's report (profileReportSchema, same names as `model evaluate --json`), null until
  // trained. Kept open here so one report that does not parse does not hide the version: the
  // client reads it with profileReportSchema and shows "no results" when it does not parse.
  metrics: z.record(z.string(), z.unknown()).nullable(),
  modelBytes: z.number().int().nullable(),
  createdBy: z.string(),
  createdAt: z.string(),
  trainedAt: z.string().nullable(),
  history: z.array(profileVersionEventSchema),
  // λ, the base model's weight the trained profile blends with (settings.baseWeight resolved), and
  // the SHA-256 (hex) of the base model it was trained beside; null until trained.
  baseWeight: z.number().nullable(),
  baseModelSha256: z.string().nullable(),
  // Who signed off after the trial and who approved it (name, time, comment), and the send-back reason.
  signedOffBy: z.string().nullable(),
  signedOffAt: z.string().nullable(),
  signOffComment: z.string().nullable(),
  approvedBy: z.string().nullable(),
  approvedAt: z.string().nullable(),
  approvalComment: z.string().nullable(),
  sentBackReason: z.string().nullable(),
  // Who retired the active version by hand, when and why (null when it was replaced by an approval).
  retiredBy: z.string().nullable(),
  retiredAt: z.string().nullable(),
  retireReason: z.string().nullable(),
});
export type ProfileVersion = z.infer<typeof profileVersionSchema>;
