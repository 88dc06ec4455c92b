// Huffman code lengths (Huffman 1952) for binary selection ordered by the
// model: at each position the user answers yes/no questions that split the
// model's distribution, and the number of questions for a symbol is its
// codeword length. Expected length per symbol lies in [H, H + 1).

let weights = new Float64Array(0);
let order = new Int32Array(0);
let parentOf = new Int32Array(0);
let mergedW = new Float64Array(0);

/**
 * Writes the Huffman codeword length of each of `probs[0..n)` into `lengths`.
 * Zero-probability symbols still get a codeword (the tree stays complete).
 * Uses the two-queue method after one sort: O(n log n). Not re-entrant
 * (module scratch buffers).
 * @param n number of symbols (0..2^24); a single symbol gets length 0
 */
export function huffmanLengths(probs: ArrayLike<number>, n: number, lengths: Int32Array): void {
  if (n === 0) return;
  if (n === 1) {
    lengths[0] = 0;
    return;
  }
  if (weights.length < n) {
    weights = new Float64Array(n * 2);
    order = new Int32Array(n * 2);
    parentOf = new Int32Array(n * 4);
    mergedW = new Float64Array(n * 2);
  }
  for (let i = 0; i < n; i++) {
    weights[i] = probs[i];
    order[i] = i;
  }
  const sorted = Array.prototype.slice.call(order.subarray(0, n)) as number[];
  sorted.sort((a, b) => weights[a] - weights[b] || a - b);
  // Leaves are nodes 0..n-1, internal nodes n..2n-2 (created in ascending weight).
  let leaf = 0;
  let inner = 0;
  let innerCount = 0;
  const take = (): number => {
    if (leaf < n && (inner >= innerCount || weights[sorted[leaf]] <= mergedW[inner])) return sorted[leaf++];
    return n + inner++;
  };
  const weightOf = (node: number): number => (node < n ? weights[node] : mergedW[node - n]);
  for (let k = 0; k < n - 1; k++) {
    const a = take();
    const b = take();
    mergedW[innerCount] = weightOf(a) + weightOf(b);
    parentOf[a] = n + innerCount;
    parentOf[b] = n + innerCount;
    innerCount++;
  }
  // Depths: the root is the last internal node; parents always come later.
  const depth = new Int32Array(2 * n - 1);
  for (let node = 2 * n - 3; node >= 0; node--) depth[node] = depth[parentOf[node]] + 1;
  for (let i = 0; i < n; i++) lengths[i] = depth[i];
}

/** Shannon entropy in bits of `probs[0..n)` (terms with p = 0 are skipped). */
export function entropyBits(probs: ArrayLike<number>, n: number): number {
  let h = 0;
  for (let i = 0; i < n; i++) if (probs[i] > 0) h -= probs[i] * Math.log2(probs[i]);
  return h;
}
