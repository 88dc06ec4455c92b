import { ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';

/** Shown in place of a page the signed-in role may not open. */
export const NotAllowed = () => (
  <>
    <PageHeader
      title="Not allowed"
      description="Your role in Keyloom does not include this page. If you need it for your work, ask the clinic's administrator."
    />
    <ButtonLink to={paths.home} variant="primary">
      Go to your home page
    </ButtonLink>
  </>
);
