import { EmptyState } from '@/components/ui/empty-state';
import { PageHeader } from '@/components/ui/page-header';

export const ReviewsRoute = () => (
  <>
    <PageHeader
      title="Reviews"
      description="You look across the clinic's caseloads, weigh each profile version's measurements and trials, approve it or send it back with a comment, and keep an eye on the audit log."
    />
    <EmptyState title="Nothing is waiting for your review.">
      Profile versions that clinicians put forward for approval will appear here, oldest first.
    </EmptyState>
  </>
);
