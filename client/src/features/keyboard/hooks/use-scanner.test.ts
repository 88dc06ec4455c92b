import { act, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
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
