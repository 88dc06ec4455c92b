import type { Trial } from '@keyloom/shared';
import { LoadError } from '@/components/ui/load-error';
import { LoadingState } from '@/components/ui/loading-state';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { formatDateTime } from '@/lib/format';
import { useTrials } from '../api/get-trials';
import { selectionModeShort, percentOrDash, wpmOrDash } from '../logic/trial-figures';

const roleWords: Record<string, string> = { carer: 'carer', clinician: 'clinician' };

/** One version's trials as a table: measured figures beside the version's simulated ones. */
export const TrialsTable = ({ trials, caption }: { trials: readonly Trial[]; caption: string }) => (
  <Table caption={caption}>
    <TableHead>
      <ColumnHeader>Date</ColumnHeader>
      <ColumnHeader>By</ColumnHeader>
      <ColumnHeader>Method</ColumnHeader>
      <ColumnHeader>Characters</ColumnHeader>
      <ColumnHeader>Keystrokes</ColumnHeader>
      <ColumnHeader>Keystroke savings, measured (simulated)</ColumnHeader>
      <ColumnHeader>Words per minute, measured (estimated)</ColumnHeader>
      <ColumnHeader>Error rate</ColumnHeader>
    </TableHead>
    <TableBody>
      {trials.map((trial) => (
        <TableRow key={trial.id}>
          <RowHeader label="Date">{formatDateTime(trial.finishedAt)}</RowHeader>
          <TableCell label="By">
            {trial.by.name}
            {roleWords[trial.by.role] && (
              <span className="block text-ink-soft">{roleWords[trial.by.role]}</span>
            )}
          </TableCell>
          <TableCell label="Method">
            {selectionModeShort[trial.settings.selectionMode]}
            {trial.settings.selectionMode === 'scanning' && (
              <span className="block text-ink-soft">{trial.measures.switchActivations} switch presses</span>
            )}
          </TableCell>
          <TableCell label="Characters">{trial.measures.characters}</TableCell>
          <TableCell label="Keystrokes">{trial.measures.keystrokes}</TableCell>
          <TableCell label="Keystroke savings, measured (simulated)">
            {percentOrDash(trial.measures.keystrokeSavings)} (
            {percentOrDash(trial.simulated.keystrokeSavings)} at {trial.simulated.slots} slots)
          </TableCell>
          <TableCell label="Words per minute, measured (estimated)">
            {wpmOrDash(trial.measures.wpm)} ({wpmOrDash(trial.simulated.wpm)})
          </TableCell>
          <TableCell label="Error rate">{percentOrDash(trial.measures.errorRate)}</TableCell>
        </TableRow>
      ))}
    </TableBody>
  </Table>
);

type TrialHistoryProps = {
  versionId: string;
  versionNumber: number;
};

/** The trial history of one version, loaded from the API, with its empty and error states. */
export const TrialHistory = ({ versionId, versionNumber }: TrialHistoryProps) => {
  const trials = useTrials(versionId);
  if (trials.isPending) return <LoadingState label="Loading the trials…" />;
  if (trials.isError) {
    return (
      <LoadError
        title="The trials could not be loaded."
        error={trials.error}
        onRetry={() => void trials.refetch()}
      />
    );
  }
  if (trials.data.length === 0) {
    return (
      <p className="text-lg" data-trial-count="0">
        No trials of version {versionNumber} yet. Each trial on the test keyboard is listed here with what it
        measured.
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <TrialsTable trials={trials.data} caption={`Trials of version ${versionNumber}, newest first`} />
      <p className="max-w-3xl text-ink-soft">
        Keystroke savings are not time savings: reading the suggestions costs time too. The figures in
        brackets are the version’s simulated ones.
      </p>
    </div>
  );
};
