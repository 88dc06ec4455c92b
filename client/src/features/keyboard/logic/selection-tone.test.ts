import { afterEach, describe, expect, it, vi } from 'vitest';
import { playSelectionTone, resetSelectionTone, SELECTION_TONE } from './selection-tone';

/** A stand-in for the browser's AudioContext that records the nodes made and their calls. */
const fakeAudio = () => {
  const calls: string[] = [];
  const param = (name: string) => ({
    setValueAtTime: (v: number, t: number) => calls.push(`${name}=${v}@${t}`),
    exponentialRampToValueAtTime: (v: number, t: number) => calls.push(`${name}->${v}@${t}`),
  });
  const made = vi.fn();
  class FakeContext {
    state = 'running';
    currentTime = 2;
    destination = { name: 'out' };
    constructor() {
      made();
    }
    resume = () => Promise.resolve();
    createOscillator() {
      return {
        type: '',
        frequency: param('frequency'),
        connect: () => calls.push('oscillator→gain'),
        start: (t: number) => calls.push(`start@${t}`),
        stop: (t: number) => calls.push(`stop@${t}`),
      };
    }
    createGain() {
      return { gain: param('gain'), connect: () => calls.push('gain→out') };
    }
  }
  return { FakeContext, calls, made };
};

describe('playSelectionTone', () => {
  afterEach(() => {
    resetSelectionTone();
    vi.unstubAllGlobals();
  });

  it('plays a short tone with an oscillator and a falling gain, reusing one audio context', () => {
    const { FakeContext, calls, made } = fakeAudio();
    vi.stubGlobal('AudioContext', FakeContext);
    playSelectionTone();
    expect(calls).toEqual([
      `frequency=${SELECTION_TONE.frequency}@2`,
      `gain=${SELECTION_TONE.level}@2`,
      `gain->0.0001@${2 + SELECTION_TONE.seconds}`,
      'oscillator→gain',
      'gain→out',
      'start@2',
      `stop@${2 + SELECTION_TONE.seconds}`,
    ]);
    playSelectionTone();
    expect(made).toHaveBeenCalledTimes(1);
    expect(calls.filter((c) => c.startsWith('start'))).toHaveLength(2);
  });

  it('does nothing without Web Audio', () => {
    vi.stubGlobal('AudioContext', undefined);
    expect(() => playSelectionTone()).not.toThrow();
  });
});
