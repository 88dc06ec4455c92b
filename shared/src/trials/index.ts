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
export { computeTrialMeasures, minimumStringDistance, msdErrorRate, pausedWithin } from './trial-measures';
export { builtInPracticePhrases } from './practice-phrases';
