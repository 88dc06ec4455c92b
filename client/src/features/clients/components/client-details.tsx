import { accessMethodLabels, type Client } from '@keyloom/shared';
import type { ReactNode } from 'react';
import { formatDateTime } from '@/lib/format';
import { ConsentStatusBadge } from './consent-status-badge';
import { timingFor } from '../lib/access-timing';

const Detail = ({ term, children }: { term: string; children: ReactNode }) => (
  <div className="flex flex-col gap-1 border-b border-thread py-3 sm:flex-row sm:gap-6">
    <dt className="font-bold sm:w-56 sm:shrink-0">{term}</dt>
    <dd className="min-w-0 whitespace-pre-line">{children}</dd>
  </div>
);

/**
 * The client's record as a list of terms; the preferred name and the notes only when the reader may
 * see them (the clinical team, not carers).
 */
export const ClientDetails = ({ client, showNotes }: { client: Client; showNotes: boolean }) => {
  const timing = timingFor[client.accessMethod];
  const timingValue = client[timing.field];
  return (
    <dl>
      <Detail term="Pseudonym">{client.pseudonym}</Detail>
      {showNotes && (
        <Detail term="Preferred name">
          {client.preferredName ?? 'None given: e-mails to the family say “this client”.'}
        </Detail>
      )}
      <Detail term="Consent">
        <ConsentStatusBadge status={client.consentStatus} />
      </Detail>
      <Detail term="Access method">{accessMethodLabels[client.accessMethod]}</Detail>
      <Detail term={timing.label.replace(' (ms)', '')}>
        {timingValue === null ? 'Not measured yet' : `${timingValue} ms`}
      </Detail>
      <Detail term="Communication goals">{client.goals ?? 'None written down yet.'}</Detail>
      {showNotes && <Detail term="Notes">{client.notes ?? 'No notes.'}</Detail>}
      <Detail term="Clinician">{client.clinician.name}</Detail>
      <Detail term="Language samples">{client.sampleCount}</Detail>
      <Detail term="Last change">
        <time dateTime={client.updatedAt}>{formatDateTime(client.updatedAt)}</time>
      </Detail>
    </dl>
  );
};
