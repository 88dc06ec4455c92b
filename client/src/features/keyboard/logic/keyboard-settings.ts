import {
  type AccessMethod,
  type Client,
  defaultAccessTiming,
  type KeySpacing,
  type TrialSelectionMode,
  type TrialSettings,
} from '@keyloom/shared';

/** What the test keyboard page can change: the trial's settings plus a display-only motion switch. */
export type KeyboardViewSettings = TrialSettings & {
  /** Dwell fill and scan highlight move in steps, with no transition (also forced on by the OS). */
  reduceMotion: boolean;
  /** A capital comes on its own at the message's start and after a sentence's end. */
  autoCapital: boolean;
  /** In direct mode, the number keys 1–9 of a physical keyboard pick suggestions 1–9. */
  numberKeysPick: boolean;
  /** The gap between keys, rows and suggestion slots. */
  keySpacing: KeySpacing;
  /** Dwell: ms after each selection during which no dwell starts (0–2000). */
  dwellRefractoryMs: number;
  /** Dwell: a short tone on each selection. */
  dwellSound: boolean;
  /** Scanning: a polite live region says what the scanner highlights (display only, not logged). */
  scanAnnounce: boolean;
};

// The client record's access method decides the trial's selection mode by default.
const selectionModeFor: Record<AccessMethod, TrialSelectionMode> = {
  direct: 'direct',
  head_pointer: 'direct',
  other: 'direct',
  eye_gaze: 'dwell',
  switch: 'scanning',
};

/**
 * Step scanning with one switch: how long without a press before the highlighted entry is chosen,
 * ms (range 500–10000). Common practice, no source.
 */
export const DEFAULT_SCAN_ACCEPT_MS = 1500;

/**
 * Dwell: the refractory time after each selection, ms (range 0–2000), during which no dwell starts,
 * so a gaze that lingers does not choose the next key at once. Common practice, no source.
 */
export const DEFAULT_DWELL_REFRACTORY_MS = 300;

/** Text size choices, as multiples of the normal size (100–300 %). */
export const textScales = [1, 1.25, 1.5, 2, 2.5, 3] as const;

/**
 * Starting settings from the client record and the version's slot count.
 * @param client the record's access method and timings (null timings fall back to Keyloom's defaults)
 * @param slots the version's suggestion slots, 1–10
 * @param osReducedMotion whether the system asks for reduced motion
 */
export const defaultKeyboardSettings = (
  client: Pick<Client, 'accessMethod' | 'dwellMs' | 'scanIntervalMs'>,
  slots: number,
  osReducedMotion = false,
): KeyboardViewSettings => ({
  selectionMode: selectionModeFor[client.accessMethod],
  layout: 'typewriter',
  slots: Math.min(10, Math.max(1, Math.round(slots))),
  dwellMs: client.dwellMs ?? defaultAccessTiming.dwellMs,
  scanIntervalMs: client.scanIntervalMs ?? defaultAccessTiming.scanIntervalMs,
  largeTargets: false,
  highContrast: false,
  textScale: 1,
  tintKeys: false,
  reduceMotion: osReducedMotion,
  autoCapital: true,
  numberKeysPick: false,
  scanPattern: 'auto-row-column',
  suggestionsScanned: 'first',
  scanAcceptMs: DEFAULT_SCAN_ACCEPT_MS,
  keySpacing: 'small',
  dwellRefractoryMs: DEFAULT_DWELL_REFRACTORY_MS,
  dwellSound: false,
  scanAnnounce: false,
});

/** The settings a trial is logged with: only the timing its selection mode uses (the schema's shape). */
export const trialSettingsOf = (settings: KeyboardViewSettings): TrialSettings => ({
  selectionMode: settings.selectionMode,
  layout: settings.layout,
  slots: settings.slots,
  dwellMs: settings.selectionMode === 'dwell' ? settings.dwellMs : null,
  scanIntervalMs: settings.selectionMode === 'scanning' ? settings.scanIntervalMs : null,
  largeTargets: settings.largeTargets,
  highContrast: settings.highContrast,
  textScale: settings.textScale,
  tintKeys: settings.tintKeys,
  // The scanning pattern, where the suggestions come and (step, one switch) the acceptance time.
  ...(settings.selectionMode === 'scanning'
    ? {
        scanPattern: settings.scanPattern ?? 'auto-row-column',
        suggestionsScanned: settings.suggestionsScanned ?? 'first',
        ...(settings.scanPattern === 'step-one-switch'
          ? { scanAcceptMs: settings.scanAcceptMs ?? DEFAULT_SCAN_ACCEPT_MS }
          : {}),
      }
    : {}),
  autoCapital: settings.autoCapital,
  keySpacing: settings.keySpacing,
  ...(settings.selectionMode === 'direct' ? { numberKeysPick: settings.numberKeysPick } : {}),
  ...(settings.selectionMode === 'dwell'
    ? { dwellRefractoryMs: settings.dwellRefractoryMs, dwellSound: settings.dwellSound }
    : {}),
});

/** A millisecond value from a number field, clamped to [min, max]; the old value when not a number. */
export const clampMs = (raw: string, min: number, max: number, previous: number): number => {
  const value = Math.round(Number(raw));
  if (raw.trim() === '' || !Number.isFinite(value)) return previous;
  return Math.min(max, Math.max(min, value));
};
