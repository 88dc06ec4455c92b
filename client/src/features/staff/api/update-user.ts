import { type UpdateUserInput, type User, userSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { userKeys } from './keys';

export type UpdateUserVariables = { id: string; changes: UpdateUserInput };

/** Changes a staff account's name, role or active flag (admin only). */
export const updateUser = ({ id, changes }: UpdateUserVariables): Promise<User> =>
  apiRequest(`/users/${encodeURIComponent(id)}`, { method: 'PATCH', body: changes, schema: userSchema });

export const useUpdateUser = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: userKeys.all }),
  });
};
