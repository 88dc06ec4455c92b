import {
  type ClientVocabulary,
  type VocabularyEntry,
  type VocabularyQuery,
  type VocabularyWord,
  wordKey,
} from '@keyloom/shared';

/** What the listing needs to know of one frozen sample (null dates: the sample row is gone). */
export type SampleDates = { id: string; title: string; firstDate: string | null; lastDate: string | null };

/**
 * Every word of a version's listing, most written first: the words of its samples (`entries` from
 * vocabularyOf), then its additions the samples never had (count 0) and its blocks the samples never
 * had (count 0), each marked `added` / `blocked` (with the block's replacement).
 */
export function listingWords(
  entries: readonly VocabularyEntry[],
  samples: ReadonlyMap<string, SampleDates>,
  vocabulary: ClientVocabulary,
  inBase: (key: string) => boolean,
): VocabularyWord[] {
  const added = new Map(vocabulary.additions.map((a) => [wordKey(a.text.trim().replace(/\s+/g, ' ')), a]));
  const blocked = new Map(vocabulary.blocks.map((b) => [wordKey(b.word), b]));
  const words: VocabularyWord[] = entries.map((e) => ({
    key: e.key,
    word: e.form,
    count: e.count,
    samples: e.documents.map((d) => ({ id: d.id, title: samples.get(d.id)?.title ?? '', count: d.count })),
    firstUsed: samples.get(e.firstDocument)?.firstDate ?? null,
    lastUsed: samples.get(e.lastDocument)?.lastDate ?? null,
    inBase: e.inBase,
    added: added.has(e.key),
    blocked: blocked.has(e.key),
    replacement: blocked.get(e.key)?.replacement ?? null,
  }));
  const written = new Set(entries.map((e) => e.key));
  const unwritten = (key: string, word: string): VocabularyWord => ({
    key,
    word,
    count: 0,
    samples: [],
    firstUsed: null,
    lastUsed: null,
    inBase: inBase(key),
    added: added.has(key),
    blocked: blocked.has(key),
    replacement: blocked.get(key)?.replacement ?? null,
  });
  for (const [key, a] of added) if (!written.has(key)) words.push(unwritten(key, a.text.trim()));
  for (const [key, b] of blocked) if (!written.has(key)) words.push(unwritten(key, b.word));
  return words;
}

const byKey = (a: VocabularyWord, b: VocabularyWord): number => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0);
const byCount = (a: VocabularyWord, b: VocabularyWord): number => a.count - b.count;

/** Dates compared as text (YYYY-MM-DD); null (unknown) sorts last in either order. */
function byDate(field: 'firstUsed' | 'lastUsed', sign: 1 | -1) {
  return (a: VocabularyWord, b: VocabularyWord): number => {
    const x = a[field];
    const y = b[field];
    if (x === y) return 0;
    if (x === null) return 1;
    if (y === null) return -1;
    return sign * (x < y ? -1 : 1);
  };
}

/** The order of a listing: the chosen sort, then most written first, then by key. */
export function listingOrder(
  sort: VocabularyQuery['sort'],
  order: VocabularyQuery['order'],
): (a: VocabularyWord, b: VocabularyWord) => number {
  const descending = (order ?? (sort === 'count' ? 'desc' : 'asc')) === 'desc';
  const sign = descending ? -1 : 1;
  const ties = (a: VocabularyWord, b: VocabularyWord) => -byCount(a, b) || byKey(a, b);
  switch (sort) {
    case 'count':
      return (a, b) => sign * byCount(a, b) || byKey(a, b);
    case 'word':
      return (a, b) => sign * (byKey(a, b) || (a.word < b.word ? -1 : a.word > b.word ? 1 : 0));
    case 'first':
      return (a, b) => byDate('firstUsed', sign)(a, b) || ties(a, b);
    case 'last':
      return (a, b) => byDate('lastUsed', sign)(a, b) || ties(a, b);
  }
}

const SHOWS: Record<VocabularyQuery['show'], (w: VocabularyWord) => boolean> = {
  all: () => true,
  not_in_base: (w) => !w.inBase,
  added: (w) => w.added,
  blocked: (w) => w.blocked,
};

/**
 * One page of a listing. `query` (lower-cased as the keys are) matches keys that start with it
 * first, then keys that only contain it; each group in the chosen order.
 */
export function listingPage(
  words: readonly VocabularyWord[],
  q: VocabularyQuery,
): { total: number; totalWords: number; page: number; pageSize: number; words: VocabularyWord[] } {
  const show = SHOWS[q.show];
  const text = q.query ? wordKey(q.query) : '';
  const starting: VocabularyWord[] = [];
  const containing: VocabularyWord[] = [];
  for (const w of words) {
    if (!show(w)) continue;
    if (!text || w.key.startsWith(text)) starting.push(w);
    else if (w.key.includes(text)) containing.push(w);
  }
  const compare = listingOrder(q.sort, q.order);
  const matched = [...starting.sort(compare), ...containing.sort(compare)];
  const from = (q.page - 1) * q.pageSize;
  return {
    total: matched.length,
    totalWords: words.length,
    page: q.page,
    pageSize: q.pageSize,
    words: matched.slice(from, from + q.pageSize),
  };
}
