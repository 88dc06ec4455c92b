import { describe, expect, it } from 'vitest';
import { keyRows, initialKeyState } from './key-layouts';
import {
  LETTER_CELLS,
  letterWeights,
  modelOrderedLetterRows,
  modelOrderedLetterSteps,
  rankLetters,
} from './model-order';

const ALPHABET = 'abcdefghijklmnopqrstuvwxyz';

describe('the layout ordered by the model', () => {
  it('fills the cells by fewest row + column steps, upper row first on a tie', () => {
    // Worked by hand for rows of 9, 9 and 8 cells (row, column 1-based; steps = row + column):
    // 2: (1,1); 3: (1,2) (2,1); 4: (1,3) (2,2) (3,1); 5: (1,4) (2,3) (3,2); … 10: (1,9) (2,8) (3,7);
    // 11: (2,9) (3,8).
    expect(LETTER_CELLS.slice(0, 6).map((c) => [c.row, c.column])).toEqual([
      [1, 1],
      [1, 2],
      [2, 1],
      [1, 3],
      [2, 2],
      [3, 1],
    ]);
    expect(LETTER_CELLS.slice(-2).map((c) => [c.row, c.column, c.steps])).toEqual([
      [2, 9, 11],
      [3, 8, 11],
    ]);
    expect(LETTER_CELLS).toHaveLength(26);
  });

  it('places a five-letter distribution as worked out by hand, ties in alphabetical order', () => {
    // e 0.4, t 0.3, then a, o, n 0.1 each (a tie: alphabetical a, n, o), then the 21 letters the
    // model gives nothing, alphabetical: b c d f g h i j k l m p q r s u v w x y z.
    // By the cell order above: e (1,1), t (1,2), a (2,1), n (1,3), o (2,2), b (3,1), c (1,4),
    // d (2,3), f (3,2), g (1,5), h (2,4), i (3,3), j (1,6), k (2,5), l (3,4), m (1,7), p (2,6),
    // q (3,5), r (1,8), s (2,7), u (3,6), v (1,9), w (2,8), x (3,7), y (2,9), z (3,8).
    const weights = letterWeights([
      { char: 'o', p: 0.1 },
      { char: 'e', p: 0.4 },
      { char: 'n', p: 0.1 },
      { char: 't', p: 0.3 },
      { char: 'a', p: 0.1 },
    ]);
    expect(modelOrderedLetterRows(weights)).toEqual(['etncgjmrv', 'aodhkpswy', 'bfilquxz']);
    const steps = modelOrderedLetterSteps(weights);
    expect([...'etanoz'].map((c) => steps[ALPHABET.indexOf(c)])).toEqual([2, 3, 3, 4, 4, 11]);
  });

  it('adds capitals to their small letters and leaves out everything else', () => {
    const weights = letterWeights([
      { char: 'Z', p: 0.2 },
      { char: 'z', p: 0.2 },
      { char: 'y', p: 0.3 },
      { char: 'é', p: 0.5 },
      { char: '.', p: 0.5 },
    ]);
    expect(weights[25]).toBeCloseTo(0.4, 12);
    expect([...weights].reduce((a, b) => a + b, 0)).toBeCloseTo(0.7, 12);
    // z (0.4) beats y (0.3): z in the first cell, y in the second.
    expect(modelOrderedLetterRows(weights)[0].slice(0, 2)).toBe('zy');
  });

  it('with no answer, or every letter equally likely, ranks the letters alphabetically', () => {
    const alphabetical = keyRows('alphabetical')
      .slice(0, 3)
      .map((row) => row.map((k) => k.value).join(''));
    // Not the same strings as the alphabetical rows: the cells fill by steps, not in reading order.
    const byCells = modelOrderedLetterRows(null);
    expect(modelOrderedLetterRows(new Float64Array(26).fill(1 / 26))).toEqual(byCells);
    expect(byCells[0][0]).toBe('a');
    expect(byCells.map((row) => row.length)).toEqual(alphabetical.map((row) => row.length));
    expect(rankLetters(null)).toEqual(Array.from({ length: 26 }, (_, i) => i));
  });

  it('keeps the key ids and every letter exactly once; the other keys do not move', () => {
    const weights = letterWeights([
      { char: 'q', p: 0.9 },
      { char: 'x', p: 0.05 },
    ]);
    const rows = keyRows('model-ordered', initialKeyState, weights);
    const letters = rows.slice(0, 3).flat();
    expect(
      letters
        .map((k) => k.value)
        .sort()
        .join(''),
    ).toBe(ALPHABET);
    for (const key of letters) expect(key.id).toBe(`letter-${key.value}`);
    expect(rows[0][0].id).toBe('letter-q');
    expect(rows[0][1].id).toBe('letter-x');
    const others = (layout: 'alphabetical' | 'model-ordered') =>
      keyRows(layout, initialKeyState, weights)
        .slice(3)
        .map((row) => row.map((k) => k.id));
    expect(others('model-ordered')).toEqual(others('alphabetical'));
  });
});
