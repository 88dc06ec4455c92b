// The PPM model against docs/references.md §1 ("abracadabra", max order 2), via a
// tiny exact-fraction reference PPM written here from the published
// definitions (docs/references.md §1). Every expected value below is "derived"
// (marked "derived" in docs/references.md §1): recomputed from the definitions, not copied
// from a published table.
import { describe, expect, it } from 'vitest';
import { PpmModel } from './ppm-model';
import { Distribution } from './model-types';
import { codeLengthBits } from './text-coding';
import { type EscapeMethod } from './ppm-settings';
import { codePointsOf } from './text-preparation';
import { seededRandom } from './seeded-random';

// ---- exact fractions ----
type Frac = { n: bigint; d: bigint };
const gcd = (a: bigint, b: bigint): bigint => (b === 0n ? (a < 0n ? -a : a) : gcd(b, a % b));
const frac = (n: bigint, d: bigint): Frac => {
  const g = gcd(n, d);
  return { n: n / g, d: d / g };
};
const mul = (a: Frac, b: Frac): Frac => frac(a.n * b.n, a.d * b.d);
const F = (n: number, d: number): Frac => frac(BigInt(n), BigInt(d));
const toNumber = (f: Frac): number => Number(f.n) / Number(f.d);
const str = (f: Frac): string => `${f.n}/${f.d}`;

// ---- reference PPM (strings, maps, exact arithmetic; slow and plain) ----
type RefOptions = {
  method: EscapeMethod;
  exclusion: boolean;
  updateExclusion: boolean;
  order: number;
  alphabet: number;
};

class ReferencePpm {
  readonly contexts = new Map<string, Map<string, number>>();
  constructor(readonly o: RefOptions) {}

  private weight(c: number): number {
    return this.o.method === 'D' ? 2 * c - 1 : this.o.method === 'B' ? c - 1 : c;
  }
  private escape(q: number): number {
    return this.o.method === 'A' ? 1 : q;
  }

  /** P(x | history), exactly. Unseen or empty contexts are skipped. */
  probability(history: string, x: string): Frac {
    let p = F(1, 1);
    const excluded = new Set<string>();
    for (let k = Math.min(this.o.order, history.length); k >= 0; k--) {
      const counts = this.contexts.get(history.slice(history.length - k));
      if (!counts || counts.size === 0) continue;
      let total = this.escape(counts.size);
      for (const [y, c] of counts)
        if (!(this.o.exclusion && excluded.has(y)) && this.weight(c) > 0) total += this.weight(c);
      const cx = counts.get(x);
      if (cx !== undefined && this.weight(cx) > 0 && !(this.o.exclusion && excluded.has(x)))
        return mul(p, F(this.weight(cx), total));
      p = mul(p, F(this.escape(counts.size), total));
      if (this.o.exclusion) for (const [y, c] of counts) if (this.weight(c) > 0) excluded.add(y);
    }
    return mul(p, F(1, this.o.alphabet - (this.o.exclusion ? excluded.size : 0)));
  }

  /** Adds x after history: all orders, or with update exclusion down to the order that would code it. */
  learn(history: string, x: string): void {
    for (let k = Math.min(this.o.order, history.length); k >= 0; k--) {
      const key = history.slice(history.length - k);
      const counts = this.contexts.get(key) ?? new Map<string, number>();
      this.contexts.set(key, counts);
      const c = counts.get(x) ?? 0;
      counts.set(x, c + 1);
      if (this.o.updateExclusion && c > 0 && this.weight(c) > 0) break;
    }
  }
}

const ALPHABET = 256;
const TEXT = 'abracadabra';
const cps = (s: string): Uint32Array => codePointsOf(s);

function engine(method: EscapeMethod, exclusion: boolean, updateExclusion = false): PpmModel {
  return new PpmModel({
    order: 2,
    escape: method,
    exclusion,
    updateExclusion,
    adaptive: true,
    alphabetSize: ALPHABET,
    literals: false,
  });
}

function trainBoth(
  method: EscapeMethod,
  exclusion: boolean,
  updateExclusion = false,
): [ReferencePpm, PpmModel] {
  const ref = new ReferencePpm({ method, exclusion, updateExclusion, order: 2, alphabet: ALPHABET });
  for (let i = 0; i < TEXT.length; i++) ref.learn(TEXT.slice(0, i), TEXT[i]);
  const model = engine(method, exclusion, updateExclusion);
  model.learnText(cps(TEXT));
  return [ref, model];
}

const asObject = (m: Map<number, number> | Map<string, number> | undefined): Record<string, number> => {
  const o: Record<string, number> = {};
  for (const [k, v] of m ?? []) o[typeof k === 'number' ? String.fromCodePoint(k) : k] = v;
  return o;
};

describe('PpmModel on the abracadabra example (docs/references.md §1, derived)', () => {
  it('holds the §2 counts after the string, full updating', () => {
    const [ref, model] = trainBoth('C', true, false);
    // Count table after "abracadabra" (derived; sources in docs/references.md §1).
    const expected: Record<string, Record<string, number>> = {
      ab: { r: 2 },
      ac: { a: 1 },
      ad: { a: 1 },
      br: { a: 2 },
      ca: { d: 1 },
      da: { b: 1 },
      ra: { c: 1 },
      a: { b: 2, c: 1, d: 1 },
      b: { r: 2 },
      c: { a: 1 },
      d: { a: 1 },
      r: { a: 2 },
      '': { a: 5, b: 2, c: 1, d: 1, r: 2 },
    };
    for (const [ctx, counts] of Object.entries(expected)) {
      expect(asObject(ref.contexts.get(ctx)), `reference ${ctx}`).toEqual(counts);
      expect(asObject(model.countsAfter(cps(ctx))), `engine ${ctx}`).toEqual(counts);
    }
  });

  it('holds the §2 counts with update exclusion', () => {
    const [ref, model] = trainBoth('C', true, true);
    // After one more symbol (derived; sources in docs/references.md §1): b→{r:1}, r→{a:1}, order 0 {a:4,b:1,c:1,d:1,r:1}; a and order 2 unchanged.
    const expected: Record<string, Record<string, number>> = {
      b: { r: 1 },
      r: { a: 1 },
      '': { a: 4, b: 1, c: 1, d: 1, r: 1 },
      a: { b: 2, c: 1, d: 1 },
      ab: { r: 2 },
      br: { a: 2 },
      ra: { c: 1 },
    };
    for (const [ctx, counts] of Object.entries(expected)) {
      expect(asObject(ref.contexts.get(ctx)), `reference ${ctx}`).toEqual(counts);
      expect(asObject(model.countsAfter(cps(ctx))), `engine ${ctx}`).toEqual(counts);
    }
  });

  // Next-symbol probabilities after "abracadabra", |A| = 256, q retained (docs/references.md §1, derived).
  const nextCases: Array<{ method: EscapeMethod; exclusion: boolean; expected: Record<string, string> }> = [
    {
      method: 'C',
      exclusion: true,
      expected: { c: '1/2', d: '1/12', b: '1/6', a: '5/48', r: '1/24', t: '5/12048' },
    },
    {
      method: 'C',
      exclusion: false,
      expected: { c: '1/2', d: '1/14', b: '1/7', a: '15/224', r: '3/112', t: '15/57344' },
    },
    {
      method: 'A',
      exclusion: true,
      expected: { c: '1/2', b: '1/4', d: '1/8', a: '5/64', r: '1/32', t: '1/16064' },
    },
    { method: 'A', exclusion: false, expected: { d: '1/10', t: '1/30720' } },
    {
      method: 'D',
      exclusion: true,
      expected: { c: '1/2', b: '3/14', d: '1/14', a: '27/238', r: '9/238', t: '15/59738' },
    },
    {
      method: 'D',
      exclusion: false,
      expected: { b: '3/16', d: '1/16', a: '27/352', r: '9/352', t: '15/90112' },
    },
    {
      method: 'B',
      exclusion: false,
      expected: { b: '1/4', a: '3/11', r: '3/44', c: '15/11264', d: '15/11264', t: '15/11264' },
    },
  ];
  for (const { method, exclusion, expected } of nextCases) {
    it(`predicts the next symbol like §2 for method ${method}, exclusion ${exclusion ? 'on' : 'off'}`, () => {
      const [ref, model] = trainBoth(method, exclusion);
      const history = cps(TEXT);
      for (const [x, fraction] of Object.entries(expected)) {
        const exact = ref.probability(TEXT, x);
        expect(str(exact), `reference P(${x})`).toBe(fraction);
        expect(model.probability(history, history.length, x.codePointAt(0)!)).toBeCloseTo(
          toNumber(exact),
          12,
        );
      }
    });
  }

  // Whole-string code length from an empty model (derived; sources in docs/references.md §1).
  const wholeCases: Array<{ method: EscapeMethod; exclusion: boolean; perSymbol: string[]; bits: number }> = [
    {
      method: 'C',
      exclusion: true,
      perSymbol: ['1/256', '1/510', '1/508', '1/6', '1/1012', '2/9', '1/1008', '1/4', '1/6', '1/2', '1/2'],
      bits: 57.2832,
    },
    {
      method: 'C',
      exclusion: false,
      perSymbol: ['1/256', '1/512', '1/512', '1/6', '3/3584', '2/9', '1/1280', '1/4', '1/6', '1/2', '1/2'],
      bits: 57.8842,
    },
    {
      method: 'A',
      exclusion: true,
      perSymbol: ['1/256', '1/510', '1/762', '1/4', '1/2024', '1/3', '1/3780', '3/8', '1/4', '1/2', '1/2'],
      bits: 58.4352,
    },
    {
      method: 'D',
      exclusion: true,
      perSymbol: ['1/256', '1/510', '1/508', '1/6', '3/3542', '3/10', '1/1260', '5/14', '1/6', '1/2', '1/2'],
      bits: 56.8799,
    },
  ];
  for (const { method, exclusion, perSymbol, bits } of wholeCases) {
    for (const updateExclusion of [false, true]) {
      it(`codes the whole string like §2 for method ${method}, exclusion ${exclusion ? 'on' : 'off'}, update exclusion ${updateExclusion}`, () => {
        const ref = new ReferencePpm({ method, exclusion, updateExclusion, order: 2, alphabet: ALPHABET });
        let product = F(1, 1);
        const got: string[] = [];
        for (let i = 0; i < TEXT.length; i++) {
          const p = ref.probability(TEXT.slice(0, i), TEXT[i]);
          got.push(str(p));
          product = mul(product, p);
          ref.learn(TEXT.slice(0, i), TEXT[i]);
        }
        expect(got).toEqual(perSymbol);
        if (method === 'C' && exclusion) expect(str(product)).toBe('1/175367816856207360');
        const exactBits = Math.log2(Number(product.d)) - Math.log2(Number(product.n));
        expect(exactBits).toBeCloseTo(bits, 4);
        const model = engine(method, exclusion, updateExclusion);
        expect(codeLengthBits(model, cps(TEXT), { adaptive: true })).toBeCloseTo(exactBits, 9);
      });
    }
  }
});

describe('PpmModel distributions', () => {
  const random = seededRandom(7);
  const letters = 'aaaabbbcdde  \nxyz';
  const text = new Uint32Array(3000);
  for (let i = 0; i < text.length; i++)
    text[i] = i % 97 === 50 ? 0x1f600 + (i % 5) : letters.charCodeAt(Math.floor(random() * letters.length));

  for (const method of ['A', 'C', 'D'] as const) {
    it(`sums to 1 over the alphabet at every position (method ${method}, exclusion; sources in docs/references.md §1)`, () => {
      const model = new PpmModel({ order: 3, escape: method, exclusion: true, adaptive: true });
      const out = new Distribution();
      for (let i = 0; i < text.length; i++) {
        model.distribution(text, i, out);
        let sum = out.rest;
        for (let j = 0; j < out.size; j++) sum += out.probs[j];
        expect(Math.abs(sum - 1)).toBeLessThan(1e-12);
        // the distribution agrees with probability() for the coded symbol
        const p = model.probability(text, i, text[i]);
        let inDist = out.unnamed(text[i]);
        for (let j = 0; j < out.size; j++) if (out.symbols[j] === text[i]) inDist = out.probs[j];
        expect(Math.abs(inDist - p)).toBeLessThan(1e-15 + 1e-12 * p);
        model.learn(text, i);
      }
    });
  }

  it('wastes probability without exclusion, as §1 says (sum < 1)', () => {
    const model = engine('C', false);
    model.learnText(cps(TEXT));
    const out = new Distribution();
    const h = cps(TEXT);
    model.distribution(h, h.length, out);
    let sum = out.rest;
    for (let j = 0; j < out.size; j++) sum += out.probs[j];
    expect(sum).toBeCloseTo(50101 / 57344, 12); // docs/references.md §1, derived
    for (let j = 0; j < out.size; j++)
      expect(out.probs[j]).toBeCloseTo(model.probability(h, h.length, out.symbols[j]), 14);
    expect(out.unnamed(0x74)).toBeCloseTo(15 / 57344, 14); // P(t), docs/references.md §1, derived
  });

  it('gives every code point a positive probability with literals on', () => {
    const model = PpmModel.train(cps('hello world'), { order: 3 });
    const h = cps('hello w');
    for (const cp of [0, 65, 255, 256, 0x4e2d, 0x1f600, 0x10ffff])
      expect(model.probability(h, h.length, cp)).toBeGreaterThan(0);
  });

  it('leaves a frozen model unchanged by learn()', () => {
    const model = PpmModel.train(cps('abcabcabd'), { order: 2 }).freeze();
    const h = cps('abcabcabc');
    const before = model.probability(h, 8, 'c'.charCodeAt(0));
    for (let i = 0; i < h.length; i++) model.learn(h, i);
    expect(model.probability(h, 8, 'c'.charCodeAt(0))).toBe(before);
  });

  it('answers the same in any call order as in sequence (context cache)', () => {
    const model = PpmModel.train(text.subarray(0, 2000), { order: 4 }).freeze();
    const seq: number[] = [];
    for (let i = 0; i < 300; i++) seq.push(model.probability(text, 2000 + i, text[2000 + i]));
    const random2 = seededRandom(3);
    for (let k = 0; k < 300; k++) {
      const i = Math.floor(random2() * 300);
      expect(model.probability(text, 2000 + i, text[2000 + i])).toBe(seq[i]);
    }
  });
});
