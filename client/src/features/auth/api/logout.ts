import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { apiRequest, resetCsrfToken } from '@/lib/api-client';
import { authKeys } from './keys';

export const logout = (): Promise<void> => apiRequest<void>('/auth/logout', { method: 'POST' });

export const useLogout = () => {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: logout,
    onSuccess: async () => {
      resetCsrfToken();
      // Drop every cached answer (they may hold client data), then leave for the sign-in page.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), null);
      // flushSync commits the pending navigation at once, so the page guards see it and do not
      // send the reader to sign in with a `next` back to the page they just left.
      await navigate(paths.signIn, { replace: true, flushSync: true });
    },
  });
};
