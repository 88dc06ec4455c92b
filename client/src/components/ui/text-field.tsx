import { type ComponentPropsWithoutRef, type ReactNode, useId } from 'react';
import type { FieldError as FormFieldError, UseFormRegisterReturn } from 'react-hook-form';
import { cn } from '@/lib/cn';
import { describedBy, fieldClasses } from './field-classes';
import { FieldError, FieldHint } from './field-message';

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
}: TextFieldProps) => {
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
      <input
        id={id}
        className={fieldClasses(Boolean(errorId))}
        aria-invalid={errorId ? true : undefined}
        aria-describedby={describedBy([hintId, errorId])}
        {...inputProps}
        {...registration}
      />
      {after}
    </div>
  );
};
