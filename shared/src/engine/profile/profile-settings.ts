// The settings a clinician chooses for a profile version. A plain type here;
// the zod schema that validates forms and API bodies lives with the schemas
// and must accept exactly these fields and ranges.
import type { EscapeMethod } from '../ppm-settings';
import { ProfileInputError } from './profile-errors';

/** How the client makes selections (the client record's access method). */
export type AccessMethodKind = 'direct' | 'switch' | 'eye_gaze' | 'head_pointer' | 'other';

/** The access method and its timings (ms); missing timings take the defaults in profile-rates.ts. */
export type AccessSettings = {
  method: AccessMethodKind;
  /** Switch scanning: time per scan step, ms (> 0). */
  scanIntervalMs?: number;
  /** Gaze or head pointer: dwell time per selection, ms (> 0). */
  dwellMs?: number;
  /** Direct selection: time per key, ms (> 0). */
  keyTimeMs?: number;
};

export type ProfileSettings = {
  /** Maximum context order k, 1..12 (default 5). */
  order: number;
  /** PPM escape method (default C). */
  escape: EscapeMethod;
  /** Full exclusion (default true). */
  exclusion: boolean;
  /** Weight λ of the base model: 'auto' (tuned on held-out training text) or 0..1 (0 = personal alone, 1 = base alone). */
  baseWeight: 'auto' | number;
  /** Suggestion slots shown to the client, 1..10 (default 5). */
  slots: number;
  /** Lower-case all text before training and evaluation (default false). */
  caseFold: boolean;
  access: AccessSettings;
};

export const defaultProfileSettings: ProfileSettings = {
  order: 5,
  escape: 'C',
  exclusion: true,
  baseWeight: 'auto',
  slots: 5,
  caseFold: false,
  access: { method: 'direct' },
};

const ACCESS_METHODS: readonly AccessMethodKind[] = ['direct', 'switch', 'eye_gaze', 'head_pointer', 'other'];

/** Throws ProfileInputError naming the first field out of range. */
export function checkProfileSettings(s: ProfileSettings): void {
  const fail = (message: string): never => {
    throw new ProfileInputError(`invalid profile settings: ${message}`);
  };
  if (!Number.isInteger(s.order) || s.order < 1 || s.order > 12) fail(`order must be 1..12, got ${s.order}`);
  if (!['A', 'B', 'C', 'D'].includes(s.escape)) fail(`escape must be A, B, C or D, got ${String(s.escape)}`);
  if (typeof s.exclusion !== 'boolean') fail('exclusion must be true or false');
  if (
    s.baseWeight !== 'auto' &&
    !(typeof s.baseWeight === 'number' && s.baseWeight >= 0 && s.baseWeight <= 1)
  )
    fail(`baseWeight must be 'auto' or a number 0..1, got ${String(s.baseWeight)}`);
  if (!Number.isInteger(s.slots) || s.slots < 1 || s.slots > 10) fail(`slots must be 1..10, got ${s.slots}`);
  if (typeof s.caseFold !== 'boolean') fail('caseFold must be true or false');
  if (!s.access || !ACCESS_METHODS.includes(s.access.method))
    fail(`access.method must be one of ${ACCESS_METHODS.join(', ')}`);
  for (const key of ['scanIntervalMs', 'dwellMs', 'keyTimeMs'] as const) {
    const v = s.access[key];
    if (v !== undefined && !(Number.isFinite(v) && v > 0))
      fail(`access.${key} must be a positive number of ms`);
  }
}
