import { cn } from '@/lib/cn';

/** How a target of the keyboard is drawn: its modes and what is happening to it right now. */
export type TargetLook = {
  highContrast: boolean;
  largeTargets: boolean;
  /** Highlighted by the scanner (its row or itself). */
  scanned?: boolean;
  /** One of the three likeliest next letters (tint mode): a thick border as a cue beside colour. */
  strongCue?: boolean;
};

/** Class names of a key or suggestion button. */
export const targetClasses = ({ highContrast, largeTargets, scanned, strongCue }: TargetLook): string =>
  cn(
    'relative flex w-full min-w-0 items-center justify-center overflow-hidden rounded-lg px-1 font-bold [overflow-wrap:anywhere] select-none',
    largeTargets ? 'min-h-20' : 'min-h-12',
    strongCue ? 'border-4' : 'border-2',
    highContrast
      ? cn(strongCue || scanned ? 'border-white' : 'border-[#ffff00]')
      : cn(strongCue ? 'border-ink-deep' : 'border-ink', 'hover:brightness-95'),
    scanned &&
      (highContrast
        ? 'outline-6 outline-black -outline-offset-8'
        : 'outline-6 outline-rust -outline-offset-8'),
  );

/**
 * The background of a key: plain, or saffron whose strength follows the letter's probability. High
 * contrast keeps to black, white and yellow: the likeliest letters turn yellow, the rest stay black.
 * @param probability the letter's probability of coming next (0–1), or null when not tinted
 * @param top whether it is one of the three likeliest
 */
export const tintStyle = (
  probability: number | null,
  top: boolean,
  highContrast: boolean,
  scanned: boolean,
): { backgroundColor: string; color: string } => {
  if (highContrast) {
    return scanned || (probability !== null && top)
      ? { backgroundColor: '#ffff00', color: '#000000' }
      : { backgroundColor: '#000000', color: '#ffffff' };
  }
  if (scanned) return { backgroundColor: '#fef3d8', color: '#1d2b4f' };
  if (probability === null) return { backgroundColor: '#ffffff', color: '#1d2b4f' };
  // Square root so middling probabilities stay visible; ink on full saffron is still 7.5:1.
  const strength = Math.min(1, Math.sqrt(Math.max(0, probability)));
  return { backgroundColor: `rgba(245, 179, 53, ${strength.toFixed(3)})`, color: '#1d2b4f' };
};
