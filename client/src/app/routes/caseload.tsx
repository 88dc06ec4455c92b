import type { Role } from '@keyloom/shared';
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { PageHeader } from '@/components/ui/page-header';
import { clientPath } from '@/config/paths';
import { useClients } from '@/features/clients/api/get-clients';
import { CaseloadTable } from '@/features/clients/components/caseload-table';
import { ClientFormDialog } from '@/features/clients/components/client-form-dialog';

type ListRole = Extract<Role, 'clinician' | 'supervisor' | 'carer'>;

// What each role's list is called and says (the API decides which clients are in it).
const pageWords: Record<
  ListRole,
  { title: string; description: string; caption: string; empty: string; emptyText: string }
> = {
  clinician: {
    title: 'Caseload',
    description:
      'Your clients live here: their consent, the writing they have agreed to share, and the personal prediction profiles you train, measure and send for approval.',
    caption: 'Your clients',
    empty: 'Your caseload is empty.',
    emptyText:
      'Open a client record with “New client”; it will be listed here with its consent status and samples.',
  },
  supervisor: {
    title: 'Clients',
    description:
      'Every client of the clinic, with their clinician, consent status and samples. You can read everything here; changes are the clinician’s.',
    caption: 'Clients of the clinic',
    empty: 'The clinic has no clients yet.',
    emptyText: 'Clients that clinicians open will be listed here.',
  },
  carer: {
    title: 'My clients',
    description:
      'You try out candidate prediction profiles with the clients assigned to you on the test keyboard, then sign a version off or say what is not working.',
    caption: 'Clients assigned to you',
    empty: 'No clients are assigned to you yet.',
    emptyText:
      'When a clinician adds you to a client’s circle, that client and the versions ready to try will appear here.',
  },
};

/** The list of clients a role sees, with search and sorting; clinicians open new clients here. */
export const ClientListPage = ({ role }: { role: ListRole }) => {
  const words = pageWords[role];
  const clients = useClients();
  const navigate = useNavigate();
  const [creating, setCreating] = useState(false);

  return (
    <>
      <PageHeader
        title={words.title}
        description={words.description}
        actions={
          role === 'clinician' ? (
            <Button variant="primary" onClick={() => setCreating(true)}>
              New client
            </Button>
          ) : undefined
        }
      />
      {clients.isPending && <PageLoading />}
      {clients.isError && (
        <LoadError
          title="The client list could not be loaded."
          error={clients.error}
          onRetry={() => void clients.refetch()}
        />
      )}
      {clients.isSuccess && clients.data.length === 0 && (
        <EmptyState title={words.empty}>{words.emptyText}</EmptyState>
      )}
      {clients.isSuccess && clients.data.length > 0 && (
        <CaseloadTable clients={clients.data} caption={words.caption} showClinician={role === 'supervisor'} />
      )}
      {role === 'clinician' && (
        <ClientFormDialog
          open={creating}
          onClose={() => setCreating(false)}
          onSaved={(client) => {
            setCreating(false);
            // The new client's page is where consent comes next.
            void navigate(clientPath(client.id));
          }}
        />
      )}
    </>
  );
};

export const CaseloadRoute = () => <ClientListPage role="clinician" />;
export const ClinicClientsRoute = () => <ClientListPage role="supervisor" />;
