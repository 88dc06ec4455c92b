import { useState } from 'react';
import { PageLoading } from '@/components/layout/page-loading';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { type Announcement, LiveRegion } from '@/components/ui/live-region';
import { PageHeader } from '@/components/ui/page-header';
import { useClients } from '@/features/clients/api/get-clients';
import { CarerAssignments } from '@/features/clients/components/carer-assignments';
import { CaseloadTable } from '@/features/clients/components/caseload-table';

/** /admin/assignments — the admin's only view of clients: who cares for whom (no clinical content). */
export const AssignmentsRoute = () => {
  const clients = useClients();
  const [announcement, setAnnouncement] = useState<Announcement>(null);
  return (
    <>
      <PageHeader
        title="Assignments"
        description="Which carers may see which clients. You see only the pseudonym and summary of each client here; their clinical record stays with the clinician."
      />
      <LiveRegion message={announcement} />
      {clients.isPending && <PageLoading />}
      {clients.isError && (
        <LoadError
          title="The client list could not be loaded."
          error={clients.error}
          onRetry={() => void clients.refetch()}
        />
      )}
      {clients.isSuccess && clients.data.length === 0 && (
        <EmptyState title="No clients yet.">
          Clients that clinicians open will be listed here for carer assignment.
        </EmptyState>
      )}
      {clients.isSuccess && clients.data.length > 0 && (
        <CaseloadTable
          clients={clients.data}
          caption="Clients of the clinic"
          showClinician
          linkToClient={false}
          rowAction={{
            label: 'Carers',
            render: (client) => (
              <CarerAssignments
                client={client}
                canManage
                onChanged={(text) => setAnnouncement({ tone: 'success', text })}
              />
            ),
          }}
        />
      )}
    </>
  );
};
