import { act, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { ScanPattern } from '../logic/scanner';
import { useChoiceScan } from './use-choice-scan';

const press = (key: string) => {
  const event = new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true });
  act(() => {
    document.body.dispatchEvent(event);
  });
  return event;
};

describe('useChoiceScan (the pause dialog)', () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  const setup = (pattern: ScanPattern, available = [true, true, true], enabled = true) => {
    const onChoose = vi.fn();
    const hook = renderHook(() =>
      useChoiceScan({ enabled, pattern, intervalMs: 300, acceptMs: 1000, available, onChoose }),
    );
    return { ...hook, onChoose };
  };

  it('automatic: starts on the first choice, moves at the interval skipping a disabled one; the switch takes it', () => {
    const { result, onChoose } = setup('auto-row-column', [true, false, true]);
    expect(result.current).toBe(0);
    act(() => vi.advanceTimersByTime(300));
    expect(result.current).toBe(2);
    act(() => vi.advanceTimersByTime(300));
    expect(result.current).toBe(0);
    act(() => vi.advanceTimersByTime(300));
    expect(press(' ').defaultPrevented).toBe(true);
    expect(onChoose).toHaveBeenCalledExactlyOnceWith(2);
  });

  it('step, one switch: nothing at first; each press moves, the acceptance time takes', () => {
    const { result, onChoose } = setup('step-one-switch');
    expect(result.current).toBeNull();
    act(() => vi.advanceTimersByTime(5000));
    expect(onChoose).not.toHaveBeenCalled();
    press(' '); // Resume
    press(' '); // Finish
    act(() => vi.advanceTimersByTime(999));
    expect(result.current).toBe(1);
    expect(onChoose).not.toHaveBeenCalled();
    act(() => vi.advanceTimersByTime(1));
    expect(onChoose).toHaveBeenCalledExactlyOnceWith(1);
  });

  it('step, two switches: Space moves, Enter takes; key repeat and keys in a text field are left alone', () => {
    const { result, onChoose } = setup('step-two-switch');
    expect(result.current).toBe(0);
    press(' ');
    expect(result.current).toBe(1);
    const repeat = new KeyboardEvent('keydown', { key: ' ', repeat: true, bubbles: true, cancelable: true });
    act(() => void document.body.dispatchEvent(repeat));
    expect(result.current).toBe(1);
    const input = document.createElement('input');
    document.body.append(input);
    const typed = new KeyboardEvent('keydown', { key: ' ', bubbles: true, cancelable: true });
    act(() => void input.dispatchEvent(typed));
    expect(typed.defaultPrevented).toBe(false);
    expect(result.current).toBe(1);
    input.remove();
    press('Enter');
    expect(onChoose).toHaveBeenCalledExactlyOnceWith(1);
  });

  it('off: nothing highlighted and the switch keys are left alone', () => {
    const { result, onChoose } = setup('step-two-switch', [true, true, true], false);
    expect(result.current).toBeNull();
    expect(press('Enter').defaultPrevented).toBe(false);
    expect(onChoose).not.toHaveBeenCalled();
  });
});
