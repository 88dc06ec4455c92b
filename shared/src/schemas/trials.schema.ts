import { z } from 'zod';
import { isoDateTimeField, safeText } from './common';

// Trials on the test keyboard: what the browser logs and posts, what the API stores and returns.

/**
 * How keys are selected on the test keyboard during a trial (its selection mode). Not the client
 * record's access method (the body or device route, accessMethodSchema), which only picks the default.
 */
export const trialSelectionModes = ['direct', 'dwell', 'scanning'] as const;
export const trialSelectionModeSchema = z.enum(trialSelectionModes);
export type TrialSelectionMode = z.infer<typeof trialSelectionModeSchema>;
export const trialSelectionModeLabels: Record<TrialSelectionMode, string> = {
  direct: 'Direct (pointer, touch or keyboard)',
  dwell: 'Dwell',
  scanning: 'Single-switch scanning',
};

/**
 * Key orders of the test keyboard: the standard typewriter order, a plain alphabetical one, and the
 * letters re-ordered by the model's next-letter probabilities after every change of the text.
 */
export const keyboardLayouts = ['typewriter', 'alphabetical', 'model-ordered'] as const;
export const keyboardLayoutSchema = z.enum(keyboardLayouts);
export type KeyboardLayout = z.infer<typeof keyboardLayoutSchema>;
export const keyboardLayoutLabels: Record<KeyboardLayout, string> = {
  typewriter: 'Typewriter order',
  alphabetical: 'Alphabetical order',
  'model-ordered': 'Ordered by the model',
};

/**
 * Scanning patterns: automatic row–column, automatic group–row–key (groups of rows above the rows),
 * step scanning with one switch (each press moves one step; a pause of the acceptance time chooses)
 * and with two switches (one moves, the other chooses).
 */
export const trialScanPatterns = [
  'auto-row-column',
  'auto-group-row-key',
  'step-one-switch',
  'step-two-switch',
] as const;
export type TrialScanPattern = (typeof trialScanPatterns)[number];
export const trialScanPatternLabels: Record<TrialScanPattern, string> = {
  'auto-row-column': 'Automatic row–column',
  'auto-group-row-key': 'Automatic group–row–key',
  'step-one-switch': 'Step, one switch',
  'step-two-switch': 'Step, two switches',
};
/** Where the suggestion row comes in the scan: before the key rows or after them. */
export const suggestionsScannedPlaces = ['first', 'last'] as const;
export type SuggestionsScanned = (typeof suggestionsScannedPlaces)[number];
/** The gap between keys, between key rows and between suggestion slots: small, medium or large. */
export const keySpacings = ['small', 'medium', 'large'] as const;
export type KeySpacing = (typeof keySpacings)[number];
export const keySpacingLabels: Record<KeySpacing, string> = {
  small: 'Small',
  medium: 'Medium',
  large: 'Large',
};

/** The settings a trial ran with (the client record's access settings are the defaults). */
export const trialSettingsSchema = z.object({
  selectionMode: trialSelectionModeSchema,
  layout: keyboardLayoutSchema,
  slots: z.number().int().min(1).max(10),
  dwellMs: z.number().int().min(100).max(5_000).nullable(),
  scanIntervalMs: z.number().int().min(100).max(10_000).nullable(),
  largeTargets: z.boolean(),
  highContrast: z.boolean(),
  /** Text size as a multiple of the normal size (1 = 100 %). */
  textScale: z.number().min(1).max(3),
  tintKeys: z.boolean(),
  // Scanning only. Optional, so trials logged before these settings existed still parse: absent means
  // automatic row–column, suggestions first, no acceptance time.
  scanPattern: z.enum(trialScanPatterns).optional(),
  suggestionsScanned: z.enum(suggestionsScannedPlaces).optional(),
  /** Step scanning with one switch: ms without a press before the highlighted entry is chosen. */
  scanAcceptMs: z.number().int().min(500).max(10_000).optional(),
  // Optional, so trials logged before these settings existed still parse: absent means not recorded.
  /** A capital at the message's start and after a sentence's end (any mode). */
  autoCapital: z.boolean().optional(),
  /** Direct mode only: the number keys 1–9 of a physical keyboard pick suggestions 1–9. */
  numberKeysPick: z.boolean().optional(),
  /** The gap between keys, rows and suggestion slots (any mode). */
  keySpacing: z.enum(keySpacings).optional(),
  /** Dwell only: ms after each selection during which no dwell starts. */
  dwellRefractoryMs: z.number().int().min(0).max(2_000).optional(),
  /** Dwell only: a short tone on each selection. */
  dwellSound: z.boolean().optional(),
});
export type TrialSettings = z.infer<typeof trialSettingsSchema>;

/**
 * One logged step of a trial. `t` is milliseconds since the trial started.
 * - `letter` / `punctuation`: `value` is the one character inserted (a digit is a `letter` step; a
 *   capital is logged as the capital letter it is, whether shift or the automatic capital gave it).
 * - `space`: a space inserted. `backspace`: the last character removed.
 * - `newline`: a line break ("\n") inserted.
 * - `delete_word`: removes the word before the caret and the spaces after it ("tea  " → "");
 *   at a word's end removes that word ("i want tea" → "i want "); after punctuation removes the
 *   punctuation mark with the word before it ("tea. " → "").
 * - `suggestion`: `value` is the whole word picked from slot `slot` (0-based); the word being
 *   typed is replaced by it and a space follows.
 * - `undo_pick`: the text goes back to what it was just before the last suggestion pick not yet
 *   undone (what was typed after that pick goes with it); a replay refuses it when every pick has
 *   been undone or there was none.
 * - `shift`: `value` is the shift state chosen: `once` (the next letter is a capital), `lock`
 *   (caps lock) or `off`. `layer`: `value` is the key layer shown, `letters` or `symbols`.
 *   Neither changes the text by itself.
 * - `pause` / `resume`: the trial was paused and taken up again (no text change).
 * - `switch`: one switch activation in scanning mode (it changes no text by itself); with two
 *   switches `value` says which: `move` or `select` (absent with one switch).
 * - `offer`: the suggestion row changed; `words` is what it showed (possibly empty).
 * Selections (the trial's keystrokes for keystroke savings and KSPC) are every key the person had to
 * choose: letters, punctuation, space, backspace, new line, delete word, suggestions, undo pick, shift
 * and layer. `pause`, `resume`, `switch` and `offer` are not selections.
 */
export const trialEventTypes = [
  'letter',
  'punctuation',
  'space',
  'backspace',
  'newline',
  'delete_word',
  'suggestion',
  'undo_pick',
  'shift',
  'layer',
  'pause',
  'resume',
  'switch',
  'offer',
] as const;
/** The values of a `shift` step and of a `layer` step. */
export const trialShiftStates = ['off', 'once', 'lock'] as const;
export type TrialShiftState = (typeof trialShiftStates)[number];
export const trialKeyLayers = ['letters', 'symbols'] as const;
export type TrialKeyLayer = (typeof trialKeyLayers)[number];
export const trialEventTypeSchema = z.enum(trialEventTypes);
export type TrialEventType = z.infer<typeof trialEventTypeSchema>;

export const trialEventSchema = z.object({
  t: z
    .number()
    .int()
    .min(0)
    .max(24 * 60 * 60 * 1000),
  type: trialEventTypeSchema,
  value: safeText().max(64).optional(),
  slot: z.number().int().min(0).max(9).optional(),
  words: z.array(safeText().max(64)).max(10).optional(),
});
export type TrialEvent = z.infer<typeof trialEventSchema>;

/** Longest trial accepted: events and text. */
export const TRIAL_MAX_EVENTS = 20_000;
export const TRIAL_MAX_TEXT = 5_000;

// POST /api/profile-versions/:id/trials. `localTrialId` is made in the browser; posting the same id
// again (an upload retried after the network came back) returns the stored trial instead of a second one.
export const createTrialSchema = z.object({
  localTrialId: z.uuid({ error: 'The trial needs an id made by the browser.' }),
  startedAt: isoDateTimeField,
  finishedAt: isoDateTimeField,
  /** A practice phrase's id ("kl-…" for Keyloom's own phrases, a uuid for the client's), if one was used. */
  phraseId: safeText().max(64).nullable().default(null),
  targetPhrase: safeText().max(500).nullable().default(null),
  /** The text on screen at the end; the API replays `events` and refuses the trial if they differ. */
  text: safeText({ multiline: true }).max(TRIAL_MAX_TEXT),
  events: z
    .array(trialEventSchema)
    .min(1, { error: 'The trial has no key presses.' })
    .max(TRIAL_MAX_EVENTS, { error: `A trial can log at most ${TRIAL_MAX_EVENTS} steps.` }),
  settings: trialSettingsSchema,
  note: safeText({ multiline: true }).trim().max(2000).default(''),
});
export type CreateTrialInput = z.input<typeof createTrialSchema>;
export type CreateTrialBody = z.output<typeof createTrialSchema>;

/** What a trial measured (computeTrialMeasures in shared/src/trials). */
export const trialMeasuresSchema = z.object({
  /** Code points of the final text. */
  characters: z.number().int(),
  /** Selections: every key chosen (see trialEventTypes); not pauses, switch activations or offers. */
  keystrokes: z.number().int(),
  /** Switch activations (scanning only; 0 otherwise). */
  switchActivations: z.number().int(),
  /** Times the suggestion row changed to show at least one word. */
  suggestionsOffered: z.number().int(),
  suggestionsTaken: z.number().int(),
  /** Characters that picked suggestions put into the text (their spaces included). */
  charactersFromSuggestions: z.number().int(),
  /** Backspaces pressed. */
  errorsCorrected: z.number().int(),
  /** From the first selection to the last, less the paused time in between, ms (the time words per minute uses). */
  durationMs: z.number().int(),
  /** Paused time between the first selection and the last, ms (absent in trials stored before pauses were left out). */
  pausedMs: z.number().int().optional(),
  /** 1 − keystrokes / characters (null with no characters); negative when corrections outnumber savings. */
  keystrokeSavings: z.number().nullable(),
  /** keystrokes / characters (null with no characters). */
  kspc: z.number().nullable(),
  /** ((characters − 1) / seconds) × 60 / 5 (null under 2 characters or no time). */
  wpm: z.number().nullable(),
  /** Minimum string distance between the target phrase and the text, over the longer length (null without a target). */
  errorRate: z.number().nullable(),
});
export type TrialMeasures = z.infer<typeof trialMeasuresSchema>;

export const trialSchema = z.object({
  id: z.uuid(),
  localTrialId: z.uuid(),
  versionId: z.uuid(),
  versionNumber: z.number().int(),
  clientId: z.uuid(),
  by: z.object({ id: z.uuid().nullable(), name: z.string(), role: z.string() }),
  startedAt: z.string(),
  finishedAt: z.string(),
  phraseId: z.string().nullable(),
  targetPhrase: z.string().nullable(),
  text: z.string(),
  settings: trialSettingsSchema,
  note: z.string(),
  measures: trialMeasuresSchema,
  /** The version's simulated figures at the trial's slot count, for comparison (null when the report lacks them). */
  simulated: z.object({
    keystrokeSavings: z.number().nullable(),
    wpm: z.number().nullable(),
    slots: z.number().int(),
  }),
  createdAt: z.string(),
});
export type Trial = z.infer<typeof trialSchema>;

// Practice phrases: Keyloom's own invented list plus the ones the clinician adds for the client.
export const practicePhraseSources = ['keyloom', 'client'] as const;
export const practicePhraseSchema = z.object({
  id: z.string(),
  text: z.string(),
  source: z.enum(practicePhraseSources),
  addedBy: z.string().nullable(),
  createdAt: z.string().nullable(),
});
export type PracticePhrase = z.infer<typeof practicePhraseSchema>;

export const createPracticePhraseSchema = z.object({
  text: safeText({ error: 'Write the phrase.' })
    .trim()
    .min(2, { error: 'Write a phrase of at least 2 characters.' })
    .max(200, { error: 'Keep a practice phrase under 200 characters.' }),
});
export type CreatePracticePhraseInput = z.infer<typeof createPracticePhraseSchema>;

// POST /api/profile-versions/:id/report-problem: an assigned carer, after a trial, instead of signing off.
export const reportProblemSchema = z.object({
  reason: safeText({ error: 'Say what went wrong in the trial.', multiline: true })
    .trim()
    .min(1, { error: 'Say what went wrong in the trial.' })
    .max(2000),
});
export type ReportProblemInput = z.infer<typeof reportProblemSchema>;
