import { useEffect, useState } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { z } from 'zod';
import { PageLoading } from '@/components/layout/page-loading';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { LoadError } from '@/components/ui/load-error';
import { clientPath } from '@/config/paths';
import type { SampleSummary } from '@keyloom/shared';
import { useSamples } from '../api/get-samples';
import { useIncludeSample } from '../api/include-sample';
import { focusSoon, sampleLinkId } from '../lib/focus-targets';
import { deleteBlockedReason, type VersionUse } from '../lib/trained-versions';
import { DeleteSampleDialog } from './delete-sample-dialog';
import { PasteSampleForm } from './paste-sample-form';
import { SamplesTable } from './samples-table';
import { UploadSamplesForm } from './upload-samples-form';

type SamplesPanelProps = {
  clientId: string;
  pseudonym: string;
  /** Whether an active consent for model training exists (uploads need it). */
  trainingConsent: boolean;
  /** Owning clinician; supervisors read only. */
  canEdit: boolean;
  announce: (tone: 'success' | 'error', text: string) => void;
  /** The client's versions, to tell which samples were trained on (undefined while unknown). */
  versions?: readonly VersionUse[];
};

const deletedStateSchema = z.object({ sampleDeleted: z.string() });
const deletedMessage = (title: string) => `“${title}” was deleted.`;

/** The "Writing samples" tab: the caution, upload and paste (with consent), and the list. */
export const SamplesPanel = ({
  clientId,
  pseudonym,
  trainingConsent,
  canEdit,
  announce,
  versions,
}: SamplesPanelProps) => {
  const samples = useSamples(clientId);
  const [mode, setMode] = useState<'files' | 'paste'>('files');
  const [deleting, setDeleting] = useState<SampleSummary | null>(null);
  const include = useIncludeSample();
  // A sample deleted on its own page: say so, and put focus on the list it was removed from.
  const location = useLocation();
  const [deletedTitle] = useState(() => deletedStateSchema.safeParse(location.state).data?.sampleDeleted);
  const loaded = samples.isSuccess;
  useEffect(() => {
    if (deletedTitle === undefined || !loaded) return;
    announce('success', deletedMessage(deletedTitle));
    focusSoon('samples-heading');
    // Once, when the list has come: `announce` is a new function on every render of the page.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [deletedTitle, loaded]);

  const includeAgain = async (sample: SampleSummary) => {
    try {
      const included = await include.mutateAsync(sample.id);
      announce(
        'success',
        `“${included.title}” is included again${included.status === 'needs_review' ? '; review its open flags before training' : ''}.`,
      );
      // The row stays: focus goes to its link.
      focusSoon(sampleLinkId(sample.id));
    } catch (caught) {
      announce('error', caught instanceof Error ? caught.message : 'The sample was not included. Try again.');
    }
  };

  return (
    <div className="flex flex-col gap-8">
      <Alert tone="info" title="These samples are personal health information.">
        <p>
          Upload only writing {pseudonym} has consented to share. It stays in the clinic’s database. Review
          every flag for personal data before a sample is used, and follow local law and the clinic’s policy.
        </p>
      </Alert>

      {canEdit && !trainingConsent && (
        <section aria-labelledby="upload-blocked-heading" className="flex flex-col gap-3">
          <h3 id="upload-blocked-heading" className="text-2xl font-bold">
            Add writing
          </h3>
          <p id="upload-blocked-reason" className="max-w-3xl">
            Uploading is switched off: {pseudonym} has no active consent for model training.{' '}
            <Link to={clientPath(clientId, 'consent')} className="font-bold underline">
              Record consent on the Consent &amp; family tab
            </Link>{' '}
            first.
          </p>
          <Button disabled aria-describedby="upload-blocked-reason" className="self-start">
            Upload files
          </Button>
        </section>
      )}

      {canEdit && trainingConsent && (
        <section aria-labelledby="upload-heading" className="flex flex-col gap-4">
          <h3 id="upload-heading" className="text-2xl font-bold">
            Add writing
          </h3>
          <div role="group" aria-label="How to add writing" className="flex flex-wrap gap-2">
            {(['files', 'paste'] as const).map((choice) => (
              <Button
                key={choice}
                variant={mode === choice ? 'primary' : 'secondary'}
                aria-pressed={mode === choice}
                onClick={() => setMode(choice)}
              >
                {choice === 'files' ? 'From files' : 'Paste text'}
              </Button>
            ))}
          </div>
          {mode === 'files' ? (
            <UploadSamplesForm
              clientId={clientId}
              onFinished={(stored, problems) =>
                announce(
                  problems ? 'error' : 'success',
                  `${stored} file${stored === 1 ? '' : 's'} stored${problems ? `, ${problems} not stored — see the list for why` : ''}.`,
                )
              }
            />
          ) : (
            <PasteSampleForm clientId={clientId} onStored={(message, tone) => announce(tone, message)} />
          )}
        </section>
      )}

      <section aria-labelledby="samples-heading" className="flex flex-col gap-4">
        <h3 id="samples-heading" tabIndex={-1} className="text-2xl font-bold">
          Samples of {pseudonym}
        </h3>
        {samples.isPending && <PageLoading />}
        {samples.isError && (
          <LoadError
            title="The samples could not be loaded."
            error={samples.error}
            onRetry={() => void samples.refetch()}
          />
        )}
        {samples.isSuccess && samples.data.length === 0 && (
          <EmptyState title="No writing samples yet.">
            Uploaded and pasted writing appears here with its size and the personal data found in it.
          </EmptyState>
        )}
        {samples.isSuccess && samples.data.length > 0 && (
          <SamplesTable
            samples={samples.data}
            actions={
              canEdit
                ? {
                    onDelete: setDeleting,
                    onInclude: (s) => void includeAgain(s),
                    busy: include.isPending,
                    deleteBlocked: (s) => (versions ? deleteBlockedReason(s.id, versions) : null),
                  }
                : undefined
            }
          />
        )}
      </section>
      {canEdit && (
        <DeleteSampleDialog
          sample={deleting}
          onClose={() => setDeleting(null)}
          onDeleted={(deleted) => {
            setDeleting(null);
            announce('success', deletedMessage(deleted.title));
            // The row is gone: focus goes to the list's heading, under the message.
            focusSoon('samples-heading');
          }}
        />
      )}
    </div>
  );
};
