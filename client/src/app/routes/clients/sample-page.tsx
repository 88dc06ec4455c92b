import { sourceKindLabels } from '@keyloom/shared';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { type Announcement, LiveRegion } from '@/components/ui/live-region';
import { PageHeader } from '@/components/ui/page-header';
import { clientPath } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { profileVersionsQueryOptions } from '@/features/profiles/api/get-profile-versions';
import { useSample } from '@/features/samples/api/get-sample';
import { useIncludeSample } from '@/features/samples/api/include-sample';
import { focusSoon } from '@/features/samples/lib/focus-targets';
import { deleteBlockedReason } from '@/features/samples/lib/trained-versions';
import { DeleteSampleDialog } from '@/features/samples/components/delete-sample-dialog';
import { ExcludeSampleDialog } from '@/features/samples/components/exclude-sample-dialog';
import { FlagReview } from '@/features/samples/components/flag-review';
import { SampleStatistics } from '@/features/samples/components/sample-statistics';
import { SampleStatusBadge } from '@/features/samples/components/sample-status-badge';

/** /clients/:clientId/samples/:sampleId — statistics, the text and its personal-data flags. */
export const SampleRoute = () => {
  const { clientId = '', sampleId = '' } = useParams();
  const me = useMe();
  const sample = useSample(sampleId);
  const [excluding, setExcluding] = useState(false);
  const [deleting, setDeleting] = useState(false);
  const include = useIncludeSample();
  const navigate = useNavigate();
  const [announcement, setAnnouncement] = useState<Announcement>(null);
  const announce = (tone: 'success' | 'error', text: string) => setAnnouncement({ tone, text });
  const canEdit = me.data?.role === 'clinician';
  // Whether a version was trained on the sample (then it cannot be deleted): only the owner asks.
  const versions = useQuery({ ...profileVersionsQueryOptions(clientId), enabled: canEdit });
  const back = (
    <Link
      to={clientPath(clientId, 'samples')}
      className="inline-flex min-h-11 items-center font-bold underline"
    >
      Back to the writing samples
    </Link>
  );

  if (sample.isPending) return <PageLoading />;
  if (sample.isError) {
    return (
      <>
        <PageHeader title="Sample not found" />
        <div role="alert">
          <Alert tone="error" title="This sample could not be opened.">
            <p>{sample.error.message}</p>
            {back}
          </Alert>
        </div>
      </>
    );
  }

  const data = sample.data;
  // Unknown versions (still loading, or not loaded) leave the decision to the API, which refuses too.
  const deleteBlocked = versions.data ? deleteBlockedReason(data.id, versions.data) : null;
  const includeAgain = async () => {
    try {
      await include.mutateAsync(data.id);
      announce('success', `“${data.title}” is included again.`);
    } catch (caught) {
      announce('error', caught instanceof Error ? caught.message : 'The sample was not included. Try again.');
    }
    // The button is gone (or still there after an error): focus goes to the sample's status.
    focusSoon('sample-status');
  };
  return (
    <>
      <PageHeader
        title={data.title}
        description={
          <span className="flex flex-col gap-2">
            <span className="flex flex-wrap items-center gap-3">
              <span id="sample-status" tabIndex={-1}>
                <SampleStatusBadge status={data.status} />
              </span>
              <span>
                {sourceKindLabels[data.sourceKind]}
                {data.fileName ? ` · ${data.fileName}` : ''} · {data.encoding}
              </span>
            </span>
            {back}
          </span>
        }
        actions={
          !canEdit ? undefined : (
            <div className="flex flex-col items-start gap-2">
              <div className="flex flex-wrap gap-3">
                {data.status === 'excluded' ? (
                  <Button disabled={include.isPending} onClick={() => void includeAgain()}>
                    Include again
                  </Button>
                ) : (
                  <Button variant="danger" onClick={() => setExcluding(true)}>
                    Leave out this sample
                  </Button>
                )}
                <Button
                  variant="danger"
                  // Offered once the versions are known, and only while none was trained on the sample.
                  disabled={versions.isPending || deleteBlocked !== null}
                  aria-describedby={deleteBlocked ? 'delete-sample-blocked' : undefined}
                  onClick={() => setDeleting(true)}
                >
                  Delete sample…
                </Button>
              </div>
              {deleteBlocked && (
                <p id="delete-sample-blocked" className="max-w-sm text-ink-soft">
                  {deleteBlocked}
                </p>
              )}
            </div>
          )
        }
      />
      <LiveRegion message={announcement} />
      {data.status === 'excluded' && (
        <Alert tone="info" title="This sample is left out." className="mb-6">
          <p>
            It is never used to train or measure a model.
            {data.excludedReason ? ` Reason: ${data.excludedReason}` : ''}
          </p>
        </Alert>
      )}
      <div className="flex flex-col gap-10">
        <section aria-labelledby="stats-heading" className="flex flex-col gap-4">
          <h2 id="stats-heading" className="text-2xl font-bold">
            Size and vocabulary
          </h2>
          <SampleStatistics sample={data} />
        </section>
        <section aria-labelledby="review-heading" className="flex flex-col gap-4">
          <h2 id="review-heading" className="text-2xl font-bold">
            Personal data review
          </h2>
          <FlagReview sample={data} canEdit={canEdit} announce={announce} />
        </section>
      </div>
      {canEdit && (
        <ExcludeSampleDialog
          open={excluding}
          sample={data}
          onClose={() => setExcluding(false)}
          onExcluded={(excluded) => {
            setExcluding(false);
            announce('success', `“${excluded.title}” is left out.`);
            focusSoon('sample-status');
          }}
        />
      )}
      {canEdit && (
        <DeleteSampleDialog
          sample={deleting ? data : null}
          onClose={() => setDeleting(false)}
          // The page is gone with the sample: the client's samples list says so, focus on its heading.
          onDeleted={(deleted) =>
            void navigate(clientPath(clientId, 'samples'), { state: { sampleDeleted: deleted.title } })
          }
        />
      )}
    </>
  );
};
