import { trialSettingsSchema } from '@keyloom/shared';
import { describe, expect, it } from 'vitest';
import { defaultKeyboardSettings, trialSettingsOf } from './keyboard-settings';

const client = { accessMethod: 'switch', dwellMs: null, scanIntervalMs: 900 } as const;

describe('scanning settings in the trial settings', () => {
  it('a trial logged before scanning patterns existed still parses (they are optional)', () => {
    const old = {
      selectionMode: 'scanning',
      layout: 'typewriter',
      slots: 5,
      dwellMs: null,
      scanIntervalMs: 900,
      largeTargets: false,
      highContrast: false,
      textScale: 1,
      tintKeys: false,
    };
    expect(trialSettingsSchema.parse(old)).toEqual(old);
    expect(trialSettingsSchema.safeParse({ ...old, scanPattern: 'round-robin' }).success).toBe(false);
    expect(trialSettingsSchema.safeParse({ ...old, scanAcceptMs: 499 }).success).toBe(false);
  });

  it('keeps the pattern and suggestion place when scanning, the acceptance time only for step with one switch', () => {
    const scanning = defaultKeyboardSettings(client, 5);
    expect(trialSettingsOf(scanning)).toMatchObject({
      scanPattern: 'auto-row-column',
      suggestionsScanned: 'first',
    });
    expect(trialSettingsOf(scanning).scanAcceptMs).toBeUndefined();
    const step = trialSettingsOf({ ...scanning, scanPattern: 'step-one-switch', suggestionsScanned: 'last' });
    expect(step).toMatchObject({
      scanPattern: 'step-one-switch',
      suggestionsScanned: 'last',
      scanAcceptMs: 1500,
    });
    expect(trialSettingsSchema.parse(step)).toEqual(step);
    const direct = trialSettingsOf({ ...scanning, selectionMode: 'direct' });
    expect('scanPattern' in direct || 'suggestionsScanned' in direct || 'scanAcceptMs' in direct).toBe(false);
  });
});
