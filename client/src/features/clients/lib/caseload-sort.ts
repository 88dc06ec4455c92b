import { accessMethodLabels, type ClientSummary, type ConsentStatus } from '@keyloom/shared';
import type { SortDirection } from '@/components/ui/table';

export type CaseloadSortKey = 'pseudonym' | 'accessMethod' | 'consentStatus' | 'sampleCount' | 'updatedAt';

// Usable consent first, then the kinds that need the clinician's attention.
const consentOrder: Record<ConsentStatus, number> = { active: 0, expired: 1, withdrawn: 2, none: 3 };

const compare: Record<CaseloadSortKey, (a: ClientSummary, b: ClientSummary) => number> = {
  pseudonym: (a, b) => a.pseudonym.localeCompare(b.pseudonym, 'en'),
  accessMethod: (a, b) =>
    accessMethodLabels[a.accessMethod].localeCompare(accessMethodLabels[b.accessMethod], 'en'),
  consentStatus: (a, b) => consentOrder[a.consentStatus] - consentOrder[b.consentStatus],
  sampleCount: (a, b) => a.sampleCount - b.sampleCount,
  updatedAt: (a, b) => a.updatedAt.localeCompare(b.updatedAt),
};

/**
 * The clients in `clients` whose pseudonym contains `search` (any case), in the given order;
 * ties fall back to the pseudonym.
 */
export const filterAndSortClients = (
  clients: readonly ClientSummary[],
  search: string,
  key: CaseloadSortKey,
  direction: SortDirection,
): ClientSummary[] => {
  const needle = search.trim().toLocaleLowerCase('en');
  const sign = direction === 'ascending' ? 1 : -1;
  return clients
    .filter((client) => client.pseudonym.toLocaleLowerCase('en').includes(needle))
    .sort((a, b) => sign * compare[key](a, b) || compare.pseudonym(a, b));
};
