import { type VocabularyQuery, vocabularyOf, type VocabularyWord } from '@keyloom/shared';
import { listingPage, listingWords, type SampleDates } from './vocabulary-page';

const query = (q: Partial<VocabularyQuery>): VocabularyQuery => ({
  query: '',
  sort: 'count',
  show: 'all',
  page: 1,
  pageSize: 50,
  ...q,
});

const word = (key: string, count: number, firstUsed: string | null, extra: Partial<VocabularyWord> = {}) =>
  ({
    key,
    word: key,
    count,
    samples: [],
    firstUsed,
    lastUsed: firstUsed,
    inBase: true,
    added: false,
    blocked: false,
    replacement: null,
    ...extra,
  }) satisfies VocabularyWord;

const words = [
  word('tiller', 5, '2026-03-01'),
  word('attic', 9, '2026-05-01'),
  word('tide', 2, '2026-04-01'),
  word('ramp', 7, null, { added: true, count: 0 }),
  word('slipway', 1, '2026-03-01', { blocked: true, inBase: false }),
];
const keys = (p: { words: VocabularyWord[] }) => p.words.map((w) => w.key);

describe('listingPage', () => {
  it('puts keys starting with the text before keys only containing it, each group in the chosen order', () => {
    expect(keys(listingPage(words, query({ query: 'TI' })))).toEqual(['tiller', 'tide', 'attic']);
    expect(keys(listingPage(words, query({ query: 'ti', sort: 'word' })))).toEqual([
      'tide',
      'tiller',
      'attic',
    ]);
  });

  it('sorts by count (most first), word (A–Z), first use (oldest first, undated last) and reverses on request', () => {
    expect(keys(listingPage(words, query({})))).toEqual(['attic', 'tiller', 'tide', 'slipway', 'ramp']);
    expect(keys(listingPage(words, query({ sort: 'word', order: 'desc' })))).toEqual([
      'tiller',
      'tide',
      'slipway',
      'ramp',
      'attic',
    ]);
    // Same first date: more written first; undated last in either order.
    expect(keys(listingPage(words, query({ sort: 'first' })))).toEqual([
      'tiller',
      'slipway',
      'tide',
      'attic',
      'ramp',
    ]);
    expect(keys(listingPage(words, query({ sort: 'first', order: 'desc' })))).toEqual([
      'attic',
      'tide',
      'tiller',
      'slipway',
      'ramp',
    ]);
  });

  it('filters added, blocked and not-in-base words and pages the rest', () => {
    expect(keys(listingPage(words, query({ show: 'added' })))).toEqual(['ramp']);
    expect(keys(listingPage(words, query({ show: 'blocked' })))).toEqual(['slipway']);
    expect(keys(listingPage(words, query({ show: 'not_in_base' })))).toEqual(['slipway']);
    const second = listingPage(words, query({ page: 2, pageSize: 2 }));
    expect(second).toMatchObject({ total: 5, totalWords: 5, page: 2, pageSize: 2 });
    expect(keys(second)).toEqual(['tide', 'slipway']);
  });
});

describe('listingWords', () => {
  it('adds unwritten additions and blocks with count 0 and marks written ones', () => {
    const entries = vocabularyOf([{ id: 'a', text: 'The dog ran to the slipway. The dog slept.' }], {
      caseFold: false,
    });
    const dates = new Map<string, SampleDates>([
      ['a', { id: 'a', title: 'Diary', firstDate: '2026-01-02', lastDate: '2026-01-09' }],
    ]);
    const out = listingWords(
      entries,
      dates,
      {
        additions: [{ text: 'dog' }, { text: 'St Anne’s' }],
        blocks: [
          { word: 'slipway', replacement: 'ramp' },
          { word: 'cat', replacement: undefined },
        ],
      },
      (key) => key === 'cat',
    );
    expect(out.find((w) => w.key === 'dog')).toMatchObject({
      count: 2,
      added: true,
      firstUsed: '2026-01-02',
      lastUsed: '2026-01-09',
      samples: [{ id: 'a', title: 'Diary', count: 2 }],
    });
    expect(out.find((w) => w.key === "st anne's")).toMatchObject({
      word: 'St Anne’s',
      count: 0,
      added: true,
      firstUsed: null,
    });
    expect(out.find((w) => w.key === 'slipway')).toMatchObject({
      count: 1,
      blocked: true,
      replacement: 'ramp',
    });
    expect(out.find((w) => w.key === 'cat')).toMatchObject({
      count: 0,
      blocked: true,
      inBase: true,
      replacement: null,
    });
  });
});
