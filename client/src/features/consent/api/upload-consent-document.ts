import { type Consent, consentSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { consentKeys } from './keys';

export type ConsentDocumentVariables = { clientId: string; consentId: string; file: File };

/** The path of a consent's scanned form (PUT to replace, GET to download). */
export const consentDocumentPath = (clientId: string, consentId: string): string =>
  `/clients/${encodeURIComponent(clientId)}/consents/${encodeURIComponent(consentId)}/document`;

/** Attaches the scanned consent form (PDF, PNG or JPEG, at most 10 MB). */
export const uploadConsentDocument = ({
  clientId,
  consentId,
  file,
}: ConsentDocumentVariables): Promise<Consent> => {
  const body = new FormData();
  body.append('file', file);
  return apiRequest(consentDocumentPath(clientId, consentId), { method: 'PUT', body, schema: consentSchema });
};

export const useUploadConsentDocument = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadConsentDocument,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: consentKeys.all }),
  });
};
