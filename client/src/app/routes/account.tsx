import { useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { PageHeader } from '@/components/ui/page-header';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';

/** "Your account": every signed-in person can change their own password here. */
export const AccountRoute = () => {
  const [changes, setChanges] = useState(0);
  const doneRef = useRef<HTMLDivElement>(null);

  return (
    <div className="max-w-xl">
      <PageHeader title="Your account" />
      <section aria-labelledby="change-password-heading">
        <h2 id="change-password-heading" className="mb-4 text-2xl font-bold">
          Change password
        </h2>
        <div role="status" ref={doneRef} tabIndex={-1}>
          {changes > 0 && (
            <Alert tone="success" className="mb-6">
              Your password is changed. Other devices signed in as you have been signed out.
            </Alert>
          )}
        </div>
        <div className="rounded-xl border-2 border-thread bg-surface p-5 sm:p-8">
          {/* A new key empties the form after a change. */}
          <ChangePasswordForm
            key={changes}
            submitLabel="Change password"
            onChanged={() => {
              setChanges((count) => count + 1);
              // After the re-render that shows the message.
              setTimeout(() => doneRef.current?.focus(), 0);
            }}
          />
        </div>
      </section>
    </div>
  );
};
