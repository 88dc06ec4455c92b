import { act, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { ScanPattern } from '../logic/scanner';
import { useScanner } from './use-scanner';

const press = (key: string, init: KeyboardEventInit = {}) => {
  const event = new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true, ...init });
  act(() => {
    document.body.dispatchEvent(event);
  });
  return event;
};

describe('useScanner', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  const setup = (rowLengths = [2, 10, 9, 7]) => {
    const onSelect = vi.fn();
    const onSwitch = vi.fn();
    const hook = renderHook(
      (props: { enabled: boolean; rowLengths: number[] }) =>
        useScanner({
          enabled: props.enabled,
          intervalMs: 200,
          rowLengths: props.rowLengths,
          onSelect,
          onSwitch,
        }),
      { initialProps: { enabled: true, rowLengths } },
    );
    return { ...hook, onSelect, onSwitch };
  };

  it('steps at the interval; Space enters a row, Enter selects, every press is a switch step', () => {
    const { result, onSelect, onSwitch } = setup();
    expect(result.current.running).toBe(false);
    // Not running: Space is left alone.
    expect(press(' ').defaultPrevented).toBe(false);
    act(() => result.current.start());
    expect(result.current.state).toEqual({ level: 'rows', row: 0, item: 0, idlePasses: 0 });
    act(() => vi.advanceTimersByTime(200 * 2));
    expect(result.current.state?.row).toBe(2);
    expect(press(' ').defaultPrevented).toBe(true);
    expect(result.current.state).toEqual({ level: 'items', row: 2, item: 0, idlePasses: 0 });
    // The highlight holds a whole interval after a press.
    act(() => vi.advanceTimersByTime(199));
    expect(result.current.state?.item).toBe(0);
    act(() => vi.advanceTimersByTime(1 + 200 * 2));
    expect(result.current.state?.item).toBe(3);
    expect(press('Enter').defaultPrevented).toBe(true);
    expect(onSelect).toHaveBeenCalledExactlyOnceWith(2, 3);
    expect(onSwitch).toHaveBeenCalledTimes(2);
    expect(result.current.state).toEqual({ level: 'rows', row: 0, item: 0, idlePasses: 0 });
  });

  it('ignores key repeat and other keys; Escape stops', () => {
    const { result, onSwitch } = setup();
    act(() => result.current.start());
    press(' ', { repeat: true });
    press('a');
    expect(onSwitch).not.toHaveBeenCalled();
    press('Escape');
    expect(result.current.running).toBe(false);
    expect(result.current.state).toBeNull();
    act(() => vi.advanceTimersByTime(1000));
    expect(press(' ').defaultPrevented).toBe(false);
  });

  it('stops when disabled and follows rows that change length', () => {
    const { result, rerender } = setup([3, 10]);
    act(() => result.current.start());
    press(' '); // enter row 0 (the suggestion row)
    act(() => vi.advanceTimersByTime(400));
    expect(result.current.state).toMatchObject({ level: 'items', row: 0, item: 2 });
    rerender({ enabled: true, rowLengths: [0, 10] });
    expect(result.current.state).toEqual({ level: 'rows', row: 1, item: 0, idlePasses: 0 });
    rerender({ enabled: false, rowLengths: [0, 10] });
    expect(result.current.running).toBe(false);
    rerender({ enabled: true, rowLengths: [0, 10] });
    expect(result.current.running).toBe(false);
    // start() while scanning is not the selection mode in use does nothing.
    rerender({ enabled: false, rowLengths: [0, 10] });
    act(() => result.current.start());
    rerender({ enabled: true, rowLengths: [0, 10] });
    expect(result.current.running).toBe(false);
  });
});

describe('useScanner patterns', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  const setup = (
    pattern: ScanPattern,
    suggestionsAt: 'first' | 'last' = 'first',
    rowLengths = [3, 10, 9, 7, 4],
  ) => {
    const onSelect = vi.fn();
    const onSwitch = vi.fn();
    const hook = renderHook(
      (props: { pattern: ScanPattern; suggestionsAt: 'first' | 'last' }) =>
        useScanner({
          enabled: true,
          intervalMs: 200,
          acceptMs: 1500,
          pattern: props.pattern,
          suggestionsAt: props.suggestionsAt,
          rowLengths,
          onSelect,
          onSwitch,
        }),
      { initialProps: { pattern, suggestionsAt } },
    );
    act(() => hook.result.current.start());
    return { ...hook, onSelect, onSwitch };
  };

  it('group–row–key: groups at the interval; press, press, press through group, row and key', () => {
    // Rows [3, 10, 9, 7, 4]: groups {0}, {1, 2}, {3, 4}.
    const { result, onSelect } = setup('auto-group-row-key');
    expect(result.current.state).toEqual({ level: 'groups', group: 0, row: 0, item: 0, idlePasses: 0 });
    act(() => vi.advanceTimersByTime(200 * 2)); // group 2
    press(' ');
    expect(result.current.state).toEqual({ level: 'rows', group: 2, row: 3, item: 0, idlePasses: 0 });
    act(() => vi.advanceTimersByTime(200)); // row 4
    press(' ');
    act(() => vi.advanceTimersByTime(200 * 3)); // key 3
    press(' ');
    expect(onSelect).toHaveBeenCalledExactlyOnceWith(4, 3);
    expect(result.current.state).toMatchObject({ level: 'groups', group: 0 });
  });

  it('step, one switch: no timer moves the highlight; presses move, 1.5 s without one chooses', () => {
    const { result, onSelect, onSwitch } = setup('step-one-switch');
    expect(result.current.state).toMatchObject({ level: 'rows', row: 0, waiting: true });
    act(() => vi.advanceTimersByTime(10_000));
    expect(result.current.state).toMatchObject({ level: 'rows', row: 0, waiting: true });
    press(' '); // row 0
    press(' '); // row 1
    act(() => vi.advanceTimersByTime(1499));
    expect(result.current.state).toEqual({ level: 'rows', row: 1, item: 0, idlePasses: 0 });
    act(() => vi.advanceTimersByTime(1));
    expect(result.current.state).toEqual({ level: 'items', row: 1, item: 0, idlePasses: 0, waiting: true });
    press(' ');
    press(' ');
    press(' '); // key 2
    // Each press starts the acceptance time again.
    act(() => vi.advanceTimersByTime(1000));
    press(' '); // key 3
    act(() => vi.advanceTimersByTime(1000));
    expect(onSelect).not.toHaveBeenCalled();
    act(() => vi.advanceTimersByTime(500));
    expect(onSelect).toHaveBeenCalledExactlyOnceWith(1, 3);
    expect(onSwitch).toHaveBeenCalledTimes(6);
    expect(onSwitch.mock.calls.every((call) => call.length === 0)).toBe(true);
    // Back at the top with nothing highlighted: waiting chooses nothing more.
    act(() => vi.advanceTimersByTime(5000));
    expect(onSelect).toHaveBeenCalledTimes(1);
  });

  it('step, two switches: Space moves, Enter selects, each logged as move or select; no timer', () => {
    const { result, onSelect, onSwitch } = setup('step-two-switch', 'last');
    // Suggestions last: rows 1, 2, 3, 4, 0.
    expect(result.current.state).toEqual({ level: 'rows', row: 1, item: 0, idlePasses: 0 });
    act(() => vi.advanceTimersByTime(10_000));
    expect(result.current.state?.row).toBe(1);
    for (let k = 0; k < 4; k++) press(' '); // row 0, the suggestions
    expect(press('Enter').defaultPrevented).toBe(true);
    press(' ');
    press(' ');
    press('Enter');
    expect(onSelect).toHaveBeenCalledExactlyOnceWith(0, 2);
    expect(onSwitch.mock.calls.map((call) => call[0])).toEqual([
      'move',
      'move',
      'move',
      'move',
      'select',
      'move',
      'move',
      'select',
    ]);
    expect(result.current.state).toEqual({ level: 'rows', row: 1, item: 0, idlePasses: 0 });
  });

  it('a new pattern starts the scan again at the top', () => {
    const { result, rerender } = setup('auto-row-column');
    act(() => vi.advanceTimersByTime(400));
    expect(result.current.state?.row).toBe(2);
    rerender({ pattern: 'auto-group-row-key', suggestionsAt: 'last' });
    expect(result.current.state).toEqual({ level: 'groups', group: 0, row: 1, item: 0, idlePasses: 0 });
  });
});

describe('useScanner in a trial: pause, Escape and a long press', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  const setup = (pattern: ScanPattern) => {
    const onSelect = vi.fn();
    const onEscape = vi.fn();
    const onLongPress = vi.fn();
    const hook = renderHook(
      (props: { paused: boolean }) =>
        useScanner({
          enabled: true,
          intervalMs: 200,
          pattern,
          acceptMs: 1000,
          rowLengths: [2, 10, 9, 7],
          onSelect,
          onSwitch: () => undefined,
          paused: props.paused,
          onEscape,
          onLongPress,
        }),
      { initialProps: { paused: false } },
    );
    act(() => hook.result.current.start());
    return { ...hook, onSelect, onEscape, onLongPress };
  };
  const up = (key: string) =>
    act(() => {
      document.body.dispatchEvent(new KeyboardEvent('keyup', { key, bubbles: true, cancelable: true }));
    });

  it('paused: the highlight stays, the switch is left alone; it goes on from there', () => {
    const { result, rerender, onSelect } = setup('auto-row-column');
    act(() => vi.advanceTimersByTime(400));
    expect(result.current.state?.row).toBe(2);
    rerender({ paused: true });
    act(() => vi.advanceTimersByTime(2000));
    expect(result.current.state?.row).toBe(2);
    expect(press(' ').defaultPrevented).toBe(false);
    expect(onSelect).not.toHaveBeenCalled();
    rerender({ paused: false });
    expect(result.current.state?.row).toBe(2);
    act(() => vi.advanceTimersByTime(200));
    expect(result.current.state?.row).toBe(3);
  });

  it('Escape calls onEscape instead of stopping; a switch held 2 s is a long press, a shorter one is not', () => {
    const { result, onEscape, onLongPress } = setup('step-two-switch');
    press('Escape');
    expect(onEscape).toHaveBeenCalledOnce();
    expect(result.current.running).toBe(true);
    press(' ');
    act(() => vi.advanceTimersByTime(1999));
    up(' ');
    act(() => vi.advanceTimersByTime(5000));
    expect(onLongPress).not.toHaveBeenCalled();
    press(' ');
    act(() => vi.advanceTimersByTime(2000));
    expect(onLongPress).toHaveBeenCalledOnce();
  });

  it('step, one switch: nothing is chosen while the switch is held; the acceptance time counts from its release', () => {
    const { result } = setup('step-one-switch');
    press(' '); // row 0 highlighted, the switch still held
    expect(result.current.state).toMatchObject({ level: 'rows', row: 0 });
    act(() => vi.advanceTimersByTime(1500));
    expect(result.current.state).toMatchObject({ level: 'rows', row: 0 });
    up(' ');
    act(() => vi.advanceTimersByTime(999));
    expect(result.current.state).toMatchObject({ level: 'rows', row: 0 });
    act(() => vi.advanceTimersByTime(1));
    // Chosen: the row is entered.
    expect(result.current.state).toMatchObject({ level: 'items', row: 0 });
  });
});
