import type { ProfileVersion, Role } from '@keyloom/shared';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { buttonClasses } from '@/components/ui/button-classes';
import { useCancelProfileVersion } from '../api/cancel-profile-version';
import { useTrainProfileVersion } from '../api/train-profile-version';
import { profileExportUrl } from '../api/verify-profile-export';
import { ApproveDialog, SendBackDialog, SignOffDialog } from './decision-dialogs';
import { visibleActions } from './profile-words';

export type Announce = (tone: 'success' | 'error', text: string) => void;

type Dialog = 'sign-off' | 'approve' | 'send-back' | null;

type VersionActionsProps = { role: Role; version: ProfileVersion; announce: Announce };

/** The buttons of a version's page, and the dialogs they open. */
export const VersionActions = ({ role, version, announce }: VersionActionsProps) => {
  const [dialog, setDialog] = useState<Dialog>(null);
  const train = useTrainProfileVersion();
  const cancel = useCancelProfileVersion();
  const show = visibleActions(role, version.status);
  const fail = (error: unknown) =>
    announce('error', error instanceof Error ? error.message : 'That did not work.');
  const done = (text: string) => () => {
    setDialog(null);
    announce('success', text);
  };

  if (!Object.values(show).some(Boolean)) return null;
  return (
    <div role="group" aria-label="Actions on this version" className="flex flex-wrap gap-3">
      {(show.train || show.retry) && (
        <Button
          variant="primary"
          disabled={train.isPending}
          onClick={() =>
            train.mutate(version.id, {
              onSuccess: () => announce('success', `Training of version ${version.number} has started.`),
              onError: fail,
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
              onSuccess: () => announce('success', `Asked training of version ${version.number} to stop.`),
              onError: fail,
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
        <Button variant="primary" onClick={() => setDialog('sign-off')}>
          Sign off
        </Button>
      )}
      {show.decide && (
        <>
          <Button variant="primary" onClick={() => setDialog('approve')}>
            Approve
          </Button>
          <Button onClick={() => setDialog('send-back')}>Send back</Button>
        </>
      )}
      {show.signOff && (
        <SignOffDialog
          open={dialog === 'sign-off'}
          version={version}
          onClose={() => setDialog(null)}
          onDone={done(`You signed off version ${version.number}. A supervisor will review it.`)}
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
    </div>
  );
};
