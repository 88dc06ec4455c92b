import type { FieldError, UseFormRegisterReturn } from 'react-hook-form';
import { SelectField } from '@/components/ui/select-field';
import { TextAreaField } from '@/components/ui/text-area-field';
import { DateField } from '@/components/ui/date-field';
import { sourceKindOptions } from '../lib/source-kind-options';

type MetaField = 'sourceKind' | 'periodStart' | 'periodEnd' | 'note';

// The slice of react-hook-form's register that these fields need.
type RegisterMeta = (
  name: MetaField,
  options?: { setValueAs: (value: unknown) => unknown },
) => UseFormRegisterReturn;

// An empty date field means "no date", which the schemas take as null.
const emptyToNull = (value: unknown) => (value === '' ? null : value);

type SampleMetaFieldsProps = {
  register: RegisterMeta;
  errors: Partial<Record<MetaField, FieldError>>;
};

/** Where the text came from, when it was written, and a note: the same for uploads and pasted text. */
export const SampleMetaFields = ({ register, errors }: SampleMetaFieldsProps) => {
  const registrations = {
    sourceKind: register('sourceKind'),
    periodStart: register('periodStart', { setValueAs: emptyToNull }),
    periodEnd: register('periodEnd', { setValueAs: emptyToNull }),
    note: register('note'),
  };
  return (
    <>
      <SelectField
        label="Where the text came from"
        options={sourceKindOptions}
        registration={registrations.sourceKind}
        error={errors.sourceKind}
      />
      <div className="grid gap-5 sm:grid-cols-2">
        <DateField
          label="Written from (optional)"
          registration={registrations.periodStart}
          error={errors.periodStart}
        />
        <DateField
          label="Written until (optional)"
          registration={registrations.periodEnd}
          error={errors.periodEnd}
        />
      </div>
      <TextAreaField label="Note (optional)" rows={2} registration={registrations.note} error={errors.note} />
    </>
  );
};
