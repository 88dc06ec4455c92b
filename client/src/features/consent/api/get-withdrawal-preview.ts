import { type WithdrawalPreview, withdrawalPreviewSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { consentKeys } from './keys';

/** What withdrawing the consent would delete now, and which other consents keep a scope covered. */
export const getWithdrawalPreview = (
  clientId: string,
  consentId: string,
  signal?: AbortSignal,
): Promise<WithdrawalPreview> =>
  apiRequest(
    `/clients/${encodeURIComponent(clientId)}/consents/${encodeURIComponent(consentId)}/withdrawal-preview`,
    { schema: withdrawalPreviewSchema, signal },
  );

export const withdrawalPreviewQueryOptions = (clientId: string, consentId: string) =>
  queryOptions({
    queryKey: consentKeys.withdrawalPreview(clientId, consentId),
    queryFn: ({ signal }) => getWithdrawalPreview(clientId, consentId, signal),
    // Always asked afresh when the dialog opens: the counts must be those of now.
    staleTime: 0,
    gcTime: 0,
  });

/** The preview of `consentId`; no request while it is null (dialog closed). */
export const useWithdrawalPreview = (clientId: string, consentId: string | null) =>
  useQuery({
    ...withdrawalPreviewQueryOptions(clientId, consentId ?? ''),
    enabled: consentId !== null,
  });
