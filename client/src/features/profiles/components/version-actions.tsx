import type { ProfileVersion, Role } from '@keyloom/shared';
import { useQuery } from '@tanstack/react-query';
import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { buttonClasses } from '@/components/ui/button-classes';
import { useCancelProfileVersion } from '../api/cancel-profile-version';
import { useTrainProfileVersion } from '../api/train-profile-version';
import { profileExportUrl } from '../api/verify-profile-export';
import { profileVersionsQueryOptions } from '../api/get-profile-versions';
import {
  ApproveDialog,
  ReportProblemDialog,
  RetireDialog,
  SendBackDialog,
  SignOffDialog,
} from './decision-dialogs';
import { DeleteDraftDialog } from './delete-draft-dialog';
import { activeAfterRetire, visibleActions } from '../lib/profile-words';

export type Announce = (tone: 'success' | 'error', text: string) => void;

type Dialog = 'sign-off' | 'report-problem' | 'approve' | 'send-back' | 'retire' | 'delete' | null;

type VersionActionsProps = {
  role: Role;
  version: ProfileVersion;
  announce: Announce;
  /**
   * Trials logged on the version (null while unknown): a carer signs off or reports a problem only
   * after at least one (the API refuses before).
   */
  trialCount?: number | null;
  /** The test keyboard for this version, offered beside a sign-off that waits for a trial. */
  keyboardHref?: string;
  /** Opens the draft's settings for editing (the page shows the form); no button without it. */
  onEdit?: () => void;
};

/** The buttons of a version's page, and the dialogs they open. */
export const VersionActions = ({
  role,
  version,
  announce,
  trialCount = null,
  keyboardHref,
  onEdit,
}: VersionActionsProps) => {
  const [dialog, setDialog] = useState<Dialog>(null);
  // After a decision the button that opened the dialog may be gone (the version moved on): focus
  // goes to this group, beside the message, instead of the page's start.
  const groupId = useId();
  const train = useTrainProfileVersion();
  const cancel = useCancelProfileVersion();
  const show = visibleActions(role, version.status);
  // The client's versions tell which one becomes active when this one is retired.
  const versions = useQuery({ ...profileVersionsQueryOptions(version.clientId), enabled: show.retire });
  const next = show.retire ? activeAfterRetire(versions.data ?? [], version) : null;
  const fail = (error: unknown) =>
    announce('error', error instanceof Error ? error.message : 'That did not work.');
  const done = (text: string) => () => {
    setDialog(null);
    announce('success', text);
    // With no action left for this role (a carer after signing off), the group is gone: the page's
    // heading takes focus instead, above the message.
    setTimeout(() => (document.getElementById(groupId) ?? document.querySelector('h1'))?.focus(), 0);
  };

  // Train and Cancel are switched off while their request runs, which drops focus to the page: after
  // the answer (started, refused, stopped) it goes to this group, just below the message.
  const settled = (then: () => void) => () => {
    then();
    setTimeout(() => document.getElementById(groupId)?.focus(), 0);
  };

  const needsTrial = show.signOff && (trialCount ?? 0) === 0;

  if (!Object.values(show).some(Boolean)) return null;
  return (
    <div
      id={groupId}
      tabIndex={-1}
      role="group"
      aria-label="Actions on this version"
      className="flex flex-wrap items-center gap-3"
    >
      {(show.train || show.retry) && (
        <Button
          variant="primary"
          disabled={train.isPending}
          onClick={() =>
            train.mutate(version.id, {
              onSuccess: settled(() =>
                announce('success', `Training of version ${version.number} has started.`),
              ),
              onError: (error) => settled(() => fail(error))(),
            })
          }
        >
          {show.retry ? 'Retry training' : 'Train'}
        </Button>
      )}
      {show.cancel && (
        <Button
          variant="danger"
          disabled={cancel.isPending}
          onClick={() =>
            cancel.mutate(version.id, {
              onSuccess: settled(() =>
                announce('success', `Asked training of version ${version.number} to stop.`),
              ),
              onError: (error) => settled(() => fail(error))(),
            })
          }
        >
          Cancel training
        </Button>
      )}
      {show.exportFile && (
        <a href={profileExportUrl(version.id)} download className={buttonClasses('secondary')}>
          Export version {version.number}
        </a>
      )}
      {show.signOff && (
        <>
          <Button
            variant="primary"
            disabled={needsTrial}
            aria-describedby={needsTrial ? 'sign-off-needs-trial' : undefined}
            onClick={() => setDialog('sign-off')}
          >
            Sign off
          </Button>
          <Button
            disabled={needsTrial}
            aria-describedby={needsTrial ? 'sign-off-needs-trial' : undefined}
            onClick={() => setDialog('report-problem')}
          >
            Report a problem
          </Button>
          {needsTrial && (
            <p id="sign-off-needs-trial" className="flex flex-wrap items-center gap-x-3">
              <span>
                {trialCount === null
                  ? 'Checking for trials…'
                  : 'Try this version on the test keyboard first.'}
              </span>
              {keyboardHref && (
                <Link to={keyboardHref} className="inline-flex min-h-11 items-center font-bold underline">
                  Open the test keyboard
                </Link>
              )}
            </p>
          )}
        </>
      )}
      {show.decide && (
        <>
          <Button variant="primary" onClick={() => setDialog('approve')}>
            Approve
          </Button>
          <Button onClick={() => setDialog('send-back')}>Send back</Button>
        </>
      )}
      {show.retire && (
        <Button variant="danger" disabled={versions.isPending} onClick={() => setDialog('retire')}>
          Retire this version
        </Button>
      )}
      {show.deleteDraft && onEdit && (
        <Button id="edit-draft-button" onClick={onEdit}>
          Edit draft
        </Button>
      )}
      {show.deleteDraft && (
        <Button variant="danger" onClick={() => setDialog('delete')}>
          Delete draft
        </Button>
      )}
      {show.signOff && (
        <SignOffDialog
          open={dialog === 'sign-off'}
          version={version}
          onClose={() => setDialog(null)}
          onDone={done(`You signed off version ${version.number}. A supervisor will review it.`)}
        />
      )}
      {show.signOff && (
        <ReportProblemDialog
          open={dialog === 'report-problem'}
          version={version}
          onClose={() => setDialog(null)}
          onDone={done(
            `You reported a problem with version ${version.number}. It went back to the clinician.`,
          )}
        />
      )}
      {show.decide && (
        <>
          <ApproveDialog
            open={dialog === 'approve'}
            version={version}
            onClose={() => setDialog(null)}
            onDone={done(`Version ${version.number} is now the active profile.`)}
          />
          <SendBackDialog
            open={dialog === 'send-back'}
            version={version}
            onClose={() => setDialog(null)}
            onDone={done(`Version ${version.number} was sent back to the clinician.`)}
          />
        </>
      )}
      {show.retire && (
        <RetireDialog
          open={dialog === 'retire'}
          version={version}
          next={next}
          onClose={() => setDialog(null)}
          onDone={done(
            next
              ? `Version ${version.number} is retired; version ${next.number} is the active profile again.`
              : `Version ${version.number} is retired; no version is active.`,
          )}
        />
      )}
      {show.deleteDraft && (
        <DeleteDraftDialog open={dialog === 'delete'} version={version} onClose={() => setDialog(null)} />
      )}
    </div>
  );
};
