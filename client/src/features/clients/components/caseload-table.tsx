import { accessMethodLabels, type ClientSummary } from '@keyloom/shared';
import { type ReactNode, useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { fieldClasses } from '@/components/ui/field-classes';
import {
  ColumnHeader,
  RowHeader,
  SortableColumnHeader,
  type SortDirection,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { clientPath } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import { type CaseloadSortKey, filterAndSortClients } from '../lib/caseload-sort';
import { ConsentStatusBadge } from './consent-status-badge';

type CaseloadTableProps = {
  clients: readonly ClientSummary[];
  caption: string;
  /** Show the owning clinician (supervisors see the whole clinic). */
  showClinician?: boolean;
  /** Whether each pseudonym links to the client page (admins have none). */
  linkToClient?: boolean;
  /** Extra cell at the end of each row, e.g. carer assignment controls. */
  rowAction?: { label: string; render: (client: ClientSummary) => ReactNode };
};

/** The caseload: search by pseudonym, sort by any column; rows become cards on narrow screens. */
export const CaseloadTable = ({
  clients,
  caption,
  showClinician = false,
  linkToClient = true,
  rowAction,
}: CaseloadTableProps) => {
  const searchId = useId();
  const [search, setSearch] = useState('');
  const [sort, setSort] = useState<{ key: CaseloadSortKey; direction: SortDirection }>({
    key: 'pseudonym',
    direction: 'ascending',
  });
  const rows = filterAndSortClients(clients, search, sort.key, sort.direction);

  const sortBy = (key: CaseloadSortKey) =>
    setSort((current) =>
      current.key === key
        ? { key, direction: current.direction === 'ascending' ? 'descending' : 'ascending' }
        : // The most recent change first is what people look for.
          { key, direction: key === 'updatedAt' ? 'descending' : 'ascending' },
    );
  const header = (key: CaseloadSortKey, label: string) => (
    <SortableColumnHeader direction={sort.key === key ? sort.direction : null} onSort={() => sortBy(key)}>
      {label}
    </SortableColumnHeader>
  );

  return (
    <div className="flex flex-col gap-4">
      <div className="flex max-w-md flex-col gap-1">
        <label htmlFor={searchId} className="font-bold">
          Search by pseudonym
        </label>
        <input
          id={searchId}
          type="search"
          value={search}
          onChange={(event) => setSearch(event.target.value)}
          className={fieldClasses(false)}
          autoComplete="off"
          spellCheck={false}
        />
      </div>
      <p aria-live="polite" className="text-ink-soft">
        {search.trim() ? `${rows.length} of ${clients.length} clients match “${search.trim()}”.` : ''}
      </p>
      <Table caption={`${caption} (${rows.length})`}>
        <TableHead>
          {header('pseudonym', 'Pseudonym')}
          {header('accessMethod', 'Access method')}
          {header('consentStatus', 'Consent')}
          {header('sampleCount', 'Samples')}
          {header('updatedAt', 'Last change')}
          {showClinician && <ColumnHeader>Clinician</ColumnHeader>}
          {rowAction && <ColumnHeader>{rowAction.label}</ColumnHeader>}
        </TableHead>
        <TableBody>
          {rows.map((client) => (
            <TableRow key={client.id}>
              <RowHeader label="Pseudonym">
                {linkToClient ? (
                  <Link to={clientPath(client.id)} className="inline-flex min-h-11 items-center underline">
                    {client.pseudonym}
                  </Link>
                ) : (
                  <span>{client.pseudonym}</span>
                )}
              </RowHeader>
              <TableCell label="Access method">{accessMethodLabels[client.accessMethod]}</TableCell>
              <TableCell label="Consent">
                <ConsentStatusBadge status={client.consentStatus} />
              </TableCell>
              <TableCell label="Samples">{client.sampleCount}</TableCell>
              <TableCell label="Last change">
                <time dateTime={client.updatedAt}>{formatDateTime(client.updatedAt)}</time>
              </TableCell>
              {showClinician && <TableCell label="Clinician">{client.clinician.name}</TableCell>}
              {rowAction && <TableCell label={rowAction.label}>{rowAction.render(client)}</TableCell>}
            </TableRow>
          ))}
        </TableBody>
      </Table>
    </div>
  );
};
