import { type SampleSummary, sourceKindLabels } from '@keyloom/shared';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
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
import { formatDateRange, formatDateTime } from '@/lib/format';
import { sampleLinkId } from '../lib/focus-targets';
import { SampleStatusBadge } from './sample-status-badge';

const period = (sample: SampleSummary) => formatDateRange(sample.periodStart, sample.periodEnd);

type SamplesTableProps = {
  samples: readonly SampleSummary[];
  /** Row actions for the owning clinician: delete, and include again while left out. */
  actions?: {
    onDelete: (sample: SampleSummary) => void;
    onInclude: (sample: SampleSummary) => void;
    busy: boolean;
    /** Why a sample cannot be deleted (a version was trained on it); null while it can, or while unknown. */
    deleteBlocked?: (sample: SampleSummary) => string | null;
  };
};

/** A row's "Delete sample…": switched off, saying why, once a version was trained on the sample. */
const DeleteButton = ({
  sample,
  actions,
}: {
  sample: SampleSummary;
  actions: NonNullable<SamplesTableProps['actions']>;
}) => {
  const blocked = actions.deleteBlocked?.(sample) ?? null;
  const reasonId = `delete-blocked-${sample.id}`;
  return (
    <>
      <Button
        variant="danger"
        disabled={blocked !== null}
        aria-describedby={blocked ? reasonId : undefined}
        onClick={() => actions.onDelete(sample)}
        aria-label={`Delete sample ${sample.title}`}
      >
        Delete sample…
      </Button>
      {blocked && (
        <p id={reasonId} className="text-ink-soft">
          {blocked}
        </p>
      )}
    </>
  );
};

/** A client's samples, newest first, each linking to its review page. */
export const SamplesTable = ({ samples, actions }: SamplesTableProps) => (
  <Table caption={`Language samples (${samples.length})`}>
    <TableHead>
      <ColumnHeader>Sample</ColumnHeader>
      <ColumnHeader>Status</ColumnHeader>
      <ColumnHeader>Open flags</ColumnHeader>
      <ColumnHeader>Source</ColumnHeader>
      <ColumnHeader>Period</ColumnHeader>
      <ColumnHeader>Words</ColumnHeader>
      <ColumnHeader>Added</ColumnHeader>
      {actions && <ColumnHeader>Actions</ColumnHeader>}
    </TableHead>
    <TableBody>
      {[...samples]
        .sort((a, b) => b.createdAt.localeCompare(a.createdAt))
        .map((sample) => (
          <TableRow key={sample.id}>
            <RowHeader label="Sample">
              <Link
                id={sampleLinkId(sample.id)}
                to={samplePath(sample.clientId, sample.id)}
                className="inline-flex min-h-11 items-center break-all underline"
              >
                {sample.title}
              </Link>
            </RowHeader>
            <TableCell label="Status">
              <SampleStatusBadge status={sample.status} />
              {sample.status === 'excluded' && sample.excludedReason && (
                <p className="mt-1 break-words">Reason: {sample.excludedReason}</p>
              )}
            </TableCell>
            <TableCell label="Open flags">{sample.openFlags}</TableCell>
            <TableCell label="Source">{sourceKindLabels[sample.sourceKind]}</TableCell>
            <TableCell label="Period">{period(sample)}</TableCell>
            <TableCell label="Words">{sample.words.toLocaleString('en-GB')}</TableCell>
            <TableCell label="Added">
              <time dateTime={sample.createdAt}>{formatDateTime(sample.createdAt)}</time>
            </TableCell>
            {actions && (
              <TableCell label="Actions">
                <div className="flex flex-wrap gap-2">
                  {sample.status === 'excluded' && (
                    <Button
                      disabled={actions.busy}
                      onClick={() => actions.onInclude(sample)}
                      aria-label={`Include again ${sample.title}`}
                    >
                      Include again
                    </Button>
                  )}
                  <DeleteButton sample={sample} actions={actions} />
                </div>
              </TableCell>
            )}
          </TableRow>
        ))}
    </TableBody>
  </Table>
);
