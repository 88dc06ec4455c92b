import { deleteSampleSchema, type SampleSummary } from '@keyloom/shared';
import { Modal } from '@/components/ui/dialog';
import { ReasonForm } from '@/components/ui/reason-form';
import { useDeleteSample } from '../api/delete-sample';

type DeleteSampleDialogProps = {
  /** The sample to delete; null = closed. */
  sample: Pick<SampleSummary, 'id' | 'title' | 'words' | 'openFlags'> | null;
  onClose: () => void;
  onDeleted: (sample: Pick<SampleSummary, 'id' | 'title'>) => void;
};

/** Deletes a sample uploaded by mistake, after saying what goes and asking why. */
export const DeleteSampleDialog = ({ sample, onClose, onDeleted }: DeleteSampleDialogProps) => {
  const remove = useDeleteSample();
  return (
    <Modal
      open={sample !== null}
      onClose={onClose}
      title={sample ? `Delete “${sample.title}”?` : 'Delete sample?'}
      description="For a sample uploaded by mistake, for example to the wrong client. This cannot be undone."
    >
      {sample && (
        <div className="flex flex-col gap-4">
          <div>
            <p className="font-bold">Deleted for good:</p>
            <ul className="list-disc pl-6">
              <li>the sample’s text ({sample.words.toLocaleString('en-GB')} words) and its statistics;</li>
              <li>its personal-data flags and the decisions on them;</li>
              <li>its place in draft versions that have not been trained.</li>
            </ul>
          </div>
          <p>
            Once a version has been trained on the sample it cannot be deleted; leave it out of future
            versions instead. The activity log keeps that a sample was deleted, not its text or your reason.
          </p>
          <ReasonForm
            key={sample.id}
            schema={deleteSampleSchema}
            defaultValues={{ reason: '' }}
            label="Reason for deleting it"
            submitLabel="Delete sample"
            busyLabel="Deleting…"
            submitVariant="danger"
            onSubmit={async (input) => {
              await remove.mutateAsync({ sampleId: sample.id, input });
              onDeleted(sample);
            }}
            onCancel={onClose}
            aria-label="Delete sample"
          />
        </div>
      )}
    </Modal>
  );
};
