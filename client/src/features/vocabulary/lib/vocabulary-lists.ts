import {
  type ClientVocabulary,
  type ClientVocabularyState,
  clientVocabularySchema,
  type VocabularyAddition,
  type VocabularyBlock,
  type VocabularyPage,
  wordKey,
} from '@keyloom/shared';
import { env } from '@/config/env';
import { formatCount } from '@/lib/format';

/** What a save changes: the whole list and the kept spellings. */
export type VocabularyChange = { vocabulary: ClientVocabulary; keptSpellings: string[] };

export const CONFLICT_MESSAGE =
  'Someone else changed this list. It has been reloaded; check it and try again.';

const change = (
  state: ClientVocabularyState,
  vocabulary: ClientVocabulary,
  keptSpellings = state.keptSpellings,
) => ({
  vocabulary,
  keptSpellings,
});

export const withAddition = (state: ClientVocabularyState, addition: VocabularyAddition): VocabularyChange =>
  change(state, { ...state.vocabulary, additions: [...state.vocabulary.additions, addition] });

export const withoutAddition = (state: ClientVocabularyState, index: number): VocabularyChange =>
  change(state, {
    ...state.vocabulary,
    additions: state.vocabulary.additions.filter((_, i) => i !== index),
  });

export const withBlock = (state: ClientVocabularyState, block: VocabularyBlock): VocabularyChange =>
  change(state, { ...state.vocabulary, blocks: [...state.vocabulary.blocks, block] });

export const withoutBlock = (state: ClientVocabularyState, index: number): VocabularyChange =>
  change(state, { ...state.vocabulary, blocks: state.vocabulary.blocks.filter((_, i) => i !== index) });

/** Accepts a written form as the client's own spelling (left out of the misspelling review). */
export const withKeptSpelling = (state: ClientVocabularyState, word: string): VocabularyChange =>
  state.keptSpellings.some((kept) => wordKey(kept) === wordKey(word))
    ? change(state, state.vocabulary)
    : change(state, state.vocabulary, [...state.keptSpellings, word]);

/**
 * The first rule the shared schema finds broken in a changed list (e.g. `"okafor" is already
 * added.`), or null: checked before sending so the field can say it at once.
 */
export const listProblem = (vocabulary: ClientVocabulary): string | null => {
  const parsed = clientVocabularySchema.safeParse(vocabulary);
  return parsed.success ? null : (parsed.error.issues[0]?.message ?? 'This list cannot be saved.');
};

/** "Words 51–100 of 6,467" for the page shown; "No words" when there are none. */
export const wordRange = (page: Pick<VocabularyPage, 'page' | 'pageSize' | 'total' | 'words'>): string => {
  if (page.total === 0 || page.words.length === 0) return 'No words';
  const first = (page.page - 1) * page.pageSize + 1;
  const last = first + page.words.length - 1;
  return `Words ${formatCount(first)}–${formatCount(last)} of ${formatCount(page.total)}`;
};

export const pageCount = (page: Pick<VocabularyPage, 'pageSize' | 'total'>): number =>
  Math.max(1, Math.ceil(page.total / page.pageSize));

export const showOptions = [
  { value: 'all', label: 'All words' },
  { value: 'not_in_base', label: 'Not in general English' },
  { value: 'added', label: 'Added' },
  { value: 'blocked', label: 'Blocked' },
] as const;

export const sortOptions = [
  { value: 'count', label: 'Most written' },
  { value: 'word', label: 'A to Z' },
  { value: 'first', label: 'First used' },
  { value: 'last', label: 'Last used' },
] as const;

/** The files for the client's device, with what each holds. */
export const deviceFiles = (versionId: string) => {
  const base = `${env.API_URL}/profile-versions/${encodeURIComponent(versionId)}`;
  return [
    {
      href: `${base}/vocabulary.csv`,
      label: 'Words with counts (CSV)',
      columns: 'Columns: word, count (times written), source (written or added).',
    },
    {
      href: `${base}/vocabulary.txt`,
      label: 'Words, one a line (text)',
      columns: 'One word per line, the most written first.',
    },
    {
      href: `${base}/word-pairs.csv`,
      label: 'Word pairs (CSV)',
      columns: 'Columns: previous (the word before), word, count (times written together).',
    },
  ];
};

/** "1 edit" / "2 edits". */
export const edits = (distance: number): string => `${distance} ${distance === 1 ? 'edit' : 'edits'}`;

/** "3 added and 2 blocked" for a frozen or current list. */
export const listCounts = (vocabulary: Pick<ClientVocabulary, 'additions' | 'blocks'>): string =>
  `${formatCount(vocabulary.additions.length)} added, ${formatCount(vocabulary.blocks.length)} blocked`;

/** Keys of a list, for the differences between two versions' lists. */
const additionLabel = (a: VocabularyAddition) => (a.weight ? `${a.text} (weight ${a.weight})` : a.text);
const blockLabel = (b: VocabularyBlock) => (b.replacement ? `${b.word} → ${b.replacement}` : b.word);

/** What `after` adds to and removes from `before`: additions and blocks, as readable labels. */
export const vocabularyDifferences = (before: ClientVocabulary, after: ClientVocabulary) => {
  const diff = <T>(from: readonly T[], to: readonly T[], label: (item: T) => string) => {
    const fromLabels = new Set(from.map(label));
    const toLabels = new Set(to.map(label));
    return {
      added: [...toLabels].filter((item) => !fromLabels.has(item)),
      removed: [...fromLabels].filter((item) => !toLabels.has(item)),
    };
  };
  return {
    additions: diff(before.additions, after.additions, additionLabel),
    blocks: diff(before.blocks, after.blocks, blockLabel),
  };
};
