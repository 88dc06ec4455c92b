import { describe, expect, it } from 'vitest';
import { loadBrown } from './brown';
import { detokenize, splitTaggedToken, taggedSentences } from './brown-detokenize';
import { loadLexicon } from './lexicon';

describe('Brown reconstruction', () => {
  const corpus = loadBrown();

  it('has 500 samples in 15 categories', () => {
    // Francis & Kučera manual: 500 samples in 15 genre categories (docs/references.md §5).
    expect(corpus.documents).toHaveLength(500);
    expect(new Set(corpus.documents.map((d) => d.section)).size).toBe(15);
    expect(new Set(corpus.documents.map((d) => d.category)).size).toBe(15);
    expect(corpus.documents.every((d) => d.id.startsWith(d.section))).toBe(true);
  });

  it('has about 5.96 million characters of running text', () => {
    // Brown et al. 1992 report 5.96 M characters for the corpus (docs/references.md §5).
    // Tolerance ±1% (±59,600): the figure is rounded to 3 digits (±5,000), and
    // our rebuild fixes conventions the original character stream may not share:
    // one space between sentences (~57,000 of them), closed-up "--" dashes
    // (~3,400, 2 spaces each), quote and bracket spacing. Code points, with one
    // separator between documents.
    const chars = corpus.documents.reduce((n, d) => n + [...d.text].length, 0) + corpus.documents.length - 1;
    expect(Math.abs(chars - 5_960_000) / 5_960_000).toBeLessThan(0.01);
  });

  it('has about 1,014,312 words', () => {
    // Francis & Kučera manual count 1,014,312 words (docs/references.md §5 via the NLTK README).
    // Tolerance ±0.5% (±5,072): we count tagged tokens containing a letter or
    // digit; the manual's rules for symbols (&, $), split numerals and
    // formulas are not stated in the package, and those tokens number a few thousand.
    const words = corpus.documents.reduce((n, d) => n + d.words, 0);
    expect(Math.abs(words - 1_014_312) / 1_014_312).toBeLessThan(0.005);
  });

  it('leaves no tags, tokeniser quotes or spaces before punctuation', () => {
    const sample = corpus.documents.map((d) => d.text).join('\n');
    // The tagged files carry ~1.16 M "/tag" suffixes; a handful of real
    // slashes (fractions, "lb/in") may survive, so count rather than forbid.
    const count = (re: RegExp): number => sample.match(re)?.length ?? 0;
    expect(count(/[a-z]\/(?:nn|vbd|at|in|jj)\b/g)).toBeLessThan(20);
    // Tokeniser quote tokens must be gone (inch marks inside tokens like 10'' stay).
    expect(count(/(?:^|\s)(?:``|'')(?:\s|$)/g)).toBe(0);
    // ~120,000 punctuation tokens were glued on; times like ":35.3" stay spaced.
    expect(count(/ [,.;:?!]/g)).toBeLessThan(5);
  });
});

describe('detokenize', () => {
  it('splits word/TAG at the last slash', () => {
    expect(splitTaggedToken('1-1/2/cd')).toEqual({ word: '1-1/2', tag: 'cd' });
    expect(splitTaggedToken('//in')).toEqual({ word: '/', tag: 'in' });
  });

  it('rebuilds quotes, punctuation, dashes and abbreviation periods', () => {
    const sentences = taggedSentences(
      "\tHe/pps said/vbd ``/`` no/at ''/'' ,/, (/( twice/rb )/) --/-- Allen/np Jr./np ./.\n\n\tIt's/pps+bez ok/jj ?/.\n",
    );
    expect(detokenize(sentences)).toBe('He said "no", (twice)--Allen Jr. It\'s ok?');
  });
});

describe('SUBTLEX lexicon', () => {
  it('has the 74,286 word types of SUBTLEX-US', () => {
    // Brysbaert & New 2009: 74,286 word types (docs/references.md §5). The npm
    // list may fold a few spellings together, so allow 0.1%.
    const lexicon = loadLexicon();
    expect(Math.abs(lexicon.size - 74_286)).toBeLessThan(75);
    expect(lexicon.get('the')).toBeGreaterThan(lexicon.get('cat') ?? Infinity);
  });
});
