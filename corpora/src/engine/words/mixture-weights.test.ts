// Fitting the word mixture's weights by EM (Jelinek & Mercer 1980; Dempster, Laird & Rubin 1977:
// an EM step never lowers the likelihood; docs/references.md §4).
import { describe, expect, it } from 'vitest';
import { loadBaseWords } from '../../base-words';
import { demoSamples } from '../../demo-texts';
import {
  type ComponentTable,
  componentProbabilities,
  DEFAULT_WORD_WEIGHTS,
  fitMixtureWeights,
  MIN_COMPONENT_WEIGHT,
  mixtureBitsPerWord,
} from '@keyloom/shared/src/engine/words/mixture-weights';
import { WORD_COMPONENTS, type WordWeights } from '@keyloom/shared/src/engine/words/word-predictor';
import { trainWordModel } from '@keyloom/shared/src/engine/words/word-training';

const sum = (w: WordWeights): number => WORD_COMPONENTS.reduce((s, c) => s + w[c], 0);
const UNIFORM: WordWeights = { personal: 0.25, base: 0.25, lexicon: 0.25, cache: 0.25 };

describe('fitMixtureWeights', () => {
  const texts = demoSamples().map((s) => s.text);
  const base = loadBaseWords();
  // Train on the first samples, fit on the last two (never the same text).
  const personal = trainWordModel(texts.slice(0, -2));
  const table = componentProbabilities({ personal, base, cache: true }, texts.slice(-2));

  it('fits weights that explain held-out demo text at least as well as uniform or default weights', () => {
    expect(table.rows.length).toBeGreaterThan(300);
    const fitted = fitMixtureWeights(table);
    const bits = mixtureBitsPerWord(table, fitted);
    expect(bits).toBeLessThanOrEqual(mixtureBitsPerWord(table, UNIFORM));
    expect(bits).toBeLessThanOrEqual(mixtureBitsPerWord(table, DEFAULT_WORD_WEIGHTS));
    expect(sum(fitted)).toBeCloseTo(1, 5);
    for (const c of WORD_COMPONENTS) expect(fitted[c]).toBeGreaterThanOrEqual(MIN_COMPONENT_WEIGHT - 1e-6);
  });

  it('never lowers the likelihood from one step to the next', () => {
    let last = Infinity;
    for (let steps = 0; steps <= 12; steps += 2) {
      const bits = mixtureBitsPerWord(table, fitMixtureWeights(table, steps));
      expect(bits, `${steps} steps`).toBeLessThanOrEqual(last + 1e-6);
      last = bits;
    }
  });

  it('gives an absent component 0', () => {
    const noPersonal = componentProbabilities({ personal: null, base, cache: false }, texts.slice(-2));
    expect(noPersonal.present).toEqual(['base', 'lexicon']);
    const w = fitMixtureWeights(noPersonal);
    expect(w.personal).toBe(0);
    expect(w.cache).toBe(0);
    expect(w.base + w.lexicon).toBeCloseTo(1, 5);
    expect(w.base).toBeGreaterThan(0);
  });

  it('reaches the known optimum where each word is explained by one component only (derived)', () => {
    // Rows [1, 0] ×30 and [0, 1] ×10 over personal and base: log-likelihood 30·log λp + 10·log λb,
    // largest at λp = 30/40 = 0.75, λb = 0.25 (derived; EM reaches it in one step from ½, ½).
    const rows: Float64Array[] = [];
    for (let i = 0; i < 30; i++) rows.push(Float64Array.from([1, 0, 0, 0]));
    for (let i = 0; i < 10; i++) rows.push(Float64Array.from([0, 1, 0, 0]));
    const t: ComponentTable = { rows, present: ['personal', 'base'] };
    expect(fitMixtureWeights(t)).toEqual({ personal: 0.75, base: 0.25, lexicon: 0, cache: 0 });
  });

  it('keeps a present component that never helps at the floor, and uses the defaults without rows', () => {
    const rows = Array.from({ length: 20 }, () => Float64Array.from([0.2, 0.1, 0, 0.3]));
    const w = fitMixtureWeights({ rows, present: ['personal', 'base', 'lexicon', 'cache'] });
    expect(w.lexicon).toBeCloseTo(MIN_COMPONENT_WEIGHT, 3);
    expect(sum(w)).toBeCloseTo(1, 5);
    const none = fitMixtureWeights({ rows: [], present: ['base', 'lexicon'] });
    // DEFAULT_WORD_WEIGHTS restricted to base and lexicon: 0.3 / 0.35 and 0.05 / 0.35.
    expect(none.base).toBeCloseTo(0.3 / 0.35, 5);
    expect(none.lexicon).toBeCloseTo(0.05 / 0.35, 5);
    expect(none.personal + none.cache).toBe(0);
  });
});
