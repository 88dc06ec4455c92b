import type { ProfileVersion, Role } from '@keyloom/shared';
import { useEffect, useRef, useState } from 'react';
import { Link, useLocation, useNavigate } from 'react-router-dom';
import { z } from 'zod';
import { PageLoading } from '@/components/layout/page-loading';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { LiveRegion } from '@/components/ui/live-region';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { keyboardPath, profileComparePath, profileVersionPath } from '@/config/paths';
import { takesTrials } from '@/features/keyboard/logic/keyboard-versions';
import { formatDateTime } from '@/lib/format';
import { useProfileVersions } from '../api/get-profile-versions';
import { BaseOnlyBadge } from './base-only-badge';
import { type AccessDefaults, NewVersionForm, type TrainableSample } from './new-version-form';

// A base-only version has no writing of the client's held out to measure it on.
const NOT_MEASURED = 'Not measured (trial only)';
import { ProfileStatusBadge } from './profile-status-badge';
import { atSlots, hitRateText, percent, readReport } from '../lib/profile-report';

type ProfilesPanelProps = {
  clientId: string;
  pseudonym: string;
  role: Role;
  trainingConsent: boolean;
  /** Ready samples (clinicians only; others do not configure versions). */
  samples: readonly TrainableSample[];
  access: AccessDefaults;
};

const VersionRow = ({
  clientId,
  version,
  selected,
  onToggle,
  carer,
}: {
  clientId: string;
  version: ProfileVersion;
  selected: boolean;
  onToggle: () => void;
  /** A carer's row: what to try instead of the measures, and no comparing. */
  carer: boolean;
}) => {
  const report = readReport(version.metrics);
  const slots = version.settings.slots;
  return (
    <TableRow>
      {!carer && (
        <TableCell label="Compare">
          <input
            type="checkbox"
            className="size-6 accent-ink"
            checked={selected}
            disabled={!report}
            onChange={onToggle}
            aria-label={`Compare version ${version.number}`}
          />
        </TableCell>
      )}
      <RowHeader label="Version">
        <Link to={profileVersionPath(clientId, version.id)} className="font-bold underline">
          Version {version.number}
        </Link>
        {version.baseOnly && (
          <span className="mt-1 block">
            <BaseOnlyBadge />
          </span>
        )}
        {version.note && <span className="block font-normal text-ink-soft">{version.note}</span>}
      </RowHeader>
      <TableCell label="Status">
        <ProfileStatusBadge status={version.status} />
      </TableCell>
      <TableCell label="Created">{formatDateTime(version.createdAt)}</TableCell>
      {carer ? (
        <TableCell label="What to try">
          {takesTrials(version) ? (
            <Link to={keyboardPath(clientId, version.id)} className="font-bold underline">
              Try version {version.number} on the test keyboard
            </Link>
          ) : (
            'Nothing to try now'
          )}
        </TableCell>
      ) : (
        <>
          <TableCell label="Keystroke savings">
            {report
              ? `${percent(atSlots(report.keystrokeSavings, slots))} at ${slots} slots`
              : version.baseOnly
                ? NOT_MEASURED
                : '—'}
          </TableCell>
          <TableCell label="Hit rate">
            {report ? hitRateText(report, slots) : version.baseOnly ? NOT_MEASURED : '—'}
          </TableCell>
        </>
      )}
    </TableRow>
  );
};

const deletedStateSchema = z.object({ versionDeleted: z.number().int() });

/** The "Profile versions" tab: the versions with their headline figures, compare, and a new version. */
export const ProfilesPanel = ({
  clientId,
  pseudonym,
  role,
  trainingConsent,
  samples,
  access,
}: ProfilesPanelProps) => {
  const versions = useProfileVersions(clientId);
  const navigate = useNavigate();
  const location = useLocation();
  // A draft deleted on its page: say so, and put focus on the list it was removed from.
  const [deleted] = useState(() => deletedStateSchema.safeParse(location.state).data?.versionDeleted ?? null);
  const listStart = useRef<HTMLElement | null>(null);
  const loaded = versions.isSuccess;
  useEffect(() => {
    if (deleted !== null && loaded) listStart.current?.focus();
  }, [deleted, loaded]);
  const [creating, setCreating] = useState(false);
  const newVersionButton = useRef<HTMLButtonElement | null>(null);
  const [chosen, setChosen] = useState<string[]>([]);
  const owner = role === 'clinician';
  const toggle = (id: string) =>
    setChosen((now) => (now.includes(id) ? now.filter((other) => other !== id) : [...now, id]));

  return (
    <div className="flex flex-col gap-8">
      <LiveRegion
        message={deleted === null ? null : { tone: 'success', text: `Draft version ${deleted} was deleted.` }}
      />
      <Alert tone="info" title="Suggestions are offered, never inserted.">
        <p>
          A profile only changes which words {pseudonym} is offered; every word is still chosen by {pseudonym}
          . The clinical decision to use a profile rests with the licensed clinician.
        </p>
      </Alert>

      {owner && !creating && (
        <div className="flex flex-col gap-2">
          <Button
            ref={(node) => {
              newVersionButton.current = node;
              if (versions.data?.length === 0) listStart.current = node;
            }}
            variant="primary"
            className="self-start"
            disabled={!trainingConsent}
            aria-describedby={
              !trainingConsent
                ? 'new-version-blocked'
                : samples.length === 0
                  ? 'new-version-base-only'
                  : undefined
            }
            onClick={() => {
              setCreating(true);
              // Focus goes to the form it opened, so keyboard and screen-reader users start there.
              requestAnimationFrame(() => document.getElementById('new-version-heading')?.focus());
            }}
          >
            New version
          </Button>
          {!trainingConsent && (
            <p id="new-version-blocked">{pseudonym} has no active consent for model training.</p>
          )}
          {trainingConsent && samples.length === 0 && (
            <p id="new-version-base-only">
              No sample is ready yet, so a new version can only use general English (base-only). Review the
              writing samples for a personal version.
            </p>
          )}
        </div>
      )}
      {owner && creating && (
        <section aria-labelledby="new-version-heading" className="flex flex-col gap-4">
          <h3 id="new-version-heading" tabIndex={-1} className="text-2xl font-bold">
            New profile version
          </h3>
          <NewVersionForm
            clientId={clientId}
            samples={samples}
            access={access}
            latestVersionId={
              versions.data?.reduce<ProfileVersion | null>(
                (latest, version) => (!latest || version.number > latest.number ? version : latest),
                null,
              )?.id ?? null
            }
            onCancel={() => {
              setCreating(false);
              requestAnimationFrame(() => newVersionButton.current?.focus());
            }}
            onStarted={(version, trainError) => {
              setCreating(false);
              // The version's page shows this message (this tab's live region goes away).
              const announcement = trainError
                ? {
                    tone: 'error',
                    text: `Version ${version.number} was saved but not started: ${trainError}`,
                  }
                : { tone: 'success', text: `Version ${version.number} is training.` };
              void navigate(profileVersionPath(clientId, version.id), { state: { announcement } });
            }}
          />
        </section>
      )}

      {versions.isPending && <PageLoading />}
      {versions.isError && (
        <div role="alert">
          <Alert tone="error" title="The profile versions could not be loaded.">
            <p>{versions.error.message}</p>
          </Alert>
        </div>
      )}
      {versions.isSuccess && versions.data.length === 0 && (
        <EmptyState title="No profile versions yet.">
          {owner
            ? 'Choose “New version” to train a personal prediction profile from the ready samples.'
            : 'The clinician has not trained a profile for this client yet.'}
        </EmptyState>
      )}
      {versions.isSuccess && versions.data.length > 0 && (
        <section aria-labelledby="versions-heading" className="flex flex-col gap-4">
          <div className="flex flex-wrap items-center justify-between gap-3">
            <h3
              id="versions-heading"
              ref={(node) => void (listStart.current = node)}
              tabIndex={-1}
              className="text-2xl font-bold"
            >
              Versions
            </h3>
            {role !== 'carer' && (
              <Button
                disabled={chosen.length < 2}
                aria-describedby="compare-hint"
                onClick={() => void navigate(profileComparePath(clientId, chosen))}
              >
                Compare {chosen.length >= 2 ? `${chosen.length} versions` : 'selected'}
              </Button>
            )}
          </div>
          {role !== 'carer' && (
            <p id="compare-hint" className="text-ink-soft">
              Tick two or more trained versions to compare them side by side.
            </p>
          )}
          <Table caption={`Profile versions of ${pseudonym}`}>
            <TableHead>
              {role !== 'carer' && <ColumnHeader>Compare</ColumnHeader>}
              <ColumnHeader>Version</ColumnHeader>
              <ColumnHeader>Status</ColumnHeader>
              <ColumnHeader>Created</ColumnHeader>
              {role === 'carer' ? (
                <ColumnHeader>What to try</ColumnHeader>
              ) : (
                <>
                  <ColumnHeader>Keystroke savings</ColumnHeader>
                  <ColumnHeader>Hit rate</ColumnHeader>
                </>
              )}
            </TableHead>
            <TableBody>
              {versions.data.map((version) => (
                <VersionRow
                  key={version.id}
                  clientId={clientId}
                  version={version}
                  selected={chosen.includes(version.id)}
                  onToggle={() => toggle(version.id)}
                  carer={role === 'carer'}
                />
              ))}
            </TableBody>
          </Table>
        </section>
      )}
    </div>
  );
};
