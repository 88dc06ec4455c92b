import { cn } from '@/lib/cn';

/** Border and size of text inputs and selects; the border turns red when invalid. */
export const fieldClasses = (invalid: boolean): string =>
  cn(
    'min-h-11 w-full rounded-lg border-2 bg-surface px-3 py-2 text-base text-ink',
    invalid ? 'border-danger' : 'border-field-border',
  );

/** The ids a field lists in aria-describedby: its hint first, then its error. */
export const describedBy = (ids: Array<string | false | undefined>): string | undefined => {
  const present = ids.filter((id): id is string => Boolean(id));
  return present.length ? present.join(' ') : undefined;
};
