import type { ClientSummary, ProfileVersion, ProfileVersionStatus } from '@keyloom/shared';
import { useQueries } from '@tanstack/react-query';
import { profileVersionsQueryOptions } from './get-profile-versions';

export type QueueItem = { client: Pick<ClientSummary, 'id' | 'pseudonym'>; version: ProfileVersion };

/**
 * The versions in one status across the given clients, oldest first: the supervisor's queue
 * (signed_off) or the carer's (trained). Built from each client's version list, since the API
 * has no clinic-wide one; the page passes the client list it already has.
 */
export const useProfileQueue = (
  clients: readonly Pick<ClientSummary, 'id' | 'pseudonym'>[],
  status: ProfileVersionStatus,
) => {
  const lists = useQueries({ queries: clients.map((client) => profileVersionsQueryOptions(client.id)) });
  const items: QueueItem[] = [];
  clients.forEach((client, index) => {
    for (const version of lists[index]?.data ?? []) {
      if (version.status === status) items.push({ client, version });
    }
  });
  items.sort((a, b) => a.version.createdAt.localeCompare(b.version.createdAt));
  return {
    items,
    isPending: lists.some((list) => list.isPending),
    error: lists.find((list) => list.isError)?.error ?? null,
    refetch: () => {
      for (const list of lists) void list.refetch();
    },
  };
};
