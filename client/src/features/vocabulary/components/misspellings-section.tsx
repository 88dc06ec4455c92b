import { useId, useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { LoadError } from '@/components/ui/load-error';
import { LoadingState } from '@/components/ui/loading-state';
import { formatCount } from '@/lib/format';
import { useMisspellings } from '../api/get-misspellings';
import { edits, withBlock, withKeptSpelling } from '../lib/vocabulary-lists';
import { LastChange } from './last-change';
import type { VocabularyEditor } from './use-vocabulary-editor';

type MisspellingsSectionProps = { versionId: string; editor: VocabularyEditor; canEdit: boolean };

/** "Possible misspellings": keep a spelling as the client's own, or offer a correction in its place. */
export const MisspellingsSection = ({ versionId, editor, canEdit }: MisspellingsSectionProps) => {
  const misspellings = useMisspellings(versionId);
  const headingRef = useRef<HTMLHeadingElement>(null);
  const [error, setError] = useState<string | null>(null);
  const id = useId();

  // The candidate leaves the list once saved: focus goes to the section heading.
  const act = (run: Promise<void>) => {
    setError(null);
    run.then(
      () => headingRef.current?.focus(),
      (reason: unknown) => {
        setError(reason instanceof Error ? reason.message : 'The change could not be saved.');
        headingRef.current?.focus();
      },
    );
  };

  const candidates = misspellings.data?.candidates ?? [];
  return (
    <section aria-labelledby="misspellings-heading" className="flex flex-col gap-4">
      <h2 id="misspellings-heading" ref={headingRef} tabIndex={-1} className="text-2xl font-bold">
        Possible misspellings
      </h2>
      <p className="max-w-3xl">
        A list to review, not a verdict: rare real words and names can appear here, and some of the client’s
        own spellings may be intended.
      </p>
      <div role="alert">{error && <Alert tone="error">{error}</Alert>}</div>
      {canEdit && (
        <LastChange editor={editor} origin="misspellings" onUndone={() => headingRef.current?.focus()} />
      )}
      {misspellings.isPending && <LoadingState label="Looking for possible misspellings…" />}
      {misspellings.isError && (
        <LoadError
          title="The possible misspellings could not be loaded."
          error={misspellings.error}
          onRetry={() => void misspellings.refetch()}
        />
      )}
      {misspellings.data && candidates.length === 0 && <p>No possible misspellings to review.</p>}
      {candidates.length > 0 && (
        <ul aria-label="Possible misspellings" className="flex flex-col gap-3">
          {candidates.map((candidate) => {
            const lineId = `${id}-${candidate.key}`;
            return (
              <li key={candidate.key} className="flex flex-col gap-2 border-b border-thread pb-3">
                <p id={lineId}>
                  <span className="font-bold">{candidate.word}</span> — written {formatCount(candidate.count)}{' '}
                  {candidate.count === 1 ? 'time' : 'times'}.
                  {candidate.corrections.length > 0 &&
                    ` Maybe: ${candidate.corrections.map((c) => `${c.word} (${edits(c.distance)})`).join(', ')}`}
                </p>
                {canEdit && (
                  <div className="flex flex-wrap gap-3">
                    <Button
                      aria-describedby={lineId}
                      disabled={editor.saving}
                      onClick={() =>
                        act(
                          editor.save((state) => withKeptSpelling(state, candidate.word), {
                            text: `Kept “${candidate.word}” as the client’s spelling.`,
                            origin: 'misspellings',
                          }),
                        )
                      }
                    >
                      Keep as the client’s spelling
                    </Button>
                    {candidate.corrections.map((correction) => (
                      <Button
                        key={correction.word}
                        aria-describedby={lineId}
                        disabled={editor.saving}
                        onClick={() =>
                          act(
                            editor.save(
                              (state) =>
                                withBlock(state, { word: candidate.word, replacement: correction.word }),
                              {
                                text: `Blocked “${candidate.word}”; “${correction.word}” is offered instead.`,
                                origin: 'misspellings',
                              },
                            ),
                          )
                        }
                      >
                        Offer ‘{correction.word}’ instead
                      </Button>
                    ))}
                  </div>
                )}
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
};
