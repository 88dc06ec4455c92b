import type { TrialMeasures } from '@keyloom/shared';
import { Alert } from '@/components/ui/alert';
import { duration, percentOrDash, wpmOrDash } from '../logic/trial-figures';

/** Where the finished trial's upload stands. */
export type UploadState = 'sending' | 'sent' | 'queued' | { failed: string };

type TrialResultsProps = {
  measures: TrialMeasures;
  simulated: { keystrokeSavings: number | null; wpm: number | null; slots: number };
  upload: UploadState;
  /** Trials on this device still waiting to upload. */
  waiting: number;
  /** The trial pressed shift or layer keys, which the simulation never does. */
  extraKeys?: boolean;
};

const uploadWords = (
  upload: UploadState,
  waiting: number,
): { tone: 'success' | 'info' | 'error'; text: string } => {
  if (upload === 'sending') return { tone: 'info', text: 'Saving the trial…' };
  if (upload === 'sent') return { tone: 'success', text: 'The trial is saved.' };
  if (upload === 'queued') {
    return {
      tone: 'info',
      text: `Waiting for the network — the trial will upload when it is back (${waiting} ${waiting === 1 ? 'trial' : 'trials'} waiting on this device).`,
    };
  }
  return { tone: 'error', text: `The trial was not saved: ${upload.failed}` };
};

/** What the finished trial measured, beside what the version's simulation expected. */
export const TrialResults = ({
  measures,
  simulated,
  upload,
  waiting,
  extraKeys = false,
}: TrialResultsProps) => {
  const state = uploadWords(upload, waiting);
  return (
    <section
      aria-labelledby="trial-results-heading"
      className="flex flex-col gap-4 rounded-xl border-2 border-ink bg-surface p-4 sm:p-6"
    >
      {/* Focused when a trial finishes (the trial view has closed). */}
      <h2 id="trial-results-heading" tabIndex={-1} className="text-2xl font-bold">
        This trial
      </h2>
      <div
        role="status"
        aria-live="polite"
        data-upload-state={typeof upload === 'string' ? upload : 'failed'}
      >
        <Alert tone={state.tone}>{state.text}</Alert>
      </div>
      <dl className="grid max-w-2xl grid-cols-[auto_1fr] gap-x-6 gap-y-1" aria-label="Measured in this trial">
        <dt className="font-bold">Keystroke savings</dt>
        <dd data-measure="keystroke-savings">
          {percentOrDash(measures.keystrokeSavings)} measured; {percentOrDash(simulated.keystrokeSavings)}{' '}
          simulated at {simulated.slots} slots
        </dd>
        <dt className="font-bold">Words per minute</dt>
        <dd data-measure="wpm">
          {wpmOrDash(measures.wpm)} measured; {wpmOrDash(simulated.wpm)} estimated
        </dd>
        <dt className="font-bold">Characters</dt>
        <dd data-measure="characters">{measures.characters}</dd>
        <dt className="font-bold">Keystrokes</dt>
        <dd data-measure="keystrokes">{measures.keystrokes}</dd>
        {measures.switchActivations > 0 && (
          <>
            <dt className="font-bold">Switch presses</dt>
            <dd data-measure="switch-activations">{measures.switchActivations}</dd>
          </>
        )}
        <dt className="font-bold">Suggestions taken</dt>
        <dd>
          {measures.suggestionsTaken} of {measures.suggestionsOffered} rows offered (
          {measures.charactersFromSuggestions} characters)
        </dd>
        <dt className="font-bold">Corrections</dt>
        <dd>{measures.errorsCorrected}</dd>
        <dt className="font-bold">Time typing</dt>
        <dd data-measure="duration">
          {duration(measures.durationMs)}
          {(measures.pausedMs ?? 0) > 0 && ` (${duration(measures.pausedMs ?? 0)} paused, left out)`}
        </dd>
        <dt className="font-bold">Error rate against the phrase</dt>
        <dd>{percentOrDash(measures.errorRate)}</dd>
      </dl>
      {extraKeys && (
        <p data-extra-keys>
          Shift and layer keys were pressed: each counts as a keystroke here, while the simulation types
          lower-case letters with no shift or layer keys, so the measured savings are lower for that reason
          alone.
        </p>
      )}
      <p className="max-w-3xl text-ink-soft" data-paused-note>
        Paused time is left out of words per minute.
      </p>
      <p className="max-w-3xl text-ink-soft">
        Keystroke savings are not time savings: reading the suggestions takes time, so fewer keys can still be
        slower.
      </p>
    </section>
  );
};
