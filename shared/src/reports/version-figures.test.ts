import { describe, expect, it } from 'vitest';
import { trainAndEvaluateProfile } from '../engine/profile/profile-pipeline';
import { defaultProfileSettings } from '../engine/profile/profile-settings';
import { rateChangeSentence, versionFigures } from './version-figures';

// Invented writing in the demo client's voice (the Willowmere demo scenario).
const entries = [
  'Bought two bags of compost at the garden centre and Hannah carried them to the car for me. ',
  'The tomatoes by the greenhouse door are finally red. I picked six and ate one straight away. ',
  'Please ask the physio if Thursday works. Tuesday clashes with the choir rehearsal again. ',
  'Choir was lovely tonight. We sang the long piece twice and my part came out right both times. ',
  'Pepper dug under the fence and met the neighbour cat. Neither of them looked very impressed. ',
  'My sister phoned from Leeds. She is coming down in May and wants to see the allotment. ',
];

const train = async () =>
  (
    await trainAndEvaluateProfile({
      documents: entries.map((text, index) => ({ id: `s${index}`, text })),
      settings: { ...defaultProfileSettings, slots: 4, access: { method: 'switch', scanIntervalMs: 1000 } },
      base: null,
      folds: 3,
      ksSampleChars: 200,
    })
  ).report;

describe('versionFigures', () => {
  it("reads each figure at the version's own slot count", async () => {
    const report = await train();
    const figures = new Map(versionFigures(report).map((f) => [f.key, f]));
    expect(figures.get('slots')?.value).toBe('4');
    expect(figures.get('keystrokeSavings')?.value).toBe(
      `${(report.keystrokeSavings['4'] * 100).toFixed(1)}%`,
    );
    expect(figures.get('kspc')?.value).toBe(`${report.kspc['4'].toFixed(2)} (1.00 without suggestions)`);
    expect(figures.get('hitRate')?.value).toBe(`${Math.round(report.hitRate['4'] * 100)}% of words`);
    expect(figures.get('selectionsPerWord')?.value).toContain(report.selectionsPerWord['4'].toFixed(1));
    expect(figures.get('scanSteps')?.value).toContain(report.scanStepsByLayout.typewriter.toFixed(2));
    // No compression term in the clinic's words.
    for (const figure of figures.values()) {
      expect(`${figure.label} ${figure.value} ${figure.explanation}`).not.toMatch(
        /bits|escape|fold|coded|entropy/i,
      );
    }
  });

  it('leaves out what an older report did not measure', async () => {
    const older = { ...(await train()) };
    for (const key of ['hitRate', 'selectionsPerWord', 'ksWords', 'scanStepsByLayout'] as const)
      delete older[key];
    const keys = versionFigures(older).map((f) => f.key);
    expect(keys).toEqual(['slots', 'keystrokeSavings', 'kspc', 'wpm', 'rateChange']);
  });
});

describe('rateChangeSentence', () => {
  // Worked by hand (derived): 6.2 → 9.1 words a minute is 2.9 more, 2.9 / 6.2 = 47% faster.
  it('says the change in words a minute and as a share', () => {
    expect(rateChangeSentence({ wpmWithout: 6.2, wpmWith: 9.1 })).toBe(
      'About 2.9 more words a minute than without suggestions (47% faster).',
    );
    expect(rateChangeSentence({ wpmWithout: 5, wpmWith: 4.6 })).toMatch(
      /^About 0\.4 fewer words a minute than without suggestions \(8% slower\): reading the list/,
    );
    expect(rateChangeSentence({ wpmWithout: 5, wpmWith: 5.02 })).toMatch(/^No change/);
  });
});
