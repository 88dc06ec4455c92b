import { useRef, useState } from 'react';
import { PageLoading } from '@/components/layout/page-loading';
import { Alert } from '@/components/ui/alert';
import { LoadError } from '@/components/ui/load-error';
import { PageHeader } from '@/components/ui/page-header';
import { useClinicSettings } from '@/features/clinic/api/get-clinic-settings';
import { ClinicSettingsForm } from '@/features/clinic/components/clinic-settings-form';
import { formatDateTime } from '@/lib/format';

/** /admin/clinic — the clinic's name, phone and address, named in progress e-mails to families. */
export const ClinicRoute = () => {
  const settings = useClinicSettings();
  const [saves, setSaves] = useState(0);
  const statusRef = useRef<HTMLDivElement>(null);
  return (
    <div className="max-w-2xl">
      <PageHeader
        title="Clinic details"
        description="Progress e-mails to families, and the page behind their stop link, name the clinic and give this phone number."
      />
      <div role="status" ref={statusRef} tabIndex={-1}>
        {saves > 0 && (
          <Alert tone="success" className="mb-6">
            Clinic details saved. The next progress e-mails use them.
          </Alert>
        )}
      </div>
      {settings.isPending && <PageLoading />}
      {settings.isError && (
        <LoadError
          title="The clinic details could not be loaded."
          error={settings.error}
          onRetry={() => void settings.refetch()}
        />
      )}
      {settings.isSuccess && (
        <div className="rounded-xl border-2 border-thread bg-surface p-5 sm:p-8">
          {!settings.data.configured && (
            <p className="mb-6">Not set yet: e-mails say “the clinic” and give no phone number.</p>
          )}
          {/* A new key after each save shows the details as stored (trimmed, lower-cased e-mail). */}
          <ClinicSettingsForm
            key={saves}
            settings={settings.data}
            onSaved={() => {
              setSaves((count) => count + 1);
              // After the re-render that shows the message.
              setTimeout(() => statusRef.current?.focus(), 0);
            }}
          />
          {settings.data.updatedAt && (
            <p className="mt-6 text-ink-soft">
              Last changed{' '}
              <time dateTime={settings.data.updatedAt}>{formatDateTime(settings.data.updatedAt)}</time>
              {settings.data.updatedBy ? ` by ${settings.data.updatedBy.name}` : ''}.
            </p>
          )}
        </div>
      )}
    </div>
  );
};
