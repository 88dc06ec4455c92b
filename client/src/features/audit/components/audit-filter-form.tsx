import { type FormEvent, useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { fieldClasses } from '@/components/ui/field-classes';
import type { SelectOption } from '@/components/ui/select-field';
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

const Select = ({
  label,
  value,
  options,
  onChange,
}: {
  label: string;
  value: string;
  options: readonly SelectOption[];
  onChange: (value: string) => void;
}) => {
  const id = useId();
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="font-bold">
        {label}
      </label>
      <select
        id={id}
        value={value}
        onChange={(event) => onChange(event.target.value)}
        className={fieldClasses(false)}
      >
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
    </div>
  );
};

const DateInput = ({
  label,
  value,
  onChange,
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
}) => {
  const id = useId();
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="font-bold">
        {label}
      </label>
      <input
        id={id}
        type="date"
        value={value}
        onChange={(event) => onChange(event.target.value)}
        className={fieldClasses(false)}
      />
    </div>
  );
};

/** Client, person, action and date range; applying starts again at page 1. */
export const AuditFilterForm = ({ filters, clientOptions, userOptions, onApply }: AuditFilterFormProps) => {
  const [draft, setDraft] = useState<Draft>({
    clientId: filters.clientId,
    userId: filters.userId,
    action: filters.action,
    from: filters.from,
    to: filters.to,
  });
  const set = (key: keyof Draft) => (value: string) => setDraft((current) => ({ ...current, [key]: value }));
  const submit = (event: FormEvent) => {
    event.preventDefault();
    onApply({ ...draft, page: 1 });
  };
  const clear = () => {
    const empty = { clientId: '', userId: '', action: '', from: '', to: '' };
    setDraft(empty);
    onApply({ ...empty, page: 1 });
  };

  return (
    <form
      aria-label="Filter the audit log"
      onSubmit={submit}
      noValidate
      className="flex flex-col gap-4 rounded-xl border-2 border-thread bg-surface p-4"
    >
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <Select
          label="Client"
          value={draft.clientId}
          options={[{ value: '', label: 'Any client' }, ...clientOptions]}
          onChange={set('clientId')}
        />
        <Select
          label="Who"
          value={draft.userId}
          options={[{ value: '', label: 'Anyone' }, ...userOptions]}
          onChange={set('userId')}
        />
        <Select label="Action" value={draft.action} options={auditActionOptions} onChange={set('action')} />
        <DateInput label="From" value={draft.from} onChange={set('from')} />
        <DateInput label="To" value={draft.to} onChange={set('to')} />
      </div>
      <div className="flex flex-wrap gap-3">
        <Button type="submit" variant="primary">
          Show events
        </Button>
        <Button onClick={clear}>Clear filters</Button>
      </div>
    </form>
  );
};
