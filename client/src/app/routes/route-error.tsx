import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';

/** Shown when a page fails to load or crashes; offers a full reload, which fixes a stale build. */
export const RouteError = () => {
  const error = useRouteError();
  const detail = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <>
      <PageHeader title="Something went wrong" />
      <div role="alert">
        <Alert tone="error" title="This page could not be shown.">
          <p>
            Reload the page to try again. If it keeps happening, tell your administrator what you were doing.
          </p>
          <p className="mt-2 text-ink-soft">Details: {detail}</p>
        </Alert>
      </div>
      <p className="mt-6">
        <a href={paths.home} className="inline-flex min-h-11 items-center font-bold underline">
          Reload Keyloom
        </a>
      </p>
    </>
  );
};
