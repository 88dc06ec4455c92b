// Expected scan steps per character, position by position over a test text:
//
// - Row–column scanning of a fixed layout: at each position the expected
//   steps under the model's distribution, Σ p_i (r_i + c_i) (docs/references.md §3),
//   averaged over positions. Mass the model leaves unnamed (`rest`) is charged
//   the off-layout cost.
// - Binary selection ordered by the model: a Huffman code over the model's
//   distribution at that position (Huffman 1952; Roark et al. 2013 use the
//   same idea for scanning); we report the codeword length of the character
//   the text actually has next, averaged over positions. The unnamed mass is
//   one extra leaf; reaching a character through it costs that leaf's length
//   plus FALLBACK_QUESTIONS further questions (a binary search over a second
//   page of ~2^FALLBACK_QUESTIONS characters).
// - Row–column scanning of the test keyboard's own layouts (shared/src/keyboard): the same
//   expected Σ p_i (r_i + c_i) on the keyboard's key rows, for the typewriter and alphabetical
//   orders and for the order by the model, re-ordered at every position with the function the
//   keyboard uses (modelOrderedLetterSteps). Letters are case-folded; symbols-layer characters,
//   characters with no key and the unnamed mass as key-scan-steps.ts says.
import { keyboardScanSteps } from '../../keyboard/key-scan-steps';
import { letterIndex, modelOrderedLetterSteps } from '../../keyboard/model-order';
import type { KeyboardLayout } from '../../schemas/trials.schema';
import { Distribution, type NextSymbolModel } from '../model-types';
import { entropyBits, huffmanLengths } from './huffman';
import { defaultScanLayout, layoutCost, type KeyLayout } from './scan-layout';

/** Questions charged after the "other" leaf of the Huffman tree. */
export const FALLBACK_QUESTIONS = 8;

export type ScanCostResult = {
  chars: number;
  /** Mean over positions of Σ p_i (r_i + c_i) for the layout. */
  rowColumn: number;
  /** Mean row–column steps of the characters actually typed (layout only). */
  rowColumnTrueText: number;
  /** Mean Huffman codeword length of the character actually typed. */
  modelOrdered: number;
  /** Mean over positions of the model-expected Huffman length Σ q_i l_i. */
  modelOrderedExpected: number;
  /** Mean over positions of the entropy of the model's distribution (bits). */
  meanEntropy: number;
  /** Mean −log2 P(actual character) in bits (ideal code length per character). */
  bitsPerChar: number;
  /**
   * Mean over positions of Σ p_i (r_i + c_i) on each of the test keyboard's layouts (key rows only,
   * letters case-folded; `model-ordered` re-ordered at every position).
   */
  keyboardRowColumn: Record<KeyboardLayout, number>;
};

const typewriterSteps = keyboardScanSteps('typewriter');
const alphabeticalSteps = keyboardScanSteps('alphabetical');
const modelOrderedSteps = keyboardScanSteps('model-ordered');

/** Σ weight_i × steps_i over the 26 letters. */
function lettersCost(weights: Float64Array, steps: Float64Array): number {
  let sum = 0;
  for (let i = 0; i < 26; i++) sum += weights[i] * steps[i];
  return sum;
}

/**
 * Expected row–column steps on each keyboard layout for one distribution. `weights` and
 * `orderedSteps` are scratch buffers of 26.
 */
function keyboardExpected(
  dist: Distribution,
  weights: Float64Array,
  orderedSteps: Float64Array,
): Record<KeyboardLayout, number> {
  weights.fill(0);
  // The keys that are not letters never move: one sum per layout all the same.
  let typewriter = dist.rest * typewriterSteps.offKeyboardSteps;
  let alphabetical = dist.rest * alphabeticalSteps.offKeyboardSteps;
  let ordered = dist.rest * modelOrderedSteps.offKeyboardSteps;
  const typewriterAscii = typewriterSteps.asciiSteps;
  const alphabeticalAscii = alphabeticalSteps.asciiSteps;
  const orderedAscii = modelOrderedSteps.asciiSteps;
  for (let k = 0; k < dist.size; k++) {
    const symbol = dist.symbols[k];
    const p = dist.probs[k];
    const letter = letterIndex(symbol);
    if (letter >= 0) weights[letter] += p;
    else if (symbol < 128) {
      typewriter += p * typewriterAscii[symbol];
      alphabetical += p * alphabeticalAscii[symbol];
      ordered += p * orderedAscii[symbol];
    } else {
      typewriter += p * typewriterSteps.otherSteps(symbol);
      alphabetical += p * alphabeticalSteps.otherSteps(symbol);
      ordered += p * modelOrderedSteps.otherSteps(symbol);
    }
  }
  modelOrderedLetterSteps(weights, orderedSteps);
  return {
    typewriter: typewriter + lettersCost(weights, typewriterSteps.letterSteps),
    alphabetical: alphabetical + lettersCost(weights, alphabeticalSteps.letterSteps),
    'model-ordered': ordered + lettersCost(weights, orderedSteps),
  };
}

/** The keyboard layouts' expected steps for a single distribution (tests and the bench). */
export function keyboardScanStepsOf(dist: Distribution): Record<KeyboardLayout, number> {
  return keyboardExpected(dist, new Float64Array(26), new Float64Array(26));
}

export type ScanCostOptions = { layout?: KeyLayout; adaptive?: boolean };

/**
 * Walks `text` (code points) once, asking the model for its distribution at
 * every position; learns each character afterwards when `adaptive`.
 */
export function scanCosts(
  model: NextSymbolModel,
  text: ArrayLike<number>,
  options: ScanCostOptions = {},
): ScanCostResult {
  const cost = layoutCost(options.layout ?? defaultScanLayout);
  const adaptive = options.adaptive ?? false;
  const dist = new Distribution(512);
  let probs = new Float64Array(512);
  let lengths = new Int32Array(512);
  const offLayout = cost.offLayoutSteps;
  let rowColumn = 0;
  let rowColumnTrue = 0;
  let modelOrdered = 0;
  let modelOrderedExpected = 0;
  let entropy = 0;
  let bits = 0;
  const keyboard: Record<KeyboardLayout, number> = { typewriter: 0, alphabetical: 0, 'model-ordered': 0 };
  const weights = new Float64Array(26);
  const orderedSteps = new Float64Array(26);
  const n = text.length;
  for (let i = 0; i < n; i++) {
    dist.clear();
    model.distribution(text, i, dist);
    const size = dist.size;
    if (probs.length < size + 1) {
      probs = new Float64Array(2 * (size + 1));
      lengths = new Int32Array(2 * (size + 1));
    }
    const actual = text[i];
    let stepsExpected = 0;
    let found = -1;
    for (let k = 0; k < size; k++) {
      const p = dist.probs[k];
      probs[k] = p;
      stepsExpected += p * cost.steps(dist.symbols[k]);
      if (dist.symbols[k] === actual) found = k;
    }
    const hasRest = dist.rest > 0;
    stepsExpected += dist.rest * offLayout;
    let leaves = size;
    if (hasRest) probs[leaves++] = dist.rest;
    huffmanLengths(probs, leaves, lengths);
    let expected = 0;
    for (let k = 0; k < leaves; k++) expected += probs[k] * lengths[k];
    if (hasRest) expected += dist.rest * FALLBACK_QUESTIONS;
    const pActual = found >= 0 ? dist.probs[found] : model.probability(text, i, actual);
    const actualLength = found >= 0 ? lengths[found] : (hasRest ? lengths[size] : 0) + FALLBACK_QUESTIONS;
    rowColumn += stepsExpected;
    rowColumnTrue += cost.steps(actual);
    modelOrdered += actualLength;
    modelOrderedExpected += expected;
    entropy += entropyBits(probs, leaves);
    bits -= Math.log2(pActual);
    const onKeyboard = keyboardExpected(dist, weights, orderedSteps);
    keyboard.typewriter += onKeyboard.typewriter;
    keyboard.alphabetical += onKeyboard.alphabetical;
    keyboard['model-ordered'] += onKeyboard['model-ordered'];
    if (adaptive) model.learn(text, i);
  }
  const mean = (x: number): number => (n === 0 ? 0 : x / n);
  return {
    chars: n,
    rowColumn: mean(rowColumn),
    rowColumnTrueText: mean(rowColumnTrue),
    modelOrdered: mean(modelOrdered),
    modelOrderedExpected: mean(modelOrderedExpected),
    meanEntropy: mean(entropy),
    bitsPerChar: mean(bits),
    keyboardRowColumn: {
      typewriter: mean(keyboard.typewriter),
      alphabetical: mean(keyboard.alphabetical),
      'model-ordered': mean(keyboard['model-ordered']),
    },
  };
}
