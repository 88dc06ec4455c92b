import type { ComponentProps } from 'react';
import { dateInputHint } from '@/lib/format';
import { TextField } from './text-field';

type DateFieldProps = Omit<ComponentProps<typeof TextField>, 'type'>;

/**
 * A labelled native date box whose hint says the order of day, month and year it asks for (the
 * browser's own order), before any hint of the field's own; announced with the box.
 */
export const DateField = ({ hint, ...props }: DateFieldProps) => (
  <TextField
    type="date"
    hint={
      <>
        {dateInputHint()}.{hint ? <> {hint}</> : null}
      </>
    }
    {...props}
  />
);
