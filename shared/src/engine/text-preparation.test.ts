// Text preparation against String.prototype.normalize (the platform's
// Unicode implementation, a general-purpose reference).
import { describe, expect, it } from 'vitest';
import { codePointsOf, prepareText, stringFromCodePoints } from './text-preparation';

describe('prepareText', () => {
  it('normalises line endings, applies NFC and optional case folding', () => {
    const decomposed = 'Cafe\u0301\r\nline two\rthree\n';
    const out = prepareText(decomposed);
    expect(stringFromCodePoints(out)).toBe('Café\nline two\nthree\n'.normalize('NFC'));
    expect(out[3]).toBe(0xe9); // é composed (U+00E9), as NFC defines it
    expect(stringFromCodePoints(prepareText('Hello ÉCOLE', { caseFold: true }))).toBe('hello école');
  });

  it('keeps astral code points as single code points and round-trips raw text', () => {
    const s = 'a👋🏽b\u{10FFFF}';
    const cps = codePointsOf(s);
    expect(Array.from(cps)).toEqual([0x61, 0x1f44b, 0x1f3fd, 0x62, 0x10ffff]);
    expect(stringFromCodePoints(cps)).toBe(s);
    const long = 'x'.repeat(20000) + '👋';
    expect(stringFromCodePoints(codePointsOf(long))).toBe(long);
  });
});
