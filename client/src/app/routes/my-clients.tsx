import { useClients } from '@/features/clients/api/get-clients';
import { ProfileQueue } from '@/features/profiles/components/profile-queue';
import { ClientListPage } from './caseload';

export const MyClientsRoute = () => {
  const clients = useClients();
  return (
    <>
      <ClientListPage role="carer" />
      {clients.isSuccess && clients.data.length > 0 && (
        <section aria-labelledby="to-try-heading" className="mt-10 flex flex-col gap-4">
          <h2 id="to-try-heading" className="text-2xl font-bold">
            Versions to try and sign off
          </h2>
          <ProfileQueue
            clients={clients.data}
            status="trained"
            caption="Profile versions waiting for your sign-off, oldest first"
            emptyTitle="No version is waiting for your sign-off."
            emptyText="When a clinician trains a new profile for one of your clients, it will appear here for you to try."
          />
        </section>
      )}
    </>
  );
};
