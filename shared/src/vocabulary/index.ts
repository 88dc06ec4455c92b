// Public API of the client's vocabulary (re-exported by src/index.ts).
export { vocabularyOf, wordPairsOf } from './vocabulary-listing';
export type { VocabularyDocument, VocabularyEntry, VocabularyOptions, WordPair } from './vocabulary-listing';
export { misspellingCandidates, MisspellingIndex } from './misspellings';
export type {
  KnownWords,
  MisspellingCandidate,
  MisspellingCorrection,
  MisspellingOptions,
  PersonalWord,
} from './misspellings';
export {
  ADDED_SOURCE,
  vocabularyCsv,
  vocabularyRows,
  vocabularyText,
  wordPairsCsv,
} from './vocabulary-export';
export type { VocabularyRow } from './vocabulary-export';
