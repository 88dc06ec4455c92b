import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { defaultKeyboardSettings, type KeyboardViewSettings } from '../logic/keyboard-settings';
import { SettingsPanel } from './settings-panel';

const start = (patch: Partial<KeyboardViewSettings>) => {
  const onChange = vi.fn();
  const settings = {
    ...defaultKeyboardSettings({ accessMethod: 'eye_gaze', dwellMs: 900, scanIntervalMs: null }, 5),
    ...patch,
  };
  render(
    <SettingsPanel settings={settings} onChange={onChange} osReducedMotion={false} trialRunning={false} />,
  );
  return onChange;
};

describe('SettingsPanel: spacing, dwell and scan announcements', () => {
  it('key spacing is a labelled choice of small, medium and large', async () => {
    const onChange = start({});
    const select = screen.getByRole('combobox', { name: 'Key spacing' });
    expect(select).toHaveValue('small');
    await userEvent.selectOptions(select, 'Large');
    expect(onChange).toHaveBeenLastCalledWith(expect.objectContaining({ keySpacing: 'large' }));
  });

  it('dwell mode offers the pause after a selection and the sound, off by default', async () => {
    const onChange = start({});
    const pause = screen.getByRole('spinbutton', { name: 'Pause after a selection (ms)' });
    expect(pause).toHaveValue(300);
    await userEvent.clear(pause);
    await userEvent.type(pause, '1200');
    expect(onChange).toHaveBeenLastCalledWith(expect.objectContaining({ dwellRefractoryMs: 1200 }));
    const sound = screen.getByRole('checkbox', { name: 'Sound on selection' });
    expect(sound).not.toBeChecked();
    await userEvent.click(sound);
    expect(onChange).toHaveBeenLastCalledWith(expect.objectContaining({ dwellSound: true }));
    expect(screen.queryByRole('checkbox', { name: 'Announce the scan highlight' })).toBeNull();
  });

  it('scanning offers the scan announcement, off by default, and no dwell settings', async () => {
    const onChange = start({ selectionMode: 'scanning' });
    expect(screen.queryByRole('checkbox', { name: 'Sound on selection' })).toBeNull();
    const announce = screen.getByRole('checkbox', { name: 'Announce the scan highlight' });
    expect(announce).not.toBeChecked();
    await userEvent.click(announce);
    expect(onChange).toHaveBeenLastCalledWith(expect.objectContaining({ scanAnnounce: true }));
  });
});
