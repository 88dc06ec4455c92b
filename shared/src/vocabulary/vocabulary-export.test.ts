// The export files, read back with a different, well-known CSV parser (npm csv-parse) to check
// RFC 4180 quoting (Shafranovich 2005), and the formula-injection guard (OWASP, "CSV Injection").
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { vocabularyOf, wordPairsOf } from './vocabulary-listing';
import { vocabularyCsv, vocabularyRows, vocabularyText, wordPairsCsv } from './vocabulary-export';

const rows = [
  { word: 'Zoë', count: 2, sources: ['Diary, March'] },
  { word: 'say "hi"', count: 5, sources: ['Letters'] },
  { word: 'naïve', count: 9, sources: ['Diary, March', 'Letters'] },
  { word: 'café, au lait', count: 1, sources: ['added'] },
];

describe('vocabularyCsv', () => {
  it('round-trips through csv-parse: same rows, ranked by count, with commas, quotes and non-ASCII letters', () => {
    const csv = vocabularyCsv(rows);
    const back = parse(csv, { columns: true }) as Record<string, string>[];
    expect(back).toEqual([
      { word: 'naïve', count: '9', source: 'Diary, March; Letters' },
      { word: 'say "hi"', count: '5', source: 'Letters' },
      { word: 'Zoë', count: '2', source: 'Diary, March' },
      { word: 'café, au lait', count: '1', source: 'added' },
    ]);
    // RFC 4180 §2: CRLF line ends, quotes doubled inside a quoted field.
    expect(csv.split('\r\n')[0]).toBe('word,count,source');
    expect(csv).toContain('"say ""hi"""');
  });

  it('prefixes cells a spreadsheet would run as a formula with an apostrophe (OWASP CSV Injection)', () => {
    const risky = ['=SUM(A1)', '+44', '-1', '@cmd'].map((word, i) => ({
      word,
      count: 10 - i,
      sources: ['x'],
    }));
    const back = parse(vocabularyCsv(risky), { columns: true }) as Record<string, string>[];
    expect(back.map((r) => r.word)).toEqual(["'=SUM(A1)", "'+44", "'-1", "'@cmd"]);
  });

  it('builds rows from the listing with sample titles and additions', () => {
    const entries = vocabularyOf(
      [
        { id: 'a', text: 'Pepper ran. Pepper slept.' },
        { id: 'b', text: 'Pepper barked at Okafor.' },
      ],
      { caseFold: false },
    );
    const titles: Record<string, string> = { a: 'Diary', b: 'Letters' };
    const r = vocabularyRows(entries, (id) => titles[id], [
      { text: 'Okafor' },
      { text: 'St Anne’s', weight: 2 },
    ]);
    expect(r[0]).toEqual({ word: 'Pepper', count: 3, sources: ['Diary', 'Letters'] });
    expect(r.find((x) => x.word === 'Okafor')?.sources).toEqual(['Letters', 'added']);
    expect(r.find((x) => x.word === 'St Anne’s')).toEqual({
      word: 'St Anne’s',
      count: 2,
      sources: ['added'],
    });
  });
});

describe('vocabularyText and wordPairsCsv', () => {
  it('writes one word per line, most written first', () => {
    expect(vocabularyText(rows)).toBe('naïve\nsay "hi"\nZoë\ncafé, au lait\n');
  });

  it('writes previous,word,count and reads back the same pairs', () => {
    const pairs = wordPairsOf([{ id: 'a', text: 'Dr Okafor came. Dr Okafor left. Dr Zoë, "hi".' }], {
      caseFold: false,
    });
    const back = parse(wordPairsCsv(pairs), { columns: true }) as Record<string, string>[];
    expect(back).toEqual(pairs.map((p) => ({ previous: p.previous, word: p.word, count: String(p.count) })));
    expect(back[0]).toEqual({ previous: 'Dr', word: 'Okafor', count: '2' });
  });
});
