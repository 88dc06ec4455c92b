import { describe, expect, it } from 'vitest';
import { charsPerSecond, estimateRates, wordsPerMinute } from './text-entry-rate';
import { crossValidate, kFoldSplits, learningCurve, summarize } from './cross-validation';

describe('text entry rates', () => {
  it('reproduces the worked example: 43 chars in 20 s → 2.10 cps → 25.2 wpm', () => {
    // MacKenzie 2002, "A note on calculating text entry speed" (docs/references.md §2);
    // 25.2 wpm derived with 5 characters per word.
    const cps = charsPerSecond(43, 20);
    expect(cps).toBeCloseTo(2.1, 12);
    expect(wordsPerMinute(cps)).toBeCloseTo(25.2, 12);
  });

  it('gives 1.71 wpm for 7 scan steps at 1.0 s', () => {
    // docs/references.md §2 (derived): 7 s per character = 8.57 char/min = 1.71 wpm.
    const r = estimateRates({ kind: 'scanning', scanIntervalMs: 1000 }, 1, 7, 0);
    expect(r.wpmWithout).toBeCloseTo(12 / 7, 12);
    expect(r.wpmWithout.toFixed(2)).toBe('1.71');
  });

  it('charges list reading, so savings need not speed typing up', () => {
    // Koester & Levine 1994/1996 (docs/references.md §2): reading the list can cancel the savings.
    // Break-even when KS = t_read / (t_key + t_read) (derived from the time model).
    const slow = estimateRates({ kind: 'direct', keyMs: 1000 }, 0.6, 0, 1000);
    expect(slow.wpmWith).toBeLessThan(slow.wpmWithout);
    const fast = estimateRates({ kind: 'dwell', dwellMs: 800, travelMs: 700 }, 0.5, 0, 300);
    expect(fast.wpmWith).toBeGreaterThan(fast.wpmWithout);
  });
});

describe('cross-validation and learning curve', () => {
  it('splits documents into disjoint folds that cover every document once', () => {
    const docs = Array.from({ length: 23 }, (_, i) => i);
    const splits = kFoldSplits(docs, 5);
    expect(splits.flatMap((s) => s.test).sort((a, b) => a - b)).toEqual(docs);
    for (const s of splits) {
      expect(s.train.length + s.test.length).toBe(23);
      expect(s.train.some((d) => s.test.includes(d))).toBe(false);
    }
    expect(() => kFoldSplits(docs, 1)).toThrow(RangeError);
  });

  it('summarises metrics with the sample standard deviation', () => {
    const { summary } = crossValidate([1, 2, 3, 4], 4, (_train, test) => ({ x: test[0] }));
    expect(summary.x.mean).toBe(2.5);
    expect(summary.x.std).toBeCloseTo(Math.sqrt(5 / 3), 12);
    expect(summarize([])).toEqual({});
  });

  it('trains on growing parts cut at whitespace', () => {
    const texts = ['alpha beta gamma delta', 'epsilon zeta eta theta'];
    const curve = learningCurve(texts, (train) => ({ chars: train.join('').length }));
    expect(curve.map((c) => c.fraction)).toEqual([0.1, 0.25, 0.5, 1]);
    expect(curve[3].trainChars).toBe(44);
    for (let i = 1; i < curve.length; i++)
      expect(curve[i].trainChars).toBeGreaterThanOrEqual(curve[i - 1].trainChars);
    expect(curve[1].metrics.chars).toBeLessThanOrEqual(11);
  });
});
