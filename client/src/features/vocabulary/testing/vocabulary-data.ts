import type {
  ClientVocabulary,
  ClientVocabularyState,
  MisspellingList,
  UpdateClientVocabularyInput,
  VocabularyPage,
  VocabularyWord,
} from '@keyloom/shared';
import { VERSION_1_ID } from '@/features/profiles/testing/profile-data';
import type { MockResponse, RecordedRequest } from '@/testing/mock-fetch';
import { ASHBY_ID } from '@/testing/data';

// Invented words of the Willowmere demo client; the tests check that the page shows and sends them.

export const vocabularyWord = (overrides: Partial<VocabularyWord> = {}): VocabularyWord => ({
  key: 'pepper',
  word: 'Pepper',
  count: 1204,
  samples: [
    { id: 's1', title: 'Messages to the sailing club', count: 800 },
    { id: 's2', title: 'Diary, August', count: 300 },
    { id: 's3', title: 'Notes to the vet', count: 100 },
    { id: 's4', title: 'Shopping lists', count: 4 },
  ],
  firstUsed: '2026-03-02',
  lastUsed: '2026-08-30',
  inBase: false,
  added: false,
  blocked: false,
  replacement: null,
  ...overrides,
});

export const vocabularyPage = (overrides: Partial<VocabularyPage> = {}): VocabularyPage => ({
  versionId: VERSION_1_ID,
  total: 6467,
  totalWords: 6467,
  page: 1,
  pageSize: 50,
  words: [
    vocabularyWord(),
    vocabularyWord({
      key: 'harbour',
      word: 'harbour',
      count: 9,
      samples: [{ id: 's1', title: 'Messages to the sailing club', count: 9 }],
      inBase: true,
    }),
    vocabularyWord({
      key: 'recieve',
      word: 'recieve',
      count: 3,
      samples: [],
      firstUsed: null,
      lastUsed: null,
      inBase: false,
      blocked: true,
      replacement: 'receive',
    }),
  ],
  ...overrides,
});

export const misspellingList = (overrides: Partial<MisspellingList> = {}): MisspellingList => ({
  versionId: VERSION_1_ID,
  candidates: [
    {
      key: 'tommorow',
      word: 'tommorow',
      count: 3,
      corrections: [
        { word: 'tomorrow', distance: 1, perMillion: 310 },
        { word: 'tomorrows', distance: 2, perMillion: 4 },
      ],
    },
  ],
  ...overrides,
});

export const clientVocabularyState = (
  vocabulary: ClientVocabulary = {
    additions: [{ text: 'Okafor' }, { text: 'Willowmere Marina', weight: 10 }],
    blocks: [{ word: 'lousy', replacement: undefined }],
  },
  overrides: Partial<ClientVocabularyState> = {},
): ClientVocabularyState => ({
  clientId: ASHBY_ID,
  revision: 4,
  vocabulary,
  keptSpellings: [],
  updatedAt: '2026-09-22T10:00:00.000Z',
  updatedBy: 'Dr. Tomasz Reyes',
  ...overrides,
});

/**
 * The client's list on a pretend server: GET answers the current state; PUT saves a body whose
 * revision is current (the revision goes up by one) and refuses a stale one with 409, as the API does.
 */
export const vocabularyServer = (initial = clientVocabularyState()) => {
  let state = initial;
  return {
    get current() {
      return state;
    },
    /** Someone else saves in another tab. */
    changeElsewhere: (next: Partial<ClientVocabularyState>) => {
      state = { ...state, ...next, revision: state.revision + 1 };
    },
    get: (): MockResponse => ({ body: state }),
    put: (request: RecordedRequest): MockResponse => {
      const body = request.body as UpdateClientVocabularyInput;
      if (body.revision !== state.revision)
        return { status: 409, body: { statusCode: 409, message: 'The list has changed since you read it.' } };
      state = {
        ...state,
        revision: state.revision + 1,
        vocabulary: {
          additions: body.vocabulary.additions ?? [],
          blocks: (body.vocabulary.blocks ?? []).map((b) => ({ word: b.word, replacement: b.replacement })),
        } as ClientVocabulary,
        keptSpellings: body.keptSpellings ?? [],
      };
      return { body: state };
    },
  };
};
