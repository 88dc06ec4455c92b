import { describe, expect, it } from 'vitest';
import { accessMethods } from '../../schemas/clients.schema';
import { profileSettingsSchema } from '../../schemas/profile-settings.schema';
import { ProfileInputError } from './profile-errors';
import { checkProfileSettings, defaultProfileSettings } from './profile-settings';

describe('profile settings (one schema for the form, the API and the engine)', () => {
  it('takes its defaults from the schema', () => {
    expect(Object.entries(defaultProfileSettings)).toEqual([
      ['order', 5],
      ['escape', 'C'],
      ['exclusion', true],
      ['baseWeight', 'auto'],
      ['slots', 5],
      ['caseFold', false],
      ['access', { method: 'direct' }],
      ['vocabulary', { additions: [], blocks: [] }],
    ]);
    expect(profileSettingsSchema.parse({ access: { method: 'switch' } })).toEqual({
      ...defaultProfileSettings,
      access: { method: 'switch' },
    });
  });

  it("rejects in the engine exactly what the form rejects, naming the field and the schema's message", () => {
    // The engine once accepted any positive scan interval; the schema's range is 100..10,000 ms.
    const slow = { ...defaultProfileSettings, access: { method: 'switch' as const, scanIntervalMs: 50 } };
    expect(profileSettingsSchema.safeParse(slow).success).toBe(false);
    expect(() => checkProfileSettings(slow)).toThrow(ProfileInputError);
    expect(() => checkProfileSettings(slow)).toThrow(/^invalid profile settings: access\.scanIntervalMs: /);
    expect(() => checkProfileSettings({ ...defaultProfileSettings, order: 13 })).toThrow(
      'invalid profile settings: order: Choose a context order from 1 to 12.',
    );
    expect(() => checkProfileSettings({ ...defaultProfileSettings, baseWeight: 1.5 })).toThrow(
      /^invalid profile settings: baseWeight: /,
    );
    const ok = { ...defaultProfileSettings, access: { method: 'switch' as const, scanIntervalMs: 100 } };
    expect(checkProfileSettings(ok)).toEqual(ok);
  });

  it('accepts every access method of the client record and no other', () => {
    for (const method of accessMethods)
      expect(checkProfileSettings({ ...defaultProfileSettings, access: { method } }).access.method).toBe(
        method,
      );
    expect(() =>
      checkProfileSettings({ ...defaultProfileSettings, access: { method: 'telepathy' } }),
    ).toThrow(/^invalid profile settings: access\.method: /);
  });
});
