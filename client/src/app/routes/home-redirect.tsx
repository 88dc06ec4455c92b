import { Navigate } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { paths, roleHome } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { SessionCheckFailed } from '@/features/auth/components/session-check-failed';

/** "/" has no page of its own: each role has a home. */
export const HomeRedirect = () => {
  const me = useMe();
  if (me.isPending) return <PageLoading />;
  if (me.isError) return <SessionCheckFailed error={me.error} onRetry={() => void me.refetch()} />;
  if (me.data?.mustChangePassword) return <Navigate to={paths.choosePassword} replace />;
  return <Navigate to={me.data ? roleHome[me.data.role] : paths.signIn} replace />;
};
