import { Button } from './button';
import type { ButtonVariant } from './button-classes';

type FormActionsProps = {
  /** The submit button's words, e.g. "Create account". */
  submitLabel: string;
  /** Shown on the submit button while the request runs, e.g. "Creating…". */
  busyLabel: string;
  submitting: boolean;
  onCancel: () => void;
  /** "danger" for a submit that deletes or cannot be undone. */
  submitVariant?: ButtonVariant;
};

/** The submit and Cancel pair that ends every dialog form. */
export const FormActions = ({
  submitLabel,
  busyLabel,
  submitting,
  onCancel,
  submitVariant = 'primary',
}: FormActionsProps) => (
  <div className="flex flex-wrap gap-3 pt-2">
    <Button type="submit" variant={submitVariant} disabled={submitting}>
      {submitting ? busyLabel : submitLabel}
    </Button>
    <Button onClick={onCancel}>Cancel</Button>
  </div>
);
