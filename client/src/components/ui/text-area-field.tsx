import type { ComponentPropsWithoutRef, ReactNode } from 'react';
import type { FieldError as FormFieldError, UseFormRegisterReturn } from 'react-hook-form';
import { cn } from '@/lib/cn';
import { FieldFrame } from './field-frame';

type TextAreaFieldProps = Omit<ComponentPropsWithoutRef<'textarea'>, 'id' | keyof UseFormRegisterReturn> & {
  label: string;
  registration: UseFormRegisterReturn;
  error?: FormFieldError;
  hint?: ReactNode;
};

/** A labelled multi-line text field whose hint and error are announced with it. */
export const TextAreaField = ({
  label,
  registration,
  error,
  hint,
  className,
  rows = 4,
  ...props
}: TextAreaFieldProps) => (
  <FieldFrame label={label} error={error} hint={hint} className={className}>
    {(control) => (
      <textarea
        {...control}
        className={cn(control.className, 'leading-relaxed')}
        rows={rows}
        {...props}
        {...registration}
      />
    )}
  </FieldFrame>
);
