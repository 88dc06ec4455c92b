import { type Contact, contactSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

const contactListSchema = z.array(contactSchema);

/** A client's family contacts (clinician, supervisor). */
export const getContacts = (clientId: string, signal?: AbortSignal): Promise<Contact[]> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/contacts`, { schema: contactListSchema, signal });

export const contactsQueryOptions = (clientId: string) =>
  queryOptions({
    queryKey: ['clients', 'contacts', clientId],
    queryFn: ({ signal }) => getContacts(clientId, signal),
  });

export const useContacts = (clientId: string) => useQuery(contactsQueryOptions(clientId));
