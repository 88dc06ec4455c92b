// One measurement of a trained model on a held-out text: ideal and coded
// bits per character (the coded stream is decoded back and compared),
// keystroke savings and KSPC for 1..maxSlots slots, and scan steps per
// character. `model evaluate` prints evaluateHeldOut; the profile pipeline
// (engine/profile) runs the same measurements one by one with the same
// pieces (freshModel, codeAndCheck) so it can report progress between them;
// its test checks the two agree.
//
// Also the two training steps both use: a personal PPM model trained on
// several texts (each its own text, no context across them), and the blend
// weight tuned on the tail of the training text (never on the test text).
import { BlendedModel, tuneBaseWeight } from '../blended-model';
import type { NextSymbolModel } from '../model-types';
import { PpmModel } from '../ppm-model';
import type { PpmSettings } from '../ppm-settings';
import { codeLengthBits, decodeText, encodeText } from '../text-coding';
import type { ListPredictor } from '../words/word-predictor';
import { simulateKeystrokes, type KeystrokeResult, type WordVisit } from './keystroke-savings';
import { scanCosts, type ScanCostResult } from './scan-cost';

/** Share of the training text the blend weight is tuned on (the last 10%). */
export const TUNING_SHARE = 0.1;

/** A personal model that learns every text in order (adaptive, so a copy can keep learning). */
export function trainPersonalModel(settings: Partial<PpmSettings>, texts: readonly Uint32Array[]): PpmModel {
  const personal = new PpmModel({ ...settings, adaptive: true });
  for (const t of texts) personal.learnText(t);
  return personal;
}

/**
 * λ (weight of the base model, 0..1) tuned on the last 10% of the training
 * texts taken together: a personal model trained on the first 90% and the
 * base model are mixed on the rest. Without training text: 1 (base alone).
 */
export function tuneBaseWeightOnTail(
  settings: Partial<PpmSettings>,
  texts: readonly Uint32Array[],
  base: NextSymbolModel,
): number {
  const total = texts.reduce((n, t) => n + t.length, 0);
  if (total === 0) return 1;
  const { head, tail } = splitTail(texts);
  const tuningModel = new PpmModel({ ...settings, adaptive: false });
  for (const t of head) tuningModel.learnText(t);
  const held: number[] = [];
  for (const t of tail) for (let i = 0; i < t.length; i++) held.push(t[i]);
  return tuneBaseWeight(tuningModel, base, Uint32Array.from(held));
}

/**
 * The training texts cut where the last TUNING_SHARE (10%) of their characters begins: `head`
 * (what a tuning model learns) and `tail` (what its weights are tuned on), each a list of the
 * texts' parts in order (a text cut in two gives its first part to head, its second to tail).
 */
export function splitTail(texts: readonly Uint32Array[]): { head: Uint32Array[]; tail: Uint32Array[] } {
  const total = texts.reduce((n, t) => n + t.length, 0);
  const cut = Math.floor(total * (1 - TUNING_SHARE));
  const head: Uint32Array[] = [];
  const tail: Uint32Array[] = [];
  let seen = 0;
  for (const t of texts) {
    const inHead = Math.max(0, Math.min(t.length, cut - seen));
    if (inHead > 0) head.push(t.subarray(0, inHead));
    if (inHead < t.length) tail.push(t.subarray(inHead));
    seen += t.length;
  }
  return { head, tail };
}

/**
 * A fresh model to run one measurement: a clone of the personal model
 * (learning when `adaptive`), blended with the shared frozen base model at
 * weight λ when there is one.
 */
export function freshModel(
  personal: PpmModel,
  base: NextSymbolModel | null | undefined,
  baseWeight: number,
  adaptive: boolean,
): NextSymbolModel {
  const p = personal.clone();
  p.adaptive = adaptive;
  return base ? new BlendedModel(p, base, baseWeight) : p;
}

export type HeldOutOptions = {
  /** The model learns the test text as it reads it (as on the client's device). */
  adaptive: boolean;
  /** Largest suggestion list simulated (1..100). */
  maxSlots: number;
  /**
   * Text the keystroke simulation types (default: the whole test text). A
   * caller may pass a leading part of the test text to bound the time.
   */
  keystrokeText?: Uint32Array;
  /** Called after each word of the keystroke simulation (see simulateKeystrokes). */
  onWord?: (visit: WordVisit) => void;
  /**
   * A fresh suggestion list for the keystroke simulation (e.g. the word-aware list); default: the
   * character-only list on `fresh(adaptive)`. Bits and scan steps always use `fresh`.
   */
  predictor?: (adaptive: boolean) => ListPredictor;
};

export type HeldOutResult = {
  chars: number;
  /** Ideal code length of the test text, bits. */
  bits: number;
  codedBytes: number;
  /** The coded stream decoded back to exactly the test text. */
  roundTrip: boolean;
  keystrokes: KeystrokeResult;
  scan: ScanCostResult;
};

/**
 * Measures `test` with a fresh model per measurement (`fresh(adaptive)`),
 * so an adaptive run learns the test text once per measurement.
 */
export function evaluateHeldOut(
  fresh: (adaptive: boolean) => NextSymbolModel,
  test: Uint32Array,
  options: HeldOutOptions,
): HeldOutResult {
  const { adaptive } = options;
  const bits = codeLengthBits(fresh(adaptive), test, { adaptive });
  const coding = codeAndCheck(fresh(adaptive), fresh(adaptive), test);
  const list = options.predictor ? options.predictor(adaptive) : fresh(adaptive);
  const keystrokes = simulateKeystrokes(list, options.keystrokeText ?? test, {
    maxSlots: options.maxSlots,
    adaptive,
    onWord: options.onWord,
  });
  const scan = scanCosts(fresh(adaptive), test, { adaptive });
  return { chars: test.length, bits, ...coding, keystrokes, scan };
}

/** Encodes with one model, decodes with an identical one, compares. */
export function codeAndCheck(
  encoderModel: NextSymbolModel,
  decoderModel: NextSymbolModel,
  test: Uint32Array,
): { codedBytes: number; roundTrip: boolean } {
  const coded = encodeText(encoderModel, test);
  const decoded = decodeText(decoderModel, coded, test.length);
  const roundTrip = decoded.length === test.length && decoded.every((c, i) => c === test[i]);
  return { codedBytes: coded.length, roundTrip };
}
