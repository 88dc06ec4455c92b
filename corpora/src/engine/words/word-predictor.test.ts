// What the word-aware list offers: names with their capitals, words learned as they are typed,
// capitals at sentence starts, joiners inside words, and nothing that is not a word.
import { describe, expect, it } from 'vitest';
import { loadBaseModel } from '../../base-model';
import { loadBaseWords } from '../../base-words';
import { BlendedModel } from '@keyloom/shared/src/engine/blended-model';
import { trainPersonalModel } from '@keyloom/shared/src/engine/evaluation/held-out-evaluation';
import { prepareText } from '@keyloom/shared/src/engine/text-preparation';
import { DEFAULT_WORD_WEIGHTS } from '@keyloom/shared/src/engine/words/mixture-weights';
import type { WordNgramModel } from '@keyloom/shared/src/engine/words/word-ngram-model';
import { WordPredictor, type WordPredictorParts } from '@keyloom/shared/src/engine/words/word-predictor';
import { isOfferable, wordKey } from '@keyloom/shared/src/engine/words/word-tokens';
import { trainWordModel } from '@keyloom/shared/src/engine/words/word-training';

// Invented for the demo clinic (no corpus): a client who writes about Bertram often.
const DIARY = [
  'Bertram came round after lunch. We talked about the boat and Bertram fixed the tiller.',
  'I asked Bertram about the regatta. Bertram says the wind will drop by Sunday.',
  'Please ask Bertram to bring the charts. The x-ray showed nothing broken, so I don’t need the sling.',
  'On the 25th we sail at 10 with Bertram. I don’t mind the early start.',
  'My neighbour ⟪person-name⟫ came too. ⟪person-name⟫ brought cake for Bertram and me.',
].map((t) => prepareText(t));

const base = loadBaseWords();
const baseChar = loadBaseModel();

function predictor(over: Partial<WordPredictorParts> = {}): WordPredictor {
  const personalChar = trainPersonalModel({ order: 5 }, DIARY);
  return new WordPredictor({
    personal: trainWordModel(DIARY),
    base,
    char: new BlendedModel(personalChar, baseChar, 0.5),
    weights: DEFAULT_WORD_WEIGHTS,
    capitalize: true,
    adaptive: true,
    ...over,
  });
}

/** The list shown after `text` (typed so far), `slots` words. */
function listAfter(p: WordPredictor, text: string, slots = 5): string[] {
  const h = prepareText(text);
  return p.suggest(h, h.length, slots).map((s) => s.word);
}

/** Types `text` into the predictor one character at a time, learning each (as the keyboard does). */
function type(p: WordPredictor, text: string): void {
  const h = prepareText(text);
  for (let i = 0; i < h.length; i++) p.learn(h, i);
}

describe('WordPredictor: names and case', () => {
  const p = predictor({ adaptive: false });

  it('offers "Bertram" after "Please ask Be" when the client names him often, never "bertram"', () => {
    const list = listAfter(p, 'Please ask Be');
    expect(list).toContain('Bertram');
    expect(list).not.toContain('bertram');
    // A name keeps its capitals even when typed in lower case.
    expect(listAfter(p, 'I saw be', 10)).toContain('Bertram');
    expect(listAfter(p, 'I saw be', 10)).not.toContain('bertram');
  });

  it('capitalises at the start of the text and after a sentence end, not inside a sentence', () => {
    expect(listAfter(p, '', 10)).toContain('The');
    expect(listAfter(p, '', 10)).not.toContain('the');
    expect(listAfter(p, 'We sail today. ', 10)).toContain('The');
    expect(listAfter(p, 'Pepper found the muddy bit of ', 10)).toContain('the');
    expect(listAfter(p, 'Pepper found the muddy bit of ', 10)).not.toContain('The');
  });

  it('keeps a typed capital, and keeps typed letters as typed', () => {
    const list = listAfter(p, 'I went to Th', 10);
    expect(list.length).toBeGreaterThan(0);
    for (const w of list) expect(w.startsWith('Th'), w).toBe(true);
    for (const w of listAfter(p, 'We went over th', 10)) expect(w.startsWith('th'), w).toBe(true);
  });

  it('does not capitalise when the profile is case-folded', () => {
    const folded = predictor({ adaptive: false, capitalize: false });
    expect(listAfter(folded, 'We sail today. ', 10)).toContain('the');
    expect(listAfter(folded, 'We sail today. ', 10)).not.toContain('The');
  });
});

describe('WordPredictor: words inside words', () => {
  const p = predictor({ adaptive: false });

  it('offers words with an apostrophe or a hyphen inside', () => {
    expect(listAfter(p, 'I do', 10)).toContain('don’t');
    expect(listAfter(p, 'The x-r', 5)).toContain('x-ray');
  });

  it('matches a typed typographic apostrophe or hyphen against the plain key, keeping what was typed', () => {
    const apostrophe = listAfter(p, 'I don’', 5);
    expect(apostrophe.map(wordKey)).toContain("don't");
    expect(apostrophe).toContain('don’t');
    const plain = listAfter(p, "I don'", 5);
    expect(plain).toContain("don't");
    const hyphen = listAfter(p, 'The x‐r', 5); // U+2010 HYPHEN
    expect(hyphen.map(wordKey)).toContain('x-ray');
    expect(hyphen).toContain('x‐ray');
  });

  it('never offers a number, after digits or elsewhere', () => {
    for (const text of ['On the 2', 'We sail at 1', 'On the 25th we sail at ', '', 'Bertram '])
      for (const w of listAfter(p, text, 10)) expect(/\p{L}/u.test(w), `${text} → ${w}`).toBe(true);
  });

  it('never offers nor learns a redaction placeholder', () => {
    const q = predictor();
    expect(q.personal?.has('person-name')).toBe(false);
    type(q, 'We met ⟪person-name⟫ at the club. ⟪person-name⟫ waved. ');
    expect(q.personal?.has('person-name')).toBe(false);
    expect(q.inVocabulary('person-name')).toBe(false);
    for (const text of ['We met ⟪', 'We met ⟪pe', 'We met ⟪person-', 'I met pe'])
      for (const w of listAfter(q, text, 10))
        expect(wordKey(w), `${text} → ${w}`).not.toContain('person-name');
    for (const [k] of q.cache.entries()) expect(isOfferable(k), k).toBe(true);
  });
});

describe('WordPredictor: learning what is typed', () => {
  it('offers a word typed once the next time its first letter is typed (adaptive)', () => {
    const p = predictor();
    expect(p.inVocabulary('zorbleck')).toBe(false);
    expect(listAfter(p, 'Then z', 5)).not.toContain('zorbleck');
    type(p, 'We found a zorbleck on the beach. ');
    expect(p.inVocabulary('zorbleck')).toBe(true);
    expect(listAfter(p, 'We found a zorbleck on the beach. Then z', 5)).toContain('zorbleck');
  });

  it('counts a word learned without a client word model (an older profile) as vocabulary', () => {
    // An older profile file has no client words: what is typed lives in the cache only, and the
    // word it offers from there must count as a word of the vocabulary.
    const p = predictor({ personal: null });
    expect(p.inVocabulary('zorbleck')).toBe(false);
    type(p, 'We found a zorbleck and a zorbleck. ');
    const list = listAfter(p, 'We found a zorbleck and a zorbleck. Then z', 5);
    expect(list).toContain('zorbleck');
    for (const w of list) expect(p.inVocabulary(w), w).toBe(true);
  });

  it('learns nothing when static', () => {
    const p = predictor({ adaptive: false });
    type(p, 'We found a zorbleck on the beach. ');
    expect(p.inVocabulary('zorbleck')).toBe(false);
    expect(listAfter(p, 'We found a zorbleck on the beach. Then z', 5)).not.toContain('zorbleck');
  });

  it('learns typed text exactly as training learns the same text, punctuation tokens included', () => {
    // Invented text with every context mark, a run of commas, a placeholder and sentence ends.
    const first = 'We sail at dawn. The boat is ready! We sail to the island, and back.\n';
    const later =
      'He said, "Go (now)." Then we wait; the tide turns: slowly, , surely. ' +
      '“Yes” she said: (fine) ok, ⟪person-name⟫, “done”. Bertram’s boat is x-ray clear.\n' +
      'Shopping:\n- Milk\n- Bread for Bertram\n';
    const p = new WordPredictor({
      personal: trainWordModel([prepareText(first)]),
      base: null,
      char: null,
      weights: DEFAULT_WORD_WEIGHTS,
      capitalize: true,
      adaptive: true,
    });
    const h = prepareText(first + later);
    for (let i = prepareText(first).length; i < h.length; i++) p.learn(h, i);
    const typed = p.personal as WordNgramModel;
    const trained = trainWordModel([h]);
    trained.discounts = typed.discounts;
    expect(typed.vocabularySize).toBe(trained.vocabularySize);
    let compared = 0;
    for (const u of trained.keys)
      for (const v of trained.keys)
        for (let id = 2; id < trained.keys.length; id++) {
          const w = trained.keys[id];
          expect(typed.probability(u, v, w), `${u} ${v} ${w}`).toBeCloseTo(trained.probability(u, v, w), 12);
          compared++;
        }
    expect(compared).toBeGreaterThan(30_000);
    for (let id = 2; id < trained.keys.length; id++) {
      const k = trained.keys[id];
      expect(typed.midForm(typed.idOf(k)), k).toBe(trained.midForm(id));
      expect(typed.startForm(typed.idOf(k)), k).toBe(trained.startForm(id));
    }
  });

  it('takes the first word of a line typed as a list item ("- Milk") as a sentence start', () => {
    const p = predictor();
    type(p, 'Shopping:\n- Milk\n- Bread\n- Milk for Pepper\n');
    // Learned as written at sentence starts, so offered in lower case inside a sentence …
    const mid = listAfter(p, 'Shopping:\n- Milk\n- Bread\n- Milk for Pepper\nI need more mi');
    expect(mid).toContain('milk');
    expect(mid).not.toContain('Milk');
    // … and with a capital after a list's "- ".
    const item = listAfter(p, 'Shopping:\n- Milk\n- Bread\n- Milk for Pepper\n- ', 10);
    expect(item).toContain('Milk');
    expect(item).not.toContain('milk');
  });

  it('learns a word closed by a quote without the quote', () => {
    const p = predictor();
    type(p, "Bertram said 'norrow' twice. ");
    expect(p.inVocabulary('norrow')).toBe(true);
    expect(p.personal?.has("norrow'")).toBe(false);
    for (const [k] of p.cache.entries()) expect(k.endsWith("'"), k).toBe(false);
    for (const w of listAfter(p, "Bertram said 'norrow' twice. He said no", 10)) expect(w).not.toMatch(/'$/);
  });
});
