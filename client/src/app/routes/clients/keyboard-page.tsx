import type { ProfileVersion } from '@keyloom/shared';
import { profileVersionStatusLabels } from '@keyloom/shared';
import { useId, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { Alert } from '@/components/ui/alert';
import { fieldClasses } from '@/components/ui/field-classes';
import { LoadError } from '@/components/ui/load-error';
import { type Announcement, LiveRegion } from '@/components/ui/live-region';
import { PageHeader } from '@/components/ui/page-header';
import { clientPath, profileVersionPath } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useClient } from '@/features/clients/api/get-client';
import { usePracticePhrases } from '@/features/keyboard/api/get-practice-phrases';
import { KeyboardCautions } from '@/features/keyboard/components/keyboard-cautions';
import { defaultKeyboardVersion, hasModel, takesTrials } from '@/features/keyboard/logic/keyboard-versions';
import { PhraseAddForm } from '@/features/keyboard/components/phrase-add-form';
import { type SimulatedFigures, TestKeyboard } from '@/features/keyboard/components/test-keyboard';
import { useProfileVersions } from '@/features/profiles/api/get-profile-versions';
import { atSlots, readReport } from '@/features/profiles/lib/profile-report';

/** The version's simulated keystroke savings at a slot count and its estimated words per minute. */
const simulatedOf =
  (version: ProfileVersion): SimulatedFigures =>
  (slots) => {
    const report = readReport(version.metrics);
    return {
      keystrokeSavings: report ? atSlots(report.keystrokeSavings, slots) : null,
      wpm: report?.rates.wpmWith ?? null,
    };
  };

const VersionSelect = ({
  versions,
  value,
  disabled,
  onChange,
}: {
  versions: readonly ProfileVersion[];
  value: string;
  disabled: boolean;
  onChange: (id: string) => void;
}) => {
  const id = useId();
  return (
    <div className="flex max-w-xl flex-col gap-1">
      <label htmlFor={id} className="font-bold">
        Profile version to try
      </label>
      {disabled && (
        <p id={`${id}-hint`} className="text-ink-soft">
          Finish or discard the trial to change the version.
        </p>
      )}
      <select
        id={id}
        className={fieldClasses(false)}
        value={value}
        disabled={disabled}
        aria-describedby={disabled ? `${id}-hint` : undefined}
        onChange={(event) => onChange(event.target.value)}
      >
        {versions.map((version) => (
          <option key={version.id} value={version.id}>
            Version {version.number} — {profileVersionStatusLabels[version.status]}
          </option>
        ))}
      </select>
    </div>
  );
};

/** /clients/:clientId/keyboard?version=<id> — the test keyboard (clinician and carer). */
export const KeyboardRoute = () => {
  const { clientId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const me = useMe();
  const client = useClient(clientId);
  const versions = useProfileVersions(clientId);
  const phrases = usePracticePhrases(clientId);
  const [announcement, setAnnouncement] = useState<Announcement>(null);
  const back = (
    <Link
      to={clientPath(clientId, 'trials')}
      className="inline-flex min-h-11 items-center font-bold underline"
    >
      Back to the try-outs
    </Link>
  );

  if (client.isPending || versions.isPending) return <PageLoading />;
  if (client.isError || versions.isError) {
    return (
      <>
        <PageHeader title="Test keyboard" />
        <div role="alert">
          <Alert tone="error" title="The test keyboard could not be opened.">
            <p>{(client.error ?? versions.error)?.message}</p>
            {back}
          </Alert>
        </div>
      </>
    );
  }

  const runnable = versions.data.filter(hasModel);
  const asked = search.get('version');
  const version = runnable.find((candidate) => candidate.id === asked) ?? defaultKeyboardVersion(runnable);
  const pseudonym = client.data.pseudonym;
  const owner = me.data?.role === 'clinician';

  return (
    <>
      <PageHeader
        title="Test keyboard"
        description={
          <span className="flex flex-col gap-2">
            <span>
              {pseudonym}
              {version ? `, version ${version.number}` : ''}
            </span>
            {back}
          </span>
        }
      />
      <LiveRegion message={announcement} />
      <div className="flex flex-col gap-8">
        <KeyboardCautions />
        {asked && version && version.id !== asked && (
          <Alert tone="info" title="The version asked for has no model to try.">
            <p>Version {version.number} is open instead.</p>
          </Alert>
        )}
        {!version ? (
          <Alert tone="info" title={`${pseudonym} has no trained profile version yet.`}>
            <p>A version can be tried once it has been trained.</p>
          </Alert>
        ) : (
          <>
            {!takesTrials(version) && (
              <Alert
                tone="info"
                title={`Version ${version.number} is ${profileVersionStatusLabels[version.status].toLowerCase()}.`}
              >
                <p>You can type on it, but trials of it are no longer saved.</p>
              </Alert>
            )}
            {phrases.isError && (
              <LoadError
                title="The practice phrases could not be loaded."
                error={phrases.error}
                onRetry={() => void phrases.refetch()}
              />
            )}
            <TestKeyboard
              client={client.data}
              versionId={version.id}
              versionSlots={version.settings.slots}
              canLogTrials={takesTrials(version)}
              simulated={simulatedOf(version)}
              phrases={phrases.data ?? []}
              versionPicker={(running) => (
                <div className="flex flex-col gap-2">
                  <VersionSelect
                    versions={runnable}
                    value={version.id}
                    disabled={running}
                    onChange={(id) => setSearch({ version: id }, { replace: true })}
                  />
                  <Link
                    to={profileVersionPath(clientId, version.id)}
                    className="inline-flex min-h-11 w-fit items-center font-bold underline"
                  >
                    Version {version.number}’s page and trial history
                  </Link>
                </div>
              )}
              phraseExtra={
                owner && (
                  <details className="rounded-xl border-2 border-thread bg-surface p-4">
                    <summary className="min-h-11 cursor-pointer font-bold">
                      Add a phrase of {pseudonym}’s own
                    </summary>
                    <div className="mt-3">
                      <PhraseAddForm
                        clientId={clientId}
                        pseudonym={pseudonym}
                        onAdded={(phrase) =>
                          setAnnouncement({
                            tone: 'success',
                            text: `Added the practice phrase “${phrase.text}”.`,
                          })
                        }
                      />
                    </div>
                  </details>
                )
              }
            />
          </>
        )}
      </div>
    </>
  );
};
