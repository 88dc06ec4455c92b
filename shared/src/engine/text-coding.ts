// Coding whole texts through a model: ideal code length, and real
// arithmetic coding to bytes and back. A PpmModel codes through its own
// integer context tables (exact); any other NextSymbolModel (e.g. a blend)
// codes through its distribution quantised to integers (see codeGeneric).
//
// These functions call model.learn after each symbol: an adaptive model
// changes while it codes. Encode and decode must each start from the same
// model state, so pass a clone() when the model is needed again.
import { Distribution, type NextSymbolModel } from './model-types';
import { PpmModel } from './ppm-model';
import { CumulativeTable, UniformTable } from './frequency-table';
import { RangeDecoder, RangeEncoder } from './range-coder';
import { CODE_POINT_LIMIT } from './ppm-settings';
import { markArray, nextToken, slotArray } from './symbol-marks';

export type CodeLengthOptions = {
  /** Call model.learn after each symbol (default true; a frozen model ignores it). */
  adaptive?: boolean;
};

/** Ideal code length of `text` in bits: the sum of -log2 P(text[i] | text[0..i)). */
export function codeLengthBits(
  model: NextSymbolModel,
  text: ArrayLike<number>,
  options: CodeLengthOptions = {},
): number {
  const adaptive = options.adaptive ?? true;
  let bits = 0;
  for (let i = 0; i < text.length; i++) {
    bits -= Math.log2(model.probability(text, i, text[i]));
    if (adaptive) model.learn(text, i);
  }
  return bits;
}

/** Arithmetic-codes `text` (code points) through `model`; decodeText with an identical model and text.length restores it. */
export function encodeText(model: NextSymbolModel, text: ArrayLike<number>): Uint8Array {
  const encoder = new RangeEncoder();
  if (model instanceof PpmModel) {
    for (let i = 0; i < text.length; i++) {
      model.encodeNext(encoder, text, i);
      model.learn(text, i);
    }
  } else {
    const generic = new GenericCoder();
    for (let i = 0; i < text.length; i++) {
      generic.encode(model, encoder, text, i);
      model.learn(text, i);
    }
  }
  return encoder.finish();
}

/** Decodes `length` code points from `bytes` with a model in the same state encodeText started from. */
export function decodeText(model: NextSymbolModel, bytes: Uint8Array, length: number): Uint32Array {
  const out = new Uint32Array(length);
  const decoder = new RangeDecoder(bytes);
  if (model instanceof PpmModel) {
    for (let i = 0; i < length; i++) {
      out[i] = model.decodeNext(decoder, out, i);
      model.learn(out, i);
    }
  } else {
    const generic = new GenericCoder();
    for (let i = 0; i < length; i++) {
      out[i] = generic.decode(model, decoder, out, i);
      model.learn(out, i);
    }
  }
  return out;
}

/** Probabilities are scaled to integers with this factor (every named symbol keeps frequency >= 1). */
const GENERIC_SCALE = 1 << 22;

/**
 * Codes with any model: named symbols get max(1, floor(p * 2^22)), then an
 * escape whose frequency is the unnamed mass; after an escape a two-way
 * table picks the range below or at/above the distribution's split (by
 * mass), then a uniform choice among the unnamed code points of that range.
 */
class GenericCoder {
  private readonly dist = new Distribution(256);
  private readonly table = new CumulativeTable(256);
  private readonly tiers = new CumulativeTable(2);
  private readonly uniform = new UniformTable();
  private sorted = new Int32Array(256);

  encode(model: NextSymbolModel, encoder: RangeEncoder, history: ArrayLike<number>, end: number): void {
    const symbol = history[end];
    this.prepare(model, history, end);
    const slot = slotArray();
    if (markArray()[symbol] === this.token) {
      encoder.encode(this.table, slot[symbol]);
      return;
    }
    encoder.encode(this.table, this.dist.size);
    const split = this.dist.split;
    const below = symbol < split;
    encoder.encode(this.tiers, below ? 0 : 1);
    const named = this.sortedNamed();
    let before = 0; // unnamed code points of the tier that precede symbol
    const from = below ? 0 : split;
    for (let i = 0; i < named.length && named[i] < symbol; i++) if (named[i] >= from) before++;
    encoder.encode(this.uniform.setSize(this.tierSize(below)), symbol - from - before);
  }

  decode(model: NextSymbolModel, decoder: RangeDecoder, history: ArrayLike<number>, end: number): number {
    this.prepare(model, history, end);
    const i = decoder.decode(this.table);
    if (i < this.dist.size) return this.dist.symbols[i];
    const below = decoder.decode(this.tiers) === 0;
    const n = decoder.decode(this.uniform.setSize(this.tierSize(below)));
    const from = below ? 0 : this.dist.split;
    let x = from + n;
    const named = this.sortedNamed();
    for (let j = 0; j < named.length; j++) {
      if (named[j] < from) continue;
      if (named[j] <= x) x++;
      else break;
    }
    return x;
  }

  private token = 0;
  private namedBelow = 0;

  private prepare(model: NextSymbolModel, history: ArrayLike<number>, end: number): void {
    const d = this.dist;
    model.distribution(history, end, d);
    const mark = markArray();
    const slot = slotArray();
    this.token = nextToken();
    this.table.reset();
    this.namedBelow = 0;
    for (let i = 0; i < d.size; i++) {
      const s = d.symbols[i];
      mark[s] = this.token;
      slot[s] = i;
      if (s < d.split) this.namedBelow++;
      this.table.add(Math.max(1, Math.floor(d.probs[i] * GENERIC_SCALE)));
    }
    this.table.add(Math.max(1, Math.floor(d.rest * GENERIC_SCALE)));
    this.tiers.reset();
    const massBelow = d.unnamedBelow * this.tierSize(true);
    const massAbove = d.unnamedAbove * this.tierSize(false);
    this.tiers.add(this.tierSize(true) > 0 ? Math.max(1, Math.floor(massBelow * GENERIC_SCALE)) : 0);
    this.tiers.add(this.tierSize(false) > 0 ? Math.max(1, Math.floor(massAbove * GENERIC_SCALE)) : 0);
  }

  private tierSize(below: boolean): number {
    const split = this.dist.split;
    return below ? split - this.namedBelow : CODE_POINT_LIMIT - split - (this.dist.size - this.namedBelow);
  }

  private sortedNamed(): Int32Array {
    const d = this.dist;
    if (this.sorted.length < d.size) this.sorted = new Int32Array(d.size * 2);
    const view = this.sorted.subarray(0, d.size);
    view.set(d.symbols.subarray(0, d.size));
    return view.sort();
  }
}
