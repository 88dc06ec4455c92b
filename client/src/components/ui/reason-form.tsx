import type { ReactNode } from 'react';
import type { DefaultValues, FieldValues, Path } from 'react-hook-form';
import type { z } from 'zod';
import type { ButtonVariant } from './button-classes';
import { Form, FormServerError } from './form';
import { FormActions } from './form-actions';
import { TextAreaField } from './text-area-field';

type ReasonFormProps<TSchema extends z.ZodType<FieldValues, FieldValues>> = {
  /** A schema with a `reason` text field (and perhaps fixed fields set in defaultValues). */
  schema: TSchema;
  defaultValues: DefaultValues<z.input<TSchema>>;
  label: string;
  hint?: ReactNode;
  submitLabel: string;
  busyLabel: string;
  submitVariant?: ButtonVariant;
  onSubmit: (values: z.output<TSchema>) => Promise<unknown>;
  onCancel: () => void;
  'aria-label': string;
};

/** A dialog form that asks only for a reason (for the record) before a decision is made. */
export const ReasonForm = <TSchema extends z.ZodType<FieldValues, FieldValues>>({
  schema,
  defaultValues,
  label,
  hint,
  submitLabel,
  busyLabel,
  submitVariant,
  onSubmit,
  onCancel,
  'aria-label': ariaLabel,
}: ReasonFormProps<TSchema>) => (
  <Form schema={schema} defaultValues={defaultValues} onSubmit={onSubmit} aria-label={ariaLabel} errorSummary>
    {({ register, formState }) => (
      <>
        <FormServerError message={formState.errors.root?.server?.message} />
        <div className="flex flex-col gap-5">
          <TextAreaField
            label={label}
            hint={hint}
            rows={3}
            // Every schema given here has a `reason` field; TypeScript cannot see that through the generic.
            registration={register('reason' as Path<z.input<TSchema>>)}
            error={formState.errors.reason as Parameters<typeof TextAreaField>[0]['error']}
          />
          <FormActions
            submitLabel={submitLabel}
            busyLabel={busyLabel}
            submitting={formState.isSubmitting}
            onCancel={onCancel}
            submitVariant={submitVariant}
          />
        </div>
      </>
    )}
  </Form>
);
