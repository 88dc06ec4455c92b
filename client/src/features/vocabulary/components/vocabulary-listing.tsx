import type { VocabularyWord } from '@keyloom/shared';
import { type FormEvent, useEffect, useId, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { fieldClasses } from '@/components/ui/field-classes';
import { LoadError } from '@/components/ui/load-error';
import { LoadingState } from '@/components/ui/loading-state';
import {
  ColumnHeader,
  RowHeader,
  Table,
  TableBody,
  TableCell,
  TableHead,
  TableRow,
} from '@/components/ui/table';
import { formatCount, formatDate } from '@/lib/format';
import { useVocabularyPage } from '../api/get-vocabulary-page';
import type { VocabularyListing as Listing } from '../api/keys';
import { pageCount, showOptions, sortOptions, wordRange } from '../lib/vocabulary-lists';

/** How many sample titles a row names before "+N more". */
const SAMPLES_SHOWN = 2;

const Samples = ({ samples }: { samples: VocabularyWord['samples'] }) => {
  if (samples.length === 0) return <span>—</span>;
  const more = samples.length - SAMPLES_SHOWN;
  return (
    <span>
      {samples
        .slice(0, SAMPLES_SHOWN)
        .map((sample) => sample.title)
        .join(', ')}
      {more > 0 && `, +${formatCount(more)} more`}
    </span>
  );
};

const Status = ({ word }: { word: VocabularyWord }) => {
  if (word.blocked) return <span>{word.replacement ? `Blocked → ${word.replacement}` : 'Blocked'}</span>;
  if (word.added) return <span>Added</span>;
  return <span>—</span>;
};

type VocabularyListingProps = {
  versionId: string;
  versionNumber: number;
  /** Opens the block form for a word (clinicians only; omitted, the rows have no Block… button). */
  onBlock?: (word: string) => void;
};

/** The version's words: find, show, sort and page through them, on the server. */
export const VocabularyListing = ({ versionId, versionNumber, onBlock }: VocabularyListingProps) => {
  const [listing, setListing] = useState<Listing>({ query: '', sort: 'count', show: 'all', page: 1 });
  const [search, setSearch] = useState('');
  const words = useVocabularyPage(versionId, listing);
  const id = useId();
  const tableRef = useRef<HTMLDivElement>(null);
  const pressed = useRef<'previous' | 'next' | null>(null);
  const previousRef = useRef<HTMLButtonElement>(null);
  const nextRef = useRef<HTMLButtonElement>(null);

  const data = words.data;
  const pages = data ? pageCount(data) : 1;
  const showPrevious = listing.page > 1;
  const showNext = listing.page < pages;

  // After Previous or Next: focus stays on the pressed button, or goes to the table (named by its
  // caption) when the button went away.
  useEffect(() => {
    if (!pressed.current || words.isPlaceholderData || !data) return;
    const button = pressed.current === 'next' ? nextRef.current : previousRef.current;
    (button ?? tableRef.current)?.focus();
    pressed.current = null;
  }, [data, words.isPlaceholderData]);

  const change = (next: Partial<Listing>) => setListing((current) => ({ ...current, page: 1, ...next }));
  const turn = (direction: 'previous' | 'next') => {
    pressed.current = direction;
    setListing((current) => ({ ...current, page: current.page + (direction === 'next' ? 1 : -1) }));
  };
  const onSearch = (event: FormEvent) => {
    event.preventDefault();
    change({ query: search.trim() });
  };

  const counted = data
    ? listing.query
      ? `${formatCount(data.total)} ${data.total === 1 ? 'word matches' : 'words match'} “${listing.query}”.`
      : `${formatCount(data.total)} ${data.total === 1 ? 'word' : 'words'} shown of ${formatCount(data.totalWords)}.`
    : '';

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-end gap-4">
        <form
          role="search"
          aria-label="Find a word"
          onSubmit={onSearch}
          className="flex flex-wrap items-end gap-2"
        >
          <div className="flex flex-col gap-1">
            <label htmlFor={`${id}-query`} className="font-bold">
              Find a word
            </label>
            <input
              id={`${id}-query`}
              type="search"
              value={search}
              maxLength={60}
              spellCheck={false}
              onChange={(event) => setSearch(event.target.value)}
              className={fieldClasses(false)}
            />
          </div>
          <Button type="submit">Find</Button>
        </form>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-show`} className="font-bold">
            Show
          </label>
          <select
            id={`${id}-show`}
            value={listing.show}
            onChange={(event) => change({ show: event.target.value as Listing['show'] })}
            className={fieldClasses(false)}
          >
            {showOptions.map((option) => (
              <option key={option.value} value={option.value}>
                {option.label}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-sort`} className="font-bold">
            Sort
          </label>
          <select
            id={`${id}-sort`}
            value={listing.sort}
            onChange={(event) => change({ sort: event.target.value as Listing['sort'] })}
            className={fieldClasses(false)}
          >
            {sortOptions.map((option) => (
              <option key={option.value} value={option.value}>
                {option.label}
              </option>
            ))}
          </select>
        </div>
      </div>

      {/* The result count, announced politely after every search, filter, sort or page. */}
      <p role="status" aria-live="polite" aria-atomic="true" className="text-ink-soft">
        {counted}
      </p>

      {words.isPending && <LoadingState label="Loading the words…" />}
      {words.isError && (
        <LoadError
          title="The words could not be loaded."
          error={words.error}
          onRetry={() => void words.refetch()}
        />
      )}
      {data && data.words.length === 0 && (
        <p className="text-lg">
          {listing.query ? `No words match “${listing.query}”.` : 'No words to show with this choice.'}
        </p>
      )}
      {data && data.words.length > 0 && (
        <Table ref={tableRef} scrollable caption={`Words of version ${versionNumber}: ${wordRange(data)}`}>
          <TableHead>
            <ColumnHeader>Word</ColumnHeader>
            <ColumnHeader>Times written</ColumnHeader>
            <ColumnHeader>Samples</ColumnHeader>
            <ColumnHeader>First used</ColumnHeader>
            <ColumnHeader>Last used</ColumnHeader>
            <ColumnHeader>General English</ColumnHeader>
            <ColumnHeader>Status</ColumnHeader>
            {onBlock && (
              <ColumnHeader>
                <span className="sr-only">Actions</span>
              </ColumnHeader>
            )}
          </TableHead>
          <TableBody>
            {data.words.map((word) => (
              <TableRow key={word.key}>
                <RowHeader label="Word" className="break-words">
                  {word.word}
                </RowHeader>
                <TableCell label="Times written">{formatCount(word.count)}</TableCell>
                <TableCell label="Samples">
                  <Samples samples={word.samples} />
                </TableCell>
                <TableCell label="First used">{formatDate(word.firstUsed)}</TableCell>
                <TableCell label="Last used">{formatDate(word.lastUsed)}</TableCell>
                <TableCell label="General English">{word.inBase ? 'Yes' : 'No'}</TableCell>
                <TableCell label="Status">
                  <Status word={word} />
                </TableCell>
                {onBlock && (
                  <TableCell label="Actions">
                    {!word.blocked && (
                      <Button className="self-start" onClick={() => onBlock(word.word)}>
                        Block… <span className="sr-only">{word.word}</span>
                      </Button>
                    )}
                  </TableCell>
                )}
              </TableRow>
            ))}
          </TableBody>
        </Table>
      )}
      {data && (showPrevious || showNext) && (
        <nav aria-label="Pages of words" className="flex flex-wrap gap-3">
          {showPrevious && (
            <Button ref={previousRef} onClick={() => turn('previous')}>
              Previous
            </Button>
          )}
          {showNext && (
            <Button ref={nextRef} onClick={() => turn('next')}>
              Next
            </Button>
          )}
        </nav>
      )}
    </div>
  );
};
