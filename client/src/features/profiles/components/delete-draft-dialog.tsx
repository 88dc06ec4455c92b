import type { ProfileVersion } from '@keyloom/shared';
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/dialog';
import { FormServerError } from '@/components/ui/form';
import { clientPath } from '@/config/paths';
import { useDeleteProfileVersion } from '../api/delete-profile-version';
import { deleteDraftDescription } from '../lib/profile-words';

type DeleteDraftDialogProps = {
  open: boolean;
  version: Pick<ProfileVersion, 'id' | 'clientId' | 'number' | 'samples'>;
  onClose: () => void;
};

/**
 * Confirms deleting a draft; on success the version list opens, with focus on it and a message
 * (the list reads `versionDeleted` from the navigation state).
 */
export const DeleteDraftDialog = ({ open, version, onClose }: DeleteDraftDialogProps) => {
  const remove = useDeleteProfileVersion();
  const navigate = useNavigate();
  const [error, setError] = useState<string | undefined>();
  return (
    <Modal
      open={open}
      onClose={onClose}
      title={`Delete draft version ${version.number}?`}
      description={deleteDraftDescription(version)}
    >
      <div className="flex flex-col gap-5">
        <FormServerError message={error} />
        <div className="flex flex-wrap gap-3 pt-2">
          <Button
            variant="danger"
            disabled={remove.isPending}
            onClick={() =>
              remove.mutate(version.id, {
                onSuccess: () =>
                  void navigate(clientPath(version.clientId, 'profiles'), {
                    state: { versionDeleted: version.number },
                  }),
                onError: (e) => setError(e instanceof Error ? e.message : 'The draft could not be deleted.'),
              })
            }
          >
            {remove.isPending ? 'Deleting…' : 'Delete draft'}
          </Button>
          <Button onClick={onClose}>Cancel</Button>
        </div>
      </div>
    </Modal>
  );
};
