import { describe, expect, it } from 'vitest';
import { keyboardScanSteps, OFF_KEYBOARD_EXTRA_STEPS } from './key-scan-steps';

const cp = (c: string): number => c.codePointAt(0) as number;
const ALPHABET = 'abcdefghijklmnopqrstuvwxyz';

describe('scan steps of the keyboard’s keys', () => {
  it('counts row + column over the key rows, as worked out by hand', () => {
    // Typewriter: q (1,1) = 2, a (2,1) = 3, z (3,1) = 4, m (3,7) = 10, p (1,10) = 11.
    const typewriter = keyboardScanSteps('typewriter');
    expect([...'qazmp'].map((c) => typewriter.letterSteps[ALPHABET.indexOf(c)])).toEqual([2, 3, 4, 10, 11]);
    // Alphabetical: a (1,1) = 2, j (2,1) = 3, s (3,1) = 4, z (3,8) = 11.
    const alphabetical = keyboardScanSteps('alphabetical');
    expect([...'ajsz'].map((c) => alphabetical.letterSteps[ALPHABET.indexOf(c)])).toEqual([2, 3, 4, 11]);
    // Control row (key row 4): space (4,1) = 5, full stop (4,3) = 7, hyphen (4,7) = 11;
    // Enter in the function row (5,3) = 8.
    expect([' ', '.', '-', '\n'].map((c) => alphabetical.otherSteps(cp(c)))).toEqual([5, 7, 11, 8]);
  });

  it('charges a symbols-layer character the 123 key, its steps there and the ABC key back', () => {
    // 123 is key (5,2) = 7 on the letters layer; on the symbols layer the digits are row 1
    // ("1234567890", so 7 is (1,7) = 8), the marks row 2 ("!" is (2,1) = 3) and ABC is (4,2) = 6.
    const steps = keyboardScanSteps('typewriter');
    expect(steps.otherSteps(cp('7'))).toBe(7 + 8 + 6);
    expect(steps.otherSteps(cp('!'))).toBe(7 + 3 + 6);
  });

  it('charges a character with no key the costliest key plus the extra steps', () => {
    // The costliest keys of either layout cost 11 ((1,10) on typewriter, (2,9) alphabetical, (4,7)).
    for (const layout of ['typewriter', 'alphabetical', 'model-ordered'] as const) {
      const steps = keyboardScanSteps(layout);
      expect(steps.offKeyboardSteps).toBe(11 + OFF_KEYBOARD_EXTRA_STEPS);
      expect(steps.otherSteps(cp('#'))).toBe(18);
      expect(steps.otherSteps(cp('é'))).toBe(18);
    }
  });
});
