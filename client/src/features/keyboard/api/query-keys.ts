// Query keys of the keyboard feature, shared by its hooks so an upload refreshes every list.

/** The trials of one profile version (GET /api/profile-versions/:id/trials). */
export const trialsQueryKey = (versionId: string) => ['profile-versions', versionId, 'trials'] as const;

/** A client's practice phrases (GET /api/clients/:id/practice-phrases). */
export const practicePhrasesQueryKey = (clientId: string) =>
  ['clients', clientId, 'practice-phrases'] as const;
