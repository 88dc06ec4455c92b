import { type LoginInput, type SessionUser, sessionUserSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest, resetCsrfToken } from '@/lib/api-client';
import { authKeys } from './keys';

export const login = (input: LoginInput): Promise<SessionUser> =>
  apiRequest('/auth/login', { method: 'POST', body: input, schema: sessionUserSchema });

export const useLogin = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (user) => {
      // The API regenerated the session: the old token is void, and nothing cached for a
      // previous user may leak into this one's screens.
      resetCsrfToken();
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
};
