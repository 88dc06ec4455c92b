// The root of each resource tree in the query cache. Every feature's key factory (its
// `api/keys.ts`) starts its keys from one of these, so a feature that changes another
// feature's data can invalidate that tree without importing the other feature.
// Pattern: the query key factory of TanStack Query's "Query Keys" guide (docs/references.md §6).

export const queryRoots = {
  auth: ['auth'],
  audit: ['audit'],
  clients: ['clients'],
  clinic: ['clinic'],
  profileVersions: ['profile-versions'],
  reports: ['reports'],
  samples: ['samples'],
  summaries: ['summaries'],
  users: ['users'],
  vocabulary: ['vocabulary'],
} as const;
