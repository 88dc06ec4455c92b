import type { Role } from '@keyloom/shared';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useLocation, useParams } from 'react-router-dom';
import { z } from 'zod';
import { PageLoading } from '@/components/layout/page-loading';
import { Alert } from '@/components/ui/alert';
import { type Announcement, LiveRegion } from '@/components/ui/live-region';
import { PageHeader } from '@/components/ui/page-header';
import { clientPath, keyboardPath, vocabularyPath } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useClient } from '@/features/clients/api/get-client';
import { useTrials } from '@/features/keyboard/api/get-trials';
import { hasModel, takesTrials } from '@/features/keyboard/logic/keyboard-versions';
import { TrialHistory } from '@/features/keyboard/components/trial-history';
import { useProfileVersion } from '@/features/profiles/api/get-profile-version';
import { BaseOnlyNote, NewVersionForm } from '@/features/profiles/components/new-version-form';
import { samplesQueryOptions } from '@/features/samples/api/get-samples';
import { count, readReport } from '@/features/profiles/lib/profile-report';
import { ProfileStatusBadge } from '@/features/profiles/components/profile-status-badge';
import { TrainingProgress } from '@/features/profiles/components/training-progress';
import { VerifyExportPanel } from '@/features/profiles/components/verify-export-panel';
import { VersionActions } from '@/features/profiles/components/version-actions';
import { VersionHistory } from '@/features/profiles/components/version-history';
import { VersionNotFound } from '@/features/profiles/components/version-not-found';
import { VersionResults } from '@/features/profiles/components/version-results';
import { WhatToTry } from '@/features/profiles/components/what-to-try';
import { EngineDetails } from '@/components/ui/engine-details';
import { VersionReportLink } from '@/features/reports/components/report-links';
import { formatDateTime } from '@/lib/format';

// A message handed over by the page that navigated here (e.g. "Version 3 is training.").
const handedOverSchema = z.object({
  announcement: z.object({ tone: z.enum(['success', 'error']), text: z.string() }),
});

/** /clients/:clientId/profiles/:versionId — one version: status, progress, results and the next step. */
export const ProfileVersionRoute = () => {
  const { clientId = '', versionId = '' } = useParams();
  const location = useLocation();
  const me = useMe();
  const client = useClient(clientId);
  const version = useProfileVersion(versionId);
  // Trials exist only for versions with a model; the carer's sign-off waits for one.
  const trials = useTrials(version.data && hasModel(version.data) ? versionId : null);
  const [handedOver] = useState(() => handedOverSchema.safeParse(location.state).data?.announcement ?? null);
  const [announcement, setAnnouncement] = useState<Announcement>(null);
  // Editing a draft: the new-version form, filled from the draft, in place of the actions.
  const [editing, setEditing] = useState(false);
  const samples = useQuery({ ...samplesQueryOptions(clientId), enabled: editing });
  const announce = (tone: 'success' | 'error', text: string) => setAnnouncement({ tone, text });
  const role: Role = me.data?.role ?? 'carer';
  const back = (
    <Link
      to={clientPath(clientId, 'profiles')}
      className="inline-flex min-h-11 items-center font-bold underline"
    >
      Back to the profile versions
    </Link>
  );

  if (version.isPending) return <PageLoading />;
  if (version.isError) return <VersionNotFound error={version.error} back={back} />;

  const data = version.data;
  const report = readReport(data.metrics);
  const pseudonym = client.data?.pseudonym ?? 'the client';
  return (
    <>
      <PageHeader
        title={`Version ${data.number} of ${pseudonym}’s profile`}
        description={
          <span className="flex flex-col gap-2">
            <span className="flex flex-wrap items-center gap-3">
              <ProfileStatusBadge status={data.status} />
              <span>
                Created {formatDateTime(data.createdAt)} by {data.createdBy}
              </span>
            </span>
            {data.note && <span>{data.note}</span>}
            {back}
            <VersionReportLink clientId={clientId} version={data} role={role} />
          </span>
        }
      />
      {/* A message from the page before ("Version 3 is training.") holds only until the version moves on. */}
      <LiveRegion
        message={announcement ?? (data.status === 'training' || data.status === 'draft' ? handedOver : null)}
      />
      <div className="flex flex-col gap-10">
        {!editing && (
          <VersionActions
            role={role}
            version={data}
            announce={announce}
            trialCount={trials.data?.length ?? null}
            keyboardHref={keyboardPath(clientId, data.id)}
            onEdit={() => {
              setEditing(true);
              setTimeout(() => document.getElementById('edit-draft-heading')?.focus(), 0);
            }}
          />
        )}
        {editing && data.status === 'draft' && (
          <section aria-labelledby="edit-draft-heading" className="flex flex-col gap-4">
            <h2 id="edit-draft-heading" tabIndex={-1} className="text-2xl font-bold">
              Edit draft version {data.number}
            </h2>
            {client.data && samples.data ? (
              <NewVersionForm
                clientId={clientId}
                draft={data}
                samples={samples.data.filter((sample) => sample.status === 'ready')}
                access={{
                  method: client.data.accessMethod,
                  scanIntervalMs: client.data.scanIntervalMs,
                  dwellMs: client.data.dwellMs,
                  keyTimeMs: client.data.keyTimeMs,
                }}
                onCancel={() => {
                  setEditing(false);
                  setTimeout(() => document.getElementById('edit-draft-button')?.focus(), 0);
                }}
                onSaved={(saved) => {
                  setEditing(false);
                  announce('success', `Draft version ${saved.number} was saved.`);
                  // Focus goes to what changed: the settings and samples.
                  setTimeout(() => document.getElementById('settings-heading')?.focus(), 0);
                }}
              />
            ) : (
              <PageLoading />
            )}
          </section>
        )}

        {data.status === 'training' && (
          <section aria-labelledby="progress-heading" className="flex flex-col gap-3">
            <h2 id="progress-heading" className="text-2xl font-bold">
              Training
            </h2>
            <TrainingProgress version={data} />
          </section>
        )}
        {data.status === 'failed' && (
          <Alert tone="error" title="Training did not finish.">
            <p>{data.error ?? 'No reason was recorded.'}</p>
            {role === 'clinician' && (
              <p>Retry training, or create a new version with other settings or samples.</p>
            )}
          </Alert>
        )}
        {data.status === 'sent_back' && (
          <Alert tone="info" title="A supervisor sent this version back.">
            <p>
              {[...data.history].reverse().find((event) => event.status === 'sent_back')?.comment ??
                'No reason was given.'}
            </p>
            {role === 'clinician' && (
              <p>A version never changes once trained: configure a new version to act on it.</p>
            )}
          </Alert>
        )}
        {data.status === 'draft' && (
          <div className="flex max-w-3xl flex-col gap-2 text-lg">
            <p>This version is configured but has not been trained yet.</p>
            {/* e.g. "Cancelled by …" after a cancelled job. */}
            {data.error && <p className="text-ink-soft">{data.error}</p>}
          </div>
        )}

        {data.baseOnly && <BaseOnlyNote />}
        {report && role === 'carer' && <WhatToTry report={report} versionNumber={data.number} />}
        {report && role !== 'carer' && (
          <section aria-labelledby="results-heading" className="flex flex-col gap-6">
            <h2 id="results-heading" className="text-3xl font-bold">
              Results
            </h2>
            {report.vocabulary && (
              <p className="text-lg">
                Trained with {count(report.vocabulary.added)} added and {count(report.vocabulary.blocked)}{' '}
                blocked {report.vocabulary.blocked === 1 ? 'word' : 'words'}.
              </p>
            )}
            <VersionResults report={report} />
          </section>
        )}
        {role !== 'carer' && (
          <Link
            to={vocabularyPath(clientId, data.id)}
            className="inline-flex min-h-11 w-fit items-center text-lg font-bold underline"
          >
            Vocabulary of version {data.number}: words, added and blocked words, files for the device
          </Link>
        )}
        {!report && data.metrics && (
          <Alert tone="error" title="The results of this version cannot be shown.">
            <p>They are stored in a form this page does not recognise.</p>
          </Alert>
        )}

        {hasModel(data) && (
          <section aria-labelledby="trials-heading" className="flex flex-col gap-3">
            <h2 id="trials-heading" className="text-2xl font-bold">
              Trials
            </h2>
            {role !== 'supervisor' && takesTrials(data) && (
              <Link
                to={keyboardPath(clientId, data.id)}
                className="inline-flex min-h-11 w-fit items-center font-bold underline"
              >
                Try version {data.number} on the test keyboard
              </Link>
            )}
            <TrialHistory versionId={data.id} versionNumber={data.number} />
          </section>
        )}

        <section aria-labelledby="settings-heading" className="flex flex-col gap-3">
          <h2 id="settings-heading" tabIndex={-1} className="text-2xl font-bold">
            Settings and samples
          </h2>
          <dl className="grid max-w-2xl grid-cols-[auto_1fr] gap-x-6 gap-y-1">
            <dt className="font-bold">Suggestion slots</dt>
            <dd>{data.settings.slots}</dd>
            <dt className="font-bold">Weight of general English</dt>
            <dd>
              {data.baseOnly
                ? '1 (general English alone)'
                : data.settings.baseWeight === 'auto'
                  ? 'Automatic'
                  : data.settings.baseWeight}
            </dd>
            <dt className="font-bold">Capitals</dt>
            <dd>{data.settings.caseFold ? 'Ignored' : 'Kept'}</dd>
          </dl>
          {data.baseOnly ? (
            <p>No samples: general English only.</p>
          ) : (
            <ul aria-label="Samples in this version" className="list-disc pl-6">
              {data.samples.map((sample) => (
                <li key={sample.id}>
                  {sample.title} ({sample.characters.toLocaleString('en-GB')} characters)
                </li>
              ))}
            </ul>
          )}
          {/* A base-only version has no personal model; carers see no engine settings. */}
          {!data.baseOnly && role !== 'carer' && (
            <EngineDetails description="How the model of the client’s writing is built.">
              <dl className="grid max-w-2xl grid-cols-[auto_1fr] gap-x-6 gap-y-1">
                <dt className="font-bold">Context order</dt>
                <dd>{data.settings.order} (letters the model looks back)</dd>
                <dt className="font-bold">Escape method</dt>
                <dd>{data.settings.escape} (how it falls back to shorter contexts)</dd>
                <dt className="font-bold">Exclusion</dt>
                <dd>{data.settings.exclusion ? 'On' : 'Off'}</dd>
              </dl>
            </EngineDetails>
          )}
        </section>

        <section aria-labelledby="history-heading" className="flex flex-col gap-3">
          <h2 id="history-heading" className="text-2xl font-bold">
            History
          </h2>
          <VersionHistory history={data.history} />
        </section>

        {role !== 'carer' && <VerifyExportPanel />}
      </div>
    </>
  );
};
