import { excludeSampleSchema, type SampleSummary } from '@keyloom/shared';
import { Modal } from '@/components/ui/dialog';
import { ReasonForm } from '@/components/ui/reason-form';
import { useExcludeSample } from '../api/exclude-sample';

type ExcludeSampleDialogProps = {
  open: boolean;
  sample: Pick<SampleSummary, 'id' | 'title'>;
  onClose: () => void;
  onExcluded: (sample: SampleSummary) => void;
};

/** Leaves a whole sample out of training, with a reason. */
export const ExcludeSampleDialog = ({ open, sample, onClose, onExcluded }: ExcludeSampleDialogProps) => {
  const exclude = useExcludeSample();
  return (
    <Modal
      open={open}
      onClose={onClose}
      title={`Leave out “${sample.title}”?`}
      description="The sample stays on record but is never used to train or measure a model until you include it again."
    >
      <ReasonForm
        schema={excludeSampleSchema}
        defaultValues={{ reason: '' }}
        label="Reason for leaving it out"
        submitLabel="Leave out this sample"
        busyLabel="Saving…"
        submitVariant="danger"
        onSubmit={async (input) => {
          onExcluded(await exclude.mutateAsync({ sampleId: sample.id, input }));
        }}
        onCancel={onClose}
        aria-label="Leave out sample"
      />
    </Modal>
  );
};
