import { useRef, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { PageLoading } from '@/components/layout/page-loading';
import { PageHeader } from '@/components/ui/page-header';
import { profileVersionPath } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useProfileVersion } from '@/features/profiles/api/get-profile-version';
import { VersionNotFound } from '@/features/profiles/components/version-not-found';
import { DeviceFiles } from '@/features/vocabulary/components/device-files';
import { MisspellingsSection } from '@/features/vocabulary/components/misspellings-section';
import { NextVersionList } from '@/features/vocabulary/components/next-version-list';
import { useVocabularyEditor } from '@/features/vocabulary/components/use-vocabulary-editor';
import { LastChange } from '@/features/vocabulary/components/last-change';
import { BlockDialog } from '@/features/vocabulary/components/vocabulary-forms';
import { VocabularyListing } from '@/features/vocabulary/components/vocabulary-listing';

/**
 * /clients/:clientId/profiles/:versionId/vocabulary — the words a version learned, the client's
 * added and blocked words for the next version, the misspelling review and the device files.
 */
export const VocabularyRoute = () => {
  const { clientId = '', versionId = '' } = useParams();
  const me = useMe();
  const version = useProfileVersion(versionId);
  const editor = useVocabularyEditor(clientId);
  const [blocking, setBlocking] = useState<string | null>(null);
  const wordsHeading = useRef<HTMLHeadingElement>(null);
  const canEdit = me.data?.role === 'clinician';
  const back = (
    <Link
      to={profileVersionPath(clientId, versionId)}
      className="inline-flex min-h-11 items-center font-bold underline"
    >
      Back to the version
    </Link>
  );

  if (version.isPending) return <PageLoading />;
  if (version.isError) return <VersionNotFound error={version.error} back={back} />;

  const data = version.data;
  return (
    <>
      <PageHeader
        title={`Vocabulary of version ${data.number}`}
        description={
          <span className="flex flex-col gap-2">
            <span>
              The words the suggestion list can offer from the client’s own writing, plus the words you added.
              General English words are offered too.
            </span>
            {back}
          </span>
        }
      />
      <div className="flex flex-col gap-12">
        <section aria-labelledby="words-heading" className="flex min-w-0 flex-col gap-4">
          <h2 id="words-heading" ref={wordsHeading} tabIndex={-1} className="text-2xl font-bold">
            Words of version {data.number}
          </h2>
          {canEdit && (
            <LastChange editor={editor} origin="listing" onUndone={() => wordsHeading.current?.focus()} />
          )}
          <VocabularyListing
            versionId={data.id}
            versionNumber={data.number}
            onBlock={canEdit ? setBlocking : undefined}
          />
        </section>
        <NextVersionList
          editor={editor}
          canEdit={canEdit}
          versionNumber={data.number}
          frozen={data.settings.vocabulary}
        />
        <MisspellingsSection versionId={data.id} editor={editor} canEdit={canEdit} />
        <DeviceFiles versionId={data.id} />
      </div>
      {canEdit && <BlockDialog editor={editor} word={blocking} onClose={() => setBlocking(null)} />}
    </>
  );
};
