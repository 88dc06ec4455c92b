import { describe, expect, it } from 'vitest';
import { loadBrown } from '../../brown';
import { codeLengthBits, PpmModel, prepareText } from '@keyloom/shared';
import { crossValidate, learningCurve } from '@keyloom/shared/src/engine/evaluation/cross-validation';
import { simulateKeystrokes } from '@keyloom/shared/src/engine/evaluation/keystroke-savings';

// Small Brown slices keep this fast; the direction of the effects is what counts.
const { documents } = loadBrown();
const news = documents.filter((d) => d.section === 'ca').slice(0, 12);

function bpc(train: string[], test: string): number {
  const model = new PpmModel({ order: 4, escape: 'C', exclusion: true });
  for (const t of train) model.learnText(prepareText(t));
  const text = prepareText(test);
  return codeLengthBits(model, text, { adaptive: true }) / text.length;
}

describe('learning curve on Brown press reportage', () => {
  it('improves with more training text, in bits and in keystrokes', () => {
    // More training text helps prediction (Lesher, Moulton & Higginbotham 1999:
    // larger training text raises keystroke savings; docs/references.md §2).
    const test = news[11].text.slice(0, 4000);
    const curve = learningCurve(
      news.slice(0, 11).map((d) => d.text),
      (train) => {
        const model = new PpmModel({ order: 4, escape: 'C', exclusion: true });
        for (const t of train) model.learnText(prepareText(t));
        const ks = simulateKeystrokes(model.freeze(), prepareText(test.slice(0, 1500)), { maxSlots: 5 });
        return { bpc: bpc(train, test), ks5: ks.savings[5] };
      },
    );
    expect(curve.map((c) => c.fraction)).toEqual([0.1, 0.25, 0.5, 1]);
    for (let i = 1; i < curve.length; i++)
      expect(curve[i].metrics.bpc).toBeLessThan(curve[i - 1].metrics.bpc);
    expect(curve[3].metrics.ks5).toBeGreaterThan(curve[0].metrics.ks5);
  });

  it('cross-validates by document with a spread across folds', () => {
    const { folds, summary } = crossValidate(news, 4, (train, test) => ({
      bpc: bpc(
        train.map((d) => d.text),
        test
          .map((d) => d.text)
          .join('\n')
          .slice(0, 3000),
      ),
    }));
    expect(folds).toHaveLength(4);
    // PPM on English text: about 2.2–2.5 bpc with ample training (docs/references.md §1);
    // with ~60k characters of training, somewhat worse.
    expect(summary.bpc.mean).toBeGreaterThan(2);
    expect(summary.bpc.mean).toBeLessThan(3.5);
    expect(summary.bpc.std).toBeGreaterThan(0);
  });
});
