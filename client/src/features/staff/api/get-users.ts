import { type User, userSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { userKeys } from './keys';

const usersSchema = z.array(userSchema);

/** Every staff account (admin only). */
export const getUsers = (signal?: AbortSignal): Promise<User[]> =>
  apiRequest('/users', { schema: usersSchema, signal });

export const usersQueryOptions = () =>
  queryOptions({
    queryKey: userKeys.list(),
    queryFn: ({ signal }) => getUsers(signal),
  });

export const useUsers = (options: { enabled?: boolean } = {}) =>
  useQuery({ ...usersQueryOptions(), enabled: options.enabled ?? true });
