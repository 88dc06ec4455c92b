import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';

export const CaseloadRoute = () => (
  <>
    <PageHeader
      title="Caseload"
      description="Your clients live here: their consent, the writing they have agreed to share, and the personal prediction profiles you train, measure and send for approval."
    />
    <EmptyState title="Your caseload is empty.">
      Clients you open will be listed here, each with their consent status and latest profile version.
    </EmptyState>
  </>
);
