export {
  applyTrialEvent,
  isSelection,
  partialWord,
  replayTrial,
  suggestionContext,
  TrialReplayError,
} from './trial-replay';
export { computeTrialMeasures, minimumStringDistance, msdErrorRate } from './trial-measures';
export { builtInPracticePhrases } from './practice-phrases';
