import {
  DEFAULT_ADDITION_WEIGHT,
  MAX_ADDITION_WEIGHT,
  vocabularyAdditionSchema,
  vocabularyBlockSchema,
  type VocabularyBlock,
} from '@keyloom/shared';
import { type ComponentProps, type ReactNode, useEffect } from 'react';
import type { FieldError as FormFieldError, Path, UseFormReturn } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { Modal } from '@/components/ui/dialog';
import { Form, FormServerError } from '@/components/ui/form';
import { FormActions } from '@/components/ui/form-actions';
import { TextField } from '@/components/ui/text-field';
import { withAddition, withBlock } from '../lib/vocabulary-lists';
import type { ChangeOrigin, VocabularyEditor } from './use-vocabulary-editor';

// An empty weight box is "no weight" (the default), never 0.
const optionalNumber = (value: unknown) => (value === '' || value === null ? undefined : value);
// The weight box's coerced type merges error types; keep the message only.
const messageOf = (error: { message?: string } | undefined): FormFieldError | undefined =>
  error?.message ? { type: 'validate', message: error.message } : undefined;

const ADD_FIELDS = ['text', 'weight'] as const;
const BLOCK_FIELDS = ['word', 'replacement'] as const;

/** After a successful add: the field cleared, and focus back in it for the next word. */
const ClearAfterSave = <T extends { text: string } | { word: string }>({
  methods,
  fields,
}: {
  methods: UseFormReturn<T, unknown, unknown>;
  /** The form's fields, the one to focus first. */
  fields: readonly string[];
}) => {
  const { isSubmitSuccessful, submitCount } = methods.formState;
  const { resetField, setFocus } = methods;
  useEffect(() => {
    if (!isSubmitSuccessful) return;
    // resetField keeps the fields registered (reset() would drop them until the next render).
    for (const name of fields) resetField(name as Path<T>);
    setFocus(fields[0] as Path<T>);
  }, [submitCount, isSubmitSuccessful, resetField, setFocus, fields]);
  return null;
};

/** A text box for a word: no spelling check or autocomplete (the client's spellings are the point). */
const WordField = (props: ComponentProps<typeof TextField>) => (
  <TextField spellCheck={false} autoComplete="off" {...props} />
);

const SubmitButton = ({
  submitting,
  label,
  busyLabel,
}: {
  submitting: boolean;
  label: string;
  busyLabel: string;
}) => (
  <Button type="submit" variant="primary" className="self-start" disabled={submitting}>
    {submitting ? busyLabel : label}
  </Button>
);

/** The bordered box of a form on the page: its heading first, then the form (a refused submit's list below the heading). */
const FormBox = ({
  headingId,
  heading,
  children,
}: {
  headingId: string;
  heading: string;
  children: ReactNode;
}) => (
  <div className="flex flex-col gap-4 rounded-xl border-2 border-thread p-4">
    <h4 id={headingId} className="text-xl font-bold">
      {heading}
    </h4>
    {children}
  </div>
);

const ADD_HINT = `Names of people and places, medical words: learned as if written ${DEFAULT_ADDITION_WEIGHT} times unless you give a weight.`;

/** "Add a word or phrase": text and an optional weight; saved into the client's list at once. */
export const AddWordForm = ({ editor }: { editor: VocabularyEditor }) => (
  <FormBox headingId="add-word-heading" heading="Add a word or phrase">
    <Form
      schema={vocabularyAdditionSchema}
      aria-labelledby="add-word-heading"
      errorSummary
      defaultValues={{ text: '', weight: undefined }}
      onSubmit={(addition) =>
        editor.save((state) => withAddition(state, addition), {
          text: `Added “${addition.text}”.`,
          origin: 'list',
          field: 'text',
        })
      }
      className="flex flex-col gap-4"
    >
      {(methods) => (
        <>
          <ClearAfterSave methods={methods} fields={ADD_FIELDS} />
          <FormServerError message={methods.formState.errors.root?.server?.message} />
          <WordField
            label="Word or phrase"
            hint={ADD_HINT}
            registration={methods.register('text')}
            error={methods.formState.errors.text}
          />
          <TextField
            label="Weight (optional)"
            type="number"
            inputMode="numeric"
            className="max-w-xs"
            hint={`1 to ${MAX_ADDITION_WEIGHT}: how many times it counts as written.`}
            registration={methods.register('weight', { setValueAs: optionalNumber })}
            error={messageOf(methods.formState.errors.weight)}
          />
          <SubmitButton submitting={methods.formState.isSubmitting} label="Add" busyLabel="Adding…" />
        </>
      )}
    </Form>
  </FormBox>
);

const BLOCK_HINT =
  'A blocked word is never offered. A replacement, e.g. the corrected spelling, is offered in its place.';

type BlockFieldsProps = {
  methods: UseFormReturn<{ word: string; replacement?: string }, unknown, unknown>;
};

const BlockFields = ({ methods }: BlockFieldsProps) => (
  <>
    <FormServerError message={methods.formState.errors.root?.server?.message} />
    <WordField
      label="Word to block"
      hint={BLOCK_HINT}
      registration={methods.register('word')}
      error={methods.formState.errors.word}
    />
    <WordField
      label="Replacement (optional)"
      registration={methods.register('replacement')}
      error={methods.formState.errors.replacement}
    />
  </>
);

const blockText = (block: VocabularyBlock) =>
  block.replacement
    ? `Blocked “${block.word}”; “${block.replacement}” is offered instead.`
    : `Blocked “${block.word}”.`;

const saveBlock = (editor: VocabularyEditor, block: VocabularyBlock, origin: ChangeOrigin) =>
  editor.save((state) => withBlock(state, block), { text: blockText(block), origin, field: 'word' });

/** "Block a word": the word and an optional replacement. */
export const BlockWordForm = ({ editor }: { editor: VocabularyEditor }) => (
  <FormBox headingId="block-word-heading" heading="Block a word">
    <Form
      schema={vocabularyBlockSchema}
      aria-labelledby="block-word-heading"
      errorSummary
      defaultValues={{ word: '', replacement: '' }}
      onSubmit={(block) => saveBlock(editor, block, 'list')}
      className="flex flex-col gap-4"
    >
      {(methods) => (
        <>
          <ClearAfterSave methods={methods} fields={BLOCK_FIELDS} />
          <BlockFields methods={methods} />
          <SubmitButton submitting={methods.formState.isSubmitting} label="Block" busyLabel="Blocking…" />
        </>
      )}
    </Form>
  </FormBox>
);

type BlockDialogProps = {
  editor: VocabularyEditor;
  /** The word to block (prefilled); null keeps the dialog closed. */
  word: string | null;
  onClose: () => void;
};

/** The block form in a dialog, opened from a row of the listing with its word filled in. */
export const BlockDialog = ({ editor, word, onClose }: BlockDialogProps) => (
  <Modal
    open={word !== null}
    onClose={onClose}
    title={`Block “${word ?? ''}”`}
    description="The block applies to the next version you train."
  >
    <Form
      key={word ?? ''}
      schema={vocabularyBlockSchema}
      aria-label={`Block “${word ?? ''}”`}
      errorSummary
      defaultValues={{ word: word ?? '', replacement: '' }}
      onSubmit={async (block) => {
        await saveBlock(editor, block, 'listing');
        onClose();
      }}
    >
      {(methods) => (
        <div className="flex flex-col gap-5">
          <BlockFields methods={methods} />
          <FormActions
            submitLabel="Block"
            busyLabel="Blocking…"
            submitting={methods.formState.isSubmitting}
            onCancel={onClose}
          />
        </div>
      )}
    </Form>
  </Modal>
);
