import { useQueries } from '@tanstack/react-query';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { Alert } from '@/components/ui/alert';
import { PageHeader } from '@/components/ui/page-header';
import { clientPath } from '@/config/paths';
import { useClient } from '@/features/clients/api/get-client';
import { profileVersionQueryOptions } from '@/features/profiles/api/get-profile-version';
import { CompareView } from '@/features/profiles/components/compare-view';

/** /clients/:clientId/profiles/compare?ids=a,b — versions side by side with the base model alone. */
export const ProfileCompareRoute = () => {
  const { clientId = '' } = useParams();
  const [search] = useSearchParams();
  const ids = (search.get('ids') ?? '').split(',').filter(Boolean);
  const client = useClient(clientId);
  const versions = useQueries({ queries: ids.map((id) => profileVersionQueryOptions(id)) });
  const pseudonym = client.data?.pseudonym ?? 'the client';
  const back = (
    <Link
      to={clientPath(clientId, 'profiles')}
      className="inline-flex min-h-11 items-center font-bold underline"
    >
      Back to the profile versions
    </Link>
  );
  const failed = versions.find((query) => query.isError)?.error;
  const loaded = versions.flatMap((query) => (query.data ? [query.data] : []));

  return (
    <>
      <PageHeader title={`Compare profile versions of ${pseudonym}`} description={back} />
      {ids.length < 2 && (
        <Alert tone="info" title="Choose two or more versions.">
          <p>Tick the versions to compare on the profile versions tab.</p>
        </Alert>
      )}
      {failed && (
        <div role="alert">
          <Alert tone="error" title="A version could not be loaded.">
            <p>{failed.message}</p>
          </Alert>
        </div>
      )}
      {ids.length >= 2 && !failed && loaded.length < ids.length && <PageLoading />}
      {ids.length >= 2 && loaded.length === ids.length && <CompareView versions={loaded} />}
    </>
  );
};
