import { describe, expect, it } from 'vitest';
import { atSentenceStart, hasCase } from './layouts';

describe('typing behaviour beside the keys', () => {
  it('capitals at the start, after a line break and after a sentence', () => {
    expect(['', 'hi. ', 'hi?  ', 'hi\n', 'hi! '].map(atSentenceStart)).toEqual([
      true,
      true,
      true,
      true,
      true,
    ]);
    expect(['hi', 'hi.', 'e.g ', 'hi, '].map(atSentenceStart)).toEqual([false, false, false, false]);
  });

  it('only letters of an alphabet have a case', () => {
    expect(['a', 'Q', 'é'].map(hasCase)).toEqual([true, true, true]);
    expect(['1', '.', ' ', '-'].map(hasCase)).toEqual([false, false, false, false]);
  });
});
