import { type Consent, type VoidConsentInput, consentSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';

export type VoidConsentVariables = { clientId: string; consentId: string; input: VoidConsentInput };

/** Voids a record made in error: kept, struck through; what only it allowed is deleted. */
export const voidConsent = ({ clientId, consentId, input }: VoidConsentVariables): Promise<Consent> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/consents/${encodeURIComponent(consentId)}/void`, {
    method: 'POST',
    body: input,
    schema: consentSchema,
  });

export const useVoidConsent = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: voidConsent,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: queryRoots.clients }),
        queryClient.invalidateQueries({ queryKey: queryRoots.samples }),
      ]),
  });
};
