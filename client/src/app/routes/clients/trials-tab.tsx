import type { Client, PracticePhrase, Role } from '@keyloom/shared';
import { useQueries } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { Button, ButtonLink } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { fieldClasses } from '@/components/ui/field-classes';
import { LoadError } from '@/components/ui/load-error';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { keyboardPath, profileVersionPath } from '@/config/paths';
import { useDeletePracticePhrase } from '@/features/keyboard/api/delete-practice-phrase';
import { usePracticePhrases } from '@/features/keyboard/api/get-practice-phrases';
import { trialsQueryOptions } from '@/features/keyboard/api/get-trials';
import { defaultKeyboardVersion, hasModel } from '@/features/keyboard/logic/keyboard-versions';
import { PhraseAddForm } from '@/features/keyboard/components/phrase-add-form';
import { percentOrDash } from '@/features/keyboard/logic/trial-figures';
import { TrialHistory } from '@/features/keyboard/components/trial-history';
import { useProfileVersions } from '@/features/profiles/api/get-profile-versions';
import { atSlots, readReport } from '@/features/profiles/lib/profile-report';
import { ProfileStatusBadge } from '@/features/profiles/components/profile-status-badge';

type Announce = (tone: 'success' | 'error', text: string) => void;

type TrialsTabProps = { client: Client; role: Role; announce: Announce };

const PhraseList = ({
  phrases,
  label,
  onDelete,
}: {
  phrases: readonly PracticePhrase[];
  label: string;
  onDelete?: (phrase: PracticePhrase) => void;
}) => (
  <ul aria-label={label} className="flex flex-col gap-2">
    {phrases.map((phrase) => (
      <li
        key={phrase.id}
        className="flex flex-wrap items-center justify-between gap-3 rounded-lg border-2 border-thread bg-surface px-4 py-2"
      >
        <span className="text-lg">{phrase.text}</span>
        {onDelete && (
          <Button
            variant="quiet"
            onClick={() => onDelete(phrase)}
            aria-label={`Delete the phrase “${phrase.text}”`}
          >
            Delete
          </Button>
        )}
      </li>
    ))}
  </ul>
);

const PracticePhrases = ({
  client,
  owner,
  announce,
}: {
  client: Client;
  owner: boolean;
  announce: Announce;
}) => {
  const phrases = usePracticePhrases(client.id);
  const remove = useDeletePracticePhrase();
  if (phrases.isPending) return <PageLoading />;
  if (phrases.isError) {
    return (
      <LoadError
        title="The practice phrases could not be loaded."
        error={phrases.error}
        onRetry={() => void phrases.refetch()}
      />
    );
  }
  const own = phrases.data.filter((phrase) => phrase.source === 'client');
  const builtIn = phrases.data.filter((phrase) => phrase.source === 'keyloom');
  return (
    <div className="flex flex-col gap-4">
      <h4 className="text-xl font-bold">{client.pseudonym}’s own phrases</h4>
      {own.length === 0 ? (
        <p className="text-ink-soft">
          None yet.{owner && ' Add phrases with the words that matter to the client.'}
        </p>
      ) : (
        <PhraseList
          phrases={own}
          label={`${client.pseudonym}’s own practice phrases`}
          onDelete={
            owner
              ? (phrase) =>
                  remove.mutate(
                    { clientId: client.id, phraseId: phrase.id },
                    {
                      onSuccess: () => announce('success', `Deleted the practice phrase “${phrase.text}”.`),
                      onError: (error) => announce('error', error.message),
                    },
                  )
              : undefined
          }
        />
      )}
      {owner && (
        <PhraseAddForm
          clientId={client.id}
          pseudonym={client.pseudonym}
          onAdded={(phrase) => announce('success', `Added the practice phrase “${phrase.text}”.`)}
        />
      )}
      <details className="rounded-xl border-2 border-thread bg-surface p-4">
        <summary className="min-h-11 cursor-pointer font-bold">
          Keyloom’s practice phrases ({builtIn.length})
        </summary>
        <ul aria-label="Keyloom’s practice phrases" className="mt-3 list-disc pl-6">
          {builtIn.map((phrase) => (
            <li key={phrase.id}>{phrase.text}</li>
          ))}
        </ul>
      </details>
    </div>
  );
};

/**
 * The "Try-outs" tab: the versions that can be tried with their trial counts, the test keyboard
 * (clinician and carer), practice phrases, and the trial history of one version.
 */
export const TrialsTab = ({ client, role, announce }: TrialsTabProps) => {
  const versions = useProfileVersions(client.id);
  const runnable = (versions.data ?? []).filter(hasModel);
  const counts = useQueries({ queries: runnable.map((version) => trialsQueryOptions(version.id)) });
  const [chosen, setChosen] = useState<string | null>(null);
  const selectId = useId();
  const owner = role === 'clinician';
  const tries = role === 'clinician' || role === 'carer';

  if (versions.isPending) return <PageLoading />;
  if (versions.isError) {
    return (
      <LoadError
        title="The profile versions could not be loaded."
        error={versions.error}
        onRetry={() => void versions.refetch()}
      />
    );
  }
  const selected = runnable.find((version) => version.id === chosen) ?? defaultKeyboardVersion(runnable);

  return (
    <div className="flex flex-col gap-10">
      <section aria-labelledby="tryout-versions-heading" className="flex flex-col gap-4">
        <h3 id="tryout-versions-heading" className="text-2xl font-bold">
          Versions to try
        </h3>
        {runnable.length === 0 ? (
          <EmptyState title="No version to try yet.">
            Once a profile version of {client.pseudonym} has been trained, it can be tried here on the test
            keyboard.
          </EmptyState>
        ) : (
          <>
            <Table caption={`Trained versions of ${client.pseudonym}’s profile, newest first`}>
              <TableHead>
                <ColumnHeader>Version</ColumnHeader>
                <ColumnHeader>Status</ColumnHeader>
                <ColumnHeader>Simulated keystroke savings</ColumnHeader>
                <ColumnHeader>Trials</ColumnHeader>
              </TableHead>
              <TableBody>
                {runnable.map((version, index) => {
                  const report = readReport(version.metrics);
                  const count = counts[index]?.data?.length;
                  return (
                    <TableRow key={version.id}>
                      <RowHeader label="Version">
                        <Link to={profileVersionPath(client.id, version.id)} className="font-bold underline">
                          Version {version.number}
                        </Link>
                      </RowHeader>
                      <TableCell label="Status">
                        <ProfileStatusBadge status={version.status} />
                      </TableCell>
                      <TableCell label="Simulated keystroke savings">
                        {report
                          ? `${percentOrDash(atSlots(report.keystrokeSavings, version.settings.slots))} at ${version.settings.slots} slots`
                          : '—'}
                      </TableCell>
                      <TableCell label="Trials">{count === undefined ? '…' : count}</TableCell>
                    </TableRow>
                  );
                })}
              </TableBody>
            </Table>
            <div className="flex flex-wrap items-end gap-4">
              <div className="flex min-w-64 flex-col gap-1">
                <label htmlFor={selectId} className="font-bold">
                  Version to try or review
                </label>
                <select
                  id={selectId}
                  className={fieldClasses(false)}
                  value={selected?.id ?? ''}
                  onChange={(event) => setChosen(event.target.value)}
                >
                  {runnable.map((version) => (
                    <option key={version.id} value={version.id}>
                      Version {version.number}
                    </option>
                  ))}
                </select>
              </div>
              {tries && selected && (
                <ButtonLink variant="primary" to={keyboardPath(client.id, selected.id)}>
                  Open the test keyboard
                </ButtonLink>
              )}
            </div>
            {selected && (
              <section aria-labelledby="tryout-history-heading" className="flex flex-col gap-3">
                <h3 id="tryout-history-heading" className="text-2xl font-bold">
                  Trials of version {selected.number}
                </h3>
                <TrialHistory versionId={selected.id} versionNumber={selected.number} />
              </section>
            )}
          </>
        )}
      </section>

      <section aria-labelledby="practice-phrases-heading" className="flex flex-col gap-4">
        <h3 id="practice-phrases-heading" className="text-2xl font-bold">
          Practice phrases
        </h3>
        <p className="max-w-3xl text-ink-soft">
          A trial can ask the person to copy a phrase, so its figures can be compared from one trial to the
          next.
        </p>
        <PracticePhrases client={client} owner={owner} announce={announce} />
      </section>
    </div>
  );
};
