import { type Consent, type CreateConsentInput, consentSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { queryRoots } from '@/lib/query-keys';

export type CreateConsentVariables = { clientId: string; input: CreateConsentInput };

/** Records a consent for a client (owning clinician). */
export const createConsent = ({ clientId, input }: CreateConsentVariables): Promise<Consent> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/consents`, {
    method: 'POST',
    body: input,
    schema: consentSchema,
  });

export const useCreateConsent = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createConsent,
    // The client's consent status and the caseload row change with it.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryRoots.clients }),
  });
};
