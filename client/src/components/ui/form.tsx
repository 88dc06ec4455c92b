import { zodResolver } from '@hookform/resolvers/zod';
import type { ComponentPropsWithoutRef, ReactNode } from 'react';
import {
  type DefaultValues,
  type FieldValues,
  type Path,
  type UseFormReturn,
  useForm,
  type UseFormProps,
} from 'react-hook-form';
import type { z } from 'zod';
import { isApiError } from '@/lib/api-client';
import { Alert } from './alert';

// The key react-hook-form keeps for errors that belong to no single field.
const SERVER_ERROR = 'root.server' as const;

type FormProps<TSchema extends z.ZodType<FieldValues, FieldValues>> = Omit<
  ComponentPropsWithoutRef<'form'>,
  'onSubmit' | 'children'
> & {
  /** The zod schema that validates the fields (shared with the API where it exists). */
  schema: TSchema;
  /** Receives parsed values. Throw an ApiError: its 400 issues land on their fields. */
  onSubmit: (values: z.output<TSchema>) => Promise<unknown> | void;
  defaultValues?: DefaultValues<z.input<TSchema>>;
  options?: Omit<UseFormProps<z.input<TSchema>, unknown, z.output<TSchema>>, 'resolver' | 'defaultValues'>;
  children: (methods: UseFormReturn<z.input<TSchema>, unknown, z.output<TSchema>>) => ReactNode;
};

/**
 * One form pattern for all of Keyloom: react-hook-form + the zod schema; server errors are
 * mapped back onto the fields they name, the rest shown in an alert at the top.
 */
export const Form = <TSchema extends z.ZodType<FieldValues, FieldValues>>({
  schema,
  onSubmit,
  defaultValues,
  options,
  children,
  ...formProps
}: FormProps<TSchema>) => {
  const methods = useForm<z.input<TSchema>, unknown, z.output<TSchema>>({
    ...options,
    defaultValues,
    resolver: zodResolver(schema),
  });

  const submit = methods.handleSubmit(async (values) => {
    try {
      await onSubmit(values);
    } catch (error) {
      const message = error instanceof Error ? error.message : 'Something went wrong. Try again.';
      const fieldNames = new Set(Object.keys(methods.getValues()));
      const fieldIssues = isApiError(error) ? error.issues.filter((issue) => fieldNames.has(issue.path)) : [];
      for (const issue of fieldIssues) {
        methods.setError(issue.path as Path<z.input<TSchema>>, { type: 'server', message: issue.message });
      }
      if (fieldIssues.length === 0) methods.setError(SERVER_ERROR, { type: 'server', message });
    }
  });

  return (
    <form noValidate onSubmit={submit} {...formProps}>
      {children(methods)}
    </form>
  );
};

/** The form-level error (e.g. a 401 or 429 from sign-in) in an alert region that is always present. */
export const FormServerError = ({ message }: { message?: string }) => (
  <div role="alert">
    {message && (
      <Alert tone="error" className="mb-6">
        {message}
      </Alert>
    )}
  </div>
);
