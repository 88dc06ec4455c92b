import type { ClientVocabularyState } from '@keyloom/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { ApiError, isApiError } from '@/lib/api-client';
import { useClientVocabulary } from '../api/get-client-vocabulary';
import { vocabularyKeys } from '../api/keys';
import { useUpdateClientVocabulary } from '../api/update-client-vocabulary';
import { CONFLICT_MESSAGE, listProblem, type VocabularyChange } from '../lib/vocabulary-lists';

/** The last saved change, with the list as it was before it (what Undo puts back). */
export type LastChange = { text: string; origin: ChangeOrigin; before: VocabularyChange };

/** The part of the page a change was made in (its Undo is shown there). */
export type ChangeOrigin = 'listing' | 'list' | 'misspellings';

export type SaveOptions = {
  /** What was done, e.g. `Added "okafor".` */
  text: string;
  origin: ChangeOrigin;
  /** The form field a rejected list is reported on. */
  field?: string;
};

/**
 * The client's current list and its one way of changing: each save PUTs the whole list with the
 * revision it was read at. A stale revision (409) reloads the list and fails with CONFLICT_MESSAGE;
 * a rule the list breaks fails with the shared schema's (or the server's) message, on `field`.
 */
export const useVocabularyEditor = (clientId: string) => {
  const list = useClientVocabulary(clientId);
  const update = useUpdateClientVocabulary();
  const queryClient = useQueryClient();
  const [lastChange, setLastChange] = useState<LastChange | null>(null);

  const put = async (state: ClientVocabularyState, next: VocabularyChange, field?: string) => {
    const problem = listProblem(next.vocabulary);
    if (problem) throw new ApiError(400, problem, field ? [{ path: field, message: problem }] : []);
    try {
      await update.mutateAsync({ clientId, input: { revision: state.revision, ...next } });
    } catch (error) {
      if (isApiError(error) && error.status === 409) {
        setLastChange(null);
        await queryClient.invalidateQueries({ queryKey: vocabularyKeys.client(clientId) });
        throw new ApiError(409, CONFLICT_MESSAGE);
      }
      if (isApiError(error) && error.status === 400 && field) {
        const message = error.issues[0]?.message ?? error.message;
        throw new ApiError(400, message, [{ path: field, message }]);
      }
      throw error;
    }
  };

  /** Saves the list `build` makes from the current one, and offers to undo it. */
  const save = async (build: (state: ClientVocabularyState) => VocabularyChange, options: SaveOptions) => {
    const state = list.data;
    if (!state) throw new ApiError(0, 'The list has not loaded yet. Try again in a moment.');
    await put(state, build(state), options.field);
    setLastChange({
      text: options.text,
      origin: options.origin,
      before: { vocabulary: state.vocabulary, keptSpellings: state.keptSpellings },
    });
  };

  /** Puts back the list as it was before the last change (one more PUT). */
  const undo = async () => {
    const state = list.data;
    if (!state || !lastChange) return;
    await put(state, lastChange.before);
    setLastChange(null);
  };

  return { list, save, undo, lastChange, saving: update.isPending };
};

export type VocabularyEditor = ReturnType<typeof useVocabularyEditor>;
