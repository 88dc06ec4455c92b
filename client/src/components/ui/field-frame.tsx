import { type ReactNode, useId } from 'react';
import type { FieldError as FormFieldError } from 'react-hook-form';
import { cn } from '@/lib/cn';
import { describedBy, fieldClasses } from './field-classes';
import { FieldError, FieldHint } from './field-message';

/** What a field's control (input, select, textarea) needs to be labelled and described. */
export type FieldControlProps = {
  id: string;
  className: string;
  'aria-invalid': true | undefined;
  'aria-describedby': string | undefined;
};

type FieldFrameProps = {
  label: string;
  error?: FormFieldError;
  hint?: ReactNode;
  className?: string;
  /** Renders the control with the props that tie it to its label, hint and error. */
  children: (control: FieldControlProps) => ReactNode;
};

/** Label, hint and error above a form control, announced with it: one pattern for every field. */
export const FieldFrame = ({ label, error, hint, className, children }: FieldFrameProps) => {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error?.message ? `${id}-error` : undefined;
  return (
    <div className={cn('flex flex-col gap-1', className)}>
      <label htmlFor={id} className="font-bold">
        {label}
      </label>
      {hintId && <FieldHint id={hintId}>{hint}</FieldHint>}
      {errorId && <FieldError id={errorId}>{error?.message}</FieldError>}
      {children({
        id,
        className: fieldClasses(Boolean(errorId)),
        'aria-invalid': errorId ? true : undefined,
        'aria-describedby': describedBy([hintId, errorId]),
      })}
    </div>
  );
};
