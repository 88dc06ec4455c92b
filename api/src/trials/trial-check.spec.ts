import {
  computeTrialMeasures,
  type CreateTrialBody,
  createTrialSchema,
  type TrialEvent,
} from '@keyloom/shared';
import {
  checkAndMeasureTrial,
  simulatedFigures,
  TRIAL_TEXT_MISMATCH_MESSAGE,
  TRIAL_TIMES_MESSAGE,
  TrialCheckError,
} from './trial-check';

function typed(text: string, ms: number): TrialEvent[] {
  const chars = [...text];
  return chars.map((c, i) => ({
    t: Math.round((i * ms) / Math.max(1, chars.length - 1)),
    type: c === ' ' ? 'space' : 'letter',
    ...(c === ' ' ? {} : { value: c }),
  }));
}

function body(overrides: Partial<CreateTrialBody>): CreateTrialBody {
  return createTrialSchema.parse({
    localTrialId: '0f8e2c1a-6b4d-4e3f-9a21-7c5d3b1e0a99',
    startedAt: '2026-12-02T10:00:00Z',
    finishedAt: '2026-12-02T10:01:00Z',
    text: 'tea please',
    events: typed('tea please', 9_000),
    settings: {
      selectionMode: 'dwell',
      layout: 'alphabetical',
      slots: 4,
      dwellMs: 800,
      scanIntervalMs: null,
      largeTargets: true,
      highContrast: false,
      textScale: 1.5,
      tintKeys: false,
    },
    ...overrides,
  });
}

describe('checkAndMeasureTrial', () => {
  it('measures the replayed log exactly as computeTrialMeasures does', () => {
    const b = body({ targetPhrase: 'tea please' });
    const m = checkAndMeasureTrial(b);
    expect(m).toEqual(computeTrialMeasures(b.events, 'tea please'));
    // 10 characters in 9 s from the first key to the last: (10 − 1) / 9 × 60 / 5 = 12 wpm
    // (MacKenzie 2002, "A note on calculating text entry speed"; the arithmetic derived).
    expect(m.wpm).toBeCloseTo(12, 9);
  });

  it('refuses times out of order, a step that cannot be replayed and a text the log does not give', () => {
    expect(() => checkAndMeasureTrial(body({ startedAt: '2026-12-02T11:00:00Z' }))).toThrow(
      new TrialCheckError(TRIAL_TIMES_MESSAGE),
    );
    // Offsets differ but the instants agree: 10:00:00Z = 11:00:00+01:00.
    expect(() =>
      checkAndMeasureTrial(
        body({ startedAt: '2026-12-02T11:00:00+01:00', finishedAt: '2026-12-02T10:00:00Z' }),
      ),
    ).not.toThrow();
    expect(() => checkAndMeasureTrial(body({ text: 'tea pleas' }))).toThrow(TRIAL_TEXT_MISMATCH_MESSAGE);
    expect(() =>
      checkAndMeasureTrial(body({ text: 'x', events: [{ t: 0, type: 'suggestion', slot: 0 }] })),
    ).toThrow('Step 1 of the trial log: A suggestion step must name the word picked.');
    expect(() =>
      checkAndMeasureTrial(
        body({
          text: 'ab',
          events: [
            { t: 5, type: 'letter', value: 'a' },
            { t: 4, type: 'letter', value: 'b' },
          ],
        }),
      ),
    ).toThrow('Step 2 of the trial log is timed before the step before it.');
  });
});

describe('simulatedFigures', () => {
  const report = { keystrokeSavings: { '1': 0.2, '4': 0.41 }, rates: { wpmWith: 9.3, wpmWithout: 6.7 } };

  it('takes the slot count’s savings and the wpm with suggestions', () => {
    expect(simulatedFigures(report, 4)).toEqual({ keystrokeSavings: 0.41, wpm: 9.3, slots: 4 });
  });

  it('gives null for what the report lacks', () => {
    expect(simulatedFigures(report, 7)).toEqual({ keystrokeSavings: null, wpm: 9.3, slots: 7 });
    expect(simulatedFigures(null, 5)).toEqual({ keystrokeSavings: null, wpm: null, slots: 5 });
    expect(simulatedFigures({ keystrokeSavings: 'x', rates: { wpmWith: Number.NaN } }, 1)).toEqual({
      keystrokeSavings: null,
      wpm: null,
      slots: 1,
    });
  });
});
