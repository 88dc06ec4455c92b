export {
  applyTrialEvent,
  emptyReplayState,
  isSelection,
  partialWord,
  replayTrial,
  stepTrial,
  suggestionContext,
  TrialReplayError,
  type TrialReplayState,
} from './trial-replay';
export { computeTrialMeasures, minimumStringDistance, msdErrorRate } from './trial-measures';
export { builtInPracticePhrases } from './practice-phrases';
