export { applyTrialEvent, isSelection, partialWord, replayTrial, TrialReplayError } from './trial-replay';
export { computeTrialMeasures, minimumStringDistance, msdErrorRate } from './trial-measures';
export { builtInPracticePhrases } from './practice-phrases';
