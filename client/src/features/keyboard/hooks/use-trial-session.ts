// The text on screen and the trial log. Every edit goes through stepTrial (the same step the API
// replays), so the logged steps always rebuild exactly the text shown.
import {
  type CreateTrialInput,
  emptyReplayState,
  isSelection,
  stepTrial,
  type TrialEvent,
  type TrialReplayState,
  type TrialSettings,
} from '@keyloom/shared';
import { useCallback, useRef, useState } from 'react';

/** A selection: a step that edits the text, or a shift or layer key. */
export type TrialSelection = Omit<TrialEvent, 't'>;

export type TrialFinish = {
  phraseId: string | null;
  targetPhrase: string | null;
  settings: TrialSettings;
  note: string;
};

export type TrialSession = {
  text: string;
  running: boolean;
  /** A running trial is paused: nothing is typed until it resumes. */
  paused: boolean;
  events: TrialEvent[];
  startedAt: string | null;
  /** Whether a suggestion pick can be undone (an `undo_pick` step would be accepted). */
  canUndoPick: boolean;
  /**
   * Applies a selection to the text; logs it while a trial runs. Returns the new text.
   * @throws TrialReplayError for a step that cannot apply (nothing changes then)
   */
  select: (e: TrialSelection) => string;
  /** Logs one switch activation (scanning) while a trial runs. */
  logSwitch: (value?: 'move' | 'select') => void;
  /** Logs the suggestion row shown, when it differs from the last one logged, while a trial runs. */
  logOffer: (words: string[]) => void;
  /** Pauses the running trial (logs `pause`); does nothing when none runs or it is paused already. */
  pause: () => void;
  /** Takes a paused trial up again (logs `resume`); does nothing unless paused. */
  resume: () => void;
  /** Starts a trial on an empty text (the API replays the log from an empty text). */
  start: () => void;
  /** Empties the text and ends any trial without keeping its log. */
  clear: () => void;
  /**
   * Ends the running trial and returns the body to upload (a fresh `localTrialId`).
   * @throws Error when no trial is running or it has no steps
   */
  finish: (o: TrialFinish) => CreateTrialInput;
};

const sameWords = (a: readonly string[] | undefined, b: readonly string[]) =>
  a !== undefined && a.length === b.length && a.every((w, i) => w === b[i]);

/**
 * The test keyboard's text and trial log. While no trial runs, typing still edits the text but
 * nothing is logged. `t` of each step is whole ms since start().
 */
export function useTrialSession(): TrialSession {
  const [text, setText] = useState('');
  const [canUndoPick, setCanUndoPick] = useState(false);
  const [running, setRunning] = useState(false);
  const [paused, setPaused] = useState(false);
  const [events, setEvents] = useState<TrialEvent[]>([]);
  const [startedAt, setStartedAt] = useState<string | null>(null);

  // The refs are the truth (several steps may come in one tick); the state mirrors them for rendering.
  const stateRef = useRef<TrialReplayState>(emptyReplayState);
  const eventsRef = useRef<TrialEvent[]>([]);
  const runningRef = useRef(false);
  const pausedRef = useRef(false);
  const startRef = useRef(0);
  const startedAtRef = useRef<string | null>(null);
  const lastOfferRef = useRef<string[] | undefined>(undefined);

  const elapsed = () => Math.max(0, Math.round(performance.now() - startRef.current));

  const log = useCallback((event: TrialEvent) => {
    eventsRef.current = [...eventsRef.current, event];
    setEvents(eventsRef.current);
  }, []);

  const select = useCallback(
    (e: TrialSelection) => {
      const event: TrialEvent = { ...e, t: runningRef.current ? elapsed() : 0 };
      // Throws on a malformed step (e.g. two letters at once) before anything changes.
      const next = stepTrial(stateRef.current, event);
      stateRef.current = next;
      setText(next.text);
      setCanUndoPick(next.beforePicks.length > 0);
      if (runningRef.current) log(event);
      return next.text;
    },
    [log],
  );

  const logSwitch = useCallback(
    (value?: 'move' | 'select') => {
      // Two switches: which one was pressed (trialEventSchema).
      if (runningRef.current) log({ t: elapsed(), type: 'switch', ...(value ? { value } : {}) });
    },
    [log],
  );

  const setPause = useCallback(
    (on: boolean) => {
      if (!runningRef.current || pausedRef.current === on) return;
      pausedRef.current = on;
      setPaused(on);
      log({ t: elapsed(), type: on ? 'pause' : 'resume' });
    },
    [log],
  );
  const pause = useCallback(() => setPause(true), [setPause]);
  const resume = useCallback(() => setPause(false), [setPause]);

  const logOffer = useCallback(
    (words: string[]) => {
      // The log keeps at most 10 words of at most 64 characters (trialEventSchema).
      const shown = words.filter((w) => w.length <= 64).slice(0, 10);
      if (!runningRef.current || sameWords(lastOfferRef.current, shown)) return;
      lastOfferRef.current = shown;
      log({ t: elapsed(), type: 'offer', words: [...shown] });
    },
    [log],
  );

  const reset = (run: boolean) => {
    stateRef.current = emptyReplayState;
    setCanUndoPick(false);
    eventsRef.current = [];
    runningRef.current = run;
    pausedRef.current = false;
    setPaused(false);
    lastOfferRef.current = undefined;
    startRef.current = performance.now();
    startedAtRef.current = run ? new Date().toISOString() : null;
    setText('');
    setEvents([]);
    setRunning(run);
    setStartedAt(startedAtRef.current);
  };

  const start = useCallback(() => reset(true), []);
  const clear = useCallback(() => reset(false), []);

  const finish = useCallback((o: TrialFinish): CreateTrialInput => {
    if (!runningRef.current || startedAtRef.current === null) throw new Error('No trial is running.');
    if (!eventsRef.current.some(isSelection)) {
      throw new Error('The trial has no key presses yet.');
    }
    runningRef.current = false;
    pausedRef.current = false;
    setRunning(false);
    setPaused(false);
    return {
      localTrialId: crypto.randomUUID(),
      startedAt: startedAtRef.current,
      finishedAt: new Date().toISOString(),
      phraseId: o.phraseId,
      targetPhrase: o.targetPhrase,
      text: stateRef.current.text,
      events: eventsRef.current,
      settings: o.settings,
      note: o.note,
    };
  }, []);

  return {
    text,
    running,
    paused,
    events,
    startedAt,
    canUndoPick,
    select,
    logSwitch,
    logOffer,
    pause,
    resume,
    start,
    clear,
    finish,
  };
}
