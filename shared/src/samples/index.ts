// Language samples: decoding uploads, normalising, statistics, personal-data flags, redaction.
export {
  SampleTextError,
  decodeTextBytes,
  binaryFormatMessage,
  EMPTY_FILE_MESSAGE,
} from './sample-text-decoder';
export type { DecodedText, SampleEncoding } from './sample-text-decoder';
export {
  normaliseSampleText,
  textStatistics,
  wordSpans,
  forEachWord,
  foldWord,
  blankRedactionTokens,
} from './text-statistics';
export type { TextStatistics, StatisticsOptions, WordCount, WordSpan } from './text-statistics';
export { detectPersonalData, classifyNumberRun } from './personal-data-detector';
export type { PersonalDataMatch } from './personal-data-detector';
export { applyRedaction, undoRedaction } from './redaction';
export type { RedactableFlag, RedactionResult } from './redaction';
