import { lazy, Suspense } from 'react';
import { Outlet } from 'react-router-dom';
import { AppShell } from '@/components/layout/app-shell';
import { MainNav } from '@/components/layout/main-nav';
import { roleNavigation } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';

// The menu brings Headless UI and its positioning code: load it only once someone signs in.
const UserMenu = lazy(async () => ({
  default: (await import('@/features/auth/components/user-menu')).UserMenu,
}));

/** Every page sits in the shell; navigation and the user menu appear once someone is signed in. */
export const RootLayout = () => {
  const { data: user } = useMe();
  return (
    <AppShell
      navigation={user ? <MainNav items={roleNavigation[user.role]} /> : undefined}
      userMenu={
        user ? (
          <Suspense
            fallback={<span className="inline-flex min-h-11 items-center font-bold">{user.name}</span>}
          >
            <UserMenu user={user} />
          </Suspense>
        ) : undefined
      }
    >
      <Outlet />
    </AppShell>
  );
};
