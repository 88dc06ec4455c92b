import type { ReactNode } from 'react';
import { Alert } from '@/components/ui/alert';
import { PageHeader } from '@/components/ui/page-header';

/** The page of a version that could not be opened: the server's reason and a way back. */
export const VersionNotFound = ({ error, back }: { error: Error; back: ReactNode }) => (
  <>
    <PageHeader title="Version not found" />
    <div role="alert">
      <Alert tone="error" title="This profile version could not be opened.">
        <p>{error.message}</p>
        {back}
      </Alert>
    </div>
  </>
);
