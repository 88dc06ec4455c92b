import type { User } from '@keyloom/shared';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/dialog';
import { useUpdateUser } from '../api/update-user';

type AccountStatusDialogProps = {
  /** The person whose account is switched off or on; null keeps the dialog closed. */
  user: User | null;
  onClose: () => void;
  onDone: (user: User) => void;
};

/** Asks before deactivating or reactivating an account, naming the person. */
export const AccountStatusDialog = ({ user, onClose, onDone }: AccountStatusDialogProps) => {
  const updateUser = useUpdateUser();
  const [error, setError] = useState<string | null>(null);
  const deactivating = user?.active ?? false;

  const close = () => {
    setError(null);
    updateUser.reset();
    onClose();
  };

  const confirm = async () => {
    if (!user) return;
    setError(null);
    try {
      const updated = await updateUser.mutateAsync({ id: user.id, changes: { active: !user.active } });
      onDone(updated);
    } catch (caught) {
      setError(caught instanceof Error ? caught.message : 'The change was not saved. Try again.');
    }
  };

  const name = user?.name ?? '';
  return (
    <Modal
      open={user !== null}
      onClose={close}
      title={deactivating ? `Deactivate ${name}?` : `Reactivate ${name}?`}
      description={
        deactivating
          ? `${name} will no longer be able to sign in. Their work and the audit trail stay as they are, and you can reactivate the account later.`
          : `${name} will be able to sign in again with their existing password.`
      }
    >
      <div role="alert">{error && <Alert tone="error">{error}</Alert>}</div>
      <div className="mt-4 flex flex-wrap gap-3">
        <Button
          variant={deactivating ? 'danger' : 'primary'}
          onClick={() => void confirm()}
          disabled={updateUser.isPending}
        >
          {deactivating ? `Deactivate ${name}` : `Reactivate ${name}`}
        </Button>
        {/* Start on the safe choice: Enter by habit must not switch off a colleague's account. */}
        <Button onClick={close} autoFocus>
          Cancel
        </Button>
      </div>
    </Modal>
  );
};
