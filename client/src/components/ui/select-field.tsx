import { type ComponentPropsWithoutRef, type ReactNode, useId } from 'react';
import type { FieldError as FormFieldError, UseFormRegisterReturn } from 'react-hook-form';
import { cn } from '@/lib/cn';
import { describedBy, fieldClasses } from './field-classes';
import { FieldError, FieldHint } from './field-message';

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
}: SelectFieldProps) => {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error?.message ? `${id}-error` : undefined;
  return (
    <div className={cn('flex flex-col gap-1', className)}>
      <label htmlFor={id} className="font-bold">
        {label}
      </label>
      {hint && <FieldHint id={`${id}-hint`}>{hint}</FieldHint>}
      {errorId && <FieldError id={errorId}>{error?.message}</FieldError>}
      <select
        id={id}
        className={fieldClasses(Boolean(errorId))}
        aria-invalid={errorId ? true : undefined}
        aria-describedby={describedBy([hintId, errorId])}
        {...props}
        {...registration}
      >
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
    </div>
  );
};
