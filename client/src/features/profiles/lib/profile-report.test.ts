import { defaultProfileSettings, trainAndEvaluateProfile } from '@keyloom/shared';
import { describe, expect, it } from 'vitest';
import { reportFixture } from '../testing/profile-data';
import {
  atSlots,
  learningCurveSpreadNote,
  learningCurveVerdict,
  listDescription,
  percent,
  readReport,
} from './profile-report';

// Invented writing in the demo client's voice (the Willowmere demo scenario).
const entries = [
  'Pepper and I went down to the harbour this morning. The wind was up and the boats were rocking. ',
  'Tell the sailing club I can crew on Saturday if Hannah drives me down to the harbour early. ',
  'The jazz night was loud and good. Pepper slept under the table the whole time, as usual. ',
  'Can you bring the blue rope and the spare jacket? The forecast says rain by the afternoon. ',
  'Thank you for the card. I am getting faster with the new keyboard, a little every week. ',
  'Hannah says the club wants a photo of the boat for the newsletter. I will send one on Sunday. ',
  'Pepper chased a gull along the harbour wall and came back soaked and very pleased with himself. ',
];

describe('readReport', () => {
  it('reads a report made by the engine itself (so the pages track its field names)', async () => {
    // The real pipeline on invented text, without a base model (small and fast).
    const { report } = await trainAndEvaluateProfile({
      documents: entries.map((text, index) => ({ id: `s${index}`, text })),
      settings: { ...defaultProfileSettings, access: { method: 'direct' } },
      base: null,
      folds: 2,
      ksSampleChars: 200,
    });
    const view = readReport(JSON.parse(JSON.stringify(report)) as Record<string, unknown>);
    expect(view).not.toBeNull();
    expect(view?.bpcIdeal).toBe(report.bpcIdeal);
    expect(Object.keys(view?.keystrokeSavings ?? {})).toHaveLength(10);
    expect(view?.baseOnly).toBeNull();
    // The word list's own fields reach the page: whole words only, checked from outside.
    expect(view?.predictor).toBe('word');
    expect(view?.nonWordSlots?.slots).toBeGreaterThan(0);
    expect(view?.nonWordSlots?.nonWordSlots).toBe(0);
    expect(listDescription(view as NonNullable<typeof view>).join(' ')).toMatch(/were real words/);
  });

  it('says when a version was trained with the earlier list, and names non-words when there were some', () => {
    const old = readReport(reportFixture());
    expect(listDescription(old as NonNullable<typeof old>)[0]).toMatch(/earlier list/);
    const charList = readReport(
      reportFixture({
        predictor: 'char',
        nonWordSlots: { share: 0.19, nonWordSlots: 19, slots: 100, lists: 20, examples: ['Teod', 'firsty'] },
      }),
    );
    expect(listDescription(charList as NonNullable<typeof charList>).join(' ')).toContain(
      '19 of 100 offered slots (19.0%) were not words, for example “Teod”, “firsty”.',
    );
  });

  it('returns null for no metrics and for a report missing its figures', () => {
    expect(readReport(null)).toBeNull();
    expect(readReport({ bpcIdeal: 2 })).toBeNull();
    expect(readReport(reportFixture())).not.toBeNull();
  });

  it('formats per-slot fractions as percentages', () => {
    expect(percent(atSlots({ '5': 0.367 }, 5))).toBe('36.7%');
    expect(percent(atSlots({ '5': 0.367 }, 6))).toBe('—');
  });
});

describe('learningCurveVerdict', () => {
  it('says more text helps when the last doubling still lowers bits per character by 0.02 or more', () => {
    expect(
      learningCurveVerdict([
        { fraction: 0.5, bpcIdeal: 2.6 },
        { fraction: 1, bpcIdeal: 2.45 },
      ]),
    ).toMatch(
      /^More text still helps: going from 50% to 100% of the text lowered bits per character by 0\.15/,
    );
  });

  it('says it has stopped helping when the gain is smaller, and says so when bpc rose', () => {
    expect(
      learningCurveVerdict([
        { fraction: 0.5, bpcIdeal: 2.46 },
        { fraction: 1, bpcIdeal: 2.45 },
      ]),
    ).toMatch(/stopped helping much.*by only 0\.01/);
    expect(
      learningCurveVerdict([
        { fraction: 0.5, bpcIdeal: 2.4 },
        { fraction: 1, bpcIdeal: 2.45 },
      ]),
    ).toMatch(/raised bits per character by 0\.05/);
    expect(learningCurveVerdict([{ fraction: 1, bpcIdeal: 2 }])).toMatch(/Not enough points/);
  });

  it('does not claim a gain smaller than the spread between folds (the spread sentence would call it chance)', () => {
    // 2.30 → 2.20 is a gain of 0.10, but the folds ranged 2.10–2.60 and 2.00–2.30: the ranges overlap.
    const points = [
      { fraction: 0.5, bpcIdeal: 2.3, spread: { folds: 3, bpcMin: 2.1, bpcMax: 2.6 } },
      { fraction: 1, bpcIdeal: 2.2, spread: { folds: 3, bpcMin: 2.0, bpcMax: 2.3 } },
    ];
    expect(learningCurveVerdict(points)).toMatch(
      /^More text may still help: .* by 0\.10, but by less than the spread/,
    );
    expect(learningCurveSpreadNote(points)).toMatch(/within the spread between folds, so it may be chance/);
    // Apart, the same gain is a gain.
    points[0].spread = { folds: 3, bpcMin: 2.28, bpcMax: 2.33 };
    points[1].spread = { folds: 3, bpcMin: 2.18, bpcMax: 2.22 };
    expect(learningCurveVerdict(points)).toMatch(/^More text still helps/);
  });
});

describe('learningCurveSpreadNote', () => {
  // Ranges overlap when neither lies wholly above the other: common practice, no source.
  const point = (fraction: number, bpcMin: number, bpcIdeal: number, bpcMax: number) => ({
    fraction,
    bpcIdeal,
    spread: { folds: 3, bpcMin, bpcMax },
  });

  it("names the earliest share whose spread overlaps the full text's", () => {
    const points = [
      point(0.1, 2.9, 3.1, 3.3),
      point(0.25, 2.2, 2.5, 2.8),
      point(0.5, 2.1, 2.3, 2.6),
      point(1, 2.0, 2.2, 2.3),
    ];
    expect(learningCurveSpreadNote(points)).toBe(
      'The change from 25% to 100% is within the spread between folds, so it may be chance.',
    );
  });

  it("says the shape is not chance when every point lies outside the full text's spread", () => {
    const points = [point(0.1, 3.0, 3.1, 3.2), point(0.5, 2.6, 2.65, 2.7), point(1, 2.2, 2.25, 2.3)];
    const note = learningCurveSpreadNote(points);
    expect(note).toMatch(/by more than the spread between the 3 folds measured/);
    expect(note).not.toMatch(/within the spread/);
  });

  it('says the spread is unknown for a report measured on one fold', () => {
    expect(
      learningCurveSpreadNote([
        { fraction: 0.5, bpcIdeal: 2.3 },
        { fraction: 1, bpcIdeal: 2.2 },
      ]),
    ).toMatch(/^Measured on one fold only/);
  });
});
