import {
  accessMethodLabels,
  accessMethods,
  type Client,
  createClientSchema,
  defaultAccessTiming,
} from '@keyloom/shared';
import type { FieldError } from 'react-hook-form';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { FormActions } from '@/components/ui/form-actions';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';
import { useCreateClient } from '../api/create-client';
import { useUpdateClient } from '../api/update-client';
import { keepMatchingTiming, timingFor } from '../lib/access-timing';

const methodOptions = accessMethods.map((method) => ({ value: method, label: accessMethodLabels[method] }));

type ClientFormDialogProps = {
  open: boolean;
  /** The client being edited; absent to open a new one. */
  client?: Client;
  onClose: () => void;
  onSaved: (client: Client) => void;
};

/** "New client" or "Edit client": pseudonym, access method and its timing, goals, notes. */
export const ClientFormDialog = ({ open, client, onClose, onSaved }: ClientFormDialogProps) => {
  const createClient = useCreateClient();
  const updateClient = useUpdateClient();
  const title = client ? `Edit ${client.pseudonym}` : 'New client';
  return (
    <Modal
      open={open}
      onClose={onClose}
      title={title}
      description="Use a pseudonym, never the client’s full name. You can change every field later."
    >
      <Form
        schema={createClientSchema}
        defaultValues={{
          pseudonym: client?.pseudonym ?? '',
          preferredName: client?.preferredName ?? '',
          accessMethod: client?.accessMethod ?? 'direct',
          scanIntervalMs: client?.scanIntervalMs ?? defaultAccessTiming.scanIntervalMs,
          dwellMs: client?.dwellMs ?? defaultAccessTiming.dwellMs,
          keyTimeMs: client?.keyTimeMs ?? defaultAccessTiming.keyTimeMs,
          goals: client?.goals ?? '',
          notes: client?.notes ?? '',
        }}
        // The timing fields of the methods not chosen are hidden: they are cleared before the check,
        // so a leftover value there can never block the submit.
        prepare={keepMatchingTiming}
        errorSummary
        onSubmit={async (values) => {
          const body = keepMatchingTiming(values);
          const saved = client
            ? await updateClient.mutateAsync({ clientId: client.id, changes: body })
            : await createClient.mutateAsync(body);
          onSaved(saved);
        }}
        aria-label={title}
      >
        {({ register, formState, watch }) => {
          const timing = timingFor[watch('accessMethod')];
          return (
            <>
              <FormServerError message={formState.errors.root?.server?.message} />
              <div className="flex flex-col gap-5">
                <TextField
                  label="Pseudonym"
                  autoComplete="off"
                  hint="A short name the team will recognise, e.g. initials and a surname."
                  registration={register('pseudonym')}
                  error={formState.errors.pseudonym}
                />
                <TextField
                  label="Preferred name (optional)"
                  autoComplete="off"
                  hint="What the family calls them in e-mails; the app keeps using the pseudonym."
                  registration={register('preferredName')}
                  error={formState.errors.preferredName}
                />
                <SelectField
                  label="Access method"
                  options={methodOptions}
                  registration={register('accessMethod')}
                  error={formState.errors.accessMethod}
                />
                <TextField
                  key={timing.field}
                  label={timing.label}
                  type="number"
                  inputMode="numeric"
                  hint={timing.hint}
                  registration={register(timing.field)}
                  // The timing fields are coerced numbers, which react-hook-form types loosely.
                  error={formState.errors[timing.field] as FieldError | undefined}
                />
                <TextAreaField
                  label="Communication goals"
                  hint="What the client wants to be able to write, and to whom."
                  registration={register('goals')}
                  error={formState.errors.goals}
                />
                <TextAreaField
                  label="Notes"
                  hint="For the clinical team only; carers do not see these."
                  registration={register('notes')}
                  error={formState.errors.notes}
                />
                <FormActions
                  submitLabel={client ? 'Save changes' : 'Create client'}
                  busyLabel="Saving…"
                  submitting={formState.isSubmitting}
                  onCancel={onClose}
                />
              </div>
            </>
          );
        }}
      </Form>
    </Modal>
  );
};
