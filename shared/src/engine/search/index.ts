// Public API of the suggestion search (see README.md in this folder).
export { suggest, nextLetterProbabilities, completionRank } from './suggest';
export type { Suggestion, SuggestOptions, LetterProbability } from './suggest';
export { defaultSearchLimits } from './best-first-search';
export type { SearchLimits } from './best-first-search';
export { CharClass, charClass, isWordChar, wordStart, toCodePoints } from './word-chars';
