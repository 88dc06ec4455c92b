import { zodResolver } from '@hookform/resolvers/zod';
import {
  type ComponentPropsWithoutRef,
  type FormEvent,
  type ReactNode,
  useEffect,
  useId,
  useRef,
  useState,
} from 'react';
import {
  type DefaultValues,
  type FieldErrors,
  type FieldValues,
  type Path,
  type Resolver,
  type UseFormReturn,
  useForm,
  type UseFormProps,
} from 'react-hook-form';
import type { z } from 'zod';
import { isApiError } from '@/lib/api-client';
import { Alert } from './alert';
import { ErrorSummary } from './error-summary';
import { type ErrorSummaryEntry, errorSummaryEntries } from './error-summary-entries';

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
  children: (
    methods: UseFormReturn<z.input<TSchema>, unknown, z.output<TSchema>>,
    summary: FormSummary<z.input<TSchema>>,
  ) => ReactNode;
  /**
   * The values as they will be sent, before they are checked: drop what the form does not show (a
   * hidden field must never block a submit). Default: the values unchanged.
   */
  prepare?: (values: z.input<TSchema>) => z.input<TSchema>;
  /**
   * A refused submit (by the schema, or by the API naming fields) lists the fields at the top of the
   * form, each a link to its field, and moves focus to that list. Off: focus goes to the first
   * refused field, as react-hook-form does.
   */
  errorSummary?: boolean;
};

/** What a form offers beside react-hook-form's methods. */
export type FormSummary<TValues extends FieldValues> = {
  /**
   * Checks some fields without submitting (e.g. before a preview); refused ones are listed at the top
   * and focused just like a refused submit. Resolves true when all of them pass.
   */
  checkFields: (names: Array<Path<TValues>>) => Promise<boolean>;
};

/** Field name → message of each refused field (top level; a group such as a list of boxes counts once). */
const flatErrors = (
  errors: FieldErrors | Record<string, { message?: string }>,
  prefix = '',
): Array<{ name: string; message: string }> =>
  Object.entries(errors as Record<string, unknown>).flatMap(([key, error]) => {
    if (!error || typeof error !== 'object' || (prefix === '' && key === 'root') || key === 'ref') return [];
    const name = prefix ? `${prefix}.${key}` : key;
    const message = (error as { message?: unknown }).message;
    // A field's error carries its message; a nested object (e.g. `settings.order`) holds more fields.
    if (typeof message === 'string') return [{ name, message }];
    return flatErrors(error as Record<string, { message?: string }>, name);
  });

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
  prepare,
  errorSummary = false,
  ...formProps
}: FormProps<TSchema>) => {
  const checked = zodResolver(schema) as Resolver<z.input<TSchema>, unknown, z.output<TSchema>>;
  const methods = useForm<z.input<TSchema>, unknown, z.output<TSchema>>({
    shouldFocusError: !errorSummary,
    ...options,
    defaultValues,
    resolver: prepare ? (values, context, opts) => checked(prepare(values), context, opts) : checked,
  });
  // The form is found by its id, not a ref: checkFields is handed to the render function, and a
  // function given to render must not read a ref.
  const generatedId = useId();
  const formId = formProps.id ?? `form-${generatedId}`;
  const summaryRef = useRef<HTMLDivElement>(null);
  const [summary, setSummary] = useState<{ entries: ErrorSummaryEntry[]; shown: number }>({
    entries: [],
    shown: 0,
  });
  // After each refused submit (`shown` counts them), once the list is on screen.
  useEffect(() => {
    if (summary.shown > 0) summaryRef.current?.focus();
  }, [summary.shown]);
  const showSummary = (errors: FieldErrors | Record<string, { message?: string }>) => {
    const form = document.getElementById(formId);
    if (!errorSummary || !(form instanceof HTMLFormElement)) return;
    const entries = errorSummaryEntries(form, flatErrors(errors));
    setSummary((before) => ({ entries, shown: entries.length > 0 ? before.shown + 1 : before.shown }));
  };

  const checkFields = async (names: Array<Path<z.input<TSchema>>>) => {
    if (await methods.trigger(names)) {
      setSummary((before) => ({ ...before, entries: [] }));
      return true;
    }
    const refused = Object.fromEntries(
      names.flatMap((name) => {
        const message = methods.getFieldState(name).error?.message;
        return message ? [[name, { message }]] : [];
      }),
    );
    showSummary(refused);
    return false;
  };

  const send = async (values: z.output<TSchema>) => {
    setSummary((before) => ({ ...before, entries: [] }));
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
      else
        showSummary(Object.fromEntries(fieldIssues.map((issue) => [issue.path, { message: issue.message }])));
    }
  };
  // handleSubmit is called in the event, not during render: showSummary reads the form's element.
  const submit = (event: FormEvent<HTMLFormElement>) => methods.handleSubmit(send, showSummary)(event);

  return (
    <form noValidate onSubmit={submit} {...formProps} id={formId}>
      {errorSummary && <ErrorSummary ref={summaryRef} entries={summary.entries} />}
      {children(methods, { checkFields })}
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
