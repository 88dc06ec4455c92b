import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/loading-state';
import { Alert } from '@/components/ui/alert';
import { useClients } from '@/features/clients/api/get-clients';
import { ProfileQueue } from '@/features/profiles/components/profile-queue';

/** /reviews — the supervisor's queue: versions signed off by a carer, waiting for approval. */
export const ReviewsRoute = () => {
  const clients = useClients();
  return (
    <>
      <PageHeader
        title="Reviews"
        description="You look across the clinic's caseloads, weigh each profile version's measurements and trials, approve it or send it back with a comment, and keep an eye on the audit log."
      />
      {clients.isPending && <LoadingState label="Loading the clinic’s clients…" />}
      {clients.isError && (
        <div role="alert">
          <Alert tone="error" title="The client list could not be loaded.">
            <p>{clients.error.message}</p>
          </Alert>
        </div>
      )}
      {clients.isSuccess && (
        <ProfileQueue
          clients={clients.data}
          status="signed_off"
          caption="Profile versions waiting for your approval, oldest first"
          emptyTitle="Nothing is waiting for your review."
          emptyText="Profile versions that carers have signed off will appear here, oldest first."
        />
      )}
    </>
  );
};
