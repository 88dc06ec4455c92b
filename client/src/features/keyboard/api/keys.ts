import { queryRoots } from '@/lib/query-keys';

/** Query keys of a profile version's trials (under the profile-versions root). */
export const trialKeys = {
  all: [...queryRoots.profileVersions, 'trials'] as const,
  list: (versionId: string) => [...trialKeys.all, versionId] as const,
};

/** Query keys of a client's practice phrases (under the clients root). */
export const practicePhraseKeys = {
  all: [...queryRoots.clients, 'practice-phrases'] as const,
  list: (clientId: string) => [...practicePhraseKeys.all, clientId] as const,
};
