import {
  type Client,
  computeTrialMeasures,
  isSelection,
  type PracticePhrase,
  type TrialEvent,
  type TrialKeyLayer,
  type TrialMeasures,
  type TrialShiftState,
} from '@keyloom/shared';
import { type ReactNode, useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { cn } from '@/lib/cn';
import { markKeyPress } from '../engine/latency-marks';
import { useKeyboardEngine } from '../engine/use-keyboard-engine';
import { useDwell } from '../hooks/use-dwell';
import { usePendingTrials } from '../hooks/use-pending-trials';
import { LONG_PRESS_MS, useScanner } from '../hooks/use-scanner';
import { type ScanPattern, scanGroups } from '../logic/scanner';
import { useTrialSession } from '../hooks/use-trial-session';
import { useChoiceScan } from '../hooks/use-choice-scan';
import {
  atSentenceStart,
  hasCase,
  type KeyDef,
  keyRows,
  letterWeights,
  nextShift,
  pauseKey,
} from '../logic/layouts';
import { physicalKeyAction } from '../logic/physical-keys';
import { KeyGrid } from './key-grid';
import {
  DEFAULT_SCAN_ACCEPT_MS,
  defaultKeyboardSettings,
  type KeyboardViewSettings,
  trialSettingsOf,
} from '../logic/keyboard-settings';
import { ModelStatus } from './model-status';
import { PhrasePicker } from './phrase-picker';
import { ScanAnnouncer } from './scan-announcer';
import { SettingsPanel } from './settings-panel';
import { SuggestionRow } from './suggestion-row';
import { slotTargetId, usesKeysTheSimulationLacks } from '../logic/trial-figures';
import { TrialOutput } from './trial-output';
import { TrialResults, type UploadState } from './trial-results';
import { TrialView } from './trial-view';
import { TrialPauseDialog } from './trial-pause-dialog';
import { type PauseChoiceId, pauseChoices } from '../logic/pause-choices';
import { useOsReducedMotion } from '../hooks/use-os-reduced-motion';

/** The version's simulated figures at a slot count (from its report), for comparison with a trial. */
export type SimulatedFigures = (slots: number) => { keystrokeSavings: number | null; wpm: number | null };

type TestKeyboardProps = {
  client: Pick<Client, 'id' | 'pseudonym' | 'accessMethod' | 'dwellMs' | 'scanIntervalMs'>;
  versionId: string;
  /** The version's suggestion slots (1–10). */
  versionSlots: number;
  /** False for a version that takes no more trials (retired, sent back): typing only. */
  canLogTrials: boolean;
  simulated: SimulatedFigures;
  phrases: readonly PracticePhrase[];
  /** Shown above the trial controls: the version picker (locked while a trial runs). */
  versionPicker: (trialRunning: boolean) => ReactNode;
  /** Shown under the phrase picker, e.g. the owning clinician's add form. */
  phraseExtra?: ReactNode;
};

/**
 * A queued trial's state follows the upload queue: sent once it has left it (the queue retries when
 * the network is back), failed when the API refused it later.
 */
const uploadNow = (
  finished: Finished,
  queue: { waitingIds: string[]; failed: { localTrialId: string; message: string }[] },
): UploadState => {
  if (finished.upload !== 'queued') return finished.upload;
  const refused = queue.failed.find((f) => f.localTrialId === finished.localTrialId);
  if (refused) return { failed: refused.message };
  return queue.waitingIds.includes(finished.localTrialId) ? 'queued' : 'sent';
};

type Finished = {
  measures: TrialMeasures;
  slots: number;
  upload: UploadState;
  localTrialId: string;
  extraKeys: boolean;
};

const stepOf = (key: KeyDef): Omit<TrialEvent, 't'> =>
  key.kind === 'letter' || key.kind === 'punctuation' || key.kind === 'layer'
    ? { type: key.kind, value: key.value }
    : { type: key.kind };

/** What the switches do in each scanning pattern, shown beside the Start scanning button. */
const scanHelp: Record<ScanPattern, string> = {
  'auto-row-column':
    'Space (or Enter) is the switch: press it to choose the highlighted row, then the highlighted key.',
  'auto-group-row-key':
    'Space (or Enter) is the switch: press it to choose the highlighted group, then the row, then the key.',
  'step-one-switch':
    'Space (or Enter) is the switch: each press moves the highlight one step; stop pressing and the highlighted row or key is chosen.',
  'step-two-switch': 'Two switches: Space moves the highlight one step, Enter chooses what is highlighted.',
};

/**
 * The test keyboard: runs one profile version in the browser, types through the trial log
 * (every edit through applyTrialEvent), and uploads finished trials (queued while offline).
 */
export const TestKeyboard = ({
  client,
  versionId,
  versionSlots,
  canLogTrials,
  simulated,
  phrases,
  versionPicker,
  phraseExtra,
}: TestKeyboardProps) => {
  const osReducedMotion = useOsReducedMotion();
  const [settings, setSettings] = useState<KeyboardViewSettings>(() =>
    defaultKeyboardSettings(client, versionSlots, osReducedMotion),
  );
  const reduceMotion = settings.reduceMotion || osReducedMotion;
  const engine = useKeyboardEngine(versionId);
  const session = useTrialSession();
  const pending = usePendingTrials();
  const [phraseId, setPhraseId] = useState<string | null>(null);
  const [note, setNote] = useState('');
  const [finished, setFinished] = useState<Finished | null>(null);
  const outputRef = useRef<HTMLDivElement>(null);
  const startRef = useRef<HTMLButtonElement>(null);
  // Where focus goes once the trial view has closed (the page behind is shown again first).
  const focusAfterRef = useRef<'results' | 'start' | null>(null);
  // True from a pause until the resume: the truth for presses, dwells and scan ticks in the same tick.
  const pausedRef = useRef(false);

  // The version decides the slot count (its simulated figures are at that count).
  const slots = versionSlots;
  // Shift and the key layer: the ref is the truth for presses in the same tick, the state draws the keys.
  const [shift, setShiftState] = useState<TrialShiftState>('off');
  const shiftRef = useRef<TrialShiftState>('off');
  const setShift = useCallback((next: TrialShiftState) => {
    shiftRef.current = next;
    setShiftState(next);
  }, []);
  const [layer, setLayer] = useState<TrialKeyLayer>('letters');
  const capital = shift !== 'off' || (settings.autoCapital && atSentenceStart(session.text));
  const canUndoPick = session.canUndoPick;
  // Ordered by the model: the letters re-order at every answer of the engine (a new answer follows
  // every change of the text); the other layouts ignore it.
  const modelOrder = settings.layout === 'model-ordered' ? engine.suggestions : null;
  const trialRunning = session.running;
  // In the trial view the Pause key is a row of its own under the function row: a key like any other
  // (clicked, dwelt on, scanned as the last row), wide enough for its label on a phone.
  const rows = useMemo(() => {
    const all = keyRows(
      settings.layout,
      { shift, layer, capital, canUndoPick },
      modelOrder && letterWeights(modelOrder.letters),
    );
    return trialRunning ? [...all, [pauseKey]] : all;
  }, [settings.layout, shift, layer, capital, canUndoPick, modelOrder, trialRunning]);
  const target = phrases.find((phrase) => phrase.id === phraseId)?.text ?? null;

  // ---- asking the engine ------------------------------------------------------------------
  const seqRef = useRef(0);
  const textRef = useRef(session.text);
  const { request } = engine;
  const { select: sessionSelect } = session;

  /** Every selection: mark the key press, then ask the engine about the new text. */
  const select = useCallback(
    (step: Omit<TrialEvent, 't'>) => {
      const seq = ++seqRef.current;
      markKeyPress(seq);
      const next = sessionSelect(step);
      textRef.current = next;
      request(next, seq, slots);
    },
    [request, slots, sessionSelect],
  );

  // Text changed by something other than a selection (clear, a new trial): ask again, unmeasured.
  useEffect(() => {
    if (session.text === textRef.current) return;
    textRef.current = session.text;
    request(session.text, ++seqRef.current, slots);
  }, [session.text, request, slots]);

  // The first row once the model is ready, and a new row when the slot count changes.
  useEffect(() => {
    if (engine.status === 'ready') request(textRef.current, ++seqRef.current, slots);
  }, [engine.status, request, slots]);

  const answer = engine.suggestions;
  const words = useMemo(() => (answer?.words ?? []).slice(0, slots), [answer, slots]);

  // ---- the trial log's "offer" steps: each time the row shows something new during a trial ----
  // (logOffer itself skips a row equal to the last one logged, and does nothing outside a trial).
  const wordsKey = words.join('\u0000');
  const { running, logOffer } = session;
  useEffect(() => {
    if (running) logOffer(wordsKey === '' ? [] : wordsKey.split('\u0000'));
  }, [running, wordsKey, logOffer]);

  const letterProbabilities = useMemo(() => {
    if (!settings.tintKeys || !answer) return null;
    const map = new Map<string, number>();
    for (const { char, p } of answer.letters) {
      const key = char.toLowerCase();
      map.set(key, (map.get(key) ?? 0) + p);
    }
    return map;
  }, [settings.tintKeys, answer]);

  // ---- pausing -----------------------------------------------------------------------------
  const { pause: sessionPause } = session;
  /** Pauses a running trial (Escape, the Pause key, a long switch press, leaving full screen). */
  const pauseTrial = useCallback(() => {
    if (!trialRunning || pausedRef.current) return;
    pausedRef.current = true;
    sessionPause();
  }, [trialRunning, sessionPause]);

  // ---- selection in any mode --------------------------------------------------------------
  const pick = useCallback(
    (slot: number, word: string) => {
      if (pausedRef.current) return;
      select({ type: 'suggestion', value: word, slot });
    },
    [select],
  );
  const { autoCapital } = settings;
  const press = useCallback(
    (key: KeyDef) => {
      if (key.disabled || pausedRef.current) return;
      if (key.kind === 'pause') {
        pauseTrial();
        return;
      }
      if (key.kind === 'shift') {
        const next = nextShift(shiftRef.current);
        setShift(next);
        select({ type: 'shift', value: next });
        return;
      }
      if (key.kind === 'layer') setLayer(key.value === 'symbols' ? 'symbols' : 'letters');
      if (key.kind === 'letter' && hasCase(key.value)) {
        // Shift (once or locked) or the automatic capital: the capital is logged as the letter it is.
        const upper = shiftRef.current !== 'off' || (autoCapital && atSentenceStart(textRef.current));
        if (shiftRef.current === 'once') setShift('off');
        select({ type: 'letter', value: upper ? key.value.toUpperCase() : key.value });
        return;
      }
      select(stepOf(key));
    },
    [select, autoCapital, setShift, pauseTrial],
  );

  // The pause dialog's choices (set below, once the trial's handlers exist).
  const choosePauseRef = useRef<(id: PauseChoiceId) => void>(() => undefined);

  // Scanning and dwell call back later: read the newest row and keys through refs.
  const latest = useRef({ words, rows, pick, press });
  useEffect(() => {
    latest.current = { words, rows, pick, press };
  });

  const rowLengths = useMemo(() => [words.length, ...rows.map((row) => row.length)], [words.length, rows]);
  const scanPattern = settings.scanPattern ?? 'auto-row-column';
  const suggestionsAt = settings.suggestionsScanned ?? 'first';
  const scanner = useScanner({
    enabled: settings.selectionMode === 'scanning',
    intervalMs: settings.scanIntervalMs ?? 1000,
    pattern: scanPattern,
    suggestionsAt,
    acceptMs: settings.scanAcceptMs ?? DEFAULT_SCAN_ACCEPT_MS,
    rowLengths,
    onSelect: useCallback((row: number, item: number) => {
      const now = latest.current;
      if (row === 0) {
        const word = now.words[item];
        if (word) now.pick(item, word);
        return;
      }
      const key = now.rows[row - 1]?.[item];
      if (key) now.press(key);
    }, []),
    onSwitch: session.logSwitch,
    // In a trial: paused, the highlight waits where it is; Escape and a long press pause.
    paused: session.paused,
    onEscape: trialRunning ? pauseTrial : undefined,
    onLongPress: trialRunning ? pauseTrial : undefined,
  });

  const dwell = useDwell({
    enabled: settings.selectionMode === 'dwell',
    dwellMs: settings.dwellMs ?? 800,
    refractoryMs: settings.dwellRefractoryMs,
    sound: settings.dwellSound,
    onActivate: useCallback((id: string) => {
      if (pauseChoices.some((choice) => choice.id === id)) {
        choosePauseRef.current(id as PauseChoiceId);
        return;
      }
      const now = latest.current;
      const slot = now.words.findIndex((_, index) => slotTargetId(index) === id);
      if (slot >= 0) {
        now.pick(slot, now.words[slot]!);
        return;
      }
      const key = now.rows.flat().find((candidate) => candidate.id === id);
      if (key) now.press(key);
    }, []),
  });

  // ---- a physical keyboard in direct mode, while a trial runs ------------------------------
  const physical = settings.selectionMode === 'direct' && session.running;
  const { numberKeysPick } = settings;
  useEffect(() => {
    if (!physical) return;
    const onKeyDown = (event: KeyboardEvent) => {
      const target = event.target instanceof Element ? event.target : null;
      // Form fields (the trial note, the settings) keep every key.
      if (event.defaultPrevented || target?.closest('input, textarea, select, [contenteditable="true"]'))
        return;
      const onControl = target?.closest('button, a, summary') != null;
      const action = physicalKeyAction(event, { onControl, numberKeysPick });
      if (!action) return;
      event.preventDefault();
      const now = latest.current;
      if ('slot' in action) {
        const word = now.words[action.slot];
        if (word) now.pick(action.slot, word);
      } else now.press(action.key);
    };
    document.addEventListener('keydown', onKeyDown);
    return () => document.removeEventListener('keydown', onKeyDown);
  }, [physical, numberKeysPick]);

  // ---- Escape pauses a running trial in every mode (scanning: through the scanner too) ------
  const pausable = trialRunning && !session.paused;
  useEffect(() => {
    if (!pausable) return;
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.key !== 'Escape') return;
      event.preventDefault();
      pauseTrial();
    };
    document.addEventListener('keydown', onKeyDown);
    return () => document.removeEventListener('keydown', onKeyDown);
  }, [pausable, pauseTrial]);

  const scanState = scanner.running ? scanner.state : null;
  // Group–row–key: the rows of the highlighted group (row 0 is the suggestion row).
  const scanGroupRows =
    scanState?.level === 'groups'
      ? (scanGroups(rowLengths.length, { pattern: scanPattern, suggestionsAt })[scanState.group ?? 0] ?? [])
      : [];
  // Nothing is highlighted yet (step, one switch, before the first press at a level).
  const scanShown = scanState && !scanState.waiting && scanState.level !== 'groups' ? scanState : null;
  const startScanning = () => {
    // Focus leaves the button, so the switch (Space or Enter) cannot also press a button.
    outputRef.current?.focus();
    scanner.start();
  };

  // ---- trial ------------------------------------------------------------------------------
  const selections = session.events.filter(isSelection).length;

  const startTrial = () => {
    setFinished(null);
    // Every trial starts from the version as trained; it then learns the words typed in it.
    engine.resetLearning();
    setShift('off');
    setLayer('letters');
    pausedRef.current = false;
    focusAfterRef.current = null;
    session.start();
    // The trial view opens: focus goes to its message window, where the trial's text appears and
    // from which Tab reaches the suggestions and the keys (scanning starts from there too).
    if (settings.selectionMode === 'scanning') scanner.start();
  };

  // The view has opened: focus its message window (the element exists only now). It has closed
  // and the page is back: the results' heading, or Start after a discard.
  useEffect(() => {
    if (trialRunning) {
      outputRef.current?.focus();
      return;
    }
    const after = focusAfterRef.current;
    focusAfterRef.current = null;
    if (after === 'results') document.getElementById('trial-results-heading')?.focus();
    else if (after === 'start') startRef.current?.focus();
  }, [trialRunning]);

  const resumeTrial = () => {
    pausedRef.current = false;
    session.resume();
    outputRef.current?.focus();
  };

  const finishTrial = () => {
    pausedRef.current = false;
    scanner.stop();
    const input = session.finish({
      phraseId,
      targetPhrase: target,
      settings: trialSettingsOf({ ...settings, slots }),
      note: note.trim(),
    });
    const measures = computeTrialMeasures(input.events, target);
    setFinished({
      measures,
      slots,
      upload: 'sending',
      localTrialId: input.localTrialId,
      extraKeys: usesKeysTheSimulationLacks(input.events),
    });
    setNote('');
    focusAfterRef.current = 'results';
    pending
      .submit(versionId, input)
      .then((result) =>
        setFinished((now) => (now ? { ...now, upload: result.outcome === 'sent' ? 'sent' : 'queued' } : now)),
      )
      .catch((error: unknown) =>
        setFinished((now) =>
          now
            ? {
                ...now,
                upload: { failed: error instanceof Error ? error.message : 'The server refused it.' },
              }
            : now,
        ),
      );
  };

  const discardTrial = () => {
    pausedRef.current = false;
    scanner.stop();
    session.clear();
    setNote('');
    focusAfterRef.current = 'start';
  };

  useEffect(() => {
    choosePauseRef.current = (id: PauseChoiceId) => {
      if (!session.paused) return;
      if (id === 'pause-resume') resumeTrial();
      else if (id === 'pause-finish') {
        if (selections > 0) finishTrial();
      } else discardTrial();
    };
  });

  // Paused in scanning: the scanner goes over the dialog's choices (a switch user can take each).
  const pauseScanned = useChoiceScan({
    enabled: session.paused && settings.selectionMode === 'scanning',
    pattern: scanPattern,
    intervalMs: settings.scanIntervalMs ?? 1000,
    acceptMs: settings.scanAcceptMs ?? DEFAULT_SCAN_ACCEPT_MS,
    available: pauseChoices.map((choice) => choice.id !== 'pause-finish' || selections > 0),
    onChoose: useCallback((index: number) => {
      const choice = pauseChoices[index];
      if (choice) choosePauseRef.current(choice.id);
    }, []),
  });

  const hc = settings.highContrast;
  const figures = finished ? simulated(finished.slots) : null;
  const dwellView = settings.selectionMode === 'dwell' ? dwell : null;

  // The message window, the suggestion row and the keys: on the page to try the keyboard out, in
  // the trial view while a trial runs.
  const scanGroupAttr = scanGroupRows.filter((row) => row > 0).join(' ') || undefined;
  const output = (
    <TrialOutput
      ref={outputRef}
      text={session.text}
      target={target}
      textScale={settings.textScale}
      highContrast={hc}
      onClear={session.clear}
      clearDisabled={session.running}
    />
  );
  const suggestionRow = (
    <SuggestionRow
      slots={slots}
      words={words}
      seq={answer?.seq ?? null}
      answersText={answer?.text ?? null}
      engineMs={answer?.engineMs ?? null}
      onPick={pick}
      highContrast={hc}
      largeTargets={settings.largeTargets}
      reduceMotion={reduceMotion}
      textScale={settings.textScale}
      scan={
        scanGroupRows.includes(0)
          ? { level: 'rows', item: 0 }
          : scanShown && scanShown.row === 0
            ? { level: scanShown.level as 'rows' | 'items', item: scanShown.item }
            : null
      }
      dwell={dwellView}
      keySpacing={settings.keySpacing}
    />
  );
  const keyGrid = (
    <KeyGrid
      rows={rows}
      onSelect={press}
      highContrast={hc}
      largeTargets={settings.largeTargets}
      reduceMotion={reduceMotion}
      textScale={settings.textScale}
      letterProbabilities={letterProbabilities}
      scan={
        scanShown && scanShown.row > 0
          ? { level: scanShown.level as 'rows' | 'items', row: scanShown.row - 1, item: scanShown.item }
          : null
      }
      dwell={dwellView}
      keySpacing={settings.keySpacing}
      scanGroup={scanGroupAttr}
    />
  );
  // Said by a hidden live region in the view or on the page, wherever the keys are.
  const scanAnnouncer = (
    <ScanAnnouncer
      enabled={settings.scanAnnounce && settings.selectionMode === 'scanning'}
      state={scanState}
      words={words}
      keyRows={rows}
      config={{ pattern: scanPattern, suggestionsAt }}
    />
  );

  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="keyboard-version-heading" className="flex flex-col gap-4">
        <h2 id="keyboard-version-heading" className="text-2xl font-bold">
          Version
        </h2>
        {versionPicker(session.running)}
        <ModelStatus status={engine.status} error={engine.error} info={engine.info} />
      </section>

      <section aria-labelledby="keyboard-trial-heading" className="flex flex-col gap-4">
        <h2 id="keyboard-trial-heading" className="text-2xl font-bold">
          Trial
        </h2>
        <p className="text-ink-soft">
          Each trial starts from the version as trained and learns every word finished in it, as the client’s
          device does and as the version’s simulated figures assume.
        </p>
        <p className="text-ink-soft">
          Start trial opens the keyboard on its own, filling the screen. Escape, the Pause key or (scanning)
          holding the switch for {LONG_PRESS_MS / 1000} seconds pauses it; from the pause you resume, finish
          or discard the trial and can add a note.
        </p>
        <div className="grid gap-4 md:grid-cols-2">
          <PhrasePicker
            phrases={phrases}
            value={phraseId}
            onChange={setPhraseId}
            disabled={session.running}
          />
        </div>
        {phraseExtra}
        <div role="group" aria-label="Trial" className="flex flex-wrap items-center gap-3">
          <Button
            ref={startRef}
            variant="primary"
            onClick={startTrial}
            disabled={engine.status !== 'ready' || !canLogTrials || session.running}
          >
            Start trial
          </Button>
          <p className="text-ink-soft" data-trial-state={session.running ? 'running' : 'stopped'}>
            {session.running
              ? `Trial running: ${selections} ${selections === 1 ? 'selection' : 'selections'} so far.`
              : 'No trial running: you can type below to get a feel for it; nothing is logged.'}
          </p>
          {pending.pending > 0 && (
            <p className="font-bold" data-pending-trials={pending.pending}>
              {pending.pending} {pending.pending === 1 ? 'trial is' : 'trials are'} waiting to upload.
            </p>
          )}
        </div>
        {pending.failed.length > 0 && (
          <ul aria-label="Trials that could not be saved" className="list-disc pl-6 text-danger">
            {pending.failed.map((failure) => (
              <li key={failure.localTrialId}>
                {failure.message}{' '}
                <Button variant="quiet" onClick={() => pending.dismiss(failure.localTrialId)}>
                  Forget this trial
                </Button>
              </li>
            ))}
          </ul>
        )}
      </section>

      {finished && figures && (
        <TrialResults
          measures={finished.measures}
          simulated={{ ...figures, slots: finished.slots }}
          upload={uploadNow(finished, pending)}
          waiting={pending.pending}
          extraKeys={finished.extraKeys}
        />
      )}

      {session.running ? (
        <TrialView
          paused={session.paused}
          onLeaveFullscreen={pauseTrial}
          highContrast={hc}
          pauseDialog={
            <TrialPauseDialog
              selections={selections}
              canFinish={selections > 0}
              onChoose={(id) => choosePauseRef.current(id)}
              note={note}
              onNoteChange={setNote}
              scanned={pauseScanned}
              dwell={dwellView}
              highContrast={hc}
              reduceMotion={reduceMotion}
            />
          }
        >
          {output}
          {suggestionRow}
          {/* The key rows share the height left (index.css, data-trial-keys). */}
          <div data-trial-keys data-scan-group={scanGroupAttr} className="min-h-0 flex-1">
            {keyGrid}
          </div>
          {scanAnnouncer}
        </TrialView>
      ) : (
        <section
          aria-labelledby="keyboard-heading"
          // Group–row–key: the highlighted group's key rows (1-based), outlined by index.css.
          data-scan-group={scanGroupAttr}
          className={cn(
            'flex flex-col gap-4 rounded-xl border-2 p-3 sm:p-5',
            hc ? 'on-dark border-white bg-black text-white' : 'border-thread bg-paper-deep',
          )}
        >
          <h2 id="keyboard-heading" className="text-2xl font-bold">
            Keyboard
          </h2>
          {output}
          {settings.selectionMode === 'scanning' && (
            <div className="flex flex-wrap items-center gap-3">
              {scanner.running ? (
                <Button onClick={scanner.stop}>Stop scanning (Escape)</Button>
              ) : (
                <Button variant="primary" onClick={startScanning} disabled={engine.status !== 'ready'}>
                  Start scanning
                </Button>
              )}
              <p className={hc ? 'text-white' : 'text-ink-soft'} data-scan-help={scanPattern}>
                {scanHelp[scanPattern]}
              </p>
            </div>
          )}
          {suggestionRow}
          {keyGrid}
          {scanAnnouncer}
        </section>
      )}

      <SettingsPanel
        settings={settings}
        onChange={setSettings}
        osReducedMotion={osReducedMotion}
        trialRunning={session.running}
      />
    </div>
  );
};
