import { type ChangePasswordInput, changePasswordSchema, PASSWORD_MIN_LENGTH } from '@keyloom/shared';
import { Button } from '@/components/ui/button';
import { Form, FormServerError } from '@/components/ui/form';
import { TextField } from '@/components/ui/text-field';
import { useChangePassword } from '../api/change-password';

type PasswordFieldSpec = {
  name: keyof ChangePasswordInput;
  label: string;
  autoComplete: string;
  hint?: string;
};

// The three password fields, in order; the new one carries the advice.
const fields = (currentLabel: string): readonly PasswordFieldSpec[] => [
  { name: 'currentPassword', label: currentLabel, autoComplete: 'current-password' },
  {
    name: 'newPassword',
    label: 'New password',
    autoComplete: 'new-password',
    hint: `At least ${PASSWORD_MIN_LENGTH} characters. Several unrelated words are easy to remember and hard to guess.`,
  },
  { name: 'confirmPassword', label: 'New password again', autoComplete: 'new-password' },
];

type ChangePasswordFormProps = {
  /** The label of the current-password field (a first sign-in calls it the temporary password). */
  currentLabel?: string;
  submitLabel: string;
  /** After the API accepted the new password. */
  onChanged: () => void;
};

/**
 * Current password and the new one twice, validated with the shared changePasswordSchema; the API
 * also refuses easily guessed passwords, and its message lands on the field it names.
 */
export const ChangePasswordForm = ({
  currentLabel = 'Current password',
  submitLabel,
  onChanged,
}: ChangePasswordFormProps) => {
  const change = useChangePassword();
  return (
    <Form
      schema={changePasswordSchema}
      defaultValues={{ currentPassword: '', newPassword: '', confirmPassword: '' }}
      onSubmit={async (values) => {
        await change.mutateAsync(values);
        onChanged();
      }}
      aria-label="Change password"
      errorSummary
    >
      {({ register, formState }) => (
        <>
          <FormServerError message={formState.errors.root?.server?.message} />
          <div className="flex flex-col gap-6">
            {fields(currentLabel).map((field) => (
              <TextField
                key={field.name}
                label={field.label}
                type="password"
                autoComplete={field.autoComplete}
                spellCheck={false}
                hint={field.hint}
                registration={register(field.name)}
                error={formState.errors[field.name]}
              />
            ))}
            <Button type="submit" variant="primary" disabled={formState.isSubmitting} className="self-start">
              {formState.isSubmitting ? 'Saving…' : submitLabel}
            </Button>
          </div>
        </>
      )}
    </Form>
  );
};
