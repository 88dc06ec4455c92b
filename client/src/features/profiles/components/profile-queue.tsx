import type { ClientSummary, ProfileVersionStatus } from '@keyloom/shared';
import { Link } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
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
import { keyboardPath, profileVersionPath } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import { useProfileQueue } from '../api/get-review-queue';
import { atSlots, hitRateText, percent, readReport } from '../lib/profile-report';

type ProfileQueueProps = {
  clients: readonly Pick<ClientSummary, 'id' | 'pseudonym'>[];
  /** signed_off for the supervisor's reviews, trained for the carer's try-outs. */
  status: ProfileVersionStatus;
  caption: string;
  emptyTitle: string;
  emptyText: string;
};

/**
 * What a carer's list shows instead of the engine's figures: what to try. Bits per character and the
 * simulated savings are for the clinician and supervisor; a carer's trial measures the version.
 */
const forCarer = (status: ProfileVersionStatus) => status === 'trained';

/** The versions waiting for the reader's step, oldest first, each linking to its page. */
export const ProfileQueue = ({ clients, status, caption, emptyTitle, emptyText }: ProfileQueueProps) => {
  const queue = useProfileQueue(clients, status);
  if (queue.isPending) return <LoadingState label="Loading the versions waiting for you…" />;
  if (queue.error) {
    return (
      <div role="alert">
        <Alert tone="error" title="The versions waiting for you could not be loaded.">
          <p>{queue.error.message}</p>
          <Button className="mt-3" onClick={queue.refetch}>
            Try again
          </Button>
        </Alert>
      </div>
    );
  }
  if (queue.items.length === 0) return <EmptyState title={emptyTitle}>{emptyText}</EmptyState>;
  const carer = forCarer(status);
  return (
    <Table caption={caption}>
      <TableHead>
        <ColumnHeader>Client</ColumnHeader>
        <ColumnHeader>Version</ColumnHeader>
        <ColumnHeader>Waiting since</ColumnHeader>
        {carer ? (
          <>
            <ColumnHeader>Suggestions offered</ColumnHeader>
            <ColumnHeader>What to try</ColumnHeader>
          </>
        ) : (
          <>
            <ColumnHeader>Keystroke savings</ColumnHeader>
            <ColumnHeader>Hit rate</ColumnHeader>
          </>
        )}
      </TableHead>
      <TableBody>
        {queue.items.map(({ client, version }) => {
          const report = readReport(version.metrics);
          const since = version.history.at(-1)?.at ?? version.createdAt;
          return (
            <TableRow key={version.id}>
              <RowHeader label="Client">{client.pseudonym}</RowHeader>
              <TableCell label="Version">
                <Link
                  to={profileVersionPath(client.id, version.id)}
                  aria-label={`Version ${version.number} of ${client.pseudonym}`}
                  className="font-bold underline"
                >
                  Version {version.number}
                </Link>
              </TableCell>
              <TableCell label="Waiting since">{formatDateTime(since)}</TableCell>
              {carer ? (
                <>
                  <TableCell label="Suggestions offered">
                    {version.settings.slots} words at a time
                    {version.baseOnly ? ', general English only' : ''}
                  </TableCell>
                  <TableCell label="What to try">
                    <Link to={keyboardPath(client.id, version.id)} className="font-bold underline">
                      Try version {version.number} on the test keyboard
                    </Link>
                  </TableCell>
                </>
              ) : (
                <>
                  <TableCell label="Keystroke savings">
                    {report
                      ? `${percent(atSlots(report.keystrokeSavings, version.settings.slots))} at ${version.settings.slots} slots`
                      : '—'}
                  </TableCell>
                  <TableCell label="Hit rate">
                    {report ? hitRateText(report, version.settings.slots) : '—'}
                  </TableCell>
                </>
              )}
            </TableRow>
          );
        })}
      </TableBody>
    </Table>
  );
};
