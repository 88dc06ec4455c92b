import { type SampleSummary, sourceKindLabels } from '@keyloom/shared';
import { Link } from 'react-router-dom';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { samplePath } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import { SampleStatusBadge } from './sample-status-badge';

const period = (sample: SampleSummary) =>
  sample.periodStart || sample.periodEnd ? `${sample.periodStart ?? '…'} to ${sample.periodEnd ?? '…'}` : '—';

/** A client's samples, newest first, each linking to its review page. */
export const SamplesTable = ({ samples }: { samples: readonly SampleSummary[] }) => (
  <Table caption={`Language samples (${samples.length})`}>
    <TableHead>
      <ColumnHeader>Sample</ColumnHeader>
      <ColumnHeader>Status</ColumnHeader>
      <ColumnHeader>Open flags</ColumnHeader>
      <ColumnHeader>Source</ColumnHeader>
      <ColumnHeader>Period</ColumnHeader>
      <ColumnHeader>Words</ColumnHeader>
      <ColumnHeader>Added</ColumnHeader>
    </TableHead>
    <TableBody>
      {[...samples]
        .sort((a, b) => b.createdAt.localeCompare(a.createdAt))
        .map((sample) => (
          <TableRow key={sample.id}>
            <RowHeader label="Sample">
              <Link
                to={samplePath(sample.clientId, sample.id)}
                className="inline-flex min-h-11 items-center break-all underline"
              >
                {sample.title}
              </Link>
            </RowHeader>
            <TableCell label="Status">
              <SampleStatusBadge status={sample.status} />
            </TableCell>
            <TableCell label="Open flags">{sample.openFlags}</TableCell>
            <TableCell label="Source">{sourceKindLabels[sample.sourceKind]}</TableCell>
            <TableCell label="Period">{period(sample)}</TableCell>
            <TableCell label="Words">{sample.words.toLocaleString('en-GB')}</TableCell>
            <TableCell label="Added">
              <time dateTime={sample.createdAt}>{formatDateTime(sample.createdAt)}</time>
            </TableCell>
          </TableRow>
        ))}
    </TableBody>
  </Table>
);
