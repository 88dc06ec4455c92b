import { type Contact, renewSummariesConsentSchema } from '@keyloom/shared';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { FormActions } from '@/components/ui/form-actions';
import { DateField } from '@/components/ui/date-field';
import { TextField } from '@/components/ui/text-field';
import { formatDateTime } from '@/lib/format';
import { useRenewSummariesConsent } from '../api/renew-summaries-consent';

type RenewSummariesDialogProps = {
  clientId: string;
  /** The stopped contact; null keeps the dialog closed. */
  contact: Contact | null;
  onClose: () => void;
  onRenewed: (contact: Contact) => void;
};

/** "Record the family's new consent to summaries": the date and who gave it, nothing pre-filled. */
export const RenewSummariesDialog = ({
  clientId,
  contact,
  onClose,
  onRenewed,
}: RenewSummariesDialogProps) => {
  const renew = useRenewSummariesConsent();
  return (
    <Modal
      open={contact !== null}
      onClose={onClose}
      title={`Record the family’s new consent to summaries`}
      description={
        contact
          ? `${contact.email} used the stop link${contact.unsubscribedAt ? ` on ${formatDateTime(contact.unsubscribedAt)}` : ''}. Record this only when the family has asked, in writing or in person, to receive summaries again. ${contact.name} will then be ticked as agreeing.`
          : ''
      }
    >
      {contact && (
        <Form
          key={contact.id}
          schema={renewSummariesConsentSchema}
          defaultValues={{ givenOn: '', givenBy: '' }}
          errorSummary
          onSubmit={async (input) => {
            onRenewed(await renew.mutateAsync({ clientId, contactId: contact.id, input }));
          }}
          aria-label="The family’s new consent to summaries"
        >
          {({ register, formState }) => (
            <>
              <FormServerError message={formState.errors.root?.server?.message} />
              <div className="flex flex-col gap-5">
                <DateField
                  label="Date the family gave consent"
                  hint="Not after today."
                  registration={register('givenOn')}
                  error={formState.errors.givenOn}
                />
                <TextField
                  label="Who gave it"
                  autoComplete="off"
                  hint="The family member who asked for summaries again."
                  registration={register('givenBy')}
                  error={formState.errors.givenBy}
                />
                <FormActions
                  submitLabel="Record consent and send summaries again"
                  busyLabel="Recording…"
                  submitting={formState.isSubmitting}
                  onCancel={onClose}
                />
              </div>
            </>
          )}
        </Form>
      )}
    </Modal>
  );
};
