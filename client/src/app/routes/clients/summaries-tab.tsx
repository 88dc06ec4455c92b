import type { Client, Role } from '@keyloom/shared';
import { SummariesPanel } from '@/features/summaries/components/summaries-panel';

/**
 * The "Family updates" tab: the client's progress summaries; the owning clinician composes,
 * previews and sends, a supervisor reads. Carers do not get this tab (client-tabs.ts).
 */
export const SummariesTab = ({
  client,
  role,
  announce,
}: {
  client: Client;
  role: Role;
  announce: (tone: 'success' | 'error', text: string) => void;
}) => (
  <SummariesPanel
    clientId={client.id}
    pseudonym={client.pseudonym}
    role={role}
    summariesConsent={client.summariesConsent}
    announce={announce}
  />
);
