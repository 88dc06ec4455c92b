import { PASSWORD_MIN_LENGTH, setPasswordSchema, type User } from '@keyloom/shared';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { FormActions } from '@/components/ui/form-actions';
import { TextField } from '@/components/ui/text-field';
import { useUpdateUser } from '../api/update-user';

type SetPasswordDialogProps = {
  /** The person who needs a new password; null keeps the dialog closed. */
  user: User | null;
  onClose: () => void;
  onDone: (user: User) => void;
};

/** "Set a new password" for a colleague who forgot theirs; it signs them out everywhere. */
export const SetPasswordDialog = ({ user, onClose, onDone }: SetPasswordDialogProps) => {
  const updateUser = useUpdateUser();
  const name = user?.name ?? '';
  return (
    <Modal
      open={user !== null}
      onClose={onClose}
      title={`Set a new password for ${name}`}
      description={`${name} is signed out on every device and signs in again with the new password. Tell them in person or by phone.`}
    >
      <Form
        schema={setPasswordSchema}
        defaultValues={{ password: '' }}
        onSubmit={async (values) => {
          if (!user) return;
          const updated = await updateUser.mutateAsync({ id: user.id, changes: values });
          onDone(updated);
        }}
        aria-label={`New password for ${name}`}
        errorSummary
      >
        {({ register, formState }) => (
          <>
            <FormServerError message={formState.errors.root?.server?.message} />
            <div className="flex flex-col gap-5">
              <TextField
                label="New password"
                type="text"
                autoComplete="new-password"
                spellCheck={false}
                hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
                registration={register('password')}
                error={formState.errors.password}
              />
              <FormActions
                submitLabel="Set password"
                busyLabel="Saving…"
                submitting={formState.isSubmitting}
                onCancel={onClose}
              />
            </div>
          </>
        )}
      </Form>
    </Modal>
  );
};
