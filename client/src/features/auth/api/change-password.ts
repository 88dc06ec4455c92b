import { type ChangePasswordInput, type SessionUser, sessionUserSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { authKeys } from './keys';

export const changePassword = (input: ChangePasswordInput): Promise<SessionUser> =>
  apiRequest('/auth/password', { method: 'POST', body: input, schema: sessionUserSchema });

/** POST /api/auth/password; the session stays, and "who am I" no longer asks for a new password. */
export const useChangePassword = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changePassword,
    onSuccess: (user) => {
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
};
