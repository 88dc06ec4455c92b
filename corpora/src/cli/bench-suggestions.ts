// The `suggestions` section of `model bench`: the word-aware list beside the
// character-only list in the same run, on the same text. Ratios and figures
// are printed, never asserted (targets beside them).
//
// - Brown split A: train on the 13 other categories, type the first
//   SUGGESTION_TEST_CHARS characters of cp + cr (held out):
//   1. order 5, no base, static;
//   2. a new client: the base character model and the base vocabulary built
//      from the training texts (`--base-corpus`; the SUBTLEX-US word list
//      kept), no personal text, adaptive (the client's models start empty and
//      learn what is typed; λ = 0.5) — the test text stays out of the base;
//   the share of offered slots that are not words (vocabulary: the training
//   texts' words and the base's) on the second.
// - The demo samples (corpora/demo): the profile pipeline run twice, word and
//   char (keystroke savings over its folds, non-word share).
// - Latency of one word-aware list with the Brown base loaded.
import { joinDocuments, loadBrown, type BrownDocument } from '../brown';
import { loadBaseModel, trainBaseModelOn } from '../base-model';
import { buildBaseWords, loadBaseWords } from '../base-words';
import { BlendedModel, prepareText } from '@keyloom/shared';
import { offeredNonWords, simulateKeystrokes, type OfferedWordsResult } from '@keyloom/shared';
import type { ProfileResult } from '@keyloom/shared';
import { seededRandom } from '@keyloom/shared/src/engine/seeded-random';
import {
  blockPartsOf,
  CharListPredictor,
  type ClientVocabulary,
  DEFAULT_WORD_WEIGHTS,
  WordPredictor,
  type ListPredictor,
} from '@keyloom/shared';
import { buildModel, type ModelChoice } from './model-setup';

/** Characters of cp + cr typed (the leading part of the held-out text). */
export const SUGGESTION_TEST_CHARS = 20_000;
const HELD_OUT = ['cp', 'cr'];
const SLOTS = 5;

const r4 = (x: number): number => Math.round(x * 1e4) / 1e4;
const ms3 = (x: number): number => Math.round(x * 1000) / 1000;

/** p50/p95/mean of a list of durations (ms). */
export function latencyFigures(times: number[]): { p50: number; p95: number; mean: number; calls: number } {
  const sorted = [...times].sort((a, b) => a - b);
  const pick = (q: number): number =>
    ms3(sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? 0);
  return {
    p50: pick(0.5),
    p95: pick(0.95),
    mean: ms3(sorted.reduce((a, b) => a + b, 0) / Math.max(1, sorted.length)),
    calls: sorted.length,
  };
}

type Pair<T> = { word: T; char: T };
type KsFigures = { ks1: number; ks5: number; seconds: number };
type NonWordFigures = {
  share: number;
  nonWordSlots: number;
  slots: number;
  lists: number;
  examples: string[];
};

function nonWordFigures(r: OfferedWordsResult): NonWordFigures {
  return {
    share: r4(r.nonWordShare),
    nonWordSlots: r.nonWordSlots,
    slots: r.slots,
    lists: r.lists,
    examples: r.examples.slice(0, 5),
  };
}

function keystrokes(list: ListPredictor, text: Uint32Array, adaptive: boolean): KsFigures {
  const start = performance.now();
  const ks = simulateKeystrokes(list, text, { maxSlots: SLOTS, adaptive });
  return {
    ks1: r4(ks.savings[1]),
    ks5: r4(ks.savings[5]),
    seconds: Math.round((performance.now() - start) / 100) / 10,
  };
}

const choiceFor = (base: ModelChoice['base'], vocabulary: ClientVocabulary): ModelChoice => ({
  order: 5,
  escape: 'C',
  exclusion: true,
  base,
  baseWeight: 'auto',
  predictor: 'word',
  baseCorpus: [],
  vocabulary,
});

/** The demo profile's figures for one list. */
function demoFigures(r: ProfileResult): {
  keystrokeSavings5: number;
  nonWordShare: number;
  examples: string[];
} {
  return {
    keystrokeSavings5: r.report.keystrokeSavings['5'],
    nonWordShare: r.report.nonWordSlots.share,
    examples: r.report.nonWordSlots.examples.slice(0, 5),
  };
}

/** @param vocabulary bench --vocabulary: added words learned, blocked words never offered (word lists) */
export function measureSuggestions(
  log: (msg: string) => void,
  demo: Pair<ProfileResult>,
  vocabulary: ClientVocabulary,
) {
  const { documents } = loadBrown();
  const isTest = (d: BrownDocument): boolean => HELD_OUT.includes(d.section);
  const trainTexts = documents.filter((d) => !isTest(d)).map((d) => prepareText(d.text));
  const testAll = prepareText(joinDocuments(documents.filter(isTest)));
  let cut = Math.min(SUGGESTION_TEST_CHARS, testAll.length);
  while (cut < testAll.length && testAll[cut] !== 0x20) cut++; // end at a space
  const test = testAll.subarray(0, cut);
  const trainChars = trainTexts.reduce((n, t) => n + t.length, 0);

  log('suggestions: Brown split A, order 5, no base, static (word and character lists)');
  let start = performance.now();
  const plain = buildModel(choiceFor('none', vocabulary), trainTexts, null, false);
  const plainBuildSeconds = (performance.now() - start) / 1000;
  const staticKs: Pair<KsFigures> = {
    word: keystrokes(plain.predictor(false), test, false),
    char: keystrokes(new CharListPredictor(plain.fresh(false), false), test, false),
  };

  log('suggestions: Brown split A, base built from the training texts (--base-corpus), adaptive');
  start = performance.now();
  const base = { char: trainBaseModelOn(trainTexts), words: buildBaseWords(trainTexts) };
  // No personal text to tune λ on: half and half (common practice, no source).
  const withBase = buildModel({ ...choiceFor('corpus', vocabulary), baseWeight: 0.5 }, [], base, true);
  const baseBuildSeconds = (performance.now() - start) / 1000;
  const adaptiveKs: Pair<KsFigures> = {
    word: keystrokes(withBase.predictor(true), test, true),
    char: keystrokes(new CharListPredictor(withBase.fresh(true), true), test, true),
  };
  log('suggestions: offered non-words on Brown split A');
  const brownNonWords: Pair<NonWordFigures> = {
    word: nonWordFigures(offeredNonWords(withBase.predictor(false), withBase.isWord, test, SLOTS)),
    char: nonWordFigures(
      offeredNonWords(new CharListPredictor(withBase.fresh(false), false), withBase.isWord, test, SLOTS),
    ),
  };

  // One word-aware list with the Brown base loaded (character and word), at 1,000 seeded
  // positions of the held-out text after 200 warm-up calls: the client's models are the
  // 13 categories' (split A), blended half and half with the Brown base character model.
  log('suggestions: word list latency with the Brown base loaded');
  const brownBase = loadBaseModel();
  const brownWords = loadBaseWords();
  const latencyList = new WordPredictor({
    personal: plain.words,
    base: brownWords,
    char: new BlendedModel(plain.fresh(false), brownBase, 0.5),
    weights: DEFAULT_WORD_WEIGHTS,
    capitalize: true,
    adaptive: false,
    ...blockPartsOf(vocabulary.blocks, { caseFold: false }),
  });
  const rnd = seededRandom(20261203);
  const times: number[] = [];
  for (let i = 0; i < 1200; i++) {
    const end = 1 + Math.floor(rnd() * (testAll.length - 1));
    const t0 = performance.now();
    latencyList.suggest(testAll, end, SLOTS);
    if (i >= 200) times.push(performance.now() - t0);
  }
  const latency = latencyFigures(times);

  const ratio = (p: Pair<KsFigures>): number => r4(p.word.ks5 - p.char.ks5);
  return {
    slots: SLOTS,
    brownSplitA: {
      trainChars,
      testChars: test.length,
      heldOutSections: HELD_OUT,
      staticNoBase: {
        ...staticKs,
        ks5WordMinusChar: ratio(staticKs),
        buildSeconds: Math.round(plainBuildSeconds * 10) / 10,
        wordWeights: plain.wordWeights,
        target: 'word KS(5) ≥ char KS(5) + 0.03',
      },
      baseFromTrainingAdaptive: {
        ...adaptiveKs,
        ks5WordMinusChar: ratio(adaptiveKs),
        buildSeconds: Math.round(baseBuildSeconds * 10) / 10,
        baseWeight: Math.round(withBase.baseWeight * 1e4) / 1e4,
        wordWeights: withBase.wordWeights,
        note:
          'a new client: the base (character model and vocabulary) built from the 13 categories, no personal ' +
          'text; both lists learn what is typed; cp + cr stay out of the base',
      },
      nonWordSlots: { ...brownNonWords, target: 'word share 0' },
    },
    demoSamples: {
      word: demoFigures(demo.word),
      char: demoFigures(demo.char),
      note: 'the profile pipeline on corpora/demo, Brown base and vocabulary, 5 folds; target: word non-word share 0',
    },
    latencyMs: {
      ...latency,
      list: 'word-aware, 5 slots, Brown base character model and vocabulary loaded, static',
      target: 'p95 ≤ 5 ms',
    },
  };
}
