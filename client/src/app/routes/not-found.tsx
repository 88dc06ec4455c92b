import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';

export const NotFoundRoute = () => (
  <>
    <PageHeader
      title="Page not found"
      description="There is no page at this address in Keyloom. It may have moved, or the link may be mistyped."
    />
    <ButtonLink to={paths.home} variant="primary">
      Go to your home page
    </ButtonLink>
  </>
);
