import type { Role, Summary } from '@keyloom/shared';
import { useQuery } from '@tanstack/react-query';
import { useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { LoadingState } from '@/components/ui/loading-state';
import { clientPath } from '@/config/paths';
import { contactsQueryOptions } from '@/features/consent/api/get-contacts';
import { profileVersionsQueryOptions } from '@/features/profiles/api/get-profile-versions';
import { useSummaries } from '../api/get-summaries';
import { SummaryComposer } from './summary-composer';
import { SummaryDraftEditor } from './summary-draft-editor';
import { SummaryList } from './summary-list';
import { summaryCardId } from '../lib/focus-targets';

type SummariesPanelProps = {
  clientId: string;
  pseudonym: string;
  role: Role;
  /** Whether a consent in force covers progress summaries (the API refuses to send without one). */
  summariesConsent: boolean;
  announce: (tone: 'success' | 'error', text: string) => void;
};

const queuedWords = (summary: Summary, round: number): string => {
  const count = summary.recipients.filter((r) => r.round === round).length;
  return `${count} ${count === 1 ? 'e-mail' : 'e-mails'}`;
};

/**
 * "Family updates": the client's progress summaries and, for the owning clinician, the composer.
 * Supervisors read; carers never reach this tab (and the API refuses them).
 */
export const SummariesPanel = ({
  clientId,
  pseudonym,
  role,
  summariesConsent,
  announce,
}: SummariesPanelProps) => {
  const owner = role === 'clinician';
  const summaries = useSummaries(clientId);
  const contacts = useQuery({ ...contactsQueryOptions(clientId), enabled: owner });
  const versions = useQuery(profileVersionsQueryOptions(clientId));
  const [composing, setComposing] = useState(false);
  // The draft open for editing (its id), or none.
  const [draftId, setDraftId] = useState<string | null>(null);
  const newButton = useRef<HTMLButtonElement>(null);
  const listHeading = useRef<HTMLHeadingElement>(null);

  const closeComposer = () => {
    setComposing(false);
    // Back to the control that opened it, so keyboard users keep their place.
    requestAnimationFrame(() => newButton.current?.focus());
  };
  const openDraft = (id: string) => {
    setComposing(false);
    // The editor focuses its own heading when it appears (once the list holds the draft).
    setDraftId(id);
  };
  const closeDraft = () => {
    setDraftId(null);
    requestAnimationFrame(() => (newButton.current ?? listHeading.current)?.focus());
  };

  if (summaries.isPending) return <LoadingState label="Loading the family updates…" />;
  if (summaries.isError) {
    return (
      <LoadError
        title="The family updates could not be loaded."
        error={summaries.error}
        onRetry={() => void summaries.refetch()}
      />
    );
  }

  const list = summaries.data;
  const draft = draftId
    ? (list.find((summary) => summary.id === draftId && summary.status === 'draft') ?? null)
    : null;
  const reasonId = `${clientId}-summaries-consent`;
  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="family-updates-heading" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <h3 id="family-updates-heading" ref={listHeading} tabIndex={-1} className="text-2xl font-bold">
            Progress summaries
          </h3>
          {owner && !composing && !draft && (
            <Button
              ref={newButton}
              variant="primary"
              disabled={!summariesConsent}
              aria-describedby={summariesConsent ? undefined : reasonId}
              onClick={() => setComposing(true)}
            >
              New progress summary
            </Button>
          )}
        </div>
        <p className="text-ink-soft">
          Plain-language e-mails to the family contacts who agreed to receive them. The figures are estimates,
          not measurements of everyday use.
        </p>
        {owner && !summariesConsent && (
          <Alert tone="info" title="No consent for summaries.">
            <p id={reasonId}>
              {pseudonym} has no consent in force that covers sharing progress with the family.{' '}
              <Link to={clientPath(clientId, 'consent')} className="font-bold underline">
                Record consent on the Consent &amp; family tab
              </Link>
              .
            </p>
          </Alert>
        )}
      </section>

      {owner && composing && (
        <section className="rounded-xl border-2 border-ink bg-paper p-5 sm:p-8">
          {contacts.isPending || versions.isPending ? (
            <LoadingState label="Loading the contacts and versions…" />
          ) : contacts.isError ? (
            <LoadError
              title="The family contacts could not be loaded."
              error={contacts.error}
              onRetry={() => void contacts.refetch()}
            />
          ) : (
            <SummaryComposer
              clientId={clientId}
              pseudonym={pseudonym}
              contacts={contacts.data}
              versions={versions.data ?? []}
              onCancel={closeComposer}
              onDrafted={(summary) => openDraft(summary.id)}
            />
          )}
        </section>
      )}

      {owner && draft && (
        <section id={`draft-${draft.id}`} className="rounded-xl border-2 border-ink bg-paper p-5 sm:p-8">
          <SummaryDraftEditor
            summary={draft}
            pseudonym={pseudonym}
            recipientNames={draft.contactIds.map(
              (id) => contacts.data?.find((contact) => contact.id === id)?.name ?? 'a removed contact',
            )}
            onClose={closeDraft}
            onDeleted={() => {
              closeDraft();
              announce('success', 'The draft was deleted. Nothing was sent.');
            }}
            onSent={(summary) => {
              // Focus on the summary just sent, at the head of the list: its state is read there.
              setDraftId(null);
              requestAnimationFrame(() => document.getElementById(summaryCardId(summary.id))?.focus());
              announce(
                'success',
                `The summary was sent: ${queuedWords(summary, 1)} queued. They go out in the background; their state shows below.`,
              );
            }}
          />
        </section>
      )}

      {list.length === 0 ? (
        <EmptyState title="No family updates yet.">
          {owner
            ? 'Summaries you send are kept here with the state of every e-mail.'
            : 'Summaries the clinician sends are kept here with the state of every e-mail.'}
        </EmptyState>
      ) : (
        <SummaryList
          summaries={list}
          versions={versions.data ?? []}
          canSend={owner}
          onOpenDraft={(summary) => openDraft(summary.id)}
          onResent={(summary) => {
            const round = Math.max(...summary.recipients.map((r) => r.round));
            announce('success', `Sending again: ${queuedWords(summary, round)} queued.`);
          }}
        />
      )}
    </div>
  );
};
