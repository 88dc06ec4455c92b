// Train and evaluate one profile version: k-fold cross-validation of the
// personal model (blended with the base model) on the frozen samples, the
// base model alone on the same held-out text, a learning curve, rates for the
// access method, the words the profile offers early, and the final model
// trained on every sample.
//
// Every figure comes from the engine's own functions (evaluation/
// held-out-evaluation.ts is the same measurement `model evaluate` prints),
// with adaptive evaluation: the model learns the held-out text as it reads
// it, as on the client's device. Deterministic: no randomness anywhere, so
// the same input gives the same report (timings aside).
import type { z } from 'zod';
import type {
  baseOnlyReportSchema,
  learningCurveReportSchema,
  nonWordSlotsReportSchema,
  perSlotSchema,
  ProfileReport,
  profileFoldReportSchema,
  ScanStepsByLayout,
  spreadSchema,
} from '../../schemas/profile-report.schema';
import type { KeyboardLayout } from '../../schemas/trials.schema';
import type { NextSymbolModel } from '../model-types';
import type { PpmSettings } from '../ppm-settings';
import { serializeModel } from '../model-serialization';
import { prepareText, stringFromCodePoints } from '../text-preparation';
import { codeLengthBits } from '../text-coding';
import { learningCurve, LEARNING_CURVE_FRACTIONS, summarize } from '../evaluation/cross-validation';
import {
  codeAndCheck,
  freshModel,
  trainPersonalModel,
  tuneBaseWeightOnTail,
} from '../evaluation/held-out-evaluation';
import { simulateKeystrokes, type KeystrokeResult } from '../evaluation/keystroke-savings';
import { offeredNonWords } from '../evaluation/offered-words';
import type { WordNgramModel } from '../words/word-ngram-model';
import { type BaseWords, type ListPredictor, WordPredictor, type WordWeights } from '../words/word-predictor';
import { trainWordModel, tuneWordWeightsOnTail } from '../words/word-training';
import {
  additionSentences,
  blockPartsOf,
  checkClientVocabulary,
  EMPTY_VOCABULARY,
  VocabularyError,
  type ClientVocabulary,
} from '../words/client-vocabulary';
import { scanCosts, type ScanCostResult } from '../evaluation/scan-cost';
import { CharListPredictor } from '../words/char-list-predictor';
import { countEarlyWords, EarlyWordRecorder, topEarlyWords } from './early-words';
import { ProfileInputError } from './profile-errors';
import { keystrokeSample, planFolds, type PreparedDocument } from './profile-folds';
import { ProgressTracker, type ProfileProgress } from './profile-progress';
import { DEFAULT_LIST_READ_MS, profileRates, type RateReport } from './profile-rates';
import { checkProfileSettings, type ProfileSettings } from './profile-settings';

/** Version of the engine that made a report; stored with each profile version. */
export const ENGINE_VERSION = 'keyloom-engine/2 (model layout 1, word model layout 2, profile report 3)';
/** Fewest characters (after preparation, all samples together) a profile is trained on. */
export const MIN_PROFILE_CHARS = 500;
/** Largest suggestion list measured. */
export const MAX_SLOTS = 10;
/**
 * Characters of each fold's held-out text the keystroke simulation types by
 * default (the leading part, cut at a space). The simulation costs about
 * 100 times more per character than the bits-per-character measures (a
 * suggestion search before every letter), so it is capped to keep a
 * 200,000-character profile under a minute; the other measures use the whole
 * held-out text.
 */
export const DEFAULT_KS_SAMPLE_CHARS = 10_000;
/** Longest earlyWords list. */
export const EARLY_WORDS_LIMIT = 30;

export type ProfileDocument = { id: string; text: string };

export type ProfileInput = {
  /** The frozen, redacted samples. */
  documents: readonly ProfileDocument[];
  settings: ProfileSettings;
  /** The frozen base model (never changed here), or null for the personal model alone. */
  base: NextSymbolModel | null;
  /** Cross-validation folds, 2..10 (default 5). */
  folds?: number;
  /** Cap per fold on the characters the keystroke simulation types (≥ 100, default 10,000); null: no cap. */
  ksSampleChars?: number | null;
  /** ms to read the suggestion list once, for the rates (default 500, an assumption). */
  listReadMs?: number;
  /** The base vocabulary (frozen), or null: the word-aware list then knows only the client's words. */
  baseWords?: BaseWords | null;
  /**
   * The list measured: `word` (default) offers only vocabulary words, ranked by word context, recency
   * and the character model; `char` is the character-only list, kept for comparison.
   */
  predictor?: 'word' | 'char';
  /**
   * The clinician's additions (learned into every word model the pipeline trains) and blocks
   * (applied to every word list it measures). Default none.
   */
  vocabulary?: ClientVocabulary;
};

// The report's types are inferred from its schema (shared/src/schemas/profile-report.schema.ts).
export type NonWordSlotsReport = z.infer<typeof nonWordSlotsReportSchema>;
/** Spread of a metric over folds (sample standard deviation). */
export type Spread = z.infer<typeof spreadSchema>;
/** A value per list size, keys "1".."10". */
export type PerSlot = z.infer<typeof perSlotSchema>;
export type ProfileFoldReport = z.infer<typeof profileFoldReportSchema>;
export type LearningCurveReport = z.infer<typeof learningCurveReportSchema>;
export type BaseOnlyReport = z.infer<typeof baseOnlyReportSchema>;
export type { ProfileReport };
/** A report as this engine writes it: the fields that reports stored before the word list lack are always there. */
export type CurrentProfileReport = ProfileReport &
  Required<
    Pick<
      ProfileReport,
      'predictor' | 'nonWordSlots' | 'scanStepsByLayout' | 'ksWords' | 'hitRate' | 'selectionsPerWord'
    >
  >;

/** Words offered per list position checked for the non-word share, per fold (three lists per word). */
const NON_WORD_CHECK_WORDS = 150;

export type ProfileResult = {
  report: CurrentProfileReport;
  /** serializeModel of the personal PPM model trained on every sample. */
  modelBytes: Uint8Array;
  /** λ to blend it with the base model (0 without a base model). */
  baseWeight: number;
  /** The client's word model trained on every sample (WordNgramModel bytes), null for the character-only list. */
  wordModelBytes: Uint8Array | null;
  wordWeights: WordWeights | null;
};

/** Cost estimates per character, roughly µs on a 2-core machine (they only shape the progress bar). */
const COST = {
  prepare: 0.5,
  train: 0.7,
  tune: 1.5,
  bits: 2.5,
  coding: 27,
  scan: 37,
  ks: 260,
  ksBase: 100,
  save: 0.3,
  words: 4,
};

/** Folds the learning curve is measured on (each point then has a spread). */
export const CURVE_FOLDS = 3;

/** One learning-curve point measured on one fold. */
type CurveMeasure = { trainChars: number; baseWeight: number; bpc: number; ks: number };

/** A learning-curve point over the folds measured: means, with the lowest and highest of each figure. */
function curvePoint(fraction: number, rows: readonly CurveMeasure[]): LearningCurveReport['points'][number] {
  const mean = (pick: (r: CurveMeasure) => number) => rows.reduce((n, r) => n + pick(r), 0) / rows.length;
  const bpcs = rows.map((r) => r.bpc);
  const savings = rows.map((r) => r.ks);
  return {
    fraction,
    trainChars: Math.round(mean((r) => r.trainChars)),
    baseWeight: round(mean((r) => r.baseWeight)),
    bpcIdeal: round(mean((r) => r.bpc)),
    keystrokeSavings: round(mean((r) => r.ks)),
    spread: {
      folds: rows.length,
      bpcMin: round(Math.min(...bpcs)),
      bpcMax: round(Math.max(...bpcs)),
      keystrokeSavingsMin: round(Math.min(...savings)),
      keystrokeSavingsMax: round(Math.max(...savings)),
    },
  };
}

function round(x: number): number {
  return Math.round(x * 1e6) / 1e6;
}

function perSlot(values: readonly number[]): PerSlot {
  const out: PerSlot = {};
  for (let w = 1; w <= MAX_SLOTS; w++) out[String(w)] = round(values[w]);
  return out;
}

/** Result of one fold, before rounding. */
type FoldWork = {
  train: Uint32Array[];
  test: Uint32Array;
  ksText: Uint32Array;
  trainChars: number;
  personal?: ReturnType<typeof trainPersonalModel>;
  baseWeight: number;
  bits: number;
  codedBytes: number;
  roundTrip: boolean;
  scan?: ScanCostResult;
  ks?: KeystrokeResult;
  baseBits: number;
  baseKs?: KeystrokeResult;
  words?: WordNgramModel;
  wordWeights?: WordWeights;
};

/**
 * Trains and evaluates a profile version.
 * @param input samples, settings, base model, folds (2..10, default 5)
 * @param onProgress called with the stage and the overall fraction (0..1, never decreasing, last call 1)
 * @param shouldCancel checked between steps (and inside long ones); true → CancelledError
 * @throws ProfileInputError for fewer than 500 characters or settings out of range
 */
export async function trainAndEvaluateProfile(
  input: ProfileInput,
  onProgress?: (p: ProfileProgress) => void,
  shouldCancel?: () => boolean,
): Promise<ProfileResult> {
  const started = Date.now();
  const settings = checkProfileSettings(input.settings);
  const k = input.folds ?? 5;
  const cap = input.ksSampleChars === undefined ? DEFAULT_KS_SAMPLE_CHARS : input.ksSampleChars;
  if (cap !== null && !(Number.isInteger(cap) && cap >= 100))
    throw new ProfileInputError(`ksSampleChars must be an integer ≥ 100 or null, got ${cap}`);
  const listReadMs = input.listReadMs ?? DEFAULT_LIST_READ_MS;
  const base = input.base;
  const baseWords = base ? (input.baseWords ?? null) : null;
  const useWords = (input.predictor ?? 'word') === 'word';
  const capitalize = !settings.caseFold;
  const vocabulary = input.vocabulary ?? EMPTY_VOCABULARY;
  try {
    checkClientVocabulary(vocabulary);
  } catch (error) {
    if (error instanceof VocabularyError) throw new ProfileInputError(error.message);
    throw error;
  }
  const added = additionSentences(vocabulary.additions, { caseFold: settings.caseFold });
  const blocks = blockPartsOf(vocabulary.blocks, { caseFold: settings.caseFold });
  /** The client's word model with the additions learned after the texts. */
  const wordModelOf = (texts: readonly Uint32Array[]) => trainWordModel(texts, added);
  const slots = settings.slots;
  const ppm: Partial<PpmSettings> = {
    order: settings.order,
    escape: settings.escape,
    exclusion: settings.exclusion,
  };
  const tuned = settings.baseWeight === 'auto' && base !== null;
  const baseWeightFor = (texts: readonly Uint32Array[]): number =>
    base === null
      ? 0
      : settings.baseWeight === 'auto'
        ? tuneBaseWeightOnTail(ppm, texts, base)
        : settings.baseWeight;

  // Preparing (cheap and needed to plan the rest, so done before the tracker).
  const documents: PreparedDocument[] = input.documents.map((d) => ({
    id: d.id,
    text: prepareText(d.text, { caseFold: settings.caseFold }),
  }));
  const chars = documents.reduce((n, d) => n + d.text.length, 0);
  if (chars < MIN_PROFILE_CHARS)
    throw new ProfileInputError(
      `A profile needs at least ${MIN_PROFILE_CHARS} characters of sample text; ` +
        `the selected samples have ${chars}. Add more samples.`,
    );
  const plan = planFolds(documents, k);
  const folds: FoldWork[] = plan.folds.map((f) => ({
    train: f.train,
    test: f.test,
    ksText: keystrokeSample(f.test, cap),
    trainChars: f.train.reduce((n, t) => n + t.length, 0),
    baseWeight: 0,
    bits: 0,
    codedBytes: 0,
    roundTrip: false,
    baseBits: 0,
  }));

  // The plan's cost, so the bar moves with time.
  // The learning curve is measured on the first CURVE_FOLDS folds, so each point shows its spread.
  const curveFolds = folds.slice(0, CURVE_FOLDS);
  const curveFractions = LEARNING_CURVE_FRACTIONS.filter((f) => f < 1);
  const slotShare = slots / MAX_SLOTS;
  const wordCost = useWords ? COST.words : 0;
  let total = chars * COST.prepare + chars * (COST.train + (tuned ? COST.tune : 0)) + chars * COST.save;
  for (const f of folds) {
    total += f.trainChars * (COST.train + (tuned ? COST.tune : 0));
    total += f.test.length * (COST.bits + COST.coding + COST.scan + (base ? COST.bits : 0));
    total += f.ksText.length * (COST.ks + (base ? COST.ksBase : 0));
  }
  const curveCost = (curveFold: (typeof folds)[number], fraction: number): number =>
    curveFold.trainChars * fraction * (COST.train + (tuned ? COST.tune : 0) + wordCost) +
    curveFold.test.length * COST.bits +
    curveFold.ksText.length * COST.ks * slotShare;
  for (const f of curveFolds) for (const fraction of curveFractions) total += curveCost(f, fraction);
  const progress = new ProgressTracker(total, onProgress, shouldCancel);
  await progress.step('preparing', chars * COST.prepare, () => undefined);

  // Training: one model per fold, and the final model on every sample.
  for (const f of folds) {
    await progress.step('training', f.trainChars * (COST.train + (tuned ? COST.tune : 0) + wordCost), () => {
      f.personal = trainPersonalModel(ppm, f.train);
      f.baseWeight = baseWeightFor(f.train);
      if (useWords) {
        f.words = wordModelOf(f.train);
        f.wordWeights = tuneWordWeightsOnTail(f.train, baseWords, true);
      }
    });
  }
  const allTexts = documents.map((d) => d.text);
  const final = await progress.step(
    'training',
    chars * (COST.train + (tuned ? COST.tune : 0) + wordCost),
    () => ({
      model: trainPersonalModel(ppm, allTexts),
      words: useWords ? wordModelOf(allTexts) : null,
      wordWeights: useWords ? tuneWordWeightsOnTail(allTexts, baseWords, true) : null,
    }),
  );
  const meanWeight = folds.reduce((s, f) => s + f.baseWeight, 0) / folds.length;
  const baseWeight = base === null ? 0 : settings.baseWeight === 'auto' ? meanWeight : settings.baseWeight;

  // Cross-validating: bits per character, ideal and coded, and scan cost.
  const fresh = (f: FoldWork): NextSymbolModel => freshModel(need(f.personal), base, f.baseWeight, true);
  /** The list a fold measures, learning as it is typed (the word model and the character model). */
  const freshList = (f: FoldWork): ListPredictor | NextSymbolModel =>
    useWords
      ? new WordPredictor({
          personal: need(f.words).clone(),
          base: baseWords,
          char: fresh(f),
          weights: need(f.wordWeights),
          capitalize,
          adaptive: true,
          ...blocks,
        })
      : fresh(f);
  /** The base alone as shipped (frozen): base vocabulary and base character model, or the base's character list. */
  const baseList = (f: FoldWork): ListPredictor | NextSymbolModel =>
    useWords && baseWords && base
      ? new WordPredictor({
          personal: null,
          base: baseWords,
          char: base,
          weights: need(f.wordWeights),
          capitalize,
          adaptive: false,
          ...blocks,
        })
      : (base as NextSymbolModel);
  for (const f of folds) {
    await progress.step('cross-validating', f.test.length * COST.bits, () => {
      f.bits = codeLengthBits(fresh(f), f.test, { adaptive: true });
    });
    await progress.step('cross-validating', f.test.length * COST.coding, () => {
      Object.assign(f, codeAndCheck(fresh(f), fresh(f), f.test));
    });
    await progress.step('cross-validating', f.test.length * COST.scan, () => {
      f.scan = scanCosts(fresh(f), f.test, { adaptive: true });
    });
    if (base) {
      // The base model as shipped: frozen, it does not learn the client's text.
      await progress.step('cross-validating', f.test.length * COST.bits, () => {
        f.baseBits = codeLengthBits(base, f.test, { adaptive: false });
      });
    }
  }

  // Simulating: keystrokes with the profile and with the base alone.
  const earlyCounts = new Map<string, number>();
  for (const f of folds) {
    const profileWords = new EarlyWordRecorder(slots);
    await progress.step('simulating', f.ksText.length * COST.ks, (inside) => {
      f.ks = simulateKeystrokes(freshList(f), f.ksText, {
        maxSlots: MAX_SLOTS,
        adaptive: true,
        onWord: (visit) => {
          profileWords.record(visit);
          inside(visit.end / f.ksText.length);
        },
      });
    });
    if (base) {
      const baseRecorder = new EarlyWordRecorder(slots);
      await progress.step('simulating', f.ksText.length * COST.ksBase, (inside) => {
        f.baseKs = simulateKeystrokes(baseList(f), f.ksText, {
          maxSlots: MAX_SLOTS,
          adaptive: false,
          onWord: (visit) => {
            baseRecorder.record(visit);
            inside(visit.end / f.ksText.length);
          },
        });
      });
      countEarlyWords(f.ksText, profileWords, baseRecorder, earlyCounts);
    }
  }

  // Offered non-words: lists of a static copy of each fold's list, checked against the fold's
  // vocabulary (its training words and the base vocabulary), whichever list is measured.
  const nonWord = { nonWordSlots: 0, slots: 0, lists: 0, examples: [] as string[] };
  for (const f of folds) {
    await progress.step(
      'simulating',
      Math.min(f.ksText.length, NON_WORD_CHECK_WORDS * 6) * COST.ks * 0.3,
      () => {
        const vocabulary = new WordPredictor({
          personal: f.words ?? wordModelOf(f.train),
          base: baseWords,
          char: null,
          weights: { personal: 1, base: 1, lexicon: 1, cache: 0 },
          capitalize,
          adaptive: false,
        });
        const list = useWords
          ? new WordPredictor({
              personal: need(f.words),
              base: baseWords,
              char: freshModel(need(f.personal), base, f.baseWeight, false),
              weights: need(f.wordWeights),
              capitalize,
              adaptive: false,
              ...blocks,
            })
          : new CharListPredictor(freshModel(need(f.personal), base, f.baseWeight, false), false);
        const r = offeredNonWords(
          list,
          (w) => vocabulary.inVocabulary(w),
          f.ksText,
          slots,
          NON_WORD_CHECK_WORDS,
        );
        nonWord.nonWordSlots += r.nonWordSlots;
        nonWord.slots += r.slots;
        nonWord.lists += r.lists;
        for (const e of r.examples)
          if (nonWord.examples.length < 10 && !nonWord.examples.includes(e)) nonWord.examples.push(e);
      },
    );
  }

  // Learning curve on each of the first CURVE_FOLDS folds; a fold's 100% point is its result.
  const curveRows: CurveMeasure[][] = LEARNING_CURVE_FRACTIONS.map(() => []);
  for (const curveFold of curveFolds) {
    const curveTexts = curveFold.train.map((t) => stringFromCodePoints(t));
    for (const [i, fraction] of LEARNING_CURVE_FRACTIONS.entries()) {
      if (fraction === 1) {
        curveRows[i].push({
          trainChars: curveFold.trainChars,
          baseWeight: curveFold.baseWeight,
          bpc: curveFold.bits / curveFold.test.length,
          ks: need(curveFold.ks).savings[slots],
        });
        continue;
      }
      const point = await progress.step('simulating', curveCost(curveFold, fraction), (inside) => {
        const [row] = learningCurve(
          curveTexts,
          (part) => {
            const texts = part.map((t) => prepareText(t, { caseFold: settings.caseFold }));
            const personal = trainPersonalModel(ppm, texts);
            const baseWeight = baseWeightFor(texts);
            const bits = codeLengthBits(freshModel(personal, base, baseWeight, true), curveFold.test, {
              adaptive: true,
            });
            const list = useWords
              ? new WordPredictor({
                  personal: wordModelOf(texts),
                  base: baseWords,
                  char: freshModel(personal, base, baseWeight, true),
                  weights: tuneWordWeightsOnTail(texts, baseWords, true),
                  capitalize,
                  adaptive: true,
                  ...blocks,
                })
              : freshModel(personal, base, baseWeight, true);
            const ks = simulateKeystrokes(list, curveFold.ksText, {
              maxSlots: slots,
              adaptive: true,
              onWord: (visit) => inside(visit.end / curveFold.ksText.length),
            });
            return { baseWeight, bpc: bits / curveFold.test.length, ks: ks.savings[slots] };
          },
          [fraction],
        );
        return row;
      });
      curveRows[i].push({
        trainChars: point.trainChars,
        baseWeight: point.metrics.baseWeight,
        bpc: point.metrics.bpc,
        ks: point.metrics.ks,
      });
    }
  }
  const curvePoints = LEARNING_CURVE_FRACTIONS.map((fraction, i) => curvePoint(fraction, curveRows[i]));

  // Saving: the final personal model, serialised.
  const modelBytes = await progress.step('saving', chars * COST.save, () => serializeModel(final.model));
  const wordModelBytes = final.words ? final.words.toBytes() : null;
  progress.finish();

  // Summaries: bpc as a mean over folds with its spread; keystrokes and scan
  // steps over all characters (folds weighted by their characters).
  const rows = folds.map((f) => ({
    bpcIdeal: f.bits / f.test.length,
    bpcCoded: (f.codedBytes * 8) / f.test.length,
    baseWeight: f.baseWeight,
  }));
  const summary = summarize(rows);
  const spread = (key: string): Spread => ({
    min: round(summary[key].min),
    max: round(summary[key].max),
    std: round(summary[key].std),
  });
  const ksChars = folds.reduce((n, f) => n + f.ksText.length, 0);
  const heldOutChars = folds.reduce((n, f) => n + f.test.length, 0);
  const keysPerSlot = (pick: (f: FoldWork) => KeystrokeResult): number[] => {
    const keys = new Array<number>(MAX_SLOTS + 1).fill(0);
    for (const f of folds) pick(f).keystrokes.forEach((x, w) => (keys[w] += x));
    return keys;
  };
  const keys = keysPerSlot((f) => need(f.ks));
  const ksWords = folds.reduce((n, f) => n + need(f.ks).words, 0);
  /** Hits per list size over all folds, as a share of the words typed. */
  const hitRateOf = (pick: (f: FoldWork) => KeystrokeResult): number[] => {
    const hits = new Array<number>(MAX_SLOTS + 1).fill(0);
    for (const f of folds) pick(f).hits.forEach((x, w) => (hits[w] += x));
    return hits.map((x) => (ksWords === 0 ? 0 : x / ksWords));
  };
  const savings = keys.map((x) => 1 - x / ksChars);
  const kspc = keys.map((x) => x / ksChars);
  const oracleKeys = folds.reduce((n, f) => n + (1 - need(f.ks).oracleSavings) * f.ksText.length, 0);
  const weightedScan = (key: 'rowColumn' | 'modelOrdered'): number =>
    folds.reduce((s, f) => s + need(f.scan)[key] * f.test.length, 0) / heldOutChars;
  const scanStepsPerChar = {
    rowColumn: round(weightedScan('rowColumn')),
    modelOrdered: round(weightedScan('modelOrdered')),
  };
  /** Each keyboard layout's steps, rounded; weighted by held-out characters over the given folds. */
  const byLayout = (over: readonly FoldWork[]): ScanStepsByLayout => {
    const chars = over.reduce((n, f) => n + f.test.length, 0);
    const of = (layout: KeyboardLayout): number =>
      round(over.reduce((s, f) => s + need(f.scan).keyboardRowColumn[layout] * f.test.length, 0) / chars);
    return {
      typewriter: of('typewriter'),
      alphabetical: of('alphabetical'),
      'model-ordered': of('model-ordered'),
    };
  };

  const scanSteps = byLayout(folds);

  let baseOnly: BaseOnlyReport | null = null;
  if (base) {
    const baseKeys = keysPerSlot((f) => need(f.baseKs));
    baseOnly = {
      bpcIdeal: round(folds.reduce((s, f) => s + f.baseBits / f.test.length, 0) / folds.length),
      keystrokeSavings: perSlot(baseKeys.map((x) => 1 - x / ksChars)),
      kspc: perSlot(baseKeys.map((x) => x / ksChars)),
      hitRate: perSlot(hitRateOf((f) => need(f.baseKs))),
    };
  }

  const timings = { ...progress.timings, total: Date.now() - started };
  const report: CurrentProfileReport = {
    engineVersion: ENGINE_VERSION,
    predictor: useWords ? 'word' : 'char',
    wordWeights: final.wordWeights,
    ...(vocabulary.additions.length + vocabulary.blocks.length > 0
      ? { vocabulary: { added: vocabulary.additions.length, blocked: vocabulary.blocks.length } }
      : {}),
    nonWordSlots: {
      share: round(nonWord.slots === 0 ? 0 : nonWord.nonWordSlots / nonWord.slots),
      nonWordSlots: nonWord.nonWordSlots,
      slots: nonWord.slots,
      lists: nonWord.lists,
      examples: nonWord.examples,
    },
    chars,
    documents: documents.length,
    settings: structuredCopy(settings),
    order: settings.order,
    escape: settings.escape,
    adaptive: true,
    folds: k,
    foldUnit: plan.unit,
    foldNote: plan.note,
    heldOutChars,
    bpcIdeal: round(summary.bpcIdeal.mean),
    bpcIdealSpread: spread('bpcIdeal'),
    bpcCoded: round(summary.bpcCoded.mean),
    bpcCodedSpread: spread('bpcCoded'),
    codedBytes: folds.reduce((n, f) => n + f.codedBytes, 0),
    roundTrip: folds.every((f) => f.roundTrip),
    baseWeight: round(baseWeight),
    baseWeightSpread: spread('baseWeight'),
    keystrokeSavings: perSlot(savings),
    kspc: perSlot(kspc),
    oracleSavings: round(1 - oracleKeys / ksChars),
    ksWords,
    hitRate: perSlot(hitRateOf((f) => need(f.ks))),
    selectionsPerWord: perSlot(keys.map((x) => (ksWords === 0 ? 0 : x / ksWords))),
    ksSampleChars: cap,
    ksChars,
    ksNote:
      cap !== null && ksChars < heldOutChars
        ? `Keystrokes were simulated on the first ${cap} characters (cut at a space) ` +
          `of each fold's held-out text, ${ksChars} characters in all; bits per character and scan steps use all ` +
          `${heldOutChars} held-out characters.`
        : `Keystrokes were simulated on all ${ksChars} held-out characters.`,
    scanStepsPerChar,
    scanStepsByLayout: scanSteps,
    // A scanning user's estimate counts the steps of the test keyboard's default key order, the
    // typewriter order, so the estimate and a trial on the test keyboard describe the same keys.
    rates: roundedRates(
      profileRates(settings.access, slots, round(kspc[slots]), scanSteps.typewriter, listReadMs),
    ),
    learningCurve: {
      fold: 0,
      folds: curveFolds.length,
      heldOutChars: curveFolds[0].test.length,
      ksChars: curveFolds[0].ksText.length,
      slots,
      points: curvePoints,
    },
    baseOnly,
    earlyWords: base ? topEarlyWords(earlyCounts, EARLY_WORDS_LIMIT) : null,
    perFold: folds.map((f, i) => ({
      heldOutIds: plan.folds[i].testIds,
      trainChars: f.trainChars,
      testChars: f.test.length,
      ksChars: f.ksText.length,
      bpcIdeal: round(rows[i].bpcIdeal),
      bpcCoded: round(rows[i].bpcCoded),
      codedBytes: f.codedBytes,
      roundTrip: f.roundTrip,
      baseWeight: round(f.baseWeight),
      keystrokeSavings: perSlot(need(f.ks).savings),
      scanStepsPerChar: {
        rowColumn: round(need(f.scan).rowColumn),
        modelOrdered: round(need(f.scan).modelOrdered),
      },
      scanStepsByLayout: byLayout([f]),
    })),
    timings,
  };
  return { report, modelBytes, baseWeight, wordModelBytes, wordWeights: final.wordWeights };
}

function roundedRates(r: RateReport): RateReport {
  return {
    ...r,
    wpmWithout: round(r.wpmWithout),
    wpmWith: round(r.wpmWith),
    msPerCharWithout: round(r.msPerCharWithout),
    msPerCharWith: round(r.msPerCharWith),
  };
}

function need<T>(value: T | undefined): T {
  if (value === undefined) throw new Error('profile pipeline: a step did not run');
  return value;
}

/** A copy of the settings, so the report does not share objects with the input. */
function structuredCopy(s: ProfileSettings): ProfileSettings {
  return { ...s, access: { ...s.access } };
}
