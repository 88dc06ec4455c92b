import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';

/** Shown when Keyloom cannot tell whether anyone is signed in (server down, network gone). */
export const SessionCheckFailed = ({ error, onRetry }: { error: Error; onRetry: () => void }) => (
  <>
    <PageHeader title="Keyloom is not answering" />
    <div role="alert">
      <Alert tone="error" title="Keyloom could not check your sign-in.">
        {error.message}
      </Alert>
    </div>
    <Button variant="primary" className="mt-6" onClick={onRetry}>
      Try again
    </Button>
  </>
);
