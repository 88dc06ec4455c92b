import { useState } from 'react';
import { createPracticePhraseSchema, type PracticePhrase } from '@keyloom/shared';
import { Button } from '@/components/ui/button';
import { Form, FormServerError } from '@/components/ui/form';
import { TextField } from '@/components/ui/text-field';
import { useAddPracticePhrase } from '../api/add-practice-phrase';

type PhraseAddFormProps = {
  clientId: string;
  pseudonym: string;
  onAdded: (phrase: PracticePhrase) => void;
};

/** The owning clinician adds one of the client's own practice phrases (names, places, hobbies). */
export const PhraseAddForm = ({ clientId, pseudonym, onAdded }: PhraseAddFormProps) => {
  const add = useAddPracticePhrase();
  // A new form after each phrase added: the field starts empty again.
  const [round, setRound] = useState(0);
  return (
    <Form
      key={round}
      schema={createPracticePhraseSchema}
      defaultValues={{ text: '' }}
      aria-label="Add a practice phrase"
      errorSummary
      onSubmit={async (input) => {
        const phrase = await add.mutateAsync({ clientId, input });
        setRound((n) => n + 1);
        onAdded(phrase);
      }}
      className="flex flex-col gap-3"
    >
      {({ register, formState }) => (
        <>
          <FormServerError message={formState.errors.root?.server?.message} />
          <TextField
            label="New practice phrase"
            hint={`Something ${pseudonym} would really write, in lower case (the test keyboard has no capitals).`}
            registration={register('text')}
            error={formState.errors.text}
            autoComplete="off"
          />
          <div className="flex flex-wrap gap-3">
            <Button type="submit" disabled={formState.isSubmitting}>
              {formState.isSubmitting ? 'Adding…' : 'Add phrase'}
            </Button>
          </div>
        </>
      )}
    </Form>
  );
};
