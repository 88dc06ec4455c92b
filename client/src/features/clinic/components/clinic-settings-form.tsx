import { type ClinicSettings, updateClinicSettingsSchema } from '@keyloom/shared';
import { Button } from '@/components/ui/button';
import { Form, FormServerError } from '@/components/ui/form';
import { TextAreaField } from '@/components/ui/text-area-field';
import { TextField } from '@/components/ui/text-field';
import { useUpdateClinicSettings } from '../api/update-clinic-settings';

type ClinicSettingsFormProps = {
  /** What is saved now; an unconfigured clinic starts from empty fields. */
  settings: ClinicSettings;
  /** After the API stored the details. */
  onSaved: (saved: ClinicSettings) => void;
};

/** Name, phone, address, e-mail and website of the clinic, as families see them in e-mails. */
export const ClinicSettingsForm = ({ settings, onSaved }: ClinicSettingsFormProps) => {
  const update = useUpdateClinicSettings();
  const saved = settings.configured ? settings : null;
  return (
    <Form
      schema={updateClinicSettingsSchema}
      defaultValues={{
        name: saved?.name ?? '',
        phone: saved?.phone ?? '',
        address: saved?.address ?? '',
        email: saved?.email ?? '',
        website: saved?.website ?? '',
      }}
      errorSummary
      onSubmit={async (values) => onSaved(await update.mutateAsync(values))}
      aria-label="Clinic details"
    >
      {({ register, formState }) => (
        <>
          <FormServerError message={formState.errors.root?.server?.message} />
          <div className="flex flex-col gap-6">
            <TextField
              label="Clinic name"
              autoComplete="organization"
              hint="As families know it; progress e-mails come from this name."
              registration={register('name')}
              error={formState.errors.name}
            />
            <TextField
              label="Phone"
              type="tel"
              autoComplete="tel"
              hint="Families call this number to start progress e-mails again, e.g. 01632 960 418."
              registration={register('phone')}
              error={formState.errors.phone}
            />
            <TextAreaField
              label="Address"
              autoComplete="street-address"
              hint="One part per line, as on an envelope."
              rows={4}
              registration={register('address')}
              error={formState.errors.address}
            />
            <TextField
              label="E-mail (optional)"
              type="email"
              autoComplete="email"
              spellCheck={false}
              registration={register('email')}
              error={formState.errors.email}
            />
            <TextField
              label="Website (optional)"
              type="url"
              autoComplete="url"
              spellCheck={false}
              hint="The full address, starting with https://."
              registration={register('website')}
              error={formState.errors.website}
            />
            <Button type="submit" variant="primary" disabled={formState.isSubmitting} className="self-start">
              {formState.isSubmitting ? 'Saving…' : 'Save clinic details'}
            </Button>
          </div>
        </>
      )}
    </Form>
  );
};
