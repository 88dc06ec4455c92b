import { z } from 'zod';
import { accessMethodSchema } from './clients.schema';
import { numberField, safeText } from './common';

// Settings of a profile version, with the engine's option names (ProfileSettings in
// shared/src/engine/profile/profile-settings.ts must accept exactly what this accepts).
export const escapeMethods = ['A', 'B', 'C', 'D'] as const;

/** A whole number from `min` to `max` (a number, or its digits from a form), one message for every problem. */
const wholeNumberFrom = (min: number, max: number, error: string) =>
  numberField(z.number({ error }).int({ error }).min(min, { error }).max(max, { error }));

const weightMessage = 'Enter a base-model weight from 0 to 1, or choose automatic.';

export const profileVersionSettingsSchema = z.object({
  order: wholeNumberFrom(1, 12, 'Choose a context order from 1 to 12.').default(5),
  escape: z.enum(escapeMethods, { error: 'Choose escape method A, B, C or D.' }).default('C'),
  exclusion: z.boolean().default(true),
  // 'auto' tunes the weight of the base English model on held-out text; 0 = personal alone, 1 = base alone.
  baseWeight: z
    .union([
      z.literal('auto'),
      numberField(
        z.number({ error: weightMessage }).min(0, { error: weightMessage }).max(1, { error: weightMessage }),
      ),
    ])
    .default('auto'),
  slots: wholeNumberFrom(1, 10, 'Choose 1 to 10 suggestion slots.').default(5),
  caseFold: z.boolean().default(false),
  // The access-method timings used for the estimates; the client record's by default.
  access: z.object({
    method: accessMethodSchema,
    scanIntervalMs: numberField(z.number().int().min(100).max(10_000)).optional(),
    dwellMs: numberField(z.number().int().min(100).max(5_000)).optional(),
    keyTimeMs: numberField(z.number().int().min(100).max(30_000)).optional(),
  }),
});
export type ProfileVersionSettings = z.infer<typeof profileVersionSettingsSchema>;

// POST /api/clients/:id/profile-versions: settings (access defaults to the client record's) and the
// samples to train on (default: every sample that is ready). The exact sample set is frozen with hashes.
export const createProfileVersionSchema = z.object({
  settings: profileVersionSettingsSchema.partial({ access: true }),
  sampleIds: z.array(z.uuid()).min(1, { error: 'Choose at least one sample.' }).optional(),
  note: safeText({ multiline: true }).trim().max(1000).optional(),
});
export type CreateProfileVersionInput = z.infer<typeof createProfileVersionSchema>;

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
  settings: profileVersionSettingsSchema,
  samples: z.array(
    z.object({ id: z.uuid(), title: z.string(), sha256: z.string(), characters: z.number().int() }),
  ),
  // The engine's ProfileReport (same names as `model evaluate --json`), null until trained.
  metrics: z.record(z.string(), z.unknown()).nullable(),
  modelBytes: z.number().int().nullable(),
  createdBy: z.string(),
  createdAt: z.string(),
  trainedAt: z.string().nullable(),
  history: z.array(profileVersionEventSchema),
});
export type ProfileVersion = z.infer<typeof profileVersionSchema>;
