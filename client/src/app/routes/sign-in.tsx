import { Navigate, useSearchParams } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { PageHeader } from '@/components/ui/page-header';
import { paths, roleHome, safeNextPath } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { SignInForm } from '@/features/auth/components/sign-in-form';

export const SignInRoute = () => {
  const me = useMe();
  const [searchParams] = useSearchParams();

  // Signed in already, or just now: go where the reader was heading, else to the role's home.
  if (me.data?.mustChangePassword) return <Navigate to={paths.choosePassword} replace />;
  if (me.data)
    return <Navigate to={safeNextPath(searchParams.get('next')) ?? roleHome[me.data.role]} replace />;
  if (me.isPending) return <PageLoading />;

  return (
    <div className="mx-auto max-w-xl">
      <PageHeader
        title="Sign in to Keyloom"
        description="Keyloom is for clinic staff only. Families get progress summaries by e-mail and need no account."
      />
      <div className="rounded-xl border-2 border-thread bg-surface p-5 sm:p-8">
        <SignInForm />
      </div>
      <p className="mt-6 text-ink-soft">
        Forgotten your password, or locked out? Ask the clinic&rsquo;s Keyloom administrator to set a new one.
      </p>
    </div>
  );
};
