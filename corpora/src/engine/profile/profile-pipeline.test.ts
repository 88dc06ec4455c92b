import { beforeAll, describe, expect, it } from 'vitest';
import { profileReportKeys, profileReportSchema } from '@keyloom/shared/src/schemas/profile-report.schema';
import { loadBaseModel } from '../../base-model';
import { loadBaseWords } from '../../base-words';
import type { BaseWords } from '@keyloom/shared/src/engine/words/word-predictor';
import { WordPredictor } from '@keyloom/shared/src/engine/words/word-predictor';
import { trainWordModel, tuneWordWeightsOnTail } from '@keyloom/shared/src/engine/words/word-training';
import { WordNgramModel } from '@keyloom/shared/src/engine/words/word-ngram-model';
import { redactionToken } from '@keyloom/shared/src/schemas/samples.schema';
import { BlendedModel, keyboardLayouts, type NextSymbolModel } from '@keyloom/shared';
import { PpmModel } from '@keyloom/shared/src/engine/ppm-model';
import { accessTiming } from '@keyloom/shared/src/engine/profile/profile-rates';
import { deserializeModel } from '@keyloom/shared/src/engine/model-serialization';
import { prepareText } from '@keyloom/shared/src/engine/text-preparation';
import { codeLengthBits, decodeText, encodeText } from '@keyloom/shared/src/engine/text-coding';
import { kFoldSplits } from '@keyloom/shared/src/engine/evaluation/cross-validation';
import { simulateKeystrokes } from '@keyloom/shared/src/engine/evaluation/keystroke-savings';
import { scanCosts } from '@keyloom/shared/src/engine/evaluation/scan-cost';
import { tuneBaseWeightOnTail } from '@keyloom/shared/src/engine/evaluation/held-out-evaluation';
import { estimateRates } from '@keyloom/shared/src/engine/evaluation/text-entry-rate';
import {
  CancelledError,
  defaultProfileSettings,
  ProfileInputError,
  trainAndEvaluateProfile,
  type ProfileDocument,
  type ProfileProgress,
  type ProfileReport,
  type ProfileSettings,
} from '@keyloom/shared';

// Invented for the Willowmere demo scenario (R. Ashby: sails, plays jazz
// piano, has a dog called Pepper; his sister is his carer). Not from any corpus.
const entries = [
  'Pepper woke me at six again. She knows when the tide is right. My sister came over with coffee and we ' +
    'talked about the regatta on Saturday. I want to crew for Tom if the wind holds.',
  'Practised the piano for an hour this afternoon. The left hand voicings in the second chorus are still ' +
    'slow, but the ballad sounds better than last week. Pepper slept under the bench the whole time.',
  'Down to the harbour with Pepper. The boat needs a new jib sheet before the regatta. Tom says the ' +
    'forecast is a steady breeze from the south west, which suits us.',
  'My sister asked what I want for my birthday. A new metronome, or the book of jazz standards with the ' +
    'chord charts. Pepper wants the beach, as always.',
  'Rough night, my shoulders ached. In the morning Pepper and I sat on the deck and watched the boats go ' +
    'out. The regatta committee sent the start times: first gun at ten.',
  'Played at the club on Thursday for the first time since the accident. Three tunes, a slow blues and ' +
    'two ballads. My sister cried a bit. Tom bought the drinks.',
  'Walked Pepper along the harbour wall. The wind was gusting and the water was grey. I thought about ' +
    'the regatta course and where we can gain on the downwind leg.',
  'Tom came round to go over the race plan. We will start at the pin end and tack early. Pepper chewed ' +
    'his glove while we talked. I practised the piano after he left.',
  'The regatta was wonderful. We came fourth in our class and Pepper barked at every boat that passed. ' +
    'My sister took photos from the harbour wall all afternoon.',
  'Pepper found a crab on the slipway and would not leave it alone. The harbour master laughed at her. ' +
    'We checked the mooring lines and then went home for tea.',
  'Jazz night on the radio. I tried to play along with the bass line and lost it in the bridge. Pepper ' +
    'howled at the trumpet solo, which my sister says is a fair review.',
  'Sent the entry form for the regatta. Tom will helm, I will call the tactics from the cockpit. My ' +
    'sister is bringing Pepper and a flask of soup to the harbour.',
  'Physio in the morning, piano in the afternoon. My hands were tired but the chords came more easily. ' +
    'Pepper brought me her lead at five, right on time.',
  'Fog on the water, no sailing today. Tom rang to talk about the regatta results and the next race. ' +
    'Pepper and I walked to the end of the harbour and back.',
  'Learnt two new jazz voicings from the book my sister gave me. Pepper sat by the piano and thumped ' +
    'her tail every time I got a chord right.',
  'Quiet day. Some piano, some reading, a long walk with Pepper by the water. Next week I want to learn ' +
    'the bridge of that jazz standard Tom likes so much.',
];
const documents: ProfileDocument[] = entries.map((text, i) => ({ id: `sample-${i + 1}`, text }));
const settings: ProfileSettings = {
  ...defaultProfileSettings,
  order: 4,
  access: { method: 'head_pointer', dwellMs: 900 },
};

let base: PpmModel;
let baseWords: BaseWords;
let report: ProfileReport;
let modelBytes: Uint8Array;
let baseWeight: number;
const progress: ProfileProgress[] = [];

beforeAll(async () => {
  base = loadBaseModel();
  baseWords = loadBaseWords();
  const result = await trainAndEvaluateProfile({ documents, settings, base, baseWords, folds: 5 }, (p) =>
    progress.push(p),
  );
  ({ report, modelBytes, baseWeight } = result);
});

const withoutTimings = (r: ProfileReport): Partial<ProfileReport> => {
  const copy: Partial<ProfileReport> = { ...r };
  delete copy.timings;
  return copy;
};

describe('trainAndEvaluateProfile on an invented corpus', () => {
  it('echoes the input and cross-validates by sample', () => {
    const chars = documents.reduce((n, d) => n + prepareText(d.text).length, 0);
    expect(report.chars).toBe(chars);
    expect(report.documents).toBe(entries.length);
    expect(report.settings).toEqual(settings);
    expect(report.foldUnit).toBe('document');
    expect(report.perFold).toHaveLength(5);
    // Each character is held out exactly once (plus one line feed between the test samples of each fold).
    expect(report.heldOutChars).toBe(chars + entries.length - 5);
    expect(report.roundTrip).toBe(true);
    expect(report.ksSampleChars).toBe(10_000);
    expect(report.ksChars).toBe(report.heldOutChars); // under the cap: everything typed
  });

  it('reports for fold 1 what the engine functions compute directly', () => {
    // The same frozen inputs, measured here with the engine's building blocks.
    const prepared = documents.map((d) => prepareText(d.text));
    const { train, test: testDocs } = kFoldSplits(prepared, 5)[0];
    const test = prepareText(testDocs.map((t) => String.fromCodePoint(...t)).join('\n'));
    const ppm = { order: 4, escape: 'C' as const, exclusion: true };
    const personal = new PpmModel({ ...ppm, adaptive: true });
    for (const t of train) personal.learnText(t);
    const baseWeight = tuneBaseWeightOnTail(ppm, train, base);
    const fresh = (): NextSymbolModel => new BlendedModel(personal.clone(), base, baseWeight);

    const fold = report.perFold[0];
    expect(fold.heldOutIds).toEqual(documents.filter((_, d) => d % 5 === 0).map((d) => d.id));
    expect(fold.baseWeight).toBeCloseTo(baseWeight, 6);
    expect(fold.testChars).toBe(test.length);
    expect(fold.bpcIdeal).toBeCloseTo(codeLengthBits(fresh(), test) / test.length, 6);
    const coded = encodeText(fresh(), test);
    expect(fold.codedBytes).toBe(coded.length);
    expect(Array.from(decodeText(fresh(), coded, test.length))).toEqual(Array.from(test));
    // The list: the fold's word model and weights tuned on its training text's tail, with the base
    // vocabulary and the blended character model, learning as it types.
    const list = new WordPredictor({
      personal: trainWordModel(train),
      base: baseWords,
      char: fresh(),
      weights: tuneWordWeightsOnTail(train, baseWords, true),
      capitalize: true,
      adaptive: true,
    });
    const ks = simulateKeystrokes(list, test, { maxSlots: 10, adaptive: true });
    for (let w = 1; w <= 10; w++) expect(fold.keystrokeSavings[String(w)]).toBeCloseTo(ks.savings[w], 6);
    const scan = scanCosts(fresh(), test, { adaptive: true });
    expect(fold.scanStepsPerChar.rowColumn).toBeCloseTo(scan.rowColumn, 6);
    expect(fold.scanStepsPerChar.modelOrdered).toBeCloseTo(scan.modelOrdered, 6);
    // The keyboard's own layouts, from the same walk over the held-out text.
    for (const layout of keyboardLayouts)
      expect(fold.scanStepsByLayout?.[layout]).toBeCloseTo(scan.keyboardRowColumn[layout], 6);
    // The learning curve's 100% point spans the curve folds trained on all their training text,
    // this fold among them.
    const full = report.learningCurve.points[3];
    expect(full.fraction).toBe(1);
    const curveFolds = report.perFold.slice(0, report.learningCurve.folds ?? 1);
    const mean = (pick: (f: (typeof curveFolds)[number]) => number) =>
      curveFolds.reduce((n, f) => n + pick(f), 0) / curveFolds.length;
    expect(full.bpcIdeal).toBeCloseTo(
      mean((f) => f.bpcIdeal),
      5,
    );
    expect(full.keystrokeSavings).toBeCloseTo(
      mean((f) => f.keystrokeSavings[String(settings.slots)]),
      5,
    );
    expect(full.spread?.bpcMin).toBeLessThanOrEqual(fold.bpcIdeal);
    expect(full.spread?.bpcMax).toBeGreaterThanOrEqual(fold.bpcIdeal);
    expect(full.spread?.keystrokeSavingsMin).toBeLessThanOrEqual(ks.savings[settings.slots] + 1e-6);
    expect(full.spread?.keystrokeSavingsMax).toBeGreaterThanOrEqual(ks.savings[settings.slots] - 1e-6);
  });

  it('averages folds as documented: bpc per fold, keystrokes and scan steps per character', () => {
    const meanBpc = report.perFold.reduce((s, f) => s + f.bpcIdeal, 0) / 5;
    expect(report.bpcIdeal).toBeCloseTo(meanBpc, 5);
    for (const key of ['bpcIdealSpread', 'bpcCodedSpread', 'baseWeightSpread'] as const) {
      const mean =
        key === 'bpcIdealSpread'
          ? report.bpcIdeal
          : key === 'bpcCodedSpread'
            ? report.bpcCoded
            : report.baseWeight;
      expect(report[key].min).toBeLessThanOrEqual(mean + 1e-6);
      expect(mean).toBeLessThanOrEqual(report[key].max + 1e-6);
      expect(report[key].std).toBeGreaterThanOrEqual(0);
    }
    expect(report.bpcIdealSpread.max).toBeGreaterThan(report.bpcIdealSpread.min); // folds differ
    // KS over all folds = 1 − total keystrokes / total characters (weighted by characters).
    const ks5 = report.perFold.reduce((s, f) => s + f.keystrokeSavings['5'] * f.ksChars, 0) / report.ksChars;
    expect(report.keystrokeSavings['5']).toBeCloseTo(ks5, 5);
    // KS = 1 − KSPC when the baseline is one key per character (docs/references.md §2, derived).
    for (let w = 1; w <= 10; w++)
      expect(report.keystrokeSavings[String(w)] + report.kspc[String(w)]).toBeCloseTo(1, 6);
    // Scan steps per keyboard layout: folds weighted by their held-out characters.
    for (const layout of keyboardLayouts) {
      const steps =
        report.perFold.reduce((s, f) => s + (f.scanStepsByLayout?.[layout] ?? 0) * f.testChars, 0) /
        report.heldOutChars;
      expect(report.scanStepsByLayout[layout]).toBeCloseTo(steps, 5);
    }
    // Letters in the cells the model picks never cost more than in fixed alphabetical order.
    expect(report.scanStepsByLayout['model-ordered']).toBeLessThan(report.scanStepsByLayout.alphabetical);
  });

  it('gives keystroke savings that never fall as slots grow and stay below the oracle bound', () => {
    for (const ks of [report.keystrokeSavings, report.baseOnly?.keystrokeSavings ?? {}]) {
      const values = Object.keys(ks).map((w) => ks[w]);
      expect(values).toHaveLength(10);
      for (let i = 1; i < values.length; i++) expect(values[i]).toBeGreaterThanOrEqual(values[i - 1]);
      for (const v of values) expect(v).toBeLessThanOrEqual(report.oracleSavings + 1e-9);
    }
  });

  it('shows what the personal text adds over the base model alone', () => {
    const baseOnly = report.baseOnly;
    expect(baseOnly).not.toBeNull();
    // The base model alone on fold 1, measured directly: static, it does not learn.
    const prepared = documents.map((d) => prepareText(d.text));
    const { test: testDocs } = kFoldSplits(prepared, 5)[0];
    const test = prepareText(testDocs.map((t) => String.fromCodePoint(...t)).join('\n'));
    const bitsFold1 = codeLengthBits(base, test, { adaptive: false }) / test.length;
    expect(bitsFold1).toBeGreaterThan(0);
    // The client's recurring names and words are learnt: the profile predicts them better.
    expect(report.bpcIdeal).toBeLessThan(baseOnly?.bpcIdeal ?? 0);
    expect(report.keystrokeSavings['5']).toBeGreaterThan(baseOnly?.keystrokeSavings['5'] ?? 1);
    const words = (report.earlyWords ?? []).map((w) => w.word);
    // Words of this client's life that a general English model does not offer that soon.
    for (const w of ['Pepper', 'piano', 'sister']) expect(words).toContain(w);
    for (const w of report.earlyWords ?? []) expect(w.count).toBeGreaterThan(0);
  });

  it('estimates rates for the access method with the stated assumptions', () => {
    const r = report.rates;
    expect(r.assumptions.timing).toEqual({ kind: 'dwell', dwellMs: 900 });
    expect(r.assumptions.defaultTiming).toBe(false);
    // wpm = characters per second × 60 / 5 (docs/references.md §2): 900 ms per character → 13.33 wpm.
    expect(r.wpmWithout).toBeCloseTo(60 / 0.9 / 5, 5);
    const again = estimateRates(r.assumptions.timing, report.kspc['5'], 0, r.assumptions.listReadMs);
    expect(r.wpmWith).toBeCloseTo(again.wpmWith, 5);
  });

  it('estimates a scanning user’s rate from the steps of the test keyboard’s default key order', async () => {
    // Same text, a switch user: each selection costs the typewriter order's row–column steps times the
    // scan interval (docs/references.md §3: r + c steps per key), the order the test keyboard opens with.
    const switchSettings: ProfileSettings = {
      ...settings,
      access: { method: 'switch', scanIntervalMs: 800 },
    };
    const scanned = await trainAndEvaluateProfile({
      documents: documents.slice(0, 6),
      settings: switchSettings,
      base,
      baseWords,
      folds: 3,
    });
    const steps = scanned.report.scanStepsByLayout?.typewriter;
    expect(steps).toBeGreaterThan(0);
    expect(scanned.report.rates.assumptions.scanStepsPerSelection).toBe(steps);
    // Not the fixed 6×7 grid of the older estimate: the typewriter order costs more steps per key.
    expect(steps).not.toBeCloseTo(scanned.report.scanStepsPerChar.rowColumn, 2);
    const again = estimateRates(
      { kind: 'scanning', scanIntervalMs: 800 },
      scanned.report.kspc['5'],
      steps!,
      0,
    );
    expect(scanned.report.rates.wpmWithout).toBeCloseTo(again.wpmWithout, 2);
  });

  it('reports the learning curve at 10/25/50/100% of the training text, from fold 1 on', () => {
    const c = report.learningCurve;
    expect(c.fold).toBe(0);
    expect(c.folds).toBe(Math.min(3, report.perFold.length));
    expect(c.points.map((p) => p.fraction)).toEqual([0.1, 0.25, 0.5, 1]);
    for (let i = 1; i < 4; i++) expect(c.points[i].trainChars).toBeGreaterThan(c.points[i - 1].trainChars);
    const curveFolds = report.perFold.slice(0, c.folds);
    expect(c.points[3].trainChars).toBe(
      Math.round(curveFolds.reduce((n, f) => n + f.trainChars, 0) / curveFolds.length),
    );
  });

  it('moves progress through the stages in order, never backwards, ending at 1', () => {
    expect(progress.length).toBeGreaterThan(20);
    const order = ['preparing', 'training', 'cross-validating', 'simulating', 'saving'];
    for (let i = 1; i < progress.length; i++) {
      expect(progress[i].fraction).toBeGreaterThanOrEqual(progress[i - 1].fraction);
      expect(order.indexOf(progress[i].stage)).toBeGreaterThanOrEqual(order.indexOf(progress[i - 1].stage));
    }
    expect(new Set(progress.map((p) => p.stage))).toEqual(new Set(order));
    expect(progress[progress.length - 1].fraction).toBe(1);
    // No gap larger than a fold's share of the work.
    for (let i = 1; i < progress.length; i++)
      expect(progress[i].fraction - progress[i - 1].fraction).toBeLessThan(0.2);
  });

  it('returns the final model, trained on every sample, which loads back with identical predictions', () => {
    const loaded = deserializeModel(modelBytes);
    const direct = new PpmModel({ order: 4, escape: 'C', exclusion: true, adaptive: true });
    for (const d of documents) direct.learnText(prepareText(d.text));
    expect(baseWeight).toBeCloseTo(report.baseWeight, 6);
    const probe = prepareText('Pepper and I sailed past the harbour wall before the regatta. Zebra!');
    for (let i = 0; i < probe.length; i++)
      expect(loaded.probability(probe, i, probe[i])).toBe(direct.probability(probe, i, probe[i]));
  });

  it('writes a report its schema accepts as it is, every field named by the schema', () => {
    const stored = JSON.parse(JSON.stringify(report)) as unknown;
    const parsed = profileReportSchema.safeParse(stored);
    expect(parsed.error).toBeUndefined();
    expect(parsed.data).toEqual(stored);
    // Every field the schema names, except `vocabulary`, which is written only for a version with
    // added or blocked words (this one has none; the vocabulary test below checks it is written).
    expect(Object.keys(report).sort()).toEqual(profileReportKeys.filter((k) => k !== 'vocabulary').sort());
  });

  it('still reads a report stored before the word list (no predictor, wordWeights or nonWordSlots)', () => {
    const { predictor, wordWeights, nonWordSlots, ...older } = JSON.parse(
      JSON.stringify(report),
    ) as ProfileReport;
    expect([predictor, wordWeights === undefined, nonWordSlots === undefined]).toEqual([
      'word',
      false,
      false,
    ]);
    expect(profileReportSchema.safeParse(older).success).toBe(true);
    expect(profileReportSchema.safeParse({ ...older, chars: undefined }).success).toBe(false);
  });

  it('still reads a report stored before scan steps per keyboard layout', () => {
    const { scanStepsByLayout, ...older } = JSON.parse(JSON.stringify(report)) as ProfileReport;
    expect(Object.keys(scanStepsByLayout ?? {}).sort()).toEqual([...keyboardLayouts].sort());
    const perFold = older.perFold.map(({ scanStepsByLayout: _, ...fold }) => fold);
    expect(profileReportSchema.safeParse({ ...older, perFold }).success).toBe(true);
    // A half-written figure is refused.
    const partial = { ...older, scanStepsByLayout: { typewriter: 1, alphabetical: 2 } };
    expect(profileReportSchema.safeParse(partial).success).toBe(false);
  });

  it('is deterministic: the same input gives the same report apart from timings', async () => {
    const again = await trainAndEvaluateProfile({ documents, settings, base, baseWords, folds: 5 });
    expect(withoutTimings(again.report)).toEqual(withoutTimings(report));
    expect(Array.from(again.modelBytes)).toEqual(Array.from(modelBytes));
  });
});

describe('trainAndEvaluateProfile edge cases', () => {
  it('refuses fewer than 500 characters with a clear message', async () => {
    const small = [{ id: 'a', text: 'Pepper and I went sailing. '.repeat(18) }]; // 486 characters
    await expect(trainAndEvaluateProfile({ documents: small, settings, base })).rejects.toThrow(
      ProfileInputError,
    );
    await expect(trainAndEvaluateProfile({ documents: small, settings, base })).rejects.toThrow(
      /at least 500 characters.*have 486/,
    );
    await expect(
      trainAndEvaluateProfile({ documents, settings: { ...settings, slots: 11 }, base }),
    ).rejects.toThrow(/invalid profile settings: slots: Choose 1 to 10 suggestion slots/);
  });

  it('stops with CancelledError when asked, before or during the work', async () => {
    await expect(
      trainAndEvaluateProfile({ documents, settings, base }, undefined, () => true),
    ).rejects.toThrow(CancelledError);
    let simulating = false;
    await expect(
      trainAndEvaluateProfile(
        { documents, settings, base },
        (p) => {
          if (p.stage === 'simulating') simulating = true;
        },
        () => simulating,
      ),
    ).rejects.toThrow(CancelledError);
  });

  it('splits the text into contiguous segments when there are fewer samples than folds', async () => {
    const two = [
      { id: 'a', text: entries.slice(0, 8).join('\n') },
      { id: 'b', text: entries.slice(8).join('\n') },
    ];
    const { report: r } = await trainAndEvaluateProfile({ documents: two, settings, base: null, folds: 5 });
    expect(r.foldUnit).toBe('segment');
    expect(r.foldNote).toMatch(/consecutive parts/);
    expect(r.perFold).toHaveLength(5);
    // Segments cover the joined text exactly once.
    expect(r.heldOutChars).toBe(r.chars + 1);
    expect(r.baseOnly).toBeNull();
    expect(r.earlyWords).toBeNull();
    expect(r.baseWeight).toBe(0);
    expect(r.roundTrip).toBe(true);
  });

  it('caps the keystroke simulation per fold and says so', async () => {
    const { report: r } = await trainAndEvaluateProfile({
      documents,
      settings: { ...settings, baseWeight: 0.25 },
      base,
      ksSampleChars: 300,
    });
    expect(r.ksSampleChars).toBe(300);
    for (const f of r.perFold) expect(f.ksChars).toBeLessThanOrEqual(300);
    expect(r.ksChars).toBeLessThan(r.heldOutChars);
    expect(r.ksNote).toMatch(/first 300 characters/);
    expect(r.baseWeight).toBe(0.25);
    for (const f of r.perFold) expect(f.baseWeight).toBe(0.25);
  });
});

describe('trainAndEvaluateProfile and the word list', () => {
  it('keeps redacted personal data out of the vocabulary and offers only words', async () => {
    // Samples as the API hands them over after a redaction: the name replaced by the placeholder.
    const token = redactionToken('person_name');
    const redacted = documents.map((d) => ({ id: d.id, text: d.text.replaceAll('Tom', token) }));
    const {
      report: r,
      wordModelBytes,
      wordWeights,
    } = await trainAndEvaluateProfile({
      documents: redacted,
      settings,
      base,
      baseWords,
      folds: 2,
      ksSampleChars: 400,
    });
    expect(r.predictor).toBe('word');
    const words = WordNgramModel.fromBytes(wordModelBytes as Uint8Array);
    expect(words.has('pepper')).toBe(true);
    for (const key of ['tom', 'person-name', 'person', 'name']) expect(words.has(key)).toBe(false);
    // Checked from outside the list: every offered slot is a word of the vocabulary.
    expect(r.nonWordSlots.slots).toBeGreaterThan(100);
    expect(r.nonWordSlots.nonWordSlots).toBe(0);
    expect(wordWeights).not.toBeNull();
    const sum = Object.values(wordWeights ?? {}).reduce((a, b) => a + b, 0);
    expect(sum).toBeCloseTo(1, 5);
  });

  it('measures the character-only list for comparison, which offers fragments', async () => {
    const { report: r, wordModelBytes } = await trainAndEvaluateProfile({
      documents,
      settings,
      base,
      baseWords,
      folds: 2,
      ksSampleChars: 400,
      predictor: 'char',
    });
    expect(r.predictor).toBe('char');
    expect(wordModelBytes).toBeNull();
    expect(r.wordWeights).toBeNull();
    expect(r.nonWordSlots.nonWordSlots).toBeGreaterThan(0);
  });
});

describe('trainAndEvaluateProfile with the clinician’s additions and blocks', () => {
  const run = (vocabulary?: Parameters<typeof trainAndEvaluateProfile>[0]['vocabulary']) =>
    trainAndEvaluateProfile({
      documents,
      settings,
      base,
      baseWords,
      folds: 2,
      ksSampleChars: 600,
      vocabulary,
    });

  it('learns additions into the word model, applies blocks to the simulation, and counts both', async () => {
    const plain = await run();
    expect(plain.report.vocabulary).toBeUndefined();
    const none = await run({ additions: [], blocks: [] });
    expect(none.report.keystrokeSavings).toEqual(plain.report.keystrokeSavings);
    expect(none.report.vocabulary).toBeUndefined();

    const edited = await run({
      additions: [{ text: 'Dr Okafor', weight: 5 }, { text: 'St Anne’s hospice' }],
      blocks: [{ word: 'Pepper' }, { word: 'regatta', replacement: 'race' }],
    });
    expect(edited.report.vocabulary).toEqual({ added: 2, blocked: 2 });
    const words = WordNgramModel.fromBytes(edited.wordModelBytes as Uint8Array);
    expect(words.counts[words.idOf('okafor')]).toBe(5);
    expect(words.counts[words.idOf('hospice')]).toBe(3);
    expect(words.probability('<s>', 'dr', 'okafor')).toBeGreaterThan(0.5);
    // "Pepper" (in every sample) can no longer be selected, so fewer keystrokes are saved.
    expect(edited.report.keystrokeSavings['5']).toBeLessThan(plain.report.keystrokeSavings['5']);
  });

  it('refuses an unusable vocabulary with ProfileInputError', async () => {
    await expect(run({ additions: [{ text: '...' }], blocks: [] })).rejects.toThrow(ProfileInputError);
    await expect(run({ additions: [], blocks: [{ word: 'a', replacement: 'b c' }] })).rejects.toThrow(
      /one word/,
    );
  });
});

describe('accessTiming', () => {
  // Keyloom's own convention (no outside source): a head pointer's record keeps a time per key.
  it('takes a head pointer’s time per key, and its dwell time only when that is all there is', () => {
    expect(accessTiming({ method: 'head_pointer', keyTimeMs: 1800 }).timing).toEqual({
      kind: 'direct',
      keyMs: 1800,
    });
    expect(accessTiming({ method: 'head_pointer', dwellMs: 900 }).timing).toEqual({
      kind: 'dwell',
      dwellMs: 900,
    });
    expect(accessTiming({ method: 'eye_gaze', dwellMs: 700 }).timing).toEqual({
      kind: 'dwell',
      dwellMs: 700,
    });
  });
});
