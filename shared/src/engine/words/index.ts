// Public API of the word-aware suggestion list (re-exported by src/index.ts).
export {
  sentencesOf,
  precedingKeys,
  atSentenceStart,
  caseForOffer,
  wordKey,
  isOfferable,
  SENTENCE_START,
  UNKNOWN_WORD,
} from './word-tokens';
export type { WordToken } from './word-tokens';
export { WordNgramModel, modifiedDiscounts } from './word-ngram-model';
export type { Discounts, OrderDiscounts } from './word-ngram-model';
export { WordLexicon } from './word-lexicon';
export { RecencyCache, DEFAULT_CACHE_WORDS } from './recency-cache';
export { WordPredictor, effectiveWeights, WORD_COMPONENTS, CHAR_EXPONENT } from './word-predictor';
export type {
  BaseWords,
  ListPredictor,
  WordComponent,
  WordPredictorParts,
  WordSuggestion,
  WordWeights,
} from './word-predictor';
export { CharListPredictor } from './char-list-predictor';
export {
  componentProbabilities,
  fitMixtureWeights,
  mixtureBitsPerWord,
  DEFAULT_WORD_WEIGHTS,
  MIN_COMPONENT_WEIGHT,
} from './mixture-weights';
export type { ComponentTable } from './mixture-weights';
export { trainWordModel, tuneWordWeightsOnTail } from './word-training';
export { serializeBaseWords, deserializeBaseWords } from './base-words-file';
export {
  additionSentences,
  blockPartsOf,
  checkClientVocabulary,
  DEFAULT_ADDITION_WEIGHT,
  EMPTY_VOCABULARY,
  MAX_ADDITION_WEIGHT,
  MAX_ADDITION_WORDS,
  VocabularyError,
} from './client-vocabulary';
export type { BlockParts, ClientVocabulary, VocabularyAddition, VocabularyBlock } from './client-vocabulary';
