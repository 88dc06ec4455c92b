// Best-first search over a character model's continuations of the word being
// typed. Nodes are partial completions; a node's priority is the probability
// of its characters given the context. Expanding a node asks the model for
// its next-symbol distribution once and yields
//   - its children, one per word character (and per joiner after a word
//     character), and
//   - one "finished" entry whose probability is the node's probability times
//     the mass of all boundary symbols (the word ends here).
// Because probabilities only shrink along a path, finished entries leave the
// queue in exact descending order: the first N popped are the N most
// probable words, as long as the node budget was not exhausted.
//
// Children enter the queue lazily: an expanded node keeps its admissible
// children in a pool and only its best not-yet-queued child sits in the
// queue; when that child is popped, the next best sibling is queued. The
// pop order is the same as queueing all children at once (the queue always
// holds the best remaining child of each parent), at a fraction of the
// queue operations.
//
// Scratch buffers are module-level and reused: the search is not re-entrant
// (JavaScript is single-threaded, and the model is never asked to search).
import { Distribution, type NextSymbolModel } from '../model-types';
import { CharClass, charClass as classOfImported } from './word-chars';

// Local copies: under CommonJS interop every access to an imported binding
// goes through a getter, which showed up as 15% of the simulator's time.
const classOf = classOfImported;
const WORD: number = CharClass.Word;
const JOINER: number = CharClass.Joiner;
const BOUNDARY: number = CharClass.Boundary;

/** Limits of one search. */
export type SearchLimits = {
  /** Most distribution() calls per search (1..1e6). */
  nodeBudget: number;
  /** Longest completion in code points, not counting the typed prefix (1..64). */
  maxCompletionLength: number;
};

export const defaultSearchLimits: SearchLimits = { nodeBudget: 300, maxCompletionLength: 24 };

/** A found word: completion code points (after the typed prefix) and its probability. */
export type Completion = { symbols: number[]; p: number };

// Node store: parallel typed arrays, grown on demand.
let capacity = 0;
let parent = new Int32Array(0);
let symbol = new Int32Array(0);
let depth = new Uint8Array(0);
let prob = new Float64Array(0);
let finished = new Uint8Array(0);
/** For a queued child: start of its parent's child list in the pool, and how many are still unqueued after it. */
let listStart = new Int32Array(0);
let listTaken = new Int32Array(0);
let listEnd = new Int32Array(0);
let heap = new Int32Array(0);
// Child pool: admissible children of expanded nodes (symbol, conditional probability).
let poolSymbols = new Int32Array(4096);
let poolProbs = new Float64Array(4096);
let poolTop = 0;
let nodeCount = 0;
let heapSize = 0;
const dist = new Distribution(512);
let context = new Int32Array(128);

function ensureCapacity(n: number): void {
  if (n <= capacity) return;
  const size = Math.max(n, capacity * 2, 1024);
  const grow = <T extends Int32Array | Uint8Array | Float64Array>(a: T, make: (k: number) => T): T => {
    const b = make(size);
    b.set(a);
    return b;
  };
  parent = grow(parent, (k) => new Int32Array(k));
  symbol = grow(symbol, (k) => new Int32Array(k));
  depth = grow(depth, (k) => new Uint8Array(k));
  prob = grow(prob, (k) => new Float64Array(k));
  finished = grow(finished, (k) => new Uint8Array(k));
  listStart = grow(listStart, (k) => new Int32Array(k));
  listTaken = grow(listTaken, (k) => new Int32Array(k));
  listEnd = grow(listEnd, (k) => new Int32Array(k));
  heap = grow(heap, (k) => new Int32Array(k));
  capacity = size;
}

function addNode(from: number, sym: number, p: number, isFinished: boolean): number {
  ensureCapacity(nodeCount + 1);
  const id = nodeCount++;
  listStart[id] = -1;
  parent[id] = from;
  symbol[id] = sym;
  depth[id] = from < 0 ? 0 : depth[from] + (isFinished ? 0 : 1);
  prob[id] = p;
  finished[id] = isFinished ? 1 : 0;
  // Sift up (max-heap on probability; ties broken by creation order, so runs are deterministic).
  let i = heapSize++;
  while (i > 0) {
    const up = (i - 1) >> 1;
    const u = heap[up];
    if (prob[u] > p || (prob[u] === p && u < id)) break;
    heap[i] = u;
    i = up;
  }
  heap[i] = id;
  return id;
}

function ensurePool(n: number): void {
  if (n <= poolSymbols.length) return;
  const size = Math.max(n, poolSymbols.length * 2);
  const syms = new Int32Array(size);
  syms.set(poolSymbols);
  poolSymbols = syms;
  const probs = new Float64Array(size);
  probs.set(poolProbs);
  poolProbs = probs;
}

/**
 * Queues the best child not yet queued from pool[start + taken .. end) of
 * `from` (selection by a linear scan, swapping it to the front of the rest),
 * if its probability reaches `bound`.
 */
function queueNextChild(from: number, start: number, taken: number, end: number, bound: number): void {
  const first = start + taken;
  if (first >= end) return;
  let best = first;
  for (let k = first + 1; k < end; k++) if (poolProbs[k] > poolProbs[best]) best = k;
  const p = prob[from] * poolProbs[best];
  if (!(p >= bound) || p <= 0) return;
  if (best !== first) {
    const s = poolSymbols[best];
    poolSymbols[best] = poolSymbols[first];
    poolSymbols[first] = s;
    const q = poolProbs[best];
    poolProbs[best] = poolProbs[first];
    poolProbs[first] = q;
  }
  const id = addNode(from, poolSymbols[first], p, false);
  listStart[id] = start;
  listTaken[id] = taken + 1;
  listEnd[id] = end;
}

function popNode(): number {
  const top = heap[0];
  const last = heap[--heapSize];
  let i = 0;
  for (;;) {
    const l = 2 * i + 1;
    if (l >= heapSize) break;
    const r = l + 1;
    let c = l;
    if (
      r < heapSize &&
      (prob[heap[r]] > prob[heap[l]] || (prob[heap[r]] === prob[heap[l]] && heap[r] < heap[l]))
    )
      c = r;
    const h = heap[c];
    if (prob[last] > prob[h] || (prob[last] === prob[h] && last < h)) break;
    heap[i] = h;
    i = c;
  }
  heap[i] = last;
  return top;
}

/** Code points of a node's path (its completion), oldest first. */
function pathOf(node: number): number[] {
  const out: number[] = [];
  for (let n = finished[node] ? parent[node] : node; n > 0; n = parent[n]) out.push(symbol[n]);
  return out.reverse();
}

/**
 * Finds the most probable completions of the word that starts at
 * `history[wordBegin]` and runs to `end` (empty at a word boundary).
 * @param maxResults number of words wanted (1..100)
 * @param floor completions below this probability are never reported (0..1)
 * @param stopAt optional completion: the search stops once it is reported
 */
export function searchCompletions(
  model: NextSymbolModel,
  history: ArrayLike<number>,
  end: number,
  wordBegin: number,
  maxResults: number,
  floor: number,
  limits: SearchLimits,
  stopAt?: ArrayLike<number>,
): Completion[] {
  const keep = Math.min(model.order, end);
  const maxLen = Math.min(limits.maxCompletionLength, 255);
  if (context.length < keep + maxLen + 1) context = new Int32Array(keep + maxLen + 1);
  for (let i = 0; i < keep; i++) context[i] = history[end - keep + i];
  // The last typed character decides what may follow: at a boundary or after a
  // joiner, only word characters; after a word character, joiners too.
  const lastClass = end > wordBegin ? classOf(history[end - 1]) : BOUNDARY;

  nodeCount = 0;
  heapSize = 0;
  poolTop = 0;
  addNode(-1, -1, 1, false);
  // Probabilities of the best `maxResults` finished entries queued so far,
  // ascending; its first element bounds what a node must reach to matter.
  const best: number[] = [];
  const results: Completion[] = [];
  let expansions = 0;

  while (heapSize > 0 && results.length < maxResults) {
    const node = popNode();
    const p = prob[node];
    if (p < floor) break;
    if (finished[node]) {
      const symbols = pathOf(node);
      results.push({ symbols, p });
      if (stopAt && sameSymbols(symbols, stopAt)) break;
      continue;
    }
    if (expansions >= limits.nodeBudget) continue; // out of budget: only drain finished entries
    const bound = Math.max(floor, best.length === maxResults ? best[0] : 0);
    // Its next sibling takes its place in the queue.
    if (listStart[node] >= 0)
      queueNextChild(parent[node], listStart[node], listTaken[node], listEnd[node], bound);
    const d = depth[node];
    if (d >= maxLen) continue;
    expansions++;
    // Context = kept history + this node's path.
    for (let n = node, i = keep + d - 1; n > 0; n = parent[n], i--) context[i] = symbol[n];
    dist.clear();
    model.distribution(context, keep + d, dist);
    const prevClass = d > 0 ? classOf(context[keep + d - 1]) : lastClass;
    let endMass = 0;
    ensurePool(poolTop + dist.size);
    const start = poolTop;
    const minQ = p > 0 ? bound / p : Infinity;
    for (let k = 0; k < dist.size; k++) {
      const sym = dist.symbols[k];
      const q = dist.probs[k];
      const c = classOf(sym);
      if (c === BOUNDARY) {
        endMass += q;
        continue;
      }
      if (c === JOINER && prevClass !== WORD) continue;
      if (q >= minQ && q > 0) {
        poolSymbols[poolTop] = sym;
        poolProbs[poolTop] = q;
        poolTop++;
      }
    }
    queueNextChild(node, start, 0, poolTop, bound);
    // A word ends only after a word character, and the typed prefix alone is a
    // word only if it is not empty.
    const canFinish = prevClass === WORD && (d > 0 || end > wordBegin);
    const pf = p * endMass;
    if (canFinish && pf > 0 && pf >= bound) {
      addNode(node, -1, pf, true);
      insertBest(best, pf, maxResults);
    }
  }
  return results;
}

function insertBest(best: number[], p: number, limit: number): void {
  if (best.length === limit) {
    if (p <= best[0]) return;
    best.shift();
  }
  let i = 0;
  while (i < best.length && best[i] < p) i++;
  best.splice(i, 0, p);
}

function sameSymbols(a: readonly number[], b: ArrayLike<number>): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}
