import { z } from 'zod';
import { profileSettingsSchema } from './profile-settings.schema';
import { keyboardLayouts } from './trials.schema';

// The report of a trained profile version: what the engine's trainAndEvaluateProfile writes
// (shared/src/engine/profile/README.md; its ProfileReport type is inferred from this schema), what
// the API stores in `profile_versions.metrics` and what the client reads. Same names as
// `model evaluate --json`. Fields added after the first stored reports ("profile report 1") are
// optional, so every stored version still parses: predictor, wordWeights, nonWordSlots and
// scanStepsByLayout.

/** The steps of a training run (the progress stages and the keys of `timings`). */
export const trainingStages = ['preparing', 'training', 'cross-validating', 'simulating', 'saving'] as const;

/** Spread of a metric over folds (sample standard deviation). */
export const spreadSchema = z.object({ min: z.number(), max: z.number(), std: z.number() });
/** A value per list size, keys "1".."10". */
export const perSlotSchema = z.record(z.string(), z.number());

/** How the client makes one selection (a key or a suggestion). */
export const accessTimingSchema = z.discriminatedUnion('kind', [
  /** Switch scanning: each selection costs its scan steps × the scan interval. */
  z.object({ kind: z.literal('scanning'), scanIntervalMs: z.number() }),
  /** Gaze or head pointer with dwell: each selection costs the dwell time plus travel. */
  z.object({ kind: z.literal('dwell'), dwellMs: z.number(), travelMs: z.number().optional() }),
  /** Direct selection (finger, pointer click): a fixed time per key. */
  z.object({ kind: z.literal('direct'), keyMs: z.number() }),
]);

/** Words per minute without and with the list, and the assumptions they rest on. */
export const rateReportSchema = z.object({
  wpmWithout: z.number(),
  wpmWith: z.number(),
  msPerCharWithout: z.number(),
  msPerCharWith: z.number(),
  assumptions: z.object({
    /** How one selection is made, as used for the estimate. */
    timing: accessTimingSchema,
    /** True where a timing was missing from the access settings and the default was used. */
    defaultTiming: z.boolean(),
    /** Expected scan steps per selection (row–column, default layout; only scanning uses it). */
    scanStepsPerSelection: z.number(),
    /** ms of one selection (a key or a suggestion cost the same). */
    msPerSelection: z.number(),
    /** ms to read the list before each selection. */
    listReadMs: z.number(),
    /** Suggestion slots the "with" figure assumes. */
    slots: z.number(),
    /** Keystrokes per character with the list, at those slots. */
    kspc: z.number(),
    note: z.string(),
  }),
});

/** Weights of the word-aware list's mixture. */
export const wordWeightsSchema = z.object({
  personal: z.number(),
  base: z.number(),
  lexicon: z.number(),
  cache: z.number(),
});

/** Offered slots that were not words of the vocabulary (lists at word starts and after 1–2 letters). */
export const nonWordSlotsReportSchema = z.object({
  share: z.number(),
  nonWordSlots: z.number(),
  slots: z.number(),
  lists: z.number(),
  examples: z.array(z.string()),
});

/**
 * The first scan figures: row–column steps on a fixed 6×7 frequency grid the keyboard does not offer,
 * and a binary code length ordered by the model. Still written (the rates and the export header use
 * rowColumn), no longer shown.
 */
const scanStepsSchema = z.object({ rowColumn: z.number(), modelOrdered: z.number() });

/**
 * Expected row–column scan steps per character on each of the test keyboard's layouts, keyed by
 * layout (`keyboardLayouts`): its own key rows, letters case-folded, the suggestion row left out.
 */
export const scanStepsByLayoutSchema = z.object(
  Object.fromEntries(keyboardLayouts.map((layout) => [layout, z.number()])) as Record<
    (typeof keyboardLayouts)[number],
    z.ZodNumber
  >,
);
export type ScanStepsByLayout = z.infer<typeof scanStepsByLayoutSchema>;

export const profileFoldReportSchema = z.object({
  /** Ids of the samples held out in this fold (by-sample folds; empty for segments). */
  heldOutIds: z.array(z.string()),
  trainChars: z.number(),
  testChars: z.number(),
  /** Characters the keystroke simulation typed in this fold. */
  ksChars: z.number(),
  bpcIdeal: z.number(),
  bpcCoded: z.number(),
  codedBytes: z.number(),
  roundTrip: z.boolean(),
  baseWeight: z.number(),
  keystrokeSavings: perSlotSchema,
  scanStepsPerChar: scanStepsSchema,
  scanStepsByLayout: scanStepsByLayoutSchema.optional(),
});

/** A learning-curve point's lowest and highest figures over the folds it was measured on. */
export const learningCurveSpreadSchema = z.object({
  folds: z.number().int(),
  bpcMin: z.number(),
  bpcMax: z.number(),
  keystrokeSavingsMin: z.number(),
  keystrokeSavingsMax: z.number(),
});

export const learningCurveReportSchema = z.object({
  /** Index into perFold of the first fold the curve was measured on. */
  fold: z.number(),
  /**
   * How many folds (from `fold` on) each point was measured on; points are then means over them.
   * Absent in reports measured on one fold.
   */
  folds: z.number().int().optional(),
  /** Held-out characters (bpc) and characters typed (KS) at every point. */
  heldOutChars: z.number(),
  ksChars: z.number(),
  slots: z.number(),
  points: z.array(
    z.object({
      fraction: z.number(),
      trainChars: z.number(),
      baseWeight: z.number(),
      bpcIdeal: z.number(),
      keystrokeSavings: z.number(),
      /** Lowest and highest over the folds (absent in reports measured on one fold). */
      spread: learningCurveSpreadSchema.optional(),
    }),
  ),
});

export const baseOnlyReportSchema = z.object({
  bpcIdeal: z.number(),
  keystrokeSavings: perSlotSchema,
  kspc: perSlotSchema,
  /** Absent in reports made before the hit rate was measured. */
  hitRate: perSlotSchema.optional(),
});

export const earlyWordSchema = z.object({ word: z.string(), count: z.number() });

export const profileReportSchema = z.object({
  engineVersion: z.string(),
  /** The list measured: whole words, or the character-only list (absent in reports before the word list). */
  predictor: z.enum(['word', 'char']).optional(),
  /**
   * Weights of the word-aware list's mixture for the final profile (tuned on the last 10% of all
   * samples; each fold tunes its own on its training text), null for the character-only list.
   */
  wordWeights: wordWeightsSchema.nullable().optional(),
  /** The share of offered slots that were not words, over all folds. */
  nonWordSlots: nonWordSlotsReportSchema.optional(),
  /** How many words the clinician added and blocked for this version (absent when none). */
  vocabulary: z.object({ added: z.number().int(), blocked: z.number().int() }).optional(),
  /** Characters of all samples after preparation. */
  chars: z.number(),
  documents: z.number(),
  settings: profileSettingsSchema,
  order: z.number(),
  escape: z.string(),
  adaptive: z.literal(true),
  folds: z.number(),
  foldUnit: z.enum(['document', 'segment']),
  foldNote: z.string(),
  /** Characters held out over all folds (each character once). */
  heldOutChars: z.number(),
  /** Mean over folds of each fold's bits per character. */
  bpcIdeal: z.number(),
  bpcIdealSpread: spreadSchema,
  bpcCoded: z.number(),
  bpcCodedSpread: spreadSchema,
  /** Coded bytes of all held-out text, summed over folds. */
  codedBytes: z.number(),
  /** Every fold's coded stream decoded back exactly. */
  roundTrip: z.boolean(),
  /** λ, the base model's weight (mean over folds when tuned); 0 without a base model. The final model's too. */
  baseWeight: z.number(),
  baseWeightSpread: spreadSchema,
  /** Fractions for 1..10 slots, over all folds weighted by characters typed. */
  keystrokeSavings: perSlotSchema,
  kspc: perSlotSchema,
  /** Upper bound: every word selected before its first letter. */
  oracleSavings: z.number(),
  /**
   * Words in the text the keystroke simulation typed, and per list size the share of them the list
   * offered before their last letter (hit rate) and the selections (keys and list choices, spaces and
   * punctuation included) per word. Absent in reports made before they were measured.
   */
  ksWords: z.number().int().optional(),
  hitRate: perSlotSchema.optional(),
  selectionsPerWord: perSlotSchema.optional(),
  /** Cap per fold on the characters typed by the keystroke simulation (null: whole held-out text). */
  ksSampleChars: z.number().nullable(),
  /** Characters the keystroke simulation typed over all folds. */
  ksChars: z.number(),
  ksNote: z.string(),
  scanStepsPerChar: scanStepsSchema,
  /** Absent in reports trained before scan steps were measured per keyboard layout. */
  scanStepsByLayout: scanStepsByLayoutSchema.optional(),
  rates: rateReportSchema,
  learningCurve: learningCurveReportSchema,
  baseOnly: baseOnlyReportSchema.nullable(),
  /** Null without a base model. */
  earlyWords: z.array(earlyWordSchema).nullable(),
  perFold: z.array(profileFoldReportSchema),
  /** ms per stage, and the whole run (a record with an enum key needs every key in zod 4: docs/references.md). */
  timings: z.record(z.enum([...trainingStages, 'total']), z.number()),
});
export type ProfileReport = z.infer<typeof profileReportSchema>;

/** The report's top-level field names. */
export const profileReportKeys = profileReportSchema.keyof().options;
export type ProfileReportKey = (typeof profileReportKeys)[number];
export type RateReport = z.infer<typeof rateReportSchema>;
export type AccessTiming = z.infer<typeof accessTimingSchema>;
export type WordWeights = z.infer<typeof wordWeightsSchema>;
export type EarlyWord = z.infer<typeof earlyWordSchema>;
export type TrainingStage = (typeof trainingStages)[number];

/** The headline figures a profile file's header carries from the report. */
export const headlineReportSchema = profileReportSchema.pick({
  chars: true,
  folds: true,
  bpcIdeal: true,
  bpcCoded: true,
  keystrokeSavings: true,
  kspc: true,
  baseWeight: true,
  scanStepsPerChar: true,
});
export const headlineReportKeys = headlineReportSchema.keyof().options;
