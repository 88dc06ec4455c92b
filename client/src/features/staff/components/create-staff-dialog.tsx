import { createUserSchema, PASSWORD_MIN_LENGTH, roleLabels, roles, type User } from '@keyloom/shared';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { FormActions } from '@/components/ui/form-actions';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useCreateUser } from '../api/create-user';

const roleOptions = roles.map((role) => ({ value: role, label: roleLabels[role] }));

type CreateStaffDialogProps = {
  open: boolean;
  onClose: () => void;
  onCreated: (user: User) => void;
};

/** "Add staff member": name, e-mail, role and a first password the person changes later. */
export const CreateStaffDialog = ({ open, onClose, onCreated }: CreateStaffDialogProps) => {
  const createUser = useCreateUser();
  return (
    <Modal
      open={open}
      onClose={onClose}
      title="Add staff member"
      description="Give the new colleague their first password in person or by phone, never in the same e-mail as the address."
    >
      <Form
        schema={createUserSchema}
        // Least access by default: the admin raises it on purpose.
        defaultValues={{ name: '', email: '', role: 'carer', password: '' }}
        onSubmit={async (values) => {
          const user = await createUser.mutateAsync(values);
          onCreated(user);
        }}
        aria-label="New staff member"
        errorSummary
      >
        {({ register, formState }) => (
          <>
            <FormServerError message={formState.errors.root?.server?.message} />
            <div className="flex flex-col gap-5">
              <TextField
                label="Full name"
                autoComplete="off"
                registration={register('name')}
                error={formState.errors.name}
              />
              <TextField
                label="E-mail address"
                type="email"
                autoComplete="off"
                spellCheck={false}
                registration={register('email')}
                error={formState.errors.email}
              />
              <SelectField
                label="Role"
                options={roleOptions}
                hint="Carers see only the clients assigned to them."
                registration={register('role')}
                error={formState.errors.role}
              />
              <TextField
                label="First password"
                type="text"
                autoComplete="new-password"
                spellCheck={false}
                hint={`At least ${PASSWORD_MIN_LENGTH} characters. A short sentence is easier to remember than a jumble.`}
                registration={register('password')}
                error={formState.errors.password}
              />
              <FormActions
                submitLabel="Create account"
                busyLabel="Creating…"
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
