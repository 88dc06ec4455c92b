import type { Client, Role } from '@keyloom/shared';
import { Tab, TabGroup, TabList, TabPanel, TabPanels } from '@headlessui/react';
import { useQuery } from '@tanstack/react-query';
import { type ReactNode, useState } from 'react';
import { Link, Navigate, useNavigate, useParams } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { type Announcement, LiveRegion } from '@/components/ui/live-region';
import { PageHeader } from '@/components/ui/page-header';
import { type ClientTab, clientPath, roleHome } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { profileVersionsQueryOptions } from '@/features/profiles/api/get-profile-versions';
import { useClient } from '@/features/clients/api/get-client';
import { CarerAssignments } from '@/features/clients/components/carer-assignments';
import { ClientDetails } from '@/features/clients/components/client-details';
import { ClientFormDialog } from '@/features/clients/components/client-form-dialog';
import { ConsentStatusBadge } from '@/features/clients/components/consent-status-badge';
import { ConsentPanel } from '@/features/consent/components/consent-panel';
import { ClientReportLink } from '@/features/reports/components/report-links';
import { SamplesPanel } from '@/features/samples/components/samples-panel';
import { cn } from '@/lib/cn';
import { tabLabels, tabsForRole } from './client-tabs';
import { ProfileVersionsTab } from './profile-versions-tab';
import { SummariesTab } from './summaries-tab';
import { TrialsTab } from './trials-tab';

type Announce = (tone: 'success' | 'error', text: string) => void;

const OverviewPanel = ({ client, role, announce }: { client: Client; role: Role; announce: Announce }) => {
  const [editing, setEditing] = useState(false);
  const owner = role === 'clinician';
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="details-heading" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h3 id="details-heading" className="text-2xl font-bold">
            Details
          </h3>
          {owner && <Button onClick={() => setEditing(true)}>Edit details</Button>}
        </div>
        <ClientDetails client={client} showNotes={role !== 'carer'} />
      </section>
      <CarerAssignments
        client={client}
        canManage={owner}
        onChanged={(message) => announce('success', message)}
      />
      {owner && (
        <ClientFormDialog
          open={editing}
          client={client}
          onClose={() => setEditing(false)}
          onSaved={(saved) => {
            setEditing(false);
            announce('success', `Saved the changes to ${saved.pseudonym}.`);
          }}
        />
      )}
    </div>
  );
};

const tabClasses = ({ selected }: { selected: boolean }) =>
  cn(
    'min-h-11 rounded-t-lg border-2 border-b-0 px-4 py-2 font-bold',
    selected
      ? 'border-ink bg-surface text-ink underline decoration-saffron decoration-4 underline-offset-8'
      : 'border-transparent text-ink-soft hover:bg-paper-deep',
  );

/** /clients/:clientId/:tab — the client page, one tab per step of the work. */
export const ClientRoute = () => {
  const { clientId = '', tab } = useParams();
  const navigate = useNavigate();
  const me = useMe();
  const client = useClient(clientId);
  const [announcement, setAnnouncement] = useState<Announcement>(null);
  const announce: Announce = (tone, text) => setAnnouncement({ tone, text });

  const role = me.data?.role ?? 'carer';
  // On the samples tab the owner's delete buttons need to know which samples a version was trained on.
  const versions = useQuery({
    ...profileVersionsQueryOptions(clientId),
    enabled: tab === 'samples' && role === 'clinician',
  });
  const tabs = tabsForRole(role);
  const index = tabs.indexOf(tab as ClientTab);
  if (index < 0) return <Navigate to={clientPath(clientId)} replace />;

  if (client.isPending) return <PageLoading />;
  if (client.isError) {
    return (
      <>
        <PageHeader title="Client not found" />
        <div role="alert">
          <Alert tone="error" title="This client could not be opened.">
            <p>{client.error.message}</p>
            <Link to={roleHome[role]} className="mt-3 inline-flex min-h-11 items-center font-bold underline">
              Back to your client list
            </Link>
          </Alert>
        </div>
      </>
    );
  }

  const data = client.data;
  const panels: Record<ClientTab, ReactNode> = {
    overview: <OverviewPanel client={data} role={role} announce={announce} />,
    consent: (
      <ConsentPanel
        clientId={data.id}
        pseudonym={data.pseudonym}
        canEdit={role === 'clinician'}
        announce={announce}
      />
    ),
    samples: (
      <SamplesPanel
        clientId={data.id}
        pseudonym={data.pseudonym}
        trainingConsent={data.trainingConsent}
        canEdit={role === 'clinician'}
        announce={announce}
        versions={versions.data}
      />
    ),
    profiles: <ProfileVersionsTab client={data} role={role} />,
    trials: <TrialsTab client={data} role={role} announce={announce} />,
    summaries: <SummariesTab client={data} role={role} announce={announce} />,
  };

  return (
    <>
      <PageHeader
        title={data.pseudonym}
        description={
          <span className="flex flex-wrap items-center gap-3">
            <span>Client of {data.clinician.name}</span>
            <ConsentStatusBadge status={data.consentStatus} />
            <ClientReportLink clientId={data.id} role={role} />
          </span>
        }
      />
      <LiveRegion message={announcement} />
      <TabGroup
        selectedIndex={index}
        onChange={(next) => {
          setAnnouncement(null);
          // A tab of the same page: the address changes, focus stays on the tab (WAI-ARIA tabs pattern).
          void navigate(clientPath(data.id, tabs[next] ?? 'overview'), { state: { keepFocus: true } });
        }}
      >
        <TabList
          aria-label={`Parts of ${data.pseudonym}’s record`}
          className="flex flex-wrap gap-1 border-b-2 border-ink"
        >
          {tabs.map((name) => (
            <Tab key={name} className={tabClasses}>
              {tabLabels[name]}
            </Tab>
          ))}
        </TabList>
        <TabPanels className="pt-6">
          {tabs.map((name) => (
            <TabPanel key={name}>
              <h2 className="sr-only">{tabLabels[name]}</h2>
              {panels[name]}
            </TabPanel>
          ))}
        </TabPanels>
      </TabGroup>
    </>
  );
};
