import { clientReportQuerySchema } from '@keyloom/shared';
import { useEffect } from 'react';
import { Button } from '@/components/ui/button';
import { Form } from '@/components/ui/form';
import { TextField } from '@/components/ui/text-field';

type ReportPeriodFormProps = {
  period: { from: string; to: string };
  /** Receives the checked period (the API's own schema: "To" before "From" is refused). */
  onApply: (period: { from: string; to: string }) => void;
};

/**
 * Keeps the fields on the period shown when it changes from outside the form (Back, a link): reset in
 * place, so the fields keep focus.
 */
const FollowPeriod = ({
  period,
  reset,
}: {
  period: { from: string; to: string };
  reset: (values: { from: string; to: string }) => void;
}) => {
  useEffect(() => reset({ from: period.from, to: period.to }), [period.from, period.to, reset]);
  return null;
};

/** The client report's period: two days, checked by the API's schema; on screen only. */
export const ReportPeriodForm = ({ period, onApply }: ReportPeriodFormProps) => (
  <Form
    schema={clientReportQuerySchema}
    errorSummary
    aria-label="Period of the report"
    defaultValues={{ from: period.from, to: period.to }}
    prepare={(values) => ({
      ...values,
      from: values.from || undefined,
      to: values.to || undefined,
    })}
    onSubmit={({ from, to }) => onApply({ from, to })}
    className="flex flex-col gap-4 rounded-xl border-2 border-thread bg-surface p-4 print:hidden"
  >
    {({ register, reset, formState: { errors } }) => (
      <div className="flex flex-wrap items-end gap-4">
        <FollowPeriod period={period} reset={reset} />
        <TextField label="From" type="date" registration={register('from')} error={errors.from} />
        <TextField label="To" type="date" registration={register('to')} error={errors.to} />
        <Button type="submit" variant="secondary">
          Show this period
        </Button>
      </div>
    )}
  </Form>
);
