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

describe('targets, spacing and dwell settings in the trial settings', () => {
  const base = defaultKeyboardSettings({ accessMethod: 'direct', dwellMs: 700, scanIntervalMs: null }, 5);

  it('direct mode logs the capital, number-key and spacing settings, no dwell fields', () => {
    const logged = trialSettingsOf({
      ...base,
      autoCapital: false,
      numberKeysPick: true,
      keySpacing: 'large',
    });
    expect(logged).toMatchObject({ autoCapital: false, numberKeysPick: true, keySpacing: 'large' });
    expect('dwellRefractoryMs' in logged || 'dwellSound' in logged).toBe(false);
    expect(trialSettingsSchema.parse(logged)).toEqual(logged);
  });

  it('dwell mode logs the refractory time and the sound, not the number keys', () => {
    const logged = trialSettingsOf({
      ...base,
      selectionMode: 'dwell',
      dwellRefractoryMs: 1200,
      dwellSound: true,
      keySpacing: 'medium',
    });
    expect(logged).toMatchObject({
      dwellMs: 700,
      dwellRefractoryMs: 1200,
      dwellSound: true,
      keySpacing: 'medium',
      autoCapital: true,
    });
    expect('numberKeysPick' in logged).toBe(false);
    expect(trialSettingsSchema.parse(logged)).toEqual(logged);
  });

  it('scanning logs neither the number keys nor the dwell fields', () => {
    const logged = trialSettingsOf({
      ...base,
      selectionMode: 'scanning',
      numberKeysPick: true,
      dwellSound: true,
    });
    expect(['numberKeysPick', 'dwellRefractoryMs', 'dwellSound'].filter((k) => k in logged)).toEqual([]);
    expect(logged.keySpacing).toBe('small');
  });

  it('defaults: small spacing, 300 ms refractory time, no sound', () => {
    expect(base).toMatchObject({
      keySpacing: 'small',
      dwellRefractoryMs: 300,
      dwellSound: false,
      scanAnnounce: false,
    });
  });

  it('the schema refuses values out of range and accepts the old shape', () => {
    const logged = trialSettingsOf({ ...base, selectionMode: 'dwell' });
    expect(trialSettingsSchema.safeParse({ ...logged, dwellRefractoryMs: 2001 }).success).toBe(false);
    expect(trialSettingsSchema.safeParse({ ...logged, dwellRefractoryMs: -1 }).success).toBe(false);
    expect(trialSettingsSchema.safeParse({ ...logged, keySpacing: 'huge' }).success).toBe(false);
    expect(trialSettingsSchema.safeParse({ ...logged, dwellSound: 'yes' }).success).toBe(false);
    const { autoCapital, keySpacing, dwellRefractoryMs, dwellSound, ...old } = logged;
    expect([autoCapital, keySpacing, dwellRefractoryMs, dwellSound]).toEqual([true, 'small', 300, false]);
    expect(trialSettingsSchema.parse(old)).toEqual(old);
  });
});
