import type { ComponentPropsWithoutRef, ReactNode } from 'react';
import type { FieldError as FormFieldError, UseFormRegisterReturn } from 'react-hook-form';
import { FieldFrame } from './field-frame';

type TextFieldProps = Omit<ComponentPropsWithoutRef<'input'>, 'id' | keyof UseFormRegisterReturn> & {
  label: string;
  registration: UseFormRegisterReturn;
  error?: FormFieldError;
  hint?: ReactNode;
  /** Rendered after the input, e.g. a "Show password" toggle. */
  after?: ReactNode;
};

/** A labelled text input whose hint and error are announced with it. */
export const TextField = ({
  label,
  registration,
  error,
  hint,
  after,
  className,
  ...inputProps
}: TextFieldProps) => (
  <FieldFrame label={label} error={error} hint={hint} className={className}>
    {(control) => (
      <>
        <input {...control} {...inputProps} {...registration} />
        {after}
      </>
    )}
  </FieldFrame>
);
