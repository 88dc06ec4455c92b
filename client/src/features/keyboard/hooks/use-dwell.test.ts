import { act, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { useDwell } from './use-dwell';

describe('useDwell', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  const setup = (enabled = true) => {
    const onActivate = vi.fn();
    const hook = renderHook(
      (props: { enabled: boolean }) => useDwell({ enabled: props.enabled, dwellMs: 800, onActivate }),
      {
        initialProps: { enabled },
      },
    );
    return { ...hook, onActivate };
  };

  it('fills while the pointer rests and activates once at the dwell time', () => {
    const { result, onActivate } = setup();
    act(() => result.current.targetProps('letter-a').onPointerEnter());
    expect(result.current.activeId).toBe('letter-a');
    act(() => vi.advanceTimersByTime(400));
    expect(result.current.progress).toBeGreaterThan(0.4);
    expect(result.current.progress).toBeLessThan(0.6);
    expect(onActivate).not.toHaveBeenCalled();
    act(() => vi.advanceTimersByTime(400));
    expect(onActivate).toHaveBeenCalledExactlyOnceWith('letter-a');
    expect(result.current.activeId).toBeNull();
    expect(result.current.progress).toBe(0);
    // Resting on: no second activation until the pointer leaves and comes back.
    act(() => vi.advanceTimersByTime(5000));
    act(() => result.current.targetProps('letter-a').onPointerEnter());
    act(() => vi.advanceTimersByTime(5000));
    expect(onActivate).toHaveBeenCalledTimes(1);
    act(() => result.current.targetProps('letter-a').onPointerLeave());
    act(() => result.current.targetProps('letter-a').onPointerEnter());
    act(() => vi.advanceTimersByTime(800));
    expect(onActivate).toHaveBeenCalledTimes(2);
  });

  it('leaving cancels; moving to another target starts afresh', () => {
    const { result, onActivate } = setup();
    act(() => result.current.targetProps('letter-a').onPointerEnter());
    act(() => vi.advanceTimersByTime(700));
    act(() => result.current.targetProps('letter-a').onPointerLeave());
    expect(result.current.activeId).toBeNull();
    act(() => result.current.targetProps('letter-b').onPointerEnter());
    act(() => vi.advanceTimersByTime(700));
    expect(onActivate).not.toHaveBeenCalled();
    act(() => vi.advanceTimersByTime(100));
    expect(onActivate).toHaveBeenCalledExactlyOnceWith('letter-b');
  });

  it('does nothing while disabled and drops a dwell when turned off', () => {
    const { result, onActivate, rerender } = setup();
    act(() => result.current.targetProps('space').onPointerEnter());
    rerender({ enabled: false });
    expect(result.current.activeId).toBeNull();
    act(() => vi.advanceTimersByTime(2000));
    act(() => result.current.targetProps('space').onPointerEnter());
    act(() => vi.advanceTimersByTime(2000));
    expect(onActivate).not.toHaveBeenCalled();
  });
});
