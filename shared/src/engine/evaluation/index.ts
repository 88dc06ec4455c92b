// Public API of evaluation (see README.md in this folder).
export { simulateKeystrokes, wordEnd } from './keystroke-savings';
export type { KeystrokeResult, KeystrokeOptions, WordVisit } from './keystroke-savings';
export { scanCosts, keyboardScanStepsOf, FALLBACK_QUESTIONS } from './scan-cost';
export type { ScanCostResult, ScanCostOptions } from './scan-cost';
export { defaultScanLayout, layoutCost, uniformGrid } from './scan-layout';
export type { KeyLayout, LayoutCost } from './scan-layout';
export { huffmanLengths, entropyBits } from './huffman';
export {
  CHARS_PER_WORD,
  charsPerSecond,
  wordsPerMinute,
  msPerSelection,
  estimateRates,
} from './text-entry-rate';
export type { AccessTiming, RateEstimate } from './text-entry-rate';
export { DistributionMemo } from './distribution-memo';
export {
  kFoldSplits,
  crossValidate,
  summarize,
  learningCurve,
  LEARNING_CURVE_FRACTIONS,
} from './cross-validation';
export type { Metrics, MetricSummary } from './cross-validation';
export {
  evaluateHeldOut,
  codeAndCheck,
  freshModel,
  trainPersonalModel,
  tuneBaseWeightOnTail,
  splitTail,
  TUNING_SHARE,
} from './held-out-evaluation';
export type { HeldOutOptions, HeldOutResult } from './held-out-evaluation';
export { offeredNonWords } from './offered-words';
export type { OfferedWordsResult } from './offered-words';
