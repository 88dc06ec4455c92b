import { type CreateUserInput, type User, userSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { userKeys } from './keys';

/** Creates a staff account (admin only); 409 when the e-mail address is taken. */
export const createUser = (input: CreateUserInput): Promise<User> =>
  apiRequest('/users', { method: 'POST', body: input, schema: userSchema });

export const useCreateUser = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  });
};
