import type { Contact } from '@keyloom/shared';
import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/dialog';
import { useDeleteContact } from '../api/delete-contact';
import { deleteContactWords } from '../lib/contact-words';

type DeleteContactDialogProps = {
  clientId: string;
  /** The contact to delete; null keeps the dialog closed. */
  contact: Contact | null;
  onClose: () => void;
  onDeleted: (contact: Contact) => void;
};

/** Asks before deleting a family contact, saying what is deleted and what stays. */
export const DeleteContactDialog = ({ clientId, contact, onClose, onDeleted }: DeleteContactDialogProps) => {
  const remove = useDeleteContact();
  const [error, setError] = useState<string | null>(null);
  const close = () => {
    setError(null);
    onClose();
  };
  const confirm = async () => {
    if (!contact) return;
    setError(null);
    try {
      await remove.mutateAsync({ clientId, contactId: contact.id });
      onDeleted(contact);
    } catch (caught) {
      setError(caught instanceof Error ? caught.message : 'The contact was not deleted. Try again.');
    }
  };
  return (
    <Modal
      open={contact !== null}
      onClose={close}
      title={`Delete ${contact?.name ?? 'this contact'}?`}
      description={contact ? deleteContactWords(contact) : ''}
    >
      <div role="alert">{error && <Alert tone="error">{error}</Alert>}</div>
      <div className="mt-4 flex flex-wrap gap-3">
        <Button variant="danger" onClick={() => void confirm()} disabled={remove.isPending}>
          {remove.isPending ? 'Deleting…' : `Delete ${contact?.name ?? ''}`}
        </Button>
        {/* Start on the safe choice. */}
        <Button onClick={close} autoFocus>
          Cancel
        </Button>
      </div>
    </Modal>
  );
};
