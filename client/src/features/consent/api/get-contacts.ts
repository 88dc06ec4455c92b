import { type Contact, contactSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { contactKeys } from './keys';

const contactListSchema = z.array(contactSchema);

/** A client's family contacts (clinician, supervisor). */
export const getContacts = (clientId: string, signal?: AbortSignal): Promise<Contact[]> =>
  apiRequest(`/clients/${encodeURIComponent(clientId)}/contacts`, { schema: contactListSchema, signal });

export const contactsQueryOptions = (clientId: string) =>
  queryOptions({
    queryKey: contactKeys.list(clientId),
    queryFn: ({ signal }) => getContacts(clientId, signal),
  });

export const useContacts = (clientId: string) => useQuery(contactsQueryOptions(clientId));
