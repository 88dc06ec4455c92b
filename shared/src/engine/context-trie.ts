// Storage for PPM contexts: a trie kept in two typed arrays (no object per
// node), laid out so that one context or one entry sits in one cache line.
//
// A context node stands for a string s of length 0..k (node 0 is the empty
// string, order 0). Its symbol list - the entries (symbol x, count c(x),
// child) - lives in one block of the entry pool; a block holds up to a power
// of two entries and moves to a block twice as large when full (freed blocks
// are reused through one free list per size). The child of entry x in node s
// is the node for s·x, created lazily the first time s·x is needed as a
// context. Order-k entries cannot have such a child (no node is longer than
// k); the PPM model uses their link as a shortcut to the order-k context
// that follows (the suffix of s·x), see ppm-model.ts. Each node also keeps
// its suffix (the node for s without its first symbol), used to find
// contexts quickly.
//
// Layout (the arrays are split into segments that never move once full, so
// a growing model leaves no large arrays behind for the garbage collector):
//   contexts: 4 int32 per node  [block, size q, total n, suffix]
//             in segments of 2^16 nodes
//   entries:  2 int32 per entry [symbol | count << 21, child]
//             in segments of 2^20 entries; a block never crosses a segment
// The first segment of each kind grows by reallocation up to full size, so
// small models stay small. A symbol takes 21 bits (0..0x10FFFF) and a count
// 10 bits (1..MAX_COUNT), so the packed word stays a positive int32.

/** Marks "no node" / "no entry". */
export const NONE = -1;

/** Largest count kept in an entry; the model halves a context's counts before any reaches it. */
export const MAX_COUNT = 1023;

const SYMBOL_MASK = 0x1fffff;
const COUNT_SHIFT = 21;
const COUNT_ONE = 1 << COUNT_SHIFT;
const CTX_SHIFT = 16; // nodes per context segment = 2^16
const CTX_MASK = (1 << CTX_SHIFT) - 1;
const ENT_SHIFT = 20; // entries per entry segment = 2^20
const ENT_MASK = (1 << ENT_SHIFT) - 1;

export class ContextTrie {
  /** Context segments, 4 int32 per node. */
  private ctxSegs: Int32Array[];
  contextCount = 0;
  /** Entry segments, 2 int32 per entry. */
  private entSegs: Int32Array[];
  /** First never-used entry slot. */
  entryTop = 0;
  /** Head of the free list of blocks of 2^c entries (linked through the first entry's child word). */
  private freeHead = new Int32Array(32).fill(NONE);

  constructor(contextCapacity = 1024, entryCapacity = 4096) {
    this.ctxSegs = [new Int32Array(4 * Math.min(Math.max(1, contextCapacity), CTX_MASK + 1))];
    this.entSegs = [new Int32Array(2 * Math.min(Math.max(1, entryCapacity), ENT_MASK + 1))];
    this.newContext(NONE);
  }

  // ---- field access (small enough to be inlined in hot loops) ----
  /** First entry id of the node's block (NONE while it has no entries). */
  blockOf(c: number): number {
    return this.ctxSegs[c >>> CTX_SHIFT][(c & CTX_MASK) << 2];
  }
  /** Number of entries q (distinct symbols seen). */
  sizeOf(c: number): number {
    return this.ctxSegs[c >>> CTX_SHIFT][((c & CTX_MASK) << 2) + 1];
  }
  /** Sum of the entries' counts n. */
  totalOf(c: number): number {
    return this.ctxSegs[c >>> CTX_SHIFT][((c & CTX_MASK) << 2) + 2];
  }
  /** Node one order shorter (drops the oldest symbol); NONE for the root. */
  suffixOf(c: number): number {
    return this.ctxSegs[c >>> CTX_SHIFT][((c & CTX_MASK) << 2) + 3];
  }
  setSuffix(c: number, suffix: number): void {
    this.ctxSegs[c >>> CTX_SHIFT][((c & CTX_MASK) << 2) + 3] = suffix;
  }
  symbolAt(e: number): number {
    return this.entSegs[e >>> ENT_SHIFT][(e & ENT_MASK) << 1] & SYMBOL_MASK;
  }
  countAt(e: number): number {
    return this.entSegs[e >>> ENT_SHIFT][(e & ENT_MASK) << 1] >>> COUNT_SHIFT;
  }
  /** Child node of the entry (for order-k nodes: the shortcut), NONE if not created. */
  childAt(e: number): number {
    return this.entSegs[e >>> ENT_SHIFT][((e & ENT_MASK) << 1) + 1];
  }
  setChild(e: number, child: number): void {
    this.entSegs[e >>> ENT_SHIFT][((e & ENT_MASK) << 1) + 1] = child;
  }

  /** Creates an empty node whose suffix is `suffix`; returns its id. */
  newContext(suffix: number): number {
    const id = this.contextCount;
    const segIndex = id >>> CTX_SHIFT;
    const r = (id & CTX_MASK) << 2;
    if (segIndex === this.ctxSegs.length) this.ctxSegs.push(new Int32Array(4 << CTX_SHIFT));
    let seg = this.ctxSegs[segIndex];
    if (r + 4 > seg.length)
      seg = this.ctxSegs[segIndex] = growTo(seg, Math.min(4 << CTX_SHIFT, Math.ceil(seg.length * 1.5) + 64));
    seg[r] = NONE;
    seg[r + 1] = 0;
    seg[r + 2] = 0;
    seg[r + 3] = suffix;
    this.contextCount++;
    return id;
  }

  /** Entry id of `symbol` in node `c`, or NONE. Linear scan (blocks are kept roughly in decreasing count order). */
  find(c: number, symbol: number): number {
    const cs = this.ctxSegs[c >>> CTX_SHIFT];
    const r = (c & CTX_MASK) << 2;
    const start = cs[r];
    const q = cs[r + 1];
    if (q === 0) return NONE;
    const seg = this.entSegs[start >>> ENT_SHIFT];
    const w0 = (start & ENT_MASK) << 1;
    for (let j = 0; j < q; j++) if ((seg[w0 + 2 * j] & SYMBOL_MASK) === symbol) return start + j;
    return NONE;
  }

  /** Child node of `symbol` in `c`, or NONE if either is missing. */
  childOf(c: number, symbol: number): number {
    const e = this.find(c, symbol);
    return e === NONE ? NONE : this.childAt(e);
  }

  /** Appends a new entry (symbol not yet present) with count 1..MAX_COUNT; returns its id. */
  append(c: number, symbol: number, count: number): number {
    const cs = this.ctxSegs[c >>> CTX_SHIFT];
    const r = (c & CTX_MASK) << 2;
    const size = cs[r + 1];
    if ((size & (size - 1)) === 0) this.growBlock(c, size); // size is 0 or a power of two: block full
    const e = cs[r] + size;
    const seg = this.entSegs[e >>> ENT_SHIFT];
    const w = (e & ENT_MASK) << 1;
    seg[w] = symbol | (count << COUNT_SHIFT);
    seg[w + 1] = NONE;
    cs[r + 1] = size + 1;
    cs[r + 2] += count;
    return e;
  }

  /** Adds one to the count of entry e of node c (the caller keeps it below MAX_COUNT). */
  bump(c: number, e: number): void {
    this.entSegs[e >>> ENT_SHIFT][(e & ENT_MASK) << 1] += COUNT_ONE;
    this.ctxSegs[c >>> CTX_SHIFT][((c & CTX_MASK) << 2) + 2]++;
  }

  /** Swaps entry e with the one before it (same block); returns e's new id. */
  swapWithPrevious(e: number): number {
    const seg = this.entSegs[e >>> ENT_SHIFT];
    const a = (e & ENT_MASK) << 1;
    const b = a - 2;
    const key = seg[a];
    const child = seg[a + 1];
    seg[a] = seg[b];
    seg[a + 1] = seg[b + 1];
    seg[b] = key;
    seg[b + 1] = child;
    return e - 1;
  }

  /** Halves every count of `c`, rounding up so no count reaches 0. */
  halve(c: number): void {
    const cs = this.ctxSegs[c >>> CTX_SHIFT];
    const r = (c & CTX_MASK) << 2;
    const start = cs[r];
    const q = cs[r + 1];
    const seg = this.entSegs[start >>> ENT_SHIFT];
    const w0 = (start & ENT_MASK) << 1;
    let total = 0;
    for (let j = 0; j < q; j++) {
      const word = seg[w0 + 2 * j];
      const count = ((word >>> COUNT_SHIFT) + 1) >>> 1;
      seg[w0 + 2 * j] = (word & SYMBOL_MASK) | (count << COUNT_SHIFT);
      total += count;
    }
    cs[r + 2] = total;
  }

  /** Bytes held by the typed arrays (allocated capacity). */
  get byteSize(): number {
    let n = 0;
    for (const s of this.ctxSegs) n += s.byteLength;
    for (const s of this.entSegs) n += s.byteLength;
    return n;
  }

  /** A deep copy (the last segment of each kind trimmed to its used part). */
  clone(): ContextTrie {
    const t = new ContextTrie(1, 1);
    t.ctxSegs = copySegments(this.ctxSegs, 4 * (((this.contextCount - 1) & CTX_MASK) + 1));
    t.contextCount = this.contextCount;
    t.entSegs = copySegments(this.entSegs, 2 * (((Math.max(this.entryTop, 1) - 1) & ENT_MASK) + 1));
    t.entryTop = this.entryTop;
    t.freeHead = this.freeHead.slice();
    return t;
  }

  /** Moves c's entries to a block twice as large (or a first block of 1). */
  private growBlock(c: number, size: number): void {
    const cls = size === 0 ? 0 : 31 - Math.clz32(size) + 1;
    const block = this.allocate(cls);
    const cs = this.ctxSegs[c >>> CTX_SHIFT];
    const r = (c & CTX_MASK) << 2;
    const old = cs[r];
    if (size > 0) {
      const from = this.entSegs[old >>> ENT_SHIFT];
      const fw = (old & ENT_MASK) << 1;
      this.entSegs[block >>> ENT_SHIFT].set(from.subarray(fw, fw + 2 * size), (block & ENT_MASK) << 1);
      const oldCls = cls - 1;
      from[fw + 1] = this.freeHead[oldCls];
      this.freeHead[oldCls] = old;
    }
    cs[r] = block;
  }

  /** A block of 2^cls entries, from the free list or the end of the pool (never crossing a segment). */
  private allocate(cls: number): number {
    const head = this.freeHead[cls];
    if (head !== NONE) {
      this.freeHead[cls] = this.childAt(head);
      return head;
    }
    const n = 1 << cls;
    let block = this.entryTop;
    if ((block & ENT_MASK) + n > ENT_MASK + 1) {
      // Not enough room left in this segment: start the next one. The
      // tail left behind is split into free blocks, largest first.
      let at = block;
      const segEnd = (block | ENT_MASK) + 1;
      for (let k = cls - 1; k >= 0; k--) {
        while (at + (1 << k) <= segEnd) {
          this.ensureEntrySlots(at + (1 << k));
          this.setChild(at, this.freeHead[k]);
          this.freeHead[k] = at;
          at += 1 << k;
        }
      }
      block = segEnd;
    }
    this.ensureEntrySlots(block + n);
    this.entryTop = block + n;
    return block;
  }

  /** Makes entry slots below `limit` addressable. */
  private ensureEntrySlots(limit: number): void {
    const last = (limit - 1) >>> ENT_SHIFT;
    while (this.entSegs.length <= last) this.entSegs.push(new Int32Array(2 << ENT_SHIFT));
    const seg = this.entSegs[last];
    const need = 2 * (((limit - 1) & ENT_MASK) + 1);
    if (need > seg.length)
      this.entSegs[last] = growTo(
        seg,
        Math.min(2 << ENT_SHIFT, Math.max(need, Math.ceil(seg.length * 1.5) + 2048)),
      );
  }
}

/** A longer copy of `a` (zero-filled after its end). */
function growTo(a: Int32Array, length: number): Int32Array {
  const b = new Int32Array(length);
  b.set(a);
  return b;
}

/** Copies segments; the last one is cut to `lastLength` words. */
function copySegments(segs: Int32Array[], lastLength: number): Int32Array[] {
  return segs.map((s, i) => (i === segs.length - 1 ? s.slice(0, Math.min(s.length, lastLength)) : s.slice()));
}
