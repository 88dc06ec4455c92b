import { computeTrialMeasures, createTrialSchema, replayTrial } from '@keyloom/shared';
import { act, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { directTrialSettings } from '../testing/trial-data';
import { useTrialSession } from './use-trial-session';

const settings = directTrialSettings;

describe('useTrialSession', () => {
  beforeEach(() => vi.useFakeTimers({ now: new Date('2026-12-02T10:00:00Z') }));
  afterEach(() => vi.useRealTimers());

  it('edits the text without logging until a trial starts', () => {
    const { result } = renderHook(() => useTrialSession());
    act(() => result.current.select({ type: 'letter', value: 'x' }));
    expect(result.current.text).toBe('x');
    expect(result.current.events).toEqual([]);
    act(() => result.current.logSwitch());
    act(() => result.current.logOffer(['x-ray']));
    expect(result.current.events).toEqual([]);
    expect(() => result.current.finish({ phraseId: null, targetPhrase: null, settings, note: '' })).toThrow(
      /No trial/,
    );
  });

  it('logs a trial whose replay is the text and whose measures follow from the key presses', () => {
    const { result } = renderHook(() => useTrialSession());
    act(() => result.current.start());
    expect(result.current.text).toBe('');
    expect(result.current.startedAt).toBe('2026-12-02T10:00:00.000Z');
    const step = (ms: number, fn: () => void) => {
      act(() => vi.advanceTimersByTime(ms));
      act(fn);
    };
    step(0, () => result.current.logOffer(['i', 'the']));
    step(1000, () => result.current.select({ type: 'letter', value: 'h' }));
    step(0, () => result.current.logOffer(['how', 'he']));
    step(0, () => result.current.logOffer(['how', 'he'])); // unchanged row: not logged twice
    step(1000, () => result.current.select({ type: 'letter', value: 'e' }));
    step(0, () => result.current.logOffer(['hello', 'here']));
    step(1000, () => result.current.logSwitch());
    step(0, () => result.current.select({ type: 'suggestion', value: 'hello', slot: 0 }));
    step(1000, () => result.current.select({ type: 'letter', value: 'x' }));
    step(500, () => result.current.select({ type: 'backspace' }));
    expect(result.current.text).toBe('hello ');
    // Several steps in one tick all land (the refs are the truth).
    act(() => {
      result.current.select({ type: 'punctuation', value: '?' });
      result.current.select({ type: 'letter', value: 'o' });
    });
    // The question mark takes the place of the space the suggestion left (applyTrialEvent).
    expect(result.current.text).toBe('hello? o');

    let finished: ReturnType<typeof result.current.finish> | null = null;
    act(() => {
      finished = result.current.finish({
        phraseId: 'kl-01',
        targetPhrase: 'hello? o',
        settings,
        note: 'first go',
      });
    });
    if (finished === null) throw new Error('finish returned nothing');
    const input: ReturnType<typeof result.current.finish> = finished;
    expect(result.current.running).toBe(false);
    expect(createTrialSchema.safeParse(input).success).toBe(true);
    expect(input.localTrialId).toMatch(/^[0-9a-f-]{36}$/);
    expect(input.finishedAt).toBe('2026-12-02T10:00:04.500Z');
    expect(replayTrial(input.events)).toBe(input.text);
    expect(input.events.map((e) => e.t)).toEqual([
      0, 1000, 1000, 2000, 2000, 3000, 3000, 4000, 4500, 4500, 4500,
    ]);

    // Derived by counting: 8 characters "hello? o", 7 selections (h, e, hello, x, ⌫, ?, o),
    // KS = 1 − 7/8 = 0.125; wpm = ((8 − 1) / 3.5 s) × 60 / 5 = 24 (MacKenzie 2002's formula).
    const m = computeTrialMeasures(input.events, input.targetPhrase ?? null);
    expect(m).toMatchObject({
      characters: 8,
      keystrokes: 7,
      switchActivations: 1,
      suggestionsOffered: 3,
      suggestionsTaken: 1,
      errorsCorrected: 1,
      durationMs: 3500,
      keystrokeSavings: 0.125,
      errorRate: 0,
    });
    expect(m.wpm).toBeCloseTo(24, 6);
    // A second finish without a new start is refused.
    expect(() => result.current.finish({ phraseId: null, targetPhrase: null, settings, note: '' })).toThrow();
  });

  it('refuses to finish a trial without key presses, and clear drops the trial', () => {
    const { result } = renderHook(() => useTrialSession());
    act(() => result.current.start());
    act(() => result.current.logOffer(['i']));
    expect(() => result.current.finish({ phraseId: null, targetPhrase: null, settings, note: '' })).toThrow(
      /no key presses/,
    );
    act(() => result.current.select({ type: 'letter', value: 'i' }));
    act(() => result.current.clear());
    expect(result.current).toMatchObject({ text: '', running: false, events: [], startedAt: null });
    expect(() => result.current.select({ type: 'letter', value: 'ab' })).toThrow(/exactly one character/);
    expect(result.current.text).toBe('');
  });

  it('keeps logged offers within the schema (10 words of at most 64 characters)', () => {
    const { result } = renderHook(() => useTrialSession());
    act(() => result.current.start());
    const words = ['a'.repeat(65), ...Array.from({ length: 12 }, (_, i) => `w${i}`)];
    act(() => result.current.logOffer(words));
    act(() => result.current.select({ type: 'letter', value: 'a' }));
    const offer = result.current.events[0];
    expect(offer.words).toEqual(words.slice(1, 11));
    let input: ReturnType<typeof result.current.finish> | null = null;
    act(() => {
      input = result.current.finish({ phraseId: null, targetPhrase: null, settings, note: '' });
    });
    expect(createTrialSchema.safeParse(input).success).toBe(true);
  });
});
