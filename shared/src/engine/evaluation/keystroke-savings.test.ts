import { describe, expect, it } from 'vitest';
import type { NextSymbolModel } from '../model-types';
import { AddOneModel, LexiconModel, seededRandom } from '../search/reference-models';
import { suggest } from '../search/suggest';
import { toCodePoints } from '../search/word-chars';
import { simulateKeystrokes, wordEnd } from './keystroke-savings';

/** Naive ideal user for ONE list size: asks suggest() for the list before every letter. */
function naiveKeystrokes(
  model: NextSymbolModel,
  text: Int32Array,
  slots: number,
  adaptive: boolean,
): { keys: number; hits: number } {
  const limits = { nodeBudget: 300, maxCompletionLength: 24 };
  let keys = 0;
  let hits = 0;
  let i = 0;
  const learn = (at: number): void => {
    if (adaptive) model.learn(text, at);
  };
  while (i < text.length) {
    const j = wordEnd(text, i);
    if (j === i) {
      keys++;
      learn(i++);
      continue;
    }
    const word = String.fromCodePoint(...text.subarray(i, j));
    const spaceAfter = text[j] === 0x20 ? 1 : 0;
    let cost = j - i + spaceAfter;
    let hit = false;
    for (let m = 0; m <= j - i; m++) {
      const listed = suggest(model, text, i + m, slots, limits).some((s) => s.word === word);
      if (listed && m + 1 < cost) cost = m + 1;
      // A hit: the list showed the word while at least one of its letters was still to type.
      if (listed && m < j - i) hit = true;
    }
    if (hit) hits++;
    // Convention 8: a word's letters are learned once the word is finished.
    for (let m = 0; m < j - i; m++) learn(i + m);
    keys += cost;
    if (spaceAfter) learn(j);
    i = j + spaceAfter;
  }
  return { keys, hits };
}

function randomText(seed: number, length: number): string {
  const rnd = seededRandom(seed);
  const words = ['the', 'then', 'there', 'cat', 'car', 'cart', "can't", 'x-ray', 'a', 'pepper', 'piano'];
  let text = '';
  while (text.length < length) {
    text += words[Math.floor(rnd() * rnd() * words.length)];
    const r = rnd();
    text += r < 0.8 ? ' ' : r < 0.9 ? ', ' : '.\n';
  }
  return text;
}

describe('simulateKeystrokes', () => {
  it('equals the hand-worked toy example', () => {
    // A hand-made toy example, worked by hand from the ideal-user rules (derived; docs/references.md §2): lexicon the 5, cat 4, then 3, there 2,
    // car 1; text "then car " = 9 keys; W = 1 → 9 keys (KS 0%); W = 2 → 4 keys (KS 5/9).
    const model = new LexiconModel(
      new Map([
        ['the', 5],
        ['cat', 4],
        ['then', 3],
        ['there', 2],
        ['car', 1],
      ]),
    );
    const r = simulateKeystrokes(model, toCodePoints('then car '), { maxSlots: 2 });
    expect(r.chars).toBe(9);
    expect(r.keystrokes[1]).toBe(9);
    expect(r.savings[1]).toBe(0);
    expect(r.keystrokes[2]).toBe(4);
    expect(r.savings[2]).toBeCloseTo(5 / 9, 15);
    expect(r.kspc[2]).toBeCloseTo(4 / 9, 15);
    // Hits, worked by hand the same way: at W = 1 neither word is listed before its last letter;
    // at W = 2 "then" is listed after "t" and "car" after "c" (2 words, hit rate 100%).
    expect(r.words).toBe(2);
    expect(r.hits[1]).toBe(0);
    expect(r.hits[2]).toBe(2);
  });

  it('agrees with a naive per-W simulator built on suggest()', () => {
    // Oracle test: one pass for all W must equal W separate walks.
    for (const adaptive of [false, true]) {
      const train = toCodePoints(randomText(11, 3000));
      const text = toCodePoints(randomText(12, 400));
      const fresh = (): AddOneModel => {
        const m = new AddOneModel(3, "abcdefghijklmnopqrstuvwxyz'-,.\n ");
        m.train(train);
        return m;
      };
      const fast = simulateKeystrokes(fresh(), text, { maxSlots: 10, adaptive });
      for (const w of [1, 2, 3, 5, 10]) {
        const naive = naiveKeystrokes(fresh(), text, w, adaptive);
        expect(fast.keystrokes[w]).toBe(naive.keys);
        expect(fast.hits[w]).toBe(naive.hits);
      }
    }
  });

  it('never loses as slots grow and never beats the oracle bound', () => {
    const train = toCodePoints(randomText(21, 5000));
    const m = new AddOneModel(2, "abcdefghijklmnopqrstuvwxyz'-,.\n ");
    m.train(train);
    const r = simulateKeystrokes(m, toCodePoints(randomText(22, 2000)), { maxSlots: 10, adaptive: true });
    for (let w = 2; w <= 10; w++) expect(r.savings[w]).toBeGreaterThanOrEqual(r.savings[w - 1]);
    // Oracle bound (Trnka & McCoy 2008 frame KS against such ideal bounds; derived here):
    // one key per word plus every non-word character not absorbed by a selection.
    for (let w = 1; w <= 10; w++) expect(r.savings[w]).toBeLessThanOrEqual(r.oracleSavings);
    expect(r.savings[10]).toBeGreaterThan(0.2);
    for (let w = 1; w <= 10; w++) expect(r.kspc[w]).toBeCloseTo(1 - r.savings[w], 12);
  });

  it('treats joiners as inside words only', () => {
    const t = toCodePoints("can't x-ray --a 'em");
    expect(wordEnd(t, 0)).toBe(5);
    expect(wordEnd(t, 6)).toBe(11);
    expect(wordEnd(t, 14)).toBe(15);
    expect(wordEnd(t, 17)).toBe(19);
  });
});
