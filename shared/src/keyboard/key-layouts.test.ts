import { describe, expect, it } from 'vitest';
import { initialKeyState, keyRows, keysById, nextShift } from './key-layouts';

describe('key layouts', () => {
  it('typewriter order is the standard three letter rows, then the control row', () => {
    const rows = keyRows('typewriter');
    expect(rows.slice(0, 3).map((r) => r.map((k) => k.value).join(''))).toEqual([
      'qwertyuiop',
      'asdfghjkl',
      'zxcvbnm',
    ]);
    expect(rows[3].map((k) => k.kind)).toEqual(['space', 'backspace', ...Array(5).fill('punctuation')]);
    expect(rows[3].filter((k) => k.kind === 'punctuation').map((k) => k.value)).toEqual([
      '.',
      ',',
      '?',
      "'",
      '-',
    ]);
  });

  it('both layouts hold the 26 letters once, unique ids and spoken names', () => {
    for (const layout of ['typewriter', 'alphabetical', 'model-ordered'] as const) {
      const keys = keyRows(layout).flat();
      const letters = keys.filter((k) => k.kind === 'letter').map((k) => k.value);
      expect([...letters].sort().join('')).toBe('abcdefghijklmnopqrstuvwxyz');
      expect(keysById(layout).size).toBe(keys.length);
      for (const k of keys) expect(k.spokenLabel.length).toBeGreaterThan(0);
    }
    expect(
      keyRows('alphabetical')[0]
        .map((k) => k.value)
        .join(''),
    ).toBe('abcdefghi');
    expect(keysById('alphabetical').get('backspace')?.spokenLabel).toBe('delete last letter');
  });

  it('every key value can be typed as the trial step of its kind', () => {
    // The built-in practice phrases use only a-z, space and . , ? ' - (shared/src/trials).
    const values = new Set(
      keyRows('typewriter')
        .flat()
        .map((k) => k.value),
    );
    for (const c of "abcxyz.,?'-") expect(values.has(c)).toBe(true);
  });

  it('the symbols layer holds the digits 0–9 and . , ? ! \' " - ( ) : ; / @ &, with unique ids', () => {
    const state = { ...initialKeyState, layer: 'symbols' as const };
    const keys = keyRows('typewriter', state).flat();
    const values = new Set(keys.map((k) => k.value));
    for (const c of '0123456789.,?!\'"-():;/@&') expect(values.has(c)).toBe(true);
    expect(keys.some((k) => k.value === 'q')).toBe(false);
    expect(keysById('typewriter', state).size).toBe(keys.length);
    expect(keys.find((k) => k.kind === 'layer')?.label).toBe('ABC');
  });

  it('shift goes once → caps lock → off; capitals show on the letter keys', () => {
    expect([nextShift('off'), nextShift('once'), nextShift('lock')]).toEqual(['once', 'lock', 'off']);
    const capitals = keyRows('alphabetical', { ...initialKeyState, capital: true, shift: 'once' });
    expect(capitals[0][0]).toMatchObject({ value: 'a', label: 'A', spokenLabel: 'A' });
    expect(capitals.at(-1)?.find((k) => k.kind === 'shift')).toMatchObject({ pressed: true });
  });
});
