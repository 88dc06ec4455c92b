import type { ProfileVersion, ProfileVersionStatus } from '@keyloom/shared';

// Versions whose model the API serves (the test keyboard can run them).
const withModel = new Set<ProfileVersionStatus>(['trained', 'signed_off', 'active', 'retired', 'sent_back']);
// Versions that take new trials (the API refuses the others with 409).
const trialable = new Set<ProfileVersionStatus>(['trained', 'signed_off', 'active']);

/** Whether the version has a model the test keyboard can run. */
export const hasModel = (version: Pick<ProfileVersion, 'status'>): boolean => withModel.has(version.status);

/** Whether trials of the version can still be logged. */
export const takesTrials = (version: Pick<ProfileVersion, 'status'>): boolean =>
  trialable.has(version.status);

/**
 * The version the keyboard opens by default: the client's active version, else the newest trained
 * or signed-off candidate, else the newest with a model; null when none has a model.
 * @param versions the client's versions, newest first (as the API sends them)
 */
export const defaultKeyboardVersion = <T extends Pick<ProfileVersion, 'status'>>(
  versions: readonly T[],
): T | null =>
  versions.find((v) => v.status === 'active') ??
  versions.find((v) => v.status === 'trained' || v.status === 'signed_off') ??
  versions.find(hasModel) ??
  null;
