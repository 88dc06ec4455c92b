import type { Client, Role } from '@keyloom/shared';
import { useQuery } from '@tanstack/react-query';
import { samplesQueryOptions } from '@/features/samples/api/get-samples';
import { ProfilesPanel } from '@/features/profiles/components/profiles-panel';

/**
 * The "Profile versions" tab: composes the client record and its ready samples (from the samples
 * feature) into the profiles panel. Only the owning clinician configures versions, so only a
 * clinician's page asks for the samples.
 */
export const ProfileVersionsTab = ({ client, role }: { client: Client; role: Role }) => {
  const owner = role === 'clinician';
  const samples = useQuery({ ...samplesQueryOptions(client.id), enabled: owner });
  const ready = owner ? (samples.data ?? []).filter((sample) => sample.status === 'ready') : [];
  return (
    <ProfilesPanel
      clientId={client.id}
      pseudonym={client.pseudonym}
      role={role}
      trainingConsent={client.trainingConsent}
      samples={ready}
      access={{
        method: client.accessMethod,
        scanIntervalMs: client.scanIntervalMs,
        dwellMs: client.dwellMs,
        keyTimeMs: client.keyTimeMs,
      }}
    />
  );
};
