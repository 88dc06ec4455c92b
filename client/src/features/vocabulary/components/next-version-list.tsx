import type { ClientVocabulary } from '@keyloom/shared';
import { useEffect, useRef, useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { LoadError } from '@/components/ui/load-error';
import { LoadingState } from '@/components/ui/loading-state';
import { formatDateTime } from '@/lib/format';
import { listCounts, withoutAddition, withoutBlock } from '../lib/vocabulary-lists';
import { LastChange } from './last-change';
import type { VocabularyEditor } from './use-vocabulary-editor';
import { AddWordForm, BlockWordForm } from './vocabulary-forms';

type Kind = 'additions' | 'blocks';

type NextVersionListProps = {
  editor: VocabularyEditor;
  /** Clinicians edit; supervisors read. */
  canEdit: boolean;
  versionNumber: number;
  /** The list frozen in this version's settings. */
  frozen: ClientVocabulary;
};

/** "Changes for the next version": the client's current added and blocked words. */
export const NextVersionList = ({ editor, canEdit, versionNumber, frozen }: NextVersionListProps) => {
  const headingRef = useRef<HTMLHeadingElement>(null);
  const removeButtons = useRef(new Map<string, HTMLButtonElement>());
  // After Remove: the next row's Remove once the saved list is shown, or the heading when none is left.
  const focusAfter = useRef<{ kind: Kind; index: number; revision: number } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const state = editor.list.data;

  useEffect(() => {
    const pending = focusAfter.current;
    if (!pending || !state || state.revision === pending.revision) return;
    focusAfter.current = null;
    const rows = state.vocabulary[pending.kind].length;
    const target =
      rows > 0 ? removeButtons.current.get(`${pending.kind}-${Math.min(pending.index, rows - 1)}`) : null;
    (target ?? headingRef.current)?.focus();
  }, [state]);

  const remove = (kind: Kind, index: number, text: string) => {
    if (!state) return;
    setError(null);
    focusAfter.current = { kind, index, revision: state.revision };
    editor
      .save(
        (current) => (kind === 'additions' ? withoutAddition(current, index) : withoutBlock(current, index)),
        {
          text,
          origin: 'list',
        },
      )
      .catch((reason: unknown) => {
        focusAfter.current = null;
        setError(reason instanceof Error ? reason.message : 'The change could not be saved.');
        headingRef.current?.focus();
      });
  };

  const removeRef = (key: string) => (button: HTMLButtonElement | null) => {
    if (button) removeButtons.current.set(key, button);
    else removeButtons.current.delete(key);
  };

  return (
    <section aria-labelledby="next-version-heading" className="flex flex-col gap-5">
      <h2 id="next-version-heading" ref={headingRef} tabIndex={-1} className="text-2xl font-bold">
        Changes for the next version
      </h2>
      <Alert tone="info">
        Changes apply to the next version you train; version {versionNumber} keeps the words it was trained
        with ({listCounts(frozen)}).
      </Alert>
      <div role="alert">{error && <Alert tone="error">{error}</Alert>}</div>
      {canEdit && <LastChange editor={editor} origin="list" onUndone={() => headingRef.current?.focus()} />}

      {editor.list.isPending && <LoadingState label="Loading the client’s list…" />}
      {editor.list.isError && (
        <LoadError
          title="The client’s list could not be loaded."
          error={editor.list.error}
          onRetry={() => void editor.list.refetch()}
        />
      )}
      {state && (
        <>
          <p className="text-ink-soft">
            The client’s list now: {listCounts(state.vocabulary)}.
            {state.updatedAt &&
              ` Last changed ${formatDateTime(state.updatedAt)}${state.updatedBy ? ` by ${state.updatedBy}` : ''}.`}
          </p>
          <div className="grid gap-6 lg:grid-cols-2">
            <div className="flex flex-col gap-3">
              <h3 className="text-xl font-bold">Added words and phrases</h3>
              {state.vocabulary.additions.length === 0 ? (
                <p>No words added.</p>
              ) : (
                <ul aria-label="Added words and phrases" className="flex flex-col gap-2">
                  {state.vocabulary.additions.map((addition, index) => (
                    <li
                      key={addition.text}
                      className="flex flex-wrap items-center gap-3 border-b border-thread pb-2"
                    >
                      <span className="font-bold break-words">{addition.text}</span>
                      <span className="text-ink-soft">
                        {addition.weight ? `weight ${addition.weight}` : 'default weight'}
                      </span>
                      {canEdit && (
                        <Button
                          ref={removeRef(`additions-${index}`)}
                          variant="quiet"
                          className="ml-auto"
                          disabled={editor.saving}
                          onClick={() => remove('additions', index, `Removed “${addition.text}”.`)}
                        >
                          Remove <span className="sr-only">“{addition.text}”</span>
                        </Button>
                      )}
                    </li>
                  ))}
                </ul>
              )}
              {canEdit && <AddWordForm editor={editor} />}
            </div>
            <div className="flex flex-col gap-3">
              <h3 className="text-xl font-bold">Blocked words</h3>
              {state.vocabulary.blocks.length === 0 ? (
                <p>No words blocked.</p>
              ) : (
                <ul aria-label="Blocked words" className="flex flex-col gap-2">
                  {state.vocabulary.blocks.map((block, index) => (
                    <li
                      key={block.word}
                      className="flex flex-wrap items-center gap-3 border-b border-thread pb-2"
                    >
                      <span className="font-bold break-words">
                        {block.word}
                        {block.replacement && ` → ${block.replacement}`}
                      </span>
                      {canEdit && (
                        <Button
                          ref={removeRef(`blocks-${index}`)}
                          variant="quiet"
                          className="ml-auto"
                          disabled={editor.saving}
                          onClick={() => remove('blocks', index, `Unblocked “${block.word}”.`)}
                        >
                          Remove <span className="sr-only">“{block.word}”</span>
                        </Button>
                      )}
                    </li>
                  ))}
                </ul>
              )}
              {canEdit && <BlockWordForm editor={editor} />}
            </div>
          </div>
        </>
      )}
    </section>
  );
};
