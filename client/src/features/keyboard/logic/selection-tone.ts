// The optional sound on a dwell selection: a short tone made in the browser with the Web Audio API
// (no audio file, nothing fetched). W3C Web Audio API (2021): an OscillatorNode through a GainNode
// whose level ramps down, so the tone ends without a click.

/** The tone: pitch (Hz), length (s) and peak level (0–1). Common practice, no source. */
export const SELECTION_TONE = { frequency: 880, seconds: 0.08, level: 0.2 } as const;

type AudioContextClass = typeof AudioContext;
let context: AudioContext | null = null;

/**
 * Plays the selection tone. The audio context is made on first use (after the person's first
 * gesture, as browsers ask) and reused. Does nothing where the browser has no Web Audio.
 */
export function playSelectionTone(): void {
  const Ctor: AudioContextClass | undefined =
    typeof window === 'undefined'
      ? undefined
      : (window.AudioContext ??
        (window as unknown as { webkitAudioContext?: AudioContextClass }).webkitAudioContext);
  if (!Ctor) return;
  try {
    context ??= new Ctor();
    if (context.state === 'suspended') void context.resume();
    const now = context.currentTime;
    const oscillator = context.createOscillator();
    const gain = context.createGain();
    oscillator.type = 'sine';
    oscillator.frequency.setValueAtTime(SELECTION_TONE.frequency, now);
    gain.gain.setValueAtTime(SELECTION_TONE.level, now);
    gain.gain.exponentialRampToValueAtTime(0.0001, now + SELECTION_TONE.seconds);
    oscillator.connect(gain);
    gain.connect(context.destination);
    oscillator.start(now);
    oscillator.stop(now + SELECTION_TONE.seconds);
  } catch {
    // A browser that refuses audio (no device, a policy): the selection itself is unaffected.
  }
}

/** Forgets the audio context (tests). */
export function resetSelectionTone(): void {
  context = null;
}
