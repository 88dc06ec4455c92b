import { type AuditFilter, auditFilterSchema } from '@keyloom/shared';
import { Button } from '@/components/ui/button';
import { Form } from '@/components/ui/form';
import { type SelectOption, SelectField } from '@/components/ui/select-field';
import { DateField } from '@/components/ui/date-field';
import type { AuditFilters } from '../api/get-audit';
import { auditActionOptions } from '../lib/audit-actions';

type AuditFilterFormProps = {
  filters: AuditFilters;
  clientOptions: readonly SelectOption[];
  userOptions: readonly SelectOption[];
  /** Receives the chosen filters, always on page 1. */
  onApply: (filters: AuditFilters) => void;
};

type Draft = Omit<AuditFilters, 'page'>;

const EMPTY: Draft = { clientId: '', userId: '', action: '', from: '', to: '' };

// An empty field means "any": it is left out before the shared schema checks the rest.
const withoutEmpty = (values: AuditFilter): AuditFilter =>
  Object.fromEntries(Object.entries(values).filter(([, value]) => value !== '' && value !== undefined));

/**
 * Client, person, action and date range, checked by the API's own schema (a "To" day before the
 * "From" day is listed in the error summary, which takes focus); applying starts again at page 1.
 */
export const AuditFilterForm = ({ filters, clientOptions, userOptions, onApply }: AuditFilterFormProps) => {
  const defaultValues: Draft = {
    clientId: filters.clientId,
    userId: filters.userId,
    action: filters.action,
    from: filters.from,
    to: filters.to,
  };
  return (
    <Form
      schema={auditFilterSchema}
      errorSummary
      aria-label="Filter the audit log"
      defaultValues={defaultValues}
      prepare={withoutEmpty}
      onSubmit={(values) => onApply({ ...EMPTY, ...values, page: 1 })}
      className="flex flex-col gap-4 rounded-xl border-2 border-thread bg-surface p-4"
    >
      {({ register, reset, formState: { errors } }) => (
        <>
          <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
            <SelectField
              label="Client"
              options={[{ value: '', label: 'Any client' }, ...clientOptions]}
              registration={register('clientId')}
              error={errors.clientId}
            />
            <SelectField
              label="Who"
              options={[{ value: '', label: 'Anyone' }, ...userOptions]}
              registration={register('userId')}
              error={errors.userId}
            />
            <SelectField
              label="Action"
              options={auditActionOptions}
              registration={register('action')}
              error={errors.action}
            />
            <DateField label="From" registration={register('from')} error={errors.from} />
            <DateField label="To" registration={register('to')} error={errors.to} />
          </div>
          <div className="flex flex-wrap gap-3">
            <Button type="submit" variant="primary">
              Show events
            </Button>
            <Button
              onClick={() => {
                reset(EMPTY);
                onApply({ ...EMPTY, page: 1 });
              }}
            >
              Clear filters
            </Button>
          </div>
        </>
      )}
    </Form>
  );
};
