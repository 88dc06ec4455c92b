import { pasteSampleSchema } from '@keyloom/shared';
import { Button } from '@/components/ui/button';
import { Form, FormServerError } from '@/components/ui/form';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';
import { usePasteSample } from '../api/paste-sample';
import { SampleMetaFields } from './sample-meta-fields';

type PasteSampleFormProps = {
  clientId: string;
  onStored: (message: string, tone: 'success' | 'error') => void;
};

/** Pasted text becomes a sample like an uploaded file (same checks and flags). */
export const PasteSampleForm = ({ clientId, onStored }: PasteSampleFormProps) => {
  const paste = usePasteSample();
  return (
    <Form
      schema={pasteSampleSchema}
      defaultValues={{
        title: '',
        sourceKind: 'messages',
        periodStart: null,
        periodEnd: null,
        note: '',
        text: '',
      }}
      onSubmit={async (input) => {
        const result = await paste.mutateAsync({ clientId, input });
        const duplicate = result.duplicates[0];
        if (duplicate) onStored(duplicate.message, 'error');
        else onStored(`Stored the pasted text as “${result.samples[0]?.title ?? input.title}”.`, 'success');
      }}
      aria-label="Paste text"
      errorSummary
    >
      {({ register, formState, reset }) => (
        <>
          <FormServerError message={formState.errors.root?.server?.message} />
          <div className="flex flex-col gap-5">
            <TextField
              label="Title"
              autoComplete="off"
              registration={register('title')}
              error={formState.errors.title}
            />
            <SampleMetaFields register={register} errors={formState.errors} />
            <TextAreaField
              label="Text"
              rows={8}
              registration={register('text')}
              error={formState.errors.text}
            />
            <div className="flex flex-wrap gap-3">
              <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
                {formState.isSubmitting ? 'Storing…' : 'Store pasted text'}
              </Button>
              <Button onClick={() => reset()}>Clear</Button>
            </div>
          </div>
        </>
      )}
    </Form>
  );
};
