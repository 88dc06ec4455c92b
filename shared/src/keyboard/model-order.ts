// The letter order of the layout "Ordered by the model": the 26 letters sit in the alphabetical
// layout's letter cells (rows of 9, 9 and 8), likeliest next letter in the cheapest cell.
//
// A cell's cost is its row–column scan steps, row + column, both 1-based and counted over the key
// rows only (docs/references.md §3; the suggestion row is left out). Cells are ranked by that cost;
// on a tie the upper row comes first (then the left cell, which on one row never ties). Letters are
// ranked by probability, highest first; letters with the same probability keep alphabetical order
// (a stable sort). Giving the likeliest letter the cheapest cell minimises the expected steps over
// these cells for the distribution (the rearrangement inequality, derived).
//
// One piece of code for the test keyboard (it re-orders after every change of the text) and the
// profile report (the engine re-orders at every position of the held-out text).

/** The letters a..z, in alphabetical order (index 0 is a). */
export const LETTERS = 'abcdefghijklmnopqrstuvwxyz';
/** Letter cells per row of the alphabetical and the model-ordered layouts. */
export const LETTER_ROW_LENGTHS: readonly number[] = [9, 9, 8];

/** A letter cell: row and column, both 1-based, and its scan steps (row + column). */
export type LetterCell = { row: number; column: number; steps: number };

/** The letter cells in the order they are filled: fewest scan steps first, then upper row first. */
export const LETTER_CELLS: readonly LetterCell[] = LETTER_ROW_LENGTHS.flatMap((length, r) =>
  Array.from({ length }, (_, c) => ({ row: r + 1, column: c + 1, steps: r + 1 + (c + 1) })),
).sort((a, b) => a.steps - b.steps || a.row - b.row || a.column - b.column);

const A = 0x61;
const CAPITAL_A = 0x41;

/** Index 0..25 of a letter a–z or A–Z (case-folded), or -1 for any other code point. */
export function letterIndex(codePoint: number): number {
  if (codePoint >= A && codePoint < A + 26) return codePoint - A;
  if (codePoint >= CAPITAL_A && codePoint < CAPITAL_A + 26) return codePoint - CAPITAL_A;
  return -1;
}

/**
 * The model's next-letter probabilities as 26 weights (a..z), case-folded: `A` and `a` add up.
 * Anything that is not a letter a–z is left out.
 */
export function letterWeights(letters: Iterable<{ char: string; p: number }>): Float64Array {
  const weights = new Float64Array(26);
  for (const { char, p } of letters) {
    if ([...char].length !== 1) continue;
    const index = letterIndex(char.codePointAt(0) as number);
    if (index >= 0 && Number.isFinite(p)) weights[index] += p;
  }
  return weights;
}

/**
 * The letters ranked for the cells: likeliest first, equal weights in alphabetical order. Returns
 * letter indexes (0 = a). A missing or non-finite weight counts as 0.
 */
export function rankLetters(weights: ArrayLike<number> | null): number[] {
  const clean = new Float64Array(26);
  for (let i = 0; i < 26; i++) {
    const w = weights?.[i];
    clean[i] = w !== undefined && Number.isFinite(w) ? w : 0;
  }
  // Insertion sort (26 items, called at every position by the engine): a letter moves before
  // another only when strictly likelier, so equal weights keep alphabetical order (stable).
  const order: number[] = [];
  for (let i = 0; i < 26; i++) {
    let j = order.length;
    while (j > 0 && clean[order[j - 1]] < clean[i]) j--;
    order.splice(j, 0, i);
  }
  return order;
}

/**
 * The scan steps of each letter (index 0 = a) in the model-ordered layout for these weights, written
 * into `out` (26 values). The engine's scan cost calls this at every position.
 */
export function modelOrderedLetterSteps(
  weights: ArrayLike<number> | null,
  out: Float64Array = new Float64Array(26),
): Float64Array {
  rankLetters(weights).forEach((letter, rank) => (out[letter] = LETTER_CELLS[rank].steps));
  return out;
}

/** The letter rows of the model-ordered layout for these weights (rows of 9, 9 and 8 letters). */
export function modelOrderedLetterRows(weights: ArrayLike<number> | null): string[] {
  const rows = LETTER_ROW_LENGTHS.map((length) => new Array<string>(length).fill(''));
  rankLetters(weights).forEach((letter, rank) => {
    const cell = LETTER_CELLS[rank];
    rows[cell.row - 1][cell.column - 1] = LETTERS[letter];
  });
  return rows.map((row) => row.join(''));
}
