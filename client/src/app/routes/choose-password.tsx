import { Navigate, useNavigate } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';
import { SessionCheckFailed } from '@/features/auth/components/session-check-failed';

/**
 * Where an account that must change its password is sent after signing in (the seeded accounts
 * outside demo mode): until it does, the API answers nothing else. Afterwards, the home page.
 */
export const ChoosePasswordRoute = () => {
  const me = useMe();
  const navigate = useNavigate();

  if (me.isPending) return <PageLoading />;
  if (me.isError) return <SessionCheckFailed error={me.error} onRetry={() => void me.refetch()} />;
  if (!me.data) return <Navigate to={paths.signIn} replace />;
  if (!me.data.mustChangePassword) return <Navigate to={paths.home} replace />;

  return (
    <div className="mx-auto max-w-xl">
      <PageHeader
        title="Choose a new password"
        description="You signed in with a temporary password. Choose your own before you go on; nobody else will know it."
      />
      <div className="rounded-xl border-2 border-thread bg-surface p-5 sm:p-8">
        <ChangePasswordForm
          currentLabel="Temporary password"
          submitLabel="Save and continue"
          onChanged={() => void navigate(paths.home, { replace: true })}
        />
      </div>
    </div>
  );
};
