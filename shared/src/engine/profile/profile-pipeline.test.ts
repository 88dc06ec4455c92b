import { describe, expect, it } from 'vitest';
import { LEARNING_CURVE_FRACTIONS } from '../evaluation/cross-validation';
import { CURVE_FOLDS, trainAndEvaluateProfile } from './profile-pipeline';
import { defaultProfileSettings } from './profile-settings';
import { profileReportSchema } from '../../schemas/profile-report.schema';

// Invented writing in the demo client's voice (the Willowmere demo scenario).
const entries = [
  'Bought two bags of compost at the garden centre and Hannah carried them to the car for me. ',
  'The tomatoes by the greenhouse door are finally red. I picked six and ate one straight away. ',
  'Please ask the physio if Thursday works. Tuesday clashes with the choir rehearsal again. ',
  'Choir was lovely tonight. We sang the long piece twice and my part came out right both times. ',
  'Pepper dug under the fence and met the neighbour cat. Neither of them looked very impressed. ',
  'My sister phoned from Leeds. She is coming down in May and wants to see the allotment. ',
  'Rain all afternoon, so I sorted the seed packets and wrote labels for the spring beds. ',
  'The bus driver waited while I got the chair on board. Kind of him, the queue was long. ',
];

// Mean, lowest and highest of the folds' figures: common practice, no source.
describe('learning curve spread', () => {
  it('measures every point on several folds and reports min ≤ mean ≤ max', async () => {
    const { report } = await trainAndEvaluateProfile({
      documents: entries.map((text, index) => ({ id: `s${index}`, text })),
      settings: { ...defaultProfileSettings, access: { method: 'direct' } },
      base: null,
      folds: 4,
      ksSampleChars: 200,
    });
    const curve = report.learningCurve;
    expect(curve.folds).toBe(CURVE_FOLDS);
    expect(curve.points.map((p) => p.fraction)).toEqual([...LEARNING_CURVE_FRACTIONS]);
    for (const point of curve.points) {
      const spread = point.spread;
      expect(spread?.folds).toBe(CURVE_FOLDS);
      if (!spread) continue;
      expect(spread.bpcMin).toBeLessThanOrEqual(point.bpcIdeal);
      expect(point.bpcIdeal).toBeLessThanOrEqual(spread.bpcMax);
      expect(spread.keystrokeSavingsMin).toBeLessThanOrEqual(point.keystrokeSavings);
      expect(point.keystrokeSavings).toBeLessThanOrEqual(spread.keystrokeSavingsMax);
    }
    // The full-text point is the curve folds' own cross-validation results.
    const full = curve.points.at(-1);
    const folds = report.perFold.slice(0, CURVE_FOLDS).map((f) => f.bpcIdeal);
    expect(full?.spread?.bpcMin).toBeCloseTo(Math.min(...folds), 3);
    expect(full?.spread?.bpcMax).toBeCloseTo(Math.max(...folds), 3);
    expect(full?.bpcIdeal).toBeCloseTo(folds.reduce((n, b) => n + b, 0) / folds.length, 3);
    // Different folds give different figures here, so the spread is not empty.
    expect(full?.spread?.bpcMax).toBeGreaterThan(full?.spread?.bpcMin ?? Infinity);
  });

  it('an older report with a one-fold curve and no spread still parses', () => {
    const curve = profileReportSchema.shape.learningCurve;
    const older = {
      fold: 0,
      heldOutChars: 900,
      ksChars: 400,
      slots: 5,
      points: [{ fraction: 0.1, trainChars: 300, baseWeight: 0.7, bpcIdeal: 2.35, keystrokeSavings: 0.31 }],
    };
    expect(curve.parse(older)).toEqual(older);
  });
});

// Hit rate and selections per word follow from the simulation's counts (derived: docs/references.md §2).
describe('hit rate and selections per word', () => {
  it('grow and fall with the list size as the keystrokes do', async () => {
    const { report } = await trainAndEvaluateProfile({
      documents: entries.map((text, index) => ({ id: `s${index}`, text })),
      settings: { ...defaultProfileSettings, access: { method: 'direct' } },
      base: null,
      folds: 4,
      ksSampleChars: 200,
    });
    expect(profileReportSchema.safeParse(report).success).toBe(true);
    expect(report.ksWords).toBeGreaterThan(0);
    let previous = 0;
    for (let w = 1; w <= 10; w++) {
      const hit = report.hitRate[String(w)];
      expect(hit).toBeGreaterThanOrEqual(previous);
      expect(hit).toBeLessThanOrEqual(1);
      previous = hit;
      // keystrokes = kspc × characters = selections per word × words
      expect(report.selectionsPerWord[String(w)] * report.ksWords).toBeCloseTo(
        report.kspc[String(w)] * report.ksChars,
        0,
      );
    }
    expect(report.hitRate['5']).toBeGreaterThan(0);
    // Without suggestions every character is a key: more selections per word than with 10 slots.
    expect(report.ksChars / report.ksWords).toBeGreaterThan(report.selectionsPerWord['10']);
  });
});
