import { type Contact, createContactSchema } from '@keyloom/shared';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { FormActions } from '@/components/ui/form-actions';
import { TextField } from '@/components/ui/text-field';
import { useCreateContact } from '../api/create-contact';
import { useUpdateContact } from '../api/update-contact';

type ContactDialogProps = {
  open: boolean;
  clientId: string;
  /** The contact being edited; absent to add one. */
  contact?: Contact;
  onClose: () => void;
  onSaved: (contact: Contact) => void;
};

/** Add or edit a family contact: name, relationship, e-mail, and whether they receive summaries. */
export const ContactDialog = ({ open, clientId, contact, onClose, onSaved }: ContactDialogProps) => {
  const createContact = useCreateContact();
  const updateContact = useUpdateContact();
  const title = contact ? `Edit ${contact.name}` : 'Add family contact';
  return (
    <Modal open={open} onClose={onClose} title={title}>
      <Form
        key={contact?.id ?? 'new'}
        schema={createContactSchema}
        defaultValues={{
          name: contact?.name ?? '',
          relationship: contact?.relationship ?? '',
          email: contact?.email ?? '',
          consentToSummaries: contact?.consentToSummaries ?? false,
        }}
        onSubmit={async (input) => {
          const saved = contact
            ? await updateContact.mutateAsync({ clientId, contactId: contact.id, changes: input })
            : await createContact.mutateAsync({ clientId, input });
          onSaved(saved);
        }}
        aria-label={title}
      >
        {({ register, formState }) => (
          <>
            <FormServerError message={formState.errors.root?.server?.message} />
            <div className="flex flex-col gap-5">
              <TextField
                label="Name"
                autoComplete="off"
                registration={register('name')}
                error={formState.errors.name}
              />
              <TextField
                label="Relationship to the client"
                autoComplete="off"
                registration={register('relationship')}
                error={formState.errors.relationship}
              />
              <TextField
                label="E-mail address"
                type="email"
                autoComplete="off"
                spellCheck={false}
                registration={register('email')}
                error={formState.errors.email}
              />
              <CheckboxField
                label="Agreed to receive progress summaries"
                hint="Only contacts who agreed, and whose client consented to summaries, are sent any."
                registration={register('consentToSummaries')}
              />
              <FormActions
                submitLabel={contact ? 'Save changes' : 'Add contact'}
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
