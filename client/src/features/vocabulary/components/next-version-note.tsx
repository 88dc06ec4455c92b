import { Link } from 'react-router-dom';
import { vocabularyPath } from '@/config/paths';
import { useClientVocabulary } from '../api/get-client-vocabulary';
import { listCounts } from '../lib/vocabulary-lists';

type NextVersionNoteProps = {
  clientId: string;
  /** The newest version, whose vocabulary page holds the list; null when there is none yet. */
  latestVersionId: string | null;
};

/** One line in the new-version form: the client's current list goes into the version as it is. */
export const NextVersionNote = ({ clientId, latestVersionId }: NextVersionNoteProps) => {
  const list = useClientVocabulary(clientId);
  const counts = list.data ? ` (${listCounts(list.data.vocabulary)})` : '';
  return (
    <p>
      Added and blocked words: this version will use the client’s current list{counts}.{' '}
      {latestVersionId ? (
        <Link to={vocabularyPath(clientId, latestVersionId)} className="font-bold underline">
          Review the list on the vocabulary page
        </Link>
      ) : (
        'The list can be changed on a version’s vocabulary page once the first version exists.'
      )}
    </p>
  );
};
