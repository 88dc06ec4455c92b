import { z } from 'zod';
import { accessMethodSchema } from './clients.schema';
import { numberField } from './common';
import { clientVocabularySchema } from './vocabulary.schema';

// The settings of a profile version: the one contract for forms, API bodies, the stored settings
// and the engine (shared/src/engine/profile/profile-settings.ts infers its types from it and checks
// its input with it). The defaults and ranges are written here only.
export const escapeMethods = ['A', 'B', 'C', 'D'] as const;

/** A whole number from `min` to `max` (a number, or its digits from a form), one message for every problem. */
const wholeNumberFrom = (min: number, max: number, error: string) =>
  numberField(z.number({ error }).int({ error }).min(min, { error }).max(max, { error }));

const weightMessage = 'Enter a base-model weight from 0 to 1, or choose automatic.';

/** The access method and its timings (ms); missing timings take the defaults in profile-rates.ts. */
export const accessSettingsSchema = z.object({
  method: accessMethodSchema,
  /** Switch scanning: time per scan step. */
  scanIntervalMs: numberField(z.number().int().min(100).max(10_000)).optional(),
  /** Gaze or head pointer: dwell time per selection. */
  dwellMs: numberField(z.number().int().min(100).max(5_000)).optional(),
  /** Direct selection: time per key. */
  keyTimeMs: numberField(z.number().int().min(100).max(30_000)).optional(),
});

export const profileSettingsSchema = z.object({
  /** Maximum context order k. */
  order: wholeNumberFrom(1, 12, 'Choose a context order from 1 to 12.').default(5),
  /** PPM escape method. */
  escape: z.enum(escapeMethods, { error: 'Choose escape method A, B, C or D.' }).default('C'),
  /** Full exclusion. */
  exclusion: z.boolean().default(true),
  /**
   * Weight λ of the base English model: 'auto' tunes it on held-out training text; a number 0..1
   * fixes it (0 = personal alone, 1 = base alone).
   */
  baseWeight: z
    .union([
      z.literal('auto'),
      numberField(
        z.number({ error: weightMessage }).min(0, { error: weightMessage }).max(1, { error: weightMessage }),
      ),
    ])
    .default('auto'),
  /** Suggestion slots shown to the client. */
  slots: wholeNumberFrom(1, 10, 'Choose 1 to 10 suggestion slots.').default(5),
  /** Lower-case all text before training and evaluation. */
  caseFold: z.boolean().default(false),
  /** The access-method timings used for the estimates; the client record's by default. */
  access: accessSettingsSchema,
  /** The clinician's added and blocked words, frozen with the version (none in versions made before). */
  vocabulary: clientVocabularySchema.default({ additions: [], blocks: [] }),
});
export type ProfileSettings = z.output<typeof profileSettingsSchema>;
/** Settings as stored or sent (fields with defaults may be missing, e.g. in versions made before they existed). */
export type ProfileSettingsInput = z.input<typeof profileSettingsSchema>;
export type AccessSettings = z.output<typeof accessSettingsSchema>;
