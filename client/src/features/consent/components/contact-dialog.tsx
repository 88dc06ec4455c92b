import { type Contact, createContactSchema } from '@keyloom/shared';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { FormActions } from '@/components/ui/form-actions';
import { TextField } from '@/components/ui/text-field';
import { formatDateTime } from '@/lib/format';
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
        errorSummary
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
              {contact?.unsubscribedAt ? (
                // Read-only: the address used the stop link. Not registered, so the stored value is
                // sent back unchanged; only the family's new consent (its own action) lifts the stop.
                <div className="flex items-start gap-3">
                  <input
                    id="contact-summaries-stopped"
                    type="checkbox"
                    checked={false}
                    disabled
                    readOnly
                    aria-describedby="contact-summaries-stopped-why"
                    className="mt-1 size-6 shrink-0 accent-ink"
                  />
                  <div>
                    <label htmlFor="contact-summaries-stopped" className="font-bold">
                      Agreed to receive progress summaries
                    </label>
                    <p id="contact-summaries-stopped-why" className="text-ink-soft">
                      Cannot be ticked: this address used the stop link of a summary e-mail on{' '}
                      {formatDateTime(contact.unsubscribedAt)}. Use “Record the family’s new consent to
                      summaries” in the contacts table when the family asks for them again.
                    </p>
                  </div>
                </div>
              ) : (
                <CheckboxField
                  label="Agreed to receive progress summaries"
                  hint="Only contacts who agreed, and whose client consented to summaries, are sent any."
                  registration={register('consentToSummaries')}
                />
              )}
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
