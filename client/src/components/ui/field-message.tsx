import type { ReactNode } from 'react';

type FieldMessageProps = { id: string; children: ReactNode };

/** The rule under a field that says what is expected (linked via aria-describedby). */
export const FieldHint = ({ id, children }: FieldMessageProps) => (
  <p id={id} className="text-ink-soft">
    {children}
  </p>
);

/** A field's validation message (linked via aria-describedby; the field gets aria-invalid). */
export const FieldError = ({ id, children }: FieldMessageProps) => (
  <p id={id} className="flex items-start gap-2 font-bold text-danger">
    <svg aria-hidden="true" viewBox="0 0 20 20" className="mt-1 size-4 shrink-0 fill-current">
      <path d="M10 1.5 19 18H1L10 1.5Zm-1 6v5h2v-5H9Zm0 6.5v2h2v-2H9Z" />
    </svg>
    <span>{children}</span>
  </p>
);
