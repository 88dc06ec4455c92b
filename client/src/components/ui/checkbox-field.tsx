import { type ComponentPropsWithoutRef, type ReactNode, useId } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { cn } from '@/lib/cn';

type CheckboxFieldProps = Omit<
  ComponentPropsWithoutRef<'input'>,
  'id' | 'type' | keyof UseFormRegisterReturn
> & {
  label: ReactNode;
  registration: UseFormRegisterReturn;
  hint?: ReactNode;
};

/** A native checkbox with its label beside it (the whole label is the click target). */
export const CheckboxField = ({ label, registration, hint, className, ...props }: CheckboxFieldProps) => {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  return (
    <div className={cn('flex items-start gap-3', className)}>
      <input
        id={id}
        type="checkbox"
        aria-describedby={hintId}
        className="mt-1 size-6 shrink-0 accent-ink"
        {...props}
        {...registration}
      />
      <div>
        <label htmlFor={id} className="font-bold">
          {label}
        </label>
        {hint && (
          <p id={hintId} className="text-ink-soft">
            {hint}
          </p>
        )}
      </div>
    </div>
  );
};
