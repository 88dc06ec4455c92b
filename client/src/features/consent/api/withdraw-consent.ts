import { type Consent, type WithdrawConsentInput, consentSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';

export type WithdrawConsentVariables = { clientId: string; consentId: string; input: WithdrawConsentInput };

/** Records a withdrawal: the API deletes the client's samples and what was derived from them. */
export const withdrawConsent = ({ clientId, consentId, input }: WithdrawConsentVariables): Promise<Consent> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/consents/${encodeURIComponent(consentId)}/withdraw`, {
    method: 'POST',
    body: input,
    schema: consentSchema,
  });

export const useWithdrawConsent = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: withdrawConsent,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: queryRoots.clients }),
        queryClient.invalidateQueries({ queryKey: queryRoots.samples }),
      ]),
  });
};
