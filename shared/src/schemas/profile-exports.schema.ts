import { z } from 'zod';

// The answer of POST /api/profile-exports/verify for a readable .klprofile file. Two separate
// findings: whether the file is damaged (layout, CRC-32, the model loads; a damaged file is answered
// 400 with what is wrong) and whether this clinic made it and it is unchanged since (the file's
// HMAC-SHA-256 signature under this installation's export key). `valid` is both together.

/** Who made the file, as far as the signature tells. */
export const profileFileAuthenticities = ['this-clinic', 'unsigned', 'other'] as const;
export const profileFileAuthenticitySchema = z.enum(profileFileAuthenticities);
export type ProfileFileAuthenticity = z.infer<typeof profileFileAuthenticitySchema>;

/** The authenticity line in plain words. */
export const profileFileAuthenticityLabels: Record<ProfileFileAuthenticity, string> = {
  'this-clinic': 'Made by this clinic and unchanged since it was exported.',
  unsigned:
    'Not signed by this clinic: the file carries no signature (older exports have none), so nothing ' +
    'shows who made it or whether its details were changed.',
  other:
    'Not signed by this clinic: the signature does not match. The file was changed after it was ' +
    'exported, or another Keyloom installation made it. Do not rely on its details.',
};

/** The damage line of a file that reads correctly. */
export const PROFILE_FILE_INTACT_TEXT =
  'Not damaged: the layout and the checksum are right, and the model inside loads.';

export const profileFileCheckSchema = z.object({
  /** Not damaged and made by this clinic. */
  valid: z.boolean(),
  intact: z.literal(true),
  authenticity: profileFileAuthenticitySchema,
  fileName: z.string().nullable(),
  bytes: z.number().int().nonnegative(),
  checksum: z.string(),
  modelBytes: z.number().int().nonnegative(),
  modelOrder: z.number().int().nonnegative(),
  modelContexts: z.number().int().nonnegative(),
  /** Words in the client's vocabulary carried by the file (0 in files made before the word-aware list). */
  vocabularyWords: z.number().int().nonnegative(),
  /** The file's own header, as written (free-form JSON). */
  header: z.record(z.string(), z.unknown()),
});
export type ProfileFileCheck = z.infer<typeof profileFileCheckSchema>;
