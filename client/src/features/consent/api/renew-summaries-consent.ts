import { type Contact, type RenewSummariesConsentInput, contactSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { contactKeys } from './keys';

export type RenewSummariesConsentVariables = {
  clientId: string;
  contactId: string;
  input: RenewSummariesConsentInput;
};

/** Records the family's new consent to summaries after a stop: summaries go to the address again. */
export const renewSummariesConsent = ({
  clientId,
  contactId,
  input,
}: RenewSummariesConsentVariables): Promise<Contact> =>
  apiRequest(
    `/clients/${encodeURIComponent(clientId)}/contacts/${encodeURIComponent(contactId)}/summaries-consent`,
    { method: 'POST', body: input, schema: contactSchema },
  );

export const useRenewSummariesConsent = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: renewSummariesConsent,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: contactKeys.all }),
  });
};
