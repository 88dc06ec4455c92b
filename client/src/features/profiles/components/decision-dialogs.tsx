import { approveSchema, type ProfileVersion, sendBackSchema, signOffSchema } from '@keyloom/shared';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { FormActions } from '@/components/ui/form-actions';
import { TextAreaField } from '@/components/ui/text-area-field';
import { useApproveProfileVersion } from '../api/approve-profile-version';
import { useSendBackProfileVersion } from '../api/send-back-profile-version';
import { useSignOffProfileVersion } from '../api/sign-off-profile-version';

type DialogProps = {
  open: boolean;
  version: Pick<ProfileVersion, 'id' | 'number'>;
  onClose: () => void;
  onDone: (version: ProfileVersion) => void;
};

/** The carer's sign-off after trying the version, with a required comment. */
export const SignOffDialog = ({ open, version, onClose, onDone }: DialogProps) => {
  const signOff = useSignOffProfileVersion();
  return (
    <Modal
      open={open}
      onClose={onClose}
      title={`Sign off version ${version.number}?`}
      description="Say how the try-outs went. A supervisor reads your comment before approving the version."
    >
      <Form
        schema={signOffSchema}
        defaultValues={{ comment: '' }}
        aria-label="Sign off"
        onSubmit={async (input) => onDone(await signOff.mutateAsync({ versionId: version.id, input }))}
      >
        {({ register, formState }) => (
          <div className="flex flex-col gap-5">
            <FormServerError message={formState.errors.root?.server?.message} />
            <TextAreaField
              label="How did the try-outs go?"
              rows={4}
              registration={register('comment')}
              error={formState.errors.comment}
            />
            <FormActions
              submitLabel="Sign off"
              busyLabel="Signing off…"
              submitting={formState.isSubmitting}
              onCancel={onClose}
            />
          </div>
        )}
      </Form>
    </Modal>
  );
};

/** The supervisor's approval, with a comment for the record. */
export const ApproveDialog = ({ open, version, onClose, onDone }: DialogProps) => {
  const approve = useApproveProfileVersion();
  return (
    <Modal
      open={open}
      onClose={onClose}
      title={`Approve version ${version.number}?`}
      description="It becomes the client’s active profile; the version active until now is retired. The clinical decision rests with the licensed clinician."
    >
      <Form
        schema={approveSchema}
        defaultValues={{ comment: '' }}
        aria-label="Approve"
        onSubmit={async (input) => onDone(await approve.mutateAsync({ versionId: version.id, input }))}
      >
        {({ register, formState }) => (
          <div className="flex flex-col gap-5">
            <FormServerError message={formState.errors.root?.server?.message} />
            <TextAreaField
              label="Comment for the record"
              rows={3}
              registration={register('comment')}
              error={formState.errors.comment}
            />
            <FormActions
              submitLabel="Approve"
              busyLabel="Approving…"
              submitting={formState.isSubmitting}
              onCancel={onClose}
            />
          </div>
        )}
      </Form>
    </Modal>
  );
};

/** The supervisor sends a signed-off version back, saying what needs to change. */
export const SendBackDialog = ({ open, version, onClose, onDone }: DialogProps) => {
  const sendBack = useSendBackProfileVersion();
  return (
    <Modal
      open={open}
      onClose={onClose}
      title={`Send version ${version.number} back?`}
      description="The clinician sees your reason; a change of settings means training a new version."
    >
      <Form
        schema={sendBackSchema}
        defaultValues={{ reason: '' }}
        aria-label="Send back"
        onSubmit={async (input) => onDone(await sendBack.mutateAsync({ versionId: version.id, input }))}
      >
        {({ register, formState }) => (
          <div className="flex flex-col gap-5">
            <FormServerError message={formState.errors.root?.server?.message} />
            <TextAreaField
              label="What needs to change"
              rows={3}
              registration={register('reason')}
              error={formState.errors.reason}
            />
            <FormActions
              submitLabel="Send back"
              busyLabel="Sending back…"
              submitting={formState.isSubmitting}
              onCancel={onClose}
              submitVariant="danger"
            />
          </div>
        )}
      </Form>
    </Modal>
  );
};
