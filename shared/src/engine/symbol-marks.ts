// Shared scratch marks over the whole code-point range, so that exclusion and
// merging never allocate. A symbol is "marked" when mark[s] equals the
// current token; taking a new token clears every mark at once.
// Not re-entrant: one walk at a time (JavaScript runs them one after another).
import { CODE_POINT_LIMIT } from './ppm-settings';

let marks: Int32Array | undefined;
let slots: Int32Array | undefined;
let token = 0;

/** The mark array (lazily allocated, 4.4 MB). */
export function markArray(): Int32Array {
  if (!marks) marks = new Int32Array(CODE_POINT_LIMIT);
  return marks;
}

/** A per-symbol integer slot (e.g. a position in a list), valid for marked symbols. */
export function slotArray(): Int32Array {
  if (!slots) slots = new Int32Array(CODE_POINT_LIMIT);
  return slots;
}

/** A fresh token: no symbol carries it yet. */
export function nextToken(): number {
  token++;
  if (token === 0x7fffffff) {
    markArray().fill(0);
    token = 1;
  }
  return token;
}
