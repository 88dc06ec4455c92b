import { useSearchParams } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { Button } from '@/components/ui/button';
import { buttonClasses } from '@/components/ui/button-classes';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { PageHeader } from '@/components/ui/page-header';
import type { SelectOption } from '@/components/ui/select-field';
import { auditCsvUrl, type AuditFilters, auditQueryString, useAudit } from '@/features/audit/api/get-audit';
import { AuditFilterForm } from '@/features/audit/components/audit-filter-form';
import { AuditTable } from '@/features/audit/components/audit-table';
import { useMe } from '@/features/auth/api/get-me';
import { useClients } from '@/features/clients/api/get-clients';
import { useUsers } from '@/features/staff/api/get-users';

const PAGE_SIZE = 50;

const filtersFrom = (params: URLSearchParams): AuditFilters => {
  const page = Number(params.get('page') ?? '1');
  return {
    clientId: params.get('clientId') ?? '',
    userId: params.get('userId') ?? '',
    action: params.get('action') ?? '',
    from: params.get('from') ?? '',
    to: params.get('to') ?? '',
    page: Number.isInteger(page) && page > 0 ? page : 1,
  };
};

/** /audit — who did what, when, on which client; filters live in the address so a view can be shared. */
export const AuditRoute = () => {
  const [params, setParams] = useSearchParams();
  const filters = filtersFrom(params);
  const me = useMe();
  const audit = useAudit(filters);
  const clients = useClients();
  // Only admins may list staff accounts; supervisors choose among the people on the page.
  const users = useUsers({ enabled: me.data?.role === 'admin' });

  const apply = (next: AuditFilters) => setParams(new URLSearchParams(auditQueryString(next)));

  const clientOptions: SelectOption[] = (clients.data ?? [])
    .map((client) => ({ value: client.id, label: client.pseudonym }))
    .sort((a, b) => a.label.localeCompare(b.label, 'en'));
  const people = new Map<string, string>();
  for (const user of users.data ?? []) people.set(user.id, `${user.name} (${user.email})`);
  for (const event of audit.data?.items ?? []) {
    if (event.actorId && !people.has(event.actorId))
      people.set(event.actorId, event.actorEmail ?? event.actorId);
  }
  if (filters.userId && !people.has(filters.userId)) people.set(filters.userId, 'The chosen person');
  const userOptions = [...people]
    .map(([value, label]) => ({ value, label }))
    .sort((a, b) => a.label.localeCompare(b.label, 'en'));

  const total = audit.data?.total ?? 0;
  const pageSize = audit.data?.pageSize ?? PAGE_SIZE;
  const pages = Math.max(1, Math.ceil(total / pageSize));
  const goTo = (page: number) => apply({ ...filters, page });

  return (
    <>
      <PageHeader
        title="Audit log"
        description="Every sign-in, change, upload, redaction and consent event, with who did it and when. Nothing here can be edited."
      />
      <div className="flex flex-col gap-6">
        <AuditFilterForm
          key={params.toString()}
          filters={filters}
          clientOptions={clientOptions}
          userOptions={userOptions}
          onApply={apply}
        />
        {audit.isPending && <PageLoading />}
        {audit.isError && (
          <LoadError
            title="The audit log could not be loaded."
            error={audit.error}
            onRetry={() => void audit.refetch()}
          />
        )}
        {audit.isSuccess && audit.data.items.length === 0 && (
          <EmptyState title="No events match these filters.">Widen the dates or clear a filter.</EmptyState>
        )}
        {audit.isSuccess && audit.data.items.length > 0 && (
          <>
            <p>
              <a href={auditCsvUrl(filters)} download className={buttonClasses('secondary')}>
                Download CSV of these events
              </a>{' '}
              (all {total} {total === 1 ? 'event' : 'events'}, not only this page)
            </p>
            <AuditTable
              events={audit.data.items}
              caption={`Events ${(audit.data.page - 1) * pageSize + 1}–${(audit.data.page - 1) * pageSize + audit.data.items.length} of ${total}, newest first`}
            />
            <nav aria-label="Audit log pages" className="flex flex-wrap items-center gap-3">
              <Button disabled={filters.page <= 1} onClick={() => goTo(filters.page - 1)}>
                Newer events
              </Button>
              <span>
                Page {filters.page} of {pages}
              </span>
              <Button disabled={filters.page >= pages} onClick={() => goTo(filters.page + 1)}>
                Older events
              </Button>
            </nav>
          </>
        )}
      </div>
    </>
  );
};
