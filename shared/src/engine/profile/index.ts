// Public API of the profile pipeline (see README.md in this folder).
export {
  trainAndEvaluateProfile,
  ENGINE_VERSION,
  MIN_PROFILE_CHARS,
  MAX_SLOTS,
  DEFAULT_KS_SAMPLE_CHARS,
  EARLY_WORDS_LIMIT,
} from './profile-pipeline';
export type {
  ProfileInput,
  ProfileDocument,
  ProfileReport,
  CurrentProfileReport,
  ProfileResult,
  ProfileFoldReport,
  LearningCurveReport,
  BaseOnlyReport,
  Spread,
  PerSlot,
} from './profile-pipeline';
export { buildBaseOnlyProfile, BASE_ONLY_WEIGHT } from './base-only-profile';
export type { BaseOnlyProfile } from './base-only-profile';
export { defaultProfileSettings, checkProfileSettings } from './profile-settings';
export type { ProfileSettings, AccessSettings, AccessMethodKind } from './profile-settings';
export { ProfileInputError, CancelledError } from './profile-errors';
export type { ProfileProgress, ProfileStage } from './profile-progress';
export {
  profileRates,
  accessTiming,
  DEFAULT_SCAN_INTERVAL_MS,
  DEFAULT_DWELL_MS,
  DEFAULT_KEY_TIME_MS,
  DEFAULT_LIST_READ_MS,
} from './profile-rates';
export type { RateReport } from './profile-rates';
export { planFolds, contiguousParts, keystrokeSample, joinTexts } from './profile-folds';
export type { FoldPlan, ProfileFold, PreparedDocument } from './profile-folds';
export { EARLY_LETTERS, EARLY_MIN_LETTERS, isListableEarlyWord } from './early-words';
export type { EarlyWord } from './early-words';
export {
  writeProfileFile,
  readProfileFile,
  verifyProfileFile,
  headerVocabulary,
  profileBlockParts,
  ProfileFileError,
  PROFILE_FILE_MAGIC,
  PROFILE_FILE_VERSION,
  PROFILE_FILE_SIGNED_VERSION,
  PROFILE_FILE_WORDS_VERSION,
  PROFILE_FILE_SIGNED_WORDS_VERSION,
  PROFILE_SIGNATURE_BYTES,
  PROFILE_FILE_FORMAT,
  PROFILE_FILE_EXTENSION,
} from './profile-file';
export type { ProfileFileHeader, ProfileFileContents, ProfileFileSigner } from './profile-file';
export { reportFigures } from './report-figures';
export type { ReportFigures } from './report-figures';
