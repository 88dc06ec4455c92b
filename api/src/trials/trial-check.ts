import {
  computeTrialMeasures,
  type CreateTrialBody,
  replayTrial,
  reportFigures,
  TrialReplayError,
  type TrialMeasures,
} from '@keyloom/shared';
import type { SimulatedFigures } from './trial.entity';

export const TRIAL_TIMES_MESSAGE = 'The trial cannot finish before it started.';
export const TRIAL_TEXT_MISMATCH_MESSAGE = 'The trial log does not give the text sent.';

/** A posted trial the API refuses (400); the message says why, naming the step where there is one. */
export class TrialCheckError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'TrialCheckError';
  }
}

/**
 * Checks a posted trial against its own log and measures it from the log alone (the browser's
 * figures are never taken): the times in order, every step replayable, the replayed text equal to
 * `text`. @throws TrialCheckError
 */
export function checkAndMeasureTrial(body: CreateTrialBody): TrialMeasures {
  if (Date.parse(body.startedAt) > Date.parse(body.finishedAt))
    throw new TrialCheckError(TRIAL_TIMES_MESSAGE);
  for (let i = 1; i < body.events.length; i++) {
    if (body.events[i].t < body.events[i - 1].t) {
      throw new TrialCheckError(`Step ${i + 1} of the trial log is timed before the step before it.`);
    }
  }
  let replayed: string;
  try {
    replayed = replayTrial(body.events);
  } catch (error) {
    if (error instanceof TrialReplayError) throw new TrialCheckError(error.message);
    throw error;
  }
  if (replayed !== body.text) throw new TrialCheckError(TRIAL_TEXT_MISMATCH_MESSAGE);
  return computeTrialMeasures(body.events, body.targetPhrase);
}

/**
 * The version's simulated figures for comparison: keystroke savings at `slots` and the estimated
 * wpm with suggestions, from its stored report (null when missing).
 * @param metrics the version's stored engine report (or null)
 * @param slots 1..10, the trial's suggestion slots
 */
export function simulatedFigures(metrics: Record<string, unknown> | null, slots: number): SimulatedFigures {
  const { keystrokeSavings, wpmWith } = reportFigures(metrics, slots);
  return { keystrokeSavings, wpm: wpmWith, slots };
}
