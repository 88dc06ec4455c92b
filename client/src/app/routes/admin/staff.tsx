import type { User } from '@keyloom/shared';
import { roleLabels } from '@keyloom/shared';
import { useState } from 'react';
import { PageLoading } from '@/components/layout/page-loading';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { type Announcement, LiveRegion } from '@/components/ui/live-region';
import { PageHeader } from '@/components/ui/page-header';
import { useMe } from '@/features/auth/api/get-me';
import { useUsers } from '@/features/staff/api/get-users';
import { AccountStatusDialog } from '@/features/staff/components/account-status-dialog';
import { CreateStaffDialog } from '@/features/staff/components/create-staff-dialog';
import { SetPasswordDialog } from '@/features/staff/components/set-password-dialog';
import { StaffTable } from '@/features/staff/components/staff-table';

export const StaffRoute = () => {
  const me = useMe();
  const users = useUsers();
  const [creating, setCreating] = useState(false);
  const [statusTarget, setStatusTarget] = useState<User | null>(null);
  const [passwordTarget, setPasswordTarget] = useState<User | null>(null);
  const [announcement, setAnnouncement] = useState<Announcement>(null);

  const announce = (tone: 'success' | 'error', text: string) => setAnnouncement({ tone, text });

  return (
    <>
      <PageHeader
        title="Staff"
        description="Everyone who signs in to Keyloom at the clinic: add colleagues, set their role, and switch off accounts that are no longer needed."
        actions={
          <Button variant="primary" onClick={() => setCreating(true)}>
            Add staff member
          </Button>
        }
      />
      <LiveRegion message={announcement} />

      {users.isPending && <PageLoading />}
      {users.isError && (
        <div role="alert">
          <Alert tone="error" title="The staff list could not be loaded.">
            <p>{users.error.message}</p>
            <Button className="mt-3" onClick={() => void users.refetch()}>
              Try again
            </Button>
          </Alert>
        </div>
      )}
      {users.isSuccess && users.data.length === 0 && (
        <EmptyState title="No staff accounts yet.">Accounts you add will be listed here.</EmptyState>
      )}
      {users.isSuccess && users.data.length > 0 && (
        <StaffTable
          users={users.data}
          currentUserId={me.data?.id ?? ''}
          onRoleSaved={(user) => announce('success', `${user.name} is now ${roleLabels[user.role]}.`)}
          onActionFailed={(message) => announce('error', message)}
          onToggleActive={setStatusTarget}
          onSetPassword={setPasswordTarget}
        />
      )}

      <CreateStaffDialog
        open={creating}
        onClose={() => setCreating(false)}
        onCreated={(user) => {
          setCreating(false);
          announce('success', `Added ${user.name} as ${roleLabels[user.role]}.`);
        }}
      />
      <SetPasswordDialog
        user={passwordTarget}
        onClose={() => setPasswordTarget(null)}
        onDone={(user) => {
          setPasswordTarget(null);
          announce('success', `New password set for ${user.name}. They are signed out until they use it.`);
        }}
      />
      <AccountStatusDialog
        user={statusTarget}
        onClose={() => setStatusTarget(null)}
        onDone={(user) => {
          setStatusTarget(null);
          announce('success', user.active ? `Reactivated ${user.name}.` : `Deactivated ${user.name}.`);
        }}
      />
    </>
  );
};
