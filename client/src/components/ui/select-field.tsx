import type { ComponentPropsWithoutRef, ReactNode } from 'react';
import type { FieldError as FormFieldError, UseFormRegisterReturn } from 'react-hook-form';
import { FieldFrame } from './field-frame';

export type SelectOption = { value: string; label: string };

type SelectFieldProps = Omit<ComponentPropsWithoutRef<'select'>, 'id' | keyof UseFormRegisterReturn> & {
  label: string;
  options: readonly SelectOption[];
  registration: UseFormRegisterReturn;
  error?: FormFieldError;
  hint?: ReactNode;
};

/** A labelled native select (native keeps every platform's keyboard and switch access). */
export const SelectField = ({
  label,
  options,
  registration,
  error,
  hint,
  className,
  ...props
}: SelectFieldProps) => (
  <FieldFrame label={label} error={error} hint={hint} className={className}>
    {(control) => (
      <select {...control} {...props} {...registration}>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
    )}
  </FieldFrame>
);
