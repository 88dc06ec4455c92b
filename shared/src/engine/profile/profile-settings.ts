// The settings a clinician chooses for a profile version. The types, defaults and ranges are those
// of the shared zod schema (shared/src/schemas/profile-settings.schema.ts); nothing is repeated here.
import type { AccessMethod } from '../../schemas/clients.schema';
import { profileSettingsSchema, type ProfileSettings } from '../../schemas/profile-settings.schema';
import { ProfileInputError } from './profile-errors';

export type { ProfileSettings, AccessSettings } from '../../schemas/profile-settings.schema';

/** How the client makes selections (the client record's access method). */
export type AccessMethodKind = AccessMethod;

/** The schema's defaults, with direct selection and no timings of the client's own. */
export const defaultProfileSettings: ProfileSettings = profileSettingsSchema.parse({
  access: { method: 'direct' },
});

/**
 * Checks settings against the schema and returns them as parsed (defaults filled in, digits as
 * numbers); throws ProfileInputError naming the first field out of range and the schema's message.
 */
export function checkProfileSettings(settings: unknown): ProfileSettings {
  const parsed = profileSettingsSchema.safeParse(settings);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const path = issue.path.map(String).join('.') || '(settings)';
  throw new ProfileInputError(`invalid profile settings: ${path}: ${issue.message}`);
}
