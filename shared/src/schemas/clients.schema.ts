import { z } from 'zod';
import { numberField, optionalText, safeText } from './common';

// How the client selects: the timing field that matters follows from it.
export const accessMethods = ['direct', 'switch', 'eye_gaze', 'head_pointer', 'other'] as const;
export const accessMethodSchema = z.enum(accessMethods);
export type AccessMethod = z.infer<typeof accessMethodSchema>;

export const accessMethodLabels: Record<AccessMethod, string> = {
  direct: 'Direct touch or pointer',
  switch: 'Switch scanning',
  eye_gaze: 'Eye gaze with dwell',
  head_pointer: 'Head pointer',
  other: 'Other',
};

/** The timing fields of an access method. */
export type AccessTimingField = 'scanIntervalMs' | 'dwellMs' | 'keyTimeMs';

/**
 * Which timings each access method uses, the one the client record keeps first: scanning steps for
 * a switch, dwell for eye gaze, time per key otherwise. "Other" may be timed any way for a profile
 * version's estimate (the engine prefers time per key, then scanning, then dwell).
 */
export const accessTimingFields: Record<AccessMethod, readonly [AccessTimingField, ...AccessTimingField[]]> =
  {
    direct: ['keyTimeMs'],
    switch: ['scanIntervalMs'],
    eye_gaze: ['dwellMs'],
    head_pointer: ['keyTimeMs'],
    other: ['keyTimeMs', 'scanIntervalMs', 'dwellMs'],
  };

/** What each timing field is called on forms. */
export const accessTimingLabels: Record<AccessTimingField, string> = {
  scanIntervalMs: 'Scan interval (ms)',
  dwellMs: 'Dwell time (ms)',
  keyTimeMs: 'Time per key (ms)',
};

// Starting values when the clinician has not measured the client's own timing yet
// (common practice, no source: scan 0.5–2 s per step, gaze dwell 0.45–1 s; see docs/references.md §3).
export const defaultAccessTiming = { scanIntervalMs: 1000, dwellMs: 800, keyTimeMs: 1500 } as const;

const msField = (min: number, max: number, what: string) =>
  numberField(
    z
      .number({ error: `Enter the ${what} in milliseconds.` })
      .int({ error: `Enter the ${what} as a whole number of milliseconds.` })
      .min(min, { error: `The ${what} must be at least ${min} ms.` })
      .max(max, { error: `The ${what} must be at most ${max} ms.` }),
  )
    .nullable()
    .optional();

const clientFields = {
  pseudonym: safeText({ error: 'Enter a pseudonym.' })
    .trim()
    .min(1, { error: 'Enter a pseudonym.' })
    .max(80, { error: 'Keep the pseudonym under 80 characters.' }),
  // What the family calls the client, for progress e-mails to them; the app keeps using the pseudonym.
  preferredName: optionalText(80, 'Keep the preferred name under 80 characters.', { multiline: false }),
  accessMethod: accessMethodSchema,
  // Time between scan steps (switch scanning).
  scanIntervalMs: msField(100, 10_000, 'scan interval'),
  // Time the gaze must rest on a target (eye gaze).
  dwellMs: msField(100, 5_000, 'dwell time'),
  // Average time to reach and press one key (direct touch, head pointer, other).
  keyTimeMs: msField(100, 30_000, 'time per key'),
  goals: optionalText(4000, 'Keep the goals under 4000 characters.'),
  notes: optionalText(4000, 'Keep the notes under 4000 characters.'),
};

// POST /api/clients (clinician: the client joins their own caseload).
export const createClientSchema = z.object(clientFields);
export type CreateClientInput = z.infer<typeof createClientSchema>;

// PATCH /api/clients/:id (owning clinician).
export const updateClientSchema = z
  .object(clientFields)
  .partial()
  .refine((value) => Object.keys(value).length > 0, { error: 'Nothing to change.' });
export type UpdateClientInput = z.infer<typeof updateClientSchema>;

// Where consent stands for a client, from its consent records.
export const consentStatuses = ['none', 'active', 'expired', 'withdrawn'] as const;
export const consentStatusSchema = z.enum(consentStatuses);
export type ConsentStatus = z.infer<typeof consentStatusSchema>;

export const personRefSchema = z.object({ id: z.uuid(), name: z.string() });
export type PersonRef = z.infer<typeof personRefSchema>;

// A row of the caseload table (GET /api/clients). Admins get these rows too
// (to assign carers) but never goals, notes, consent documents or samples.
export const clientSummarySchema = z.object({
  id: z.uuid(),
  pseudonym: z.string(),
  accessMethod: accessMethodSchema,
  clinician: personRefSchema,
  carers: z.array(personRefSchema),
  consentStatus: consentStatusSchema,
  trainingConsent: z.boolean(),
  summariesConsent: z.boolean(),
  sampleCount: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ClientSummary = z.infer<typeof clientSummarySchema>;

// GET /api/clients/:id — the client page. preferredName is null for carers (like contacts, a name
// the family uses is not theirs to see).
export const clientSchema = clientSummarySchema.extend({
  preferredName: z.string().nullable(),
  scanIntervalMs: z.number().int().nullable(),
  dwellMs: z.number().int().nullable(),
  keyTimeMs: z.number().int().nullable(),
  goals: z.string().nullable(),
  notes: z.string().nullable(),
});
export type Client = z.infer<typeof clientSchema>;

// POST /api/clients/:id/assignments (clinician who owns the client, or admin): a carer.
export const createAssignmentSchema = z.object({ userId: z.uuid({ error: 'Choose a carer.' }) });
export type CreateAssignmentInput = z.infer<typeof createAssignmentSchema>;

export const assignmentSchema = z.object({
  userId: z.uuid(),
  name: z.string(),
  email: z.string(),
  assignedAt: z.string(),
  assignedBy: z.string(),
});
export type Assignment = z.infer<typeof assignmentSchema>;
