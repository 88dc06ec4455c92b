import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';

export const MyClientsRoute = () => (
  <>
    <PageHeader
      title="My clients"
      description="You try out candidate prediction profiles with the clients assigned to you on the test keyboard, then sign a version off or say what is not working."
    />
    <EmptyState title="No clients are assigned to you yet.">
      When a clinician adds you to a client&rsquo;s circle, that client and the versions ready to try will
      appear here.
    </EmptyState>
  </>
);
