import { z } from 'zod';
import { isoDateField, optionalText, safeText } from './common';

// Where a language sample came from.
export const sourceKinds = ['messages', 'diary', 'email', 'transcript', 'other'] as const;
export const sourceKindSchema = z.enum(sourceKinds, { error: 'Choose where the text came from.' });
export type SourceKind = z.infer<typeof sourceKindSchema>;

export const sourceKindLabels: Record<SourceKind, string> = {
  messages: 'Messages',
  diary: 'Diary',
  email: 'E-mail',
  transcript: 'Conversation transcript',
  other: 'Other',
};

// Limits (defaults; the API's env can change them): per file, per client, per upload.
export const sampleLimits = {
  maxFileBytes: 20 * 1024 * 1024,
  maxClientBytes: 200 * 1024 * 1024,
  maxFiles: 50,
};

/** Largest pasted text, in UTF-8 bytes (longer text is uploaded as a file). */
export const PASTE_MAX_BYTES = 100 * 1024;

/** UTF-8 length of a string whose surrogates are paired (safeText checks that first). */
function utf8Length(text: string): number {
  let bytes = 0;
  for (const char of text) {
    const code = char.codePointAt(0) ?? 0;
    bytes += code < 0x80 ? 1 : code < 0x800 ? 2 : code < 0x10000 ? 3 : 4;
  }
  return bytes;
}

const sampleMetaFields = {
  sourceKind: sourceKindSchema,
  periodStart: isoDateField.nullable().optional(),
  periodEnd: isoDateField.nullable().optional(),
  note: optionalText(2000, 'Keep the note under 2000 characters.'),
};

const periodInOrder = (value: { periodStart?: string | null; periodEnd?: string | null }) =>
  !value.periodStart || !value.periodEnd || value.periodStart <= value.periodEnd;
const periodIssue = { error: 'The period must end on or after its start.', path: ['periodEnd'] };

// The text fields that go with a multipart upload (field `files`). For CSV files,
// `csvColumn` names the column that holds the text (header name).
export const uploadSamplesFieldsSchema = z
  .object({
    ...sampleMetaFields,
    csvColumn: optionalText(200, 'That column name is too long.', { multiline: false }),
  })
  .refine(periodInOrder, periodIssue);
export type UploadSamplesFields = z.infer<typeof uploadSamplesFieldsSchema>;

// POST /api/clients/:id/samples with a JSON body: pasted text.
export const pasteSampleSchema = z
  .object({
    ...sampleMetaFields,
    title: safeText({ error: 'Give the sample a title.' })
      .trim()
      .min(1, { error: 'Give the sample a title.' })
      .max(120),
    text: safeText({ error: 'Paste some text.', multiline: true })
      .refine((text) => text.trim().length > 0, { error: 'Paste some text.' })
      .refine((text) => utf8Length(text) <= PASTE_MAX_BYTES, {
        error: `Pasted text is limited to ${PASTE_MAX_BYTES / 1024} kB; upload longer text as a file.`,
      }),
  })
  .refine(periodInOrder, periodIssue);
export type PasteSampleInput = z.infer<typeof pasteSampleSchema>;

/**
 * Why a sample cannot be deleted once versions have trained on it: "Version 3 was trained on it" /
 * "Versions 2 and 3 were trained on it", and what to do instead. The API's 409 and the sample page
 * say the same.
 */
export function trainedOnMessage(numbers: readonly number[]): string {
  const list =
    numbers.length === 1
      ? `Version ${numbers[0]} was`
      : `Versions ${numbers.slice(0, -1).join(', ')} and ${numbers[numbers.length - 1]} were`;
  return `${list} trained on it: leave it out of future versions instead.`;
}

// Likely personal data that should not reach a model.
export const personalDataKinds = [
  'email',
  'phone',
  'street_address',
  'postcode',
  'date_of_birth',
  'long_digits',
  'url',
] as const;
export const personalDataKindSchema = z.enum(personalDataKinds);
export type PersonalDataKind = z.infer<typeof personalDataKindSchema>;

export const personalDataKindLabels: Record<PersonalDataKind, string> = {
  email: 'E-mail address',
  phone: 'Phone number',
  street_address: 'Street address',
  postcode: 'Postcode or ZIP code',
  date_of_birth: 'Date of birth',
  long_digits: 'Long number (identity or card)',
  url: 'Web address',
};

// Keyloom's placeholder for redacted text: a word-like token in double angle
// quotation marks that no one types, so models learn it as one unit and the
// trainer can drop it. "⟪phone⟫", "⟪email⟫", …
export const redactionToken = (kind: PersonalDataKind): string => `⟪${kind.replace('_', '-')}⟫`;

export const flagStatuses = ['open', 'redacted', 'kept'] as const;
export type FlagStatus = (typeof flagStatuses)[number];

export const sampleFlagSchema = z.object({
  id: z.uuid(),
  kind: personalDataKindSchema,
  // Code-unit offsets into the sample's current text.
  start: z.number().int(),
  end: z.number().int(),
  // The matched text while the flag is open or kept; null once redacted (it is gone).
  text: z.string().nullable(),
  status: z.enum(flagStatuses),
  reason: z.string().nullable(),
  decidedBy: z.string().nullable(),
  decidedAt: z.string().nullable(),
});
export type SampleFlag = z.infer<typeof sampleFlagSchema>;

// POST /api/samples/:id/flags/:flagId. Keeping needs a reason.
export const flagDecisionSchema = z
  .object({
    action: z.enum(['redact', 'keep'], { error: 'Choose redact or keep.' }),
    reason: optionalText(500, 'Keep the reason under 500 characters.'),
  })
  .refine((value) => value.action === 'redact' || Boolean(value.reason), {
    error: 'Say why this stays in the text.',
    path: ['reason'],
  });
export type FlagDecisionInput = z.infer<typeof flagDecisionSchema>;

// POST /api/samples/:id/exclude.
export const excludeSampleSchema = z.object({
  reason: safeText({ error: 'Say why the sample is left out.', multiline: true })
    .trim()
    .min(1, { error: 'Say why the sample is left out.' })
    .max(500),
});
export type ExcludeSampleInput = z.infer<typeof excludeSampleSchema>;

// DELETE /api/samples/:id: a sample uploaded by mistake (say, to the wrong client) is deleted for good.
export const deleteSampleSchema = z.object({
  reason: safeText({ error: 'Say why the sample is deleted.', multiline: true })
    .trim()
    .min(1, { error: 'Say why the sample is deleted.' })
    .max(500),
});
export type DeleteSampleInput = z.infer<typeof deleteSampleSchema>;

// needs_review: open flags remain; ready: usable for training; excluded: left out for good.
export const sampleStatuses = ['needs_review', 'ready', 'excluded'] as const;
export type SampleStatus = (typeof sampleStatuses)[number];

export const wordCountSchema = z.object({ word: z.string(), count: z.number().int() });

export const sampleSummarySchema = z.object({
  id: z.uuid(),
  clientId: z.uuid(),
  title: z.string(),
  fileName: z.string().nullable(),
  sourceKind: sourceKindSchema,
  periodStart: z.string().nullable(),
  periodEnd: z.string().nullable(),
  note: z.string().nullable(),
  status: z.enum(sampleStatuses),
  excludedReason: z.string().nullable(),
  // "utf-8", "utf-8 with BOM", "utf-16le", "utf-16be", or "pasted".
  encoding: z.string(),
  // SHA-256 (hex) of the original bytes as uploaded (or of the pasted text in UTF-8).
  sha256: z.string(),
  byteSize: z.number().int(),
  characters: z.number().int(),
  words: z.number().int(),
  distinctWords: z.number().int(),
  openFlags: z.number().int(),
  uploadedBy: z.string(),
  createdAt: z.string(),
});
export type SampleSummary = z.infer<typeof sampleSummarySchema>;

// GET /api/samples/:id: statistics, the current (redacted) text and its flags.
export const sampleDetailSchema = sampleSummarySchema.extend({
  text: z.string(),
  topWords: z.array(wordCountSchema),
  // Words the base English lexicon does not know: the client's own names, places, hobbies.
  unknownWords: z.array(wordCountSchema),
  flags: z.array(sampleFlagSchema),
});
export type SampleDetail = z.infer<typeof sampleDetailSchema>;

// What a multipart upload answers: the stored samples, and files refused or already present.
export const uploadResultSchema = z.object({
  samples: z.array(sampleSummarySchema),
  duplicates: z.array(z.object({ fileName: z.string(), existingSampleId: z.uuid(), message: z.string() })),
});
export type UploadResult = z.infer<typeof uploadResultSchema>;
