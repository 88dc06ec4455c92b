import { act, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { CHOSEN_FLASH_MS, useDwell } from './use-dwell';

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

  const withRefractory = (refractoryMs: number) => {
    const onActivate = vi.fn();
    const hook = renderHook(() => useDwell({ enabled: true, dwellMs: 800, refractoryMs, onActivate }));
    return { ...hook, onActivate };
  };

  it('no dwell starts during the refractory time after a selection', () => {
    const { result, onActivate } = withRefractory(300);
    act(() => result.current.targetProps('letter-a').onPointerEnter());
    act(() => vi.advanceTimersByTime(800));
    expect(onActivate).toHaveBeenCalledExactlyOnceWith('letter-a');
    // The gaze moves on at once: nothing fills during the refractory time.
    act(() => result.current.targetProps('letter-a').onPointerLeave());
    act(() => result.current.targetProps('letter-b').onPointerEnter());
    expect(result.current.activeId).toBeNull();
    act(() => vi.advanceTimersByTime(250));
    expect(result.current.activeId).toBeNull();
    act(() => result.current.targetProps('letter-b').onPointerLeave());
    act(() => result.current.targetProps('letter-c').onPointerEnter());
    expect(result.current.activeId).toBeNull();
    // Left before the refractory time ended: nothing starts afterwards.
    act(() => result.current.targetProps('letter-c').onPointerLeave());
    act(() => vi.advanceTimersByTime(5000));
    expect(onActivate).toHaveBeenCalledTimes(1);
    // After it, a dwell starts as usual.
    act(() => result.current.targetProps('letter-d').onPointerEnter());
    expect(result.current.activeId).toBe('letter-d');
  });

  it('a pointer resting through the refractory time starts a fresh dwell when it ends', () => {
    const { result, onActivate } = withRefractory(300);
    act(() => result.current.targetProps('letter-a').onPointerEnter());
    act(() => vi.advanceTimersByTime(800));
    act(() => result.current.targetProps('letter-a').onPointerLeave());
    act(() => vi.advanceTimersByTime(100));
    act(() => result.current.targetProps('letter-b').onPointerEnter());
    act(() => vi.advanceTimersByTime(199));
    expect(result.current.activeId).toBeNull();
    act(() => vi.advanceTimersByTime(1));
    // 300 ms after the selection: a dwell on b from zero, not one counted from its entry at 100 ms.
    expect(result.current.activeId).toBe('letter-b');
    expect(result.current.progress).toBe(0);
    act(() => vi.advanceTimersByTime(799));
    expect(onActivate).toHaveBeenCalledTimes(1);
    act(() => vi.advanceTimersByTime(1));
    expect(onActivate).toHaveBeenLastCalledWith('letter-b');
    expect(onActivate).toHaveBeenCalledTimes(2);
  });

  it('without a refractory time the next target starts at once', () => {
    const { result } = withRefractory(0);
    act(() => result.current.targetProps('letter-a').onPointerEnter());
    act(() => vi.advanceTimersByTime(800));
    act(() => result.current.targetProps('letter-b').onPointerEnter());
    expect(result.current.activeId).toBe('letter-b');
  });

  it('the chosen target is flagged for the flash time, then cleared', () => {
    const { result } = withRefractory(300);
    expect(result.current.chosenId).toBeNull();
    act(() => result.current.targetProps('space').onPointerEnter());
    act(() => vi.advanceTimersByTime(799));
    expect(result.current.chosenId).toBeNull();
    act(() => vi.advanceTimersByTime(1));
    expect(result.current.chosenId).toBe('space');
    act(() => vi.advanceTimersByTime(CHOSEN_FLASH_MS - 1));
    expect(result.current.chosenId).toBe('space');
    act(() => vi.advanceTimersByTime(1));
    expect(result.current.chosenId).toBeNull();
  });
});

describe('useDwell sound', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => {
    vi.useRealTimers();
    vi.restoreAllMocks();
  });

  it('plays the selection tone on each activation only when the sound is on', async () => {
    const tone = await import('../logic/selection-tone');
    const play = vi.spyOn(tone, 'playSelectionTone').mockImplementation(() => undefined);
    const onActivate = vi.fn();
    const hook = renderHook(
      (props: { sound: boolean }) =>
        useDwell({ enabled: true, dwellMs: 500, sound: props.sound, onActivate }),
      {
        initialProps: { sound: false },
      },
    );
    act(() => hook.result.current.targetProps('letter-a').onPointerEnter());
    act(() => vi.advanceTimersByTime(500));
    expect(onActivate).toHaveBeenCalledTimes(1);
    expect(play).not.toHaveBeenCalled();
    hook.rerender({ sound: true });
    act(() => hook.result.current.targetProps('letter-b').onPointerEnter());
    act(() => vi.advanceTimersByTime(500));
    expect(onActivate).toHaveBeenCalledTimes(2);
    expect(play).toHaveBeenCalledTimes(1);
  });
});
