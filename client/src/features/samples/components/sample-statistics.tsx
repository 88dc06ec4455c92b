import type { SampleDetail } from '@keyloom/shared';

const number = (value: number) => value.toLocaleString('en-GB');

const Figure = ({ term, value }: { term: string; value: number }) => (
  <div className="rounded-xl border-2 border-thread bg-surface p-4">
    <dt className="text-ink-soft">{term}</dt>
    <dd className="text-3xl font-bold">{number(value)}</dd>
  </div>
);

type WordCount = SampleDetail['topWords'][number];

/** Words with their counts as compact chips; `ordered` when the order is the ranking. */
const WordList = ({ words, ordered = false }: { words: readonly WordCount[]; ordered?: boolean }) => {
  const List = ordered ? 'ol' : 'ul';
  return (
    <List className="flex flex-wrap gap-2">
      {words.map((entry) => (
        <li key={entry.word} className="rounded-lg border-2 border-thread bg-surface px-3 py-1">
          {entry.word} <span className="text-ink-soft">×{number(entry.count)}</span>
        </li>
      ))}
    </List>
  );
};

/** Size and vocabulary of a sample: counts, the most frequent words, and the client's own words. */
export const SampleStatistics = ({ sample }: { sample: SampleDetail }) => (
  <div className="flex flex-col gap-6">
    <dl className="grid gap-3 sm:grid-cols-3">
      <Figure term="Characters" value={sample.characters} />
      <Figure term="Words" value={sample.words} />
      <Figure term="Distinct words" value={sample.distinctWords} />
    </dl>
    <div className="grid gap-6 lg:grid-cols-2">
      <section aria-labelledby="top-words-heading">
        <h3 id="top-words-heading" className="mb-3 text-lg font-bold">
          Most frequent words
        </h3>
        <WordList words={sample.topWords} ordered />
      </section>
      <section aria-labelledby="own-words-heading">
        <h3 id="own-words-heading" className="mb-1 text-lg font-bold">
          The client’s own words ({sample.unknownWords.length})
        </h3>
        <p className="mb-3 text-ink-soft">
          Words the base English lexicon does not know — names, places, hobbies. These are where a personal
          model helps most.
        </p>
        {sample.unknownWords.length === 0 ? (
          <p>None: every word is in the base lexicon.</p>
        ) : (
          <WordList words={sample.unknownWords} />
        )}
      </section>
    </div>
  </div>
);
