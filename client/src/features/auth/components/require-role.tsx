import type { Role } from '@keyloom/shared';
import type { ReactNode } from 'react';
import { Navigate, Outlet, useLocation, useNavigation } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { paths, signInPath } from '@/config/paths';
import { useMe } from '../api/get-me';
import { NotAllowed } from './not-allowed';
import { SessionCheckFailed } from './session-check-failed';

type RequireRoleProps = {
  /** The roles that may see the page. */
  roles: readonly Role[];
  /** The page; without it, the nested route's page (<Outlet />). */
  children?: ReactNode;
};

/**
 * Guards a page by role: no session → the sign-in page (coming back here afterwards);
 * a password change due → "Choose a new password"; a role not listed → the "not allowed" page.
 * The API enforces the same rules.
 */
export const RequireRole = ({ roles, children }: RequireRoleProps) => {
  const me = useMe();
  const location = useLocation();
  const navigation = useNavigation();

  if (me.isPending) return <PageLoading />;
  if (me.isError) return <SessionCheckFailed error={me.error} onRetry={() => void me.refetch()} />;
  if (!me.data) {
    // A navigation already under way (e.g. sign-out heading to /sign-in) decides where we go.
    if (navigation.state !== 'idle') return <PageLoading />;
    return <Navigate to={signInPath(`${location.pathname}${location.search}`)} replace />;
  }
  // Until a due password change is done, the API answers nothing else: go and choose one.
  if (me.data.mustChangePassword) return <Navigate to={paths.choosePassword} replace />;
  if (!roles.includes(me.data.role)) return <NotAllowed />;
  return children ?? <Outlet />;
};
