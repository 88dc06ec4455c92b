import { Button } from './button';

type FormActionsProps = {
  /** The submit button's words, e.g. "Create account". */
  submitLabel: string;
  /** Shown on the submit button while the request runs, e.g. "Creating…". */
  busyLabel: string;
  submitting: boolean;
  onCancel: () => void;
};

/** The submit and Cancel pair that ends every dialog form. */
export const FormActions = ({ submitLabel, busyLabel, submitting, onCancel }: FormActionsProps) => (
  <div className="flex flex-wrap gap-3 pt-2">
    <Button type="submit" variant="primary" disabled={submitting}>
      {submitting ? busyLabel : submitLabel}
    </Button>
    <Button onClick={onCancel}>Cancel</Button>
  </div>
);
