// Integer range coder (a byte-wise arithmetic coder in the style of Martin
// 1979 with carry propagation), exact in JavaScript doubles.
//
// The coding interval is [low, low + range) on a 48-bit window; every value
// below stays an integer under 2^53, so + - * and floor(/) are exact.
// Invariants (between calls):
//   encoder: 0 <= low < 2^48 after normalisation, low + range <= 2^49,
//            2^40 <= range <= 2^48 - 1;
//   decoder: 2^40 <= range <= 2^48 - 1 and 0 <= code < range for a stream
//            this encoder produced (code = window value - low).
// Each step takes r = floor(range / total), moves low by r * low(i) and sets
// range = r * (high(i) - low(i)). With total <= 2^24 and range >= 2^40 the
// truncation loses at most -log2(1 - 2^-16) ~ 2.2e-5 bits per step
// (docs/references.md §1 gives the same argument for a 32-bit coder).
import { type FrequencyTable, MAX_TABLE_TOTAL } from './frequency-table';

const WINDOW = 2 ** 48;
const TOP_SHIFT = 2 ** 40; // weight of the top byte of the window
const FULL_RANGE = WINDOW - 1;

/** Raised when a table or index breaks the coder's preconditions. */
export class CoderError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CoderError';
  }
}

/** Writes a growing byte buffer; call finish() once to get the stream. */
export class RangeEncoder {
  private low = 0;
  private range = FULL_RANGE;
  /** The last byte not yet written (a later carry may still increment it). */
  private cache = 0;
  private hasCache = false;
  /** Count of 0xff bytes after the cache that a carry would turn into 0x00. */
  private pendingFF = 0;
  private bytes = new Uint8Array(1024);
  private length = 0;
  private finished = false;

  /** Codes index i of the table (low(i) < high(i) required). */
  encode(table: FrequencyTable, i: number): void {
    this.encodeRange(table.low(i), table.high(i), table.total);
  }

  /** Codes the sub-interval [cumLow, cumHigh) of [0, total), total <= 2^24. */
  encodeRange(cumLow: number, cumHigh: number, total: number): void {
    if (!(cumLow < cumHigh && cumHigh <= total && total <= MAX_TABLE_TOTAL)) {
      throw new CoderError(`cannot code [${cumLow}, ${cumHigh}) of ${total}: zero frequency or bad total`);
    }
    const r = Math.floor(this.range / total);
    this.low += r * cumLow;
    this.range = r * (cumHigh - cumLow);
    while (this.range < TOP_SHIFT) {
      this.shiftLow();
      this.range *= 256;
    }
  }

  /** Flushes the interval and returns the stream (trailing zero bytes dropped: the decoder reads zeros past the end). */
  finish(): Uint8Array {
    if (this.finished) throw new CoderError('encoder already finished');
    this.finished = true;
    // Pick the value in [low, low + range) with the most trailing zero bits,
    // so that fewer significant bytes need to be written.
    for (let bit = 48; bit >= 0; bit--) {
      const step = 2 ** bit;
      const v = Math.ceil(this.low / step) * step;
      if (v < this.low + this.range) {
        this.low = v;
        break;
      }
    }
    for (let i = 0; i < 7; i++) this.shiftLow();
    let end = this.length;
    while (end > 0 && this.bytes[end - 1] === 0) end--;
    return this.bytes.slice(0, end);
  }

  /** Moves the top byte of the window out, resolving carries. */
  private shiftLow(): void {
    const top = Math.floor(this.low / TOP_SHIFT); // 0..511; bit 8 is the carry
    if (top !== 0xff) {
      const carry = top >>> 8;
      if (this.hasCache) this.put(this.cache + carry);
      for (; this.pendingFF > 0; this.pendingFF--) this.put((0xff + carry) & 0xff);
      this.cache = top & 0xff;
      this.hasCache = true;
    } else {
      this.pendingFF++;
    }
    this.low = (this.low - top * TOP_SHIFT) * 256;
  }

  private put(byte: number): void {
    if (this.length === this.bytes.length) {
      const grown = new Uint8Array(this.bytes.length * 2);
      grown.set(this.bytes);
      this.bytes = grown;
    }
    this.bytes[this.length++] = byte;
  }
}

/** Reads a stream written by RangeEncoder; bytes past the end read as 0. */
export class RangeDecoder {
  private range = FULL_RANGE;
  private code = 0;
  private position = 0;
  /** floor(range / total) of the step in progress. */
  private step = 1;

  constructor(private readonly bytes: Uint8Array) {
    for (let i = 0; i < 6; i++) this.code = this.code * 256 + this.nextByte();
  }

  /** Decodes one index of the table. */
  decode(table: FrequencyTable): number {
    const i = table.find(this.target(table.total));
    this.consume(table.low(i), table.high(i));
    return i;
  }

  /**
   * First half of decoding, for callers that walk their own weights: the
   * value in 0..total-1 that identifies the coded sub-interval. Must be
   * followed by consume() with the [cumLow, cumHigh) that contains it.
   */
  target(total: number): number {
    if (!(total >= 1 && total <= MAX_TABLE_TOTAL)) throw new CoderError(`bad table total ${total}`);
    const r = Math.floor(this.range / total);
    this.step = r;
    const value = Math.floor(this.code / r);
    // Only a damaged stream lands in the unused tail [r * total, range).
    return value >= total ? total - 1 : value;
  }

  /** Second half of decoding: narrows to [cumLow, cumHigh) of the total given to target(). */
  consume(cumLow: number, cumHigh: number): void {
    const r = this.step;
    this.code -= r * cumLow;
    this.range = r * (cumHigh - cumLow);
    while (this.range < TOP_SHIFT) {
      this.code = this.code * 256 + this.nextByte();
      this.range *= 256;
    }
  }

  /** Number of bytes consumed beyond the end of the stream (0 for a healthy stream read to its end, small otherwise). */
  get overrun(): number {
    return Math.max(0, this.position - this.bytes.length);
  }

  private nextByte(): number {
    const p = this.position++;
    return p < this.bytes.length ? this.bytes[p] : 0;
  }
}
