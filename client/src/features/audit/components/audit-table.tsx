import type { AuditEventView } from '@keyloom/shared';
import {
  RowHeader,
  ColumnHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { formatDateTime } from '@/lib/format';
import { describeAction, summariseDetails } from '../lib/audit-actions';

// Long addresses may wrap after the "@", never in the middle of a word.
const EmailAddress = ({ email }: { email: string }) => {
  const at = email.indexOf('@');
  if (at < 0) return <span>{email}</span>;
  return (
    <span>
      {email.slice(0, at)}
      <wbr />@{email.slice(at + 1)}
    </span>
  );
};

/** One page of audit events, newest first, each in plain words (the API's sentence). */
export const AuditTable = ({ events, caption }: { events: readonly AuditEventView[]; caption: string }) => (
  <Table caption={caption}>
    <TableHead>
      <ColumnHeader>When</ColumnHeader>
      <ColumnHeader>Who</ColumnHeader>
      <ColumnHeader>Action</ColumnHeader>
      <ColumnHeader>Client</ColumnHeader>
      <ColumnHeader>What happened</ColumnHeader>
    </TableHead>
    <TableBody>
      {events.map((event) => (
        <TableRow key={event.id}>
          <RowHeader label="When" className="font-normal">
            <time dateTime={event.at} className="md:whitespace-nowrap">
              {formatDateTime(event.at)}
            </time>
          </RowHeader>
          <TableCell label="Who" className="md:min-w-48">
            {event.actorName ?? (event.actorEmail ? <EmailAddress email={event.actorEmail} /> : 'Keyloom')}
          </TableCell>
          <TableCell label="Action" className="md:min-w-40">
            <span title={event.action}>{describeAction(event.action)}</span>
          </TableCell>
          <TableCell label="Client">{event.clientPseudonym ?? '—'}</TableCell>
          <TableCell label="What happened" className="break-words">
            <p>{event.sentence}</p>
            {/* The stored details stay in view for checking, below the words. */}
            {Object.keys(event.details).length > 0 && (
              <p className="text-sm text-ink-soft">{summariseDetails(event.details)}</p>
            )}
          </TableCell>
        </TableRow>
      ))}
    </TableBody>
  </Table>
);
