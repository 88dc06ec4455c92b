import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Distribution, type NextSymbolModel } from '../model-types';
import { AddOneModel, seededRandom } from '../search/reference-models';
import { toCodePoints } from '../search/word-chars';
import { entropyBits, huffmanLengths } from './huffman';
import { keyboardScanStepsOf, scanCosts } from './scan-cost';
import { defaultScanLayout, layoutCost, uniformGrid } from './scan-layout';

describe('huffmanLengths', () => {
  it('gives the textbook code for {0.4, 0.2, 0.2, 0.1, 0.1}', () => {
    // Classic textbook example (from memory): average length 2.2 bits with entropy ≈ 2.122.
    const p = [0.4, 0.2, 0.2, 0.1, 0.1];
    const l = new Int32Array(5);
    huffmanLengths(p, 5, l);
    expect(p.reduce((s, x, i) => s + x * l[i], 0)).toBeCloseTo(2.2, 12);
  });

  it('lies in [H, H + 1) and satisfies Kraft with equality on random distributions', () => {
    // Huffman (1952); bound H ≤ L < H + 1 as in Cover & Thomas (docs/references.md §3, from memory).
    const rnd = seededRandom(3);
    for (let t = 0; t < 300; t++) {
      const n = 1 + Math.floor(rnd() * 80);
      const raw = Array.from({ length: n }, () => rnd() ** 3);
      const sum = raw.reduce((a, b) => a + b, 0);
      const p = raw.map((x) => x / sum);
      const l = new Int32Array(n);
      huffmanLengths(p, n, l);
      const avg = p.reduce((s, x, i) => s + x * l[i], 0);
      const h = entropyBits(p, n);
      expect(avg).toBeGreaterThanOrEqual(h - 1e-12);
      expect(avg).toBeLessThan(h + 1);
      if (n > 1) expect(Array.from(l).reduce((s, x) => s + 2 ** -x, 0)).toBeCloseTo(1, 12);
    }
  });
});

describe('scanCosts', () => {
  it('gives 7.0 row–column steps for a uniform 6×6 grid', () => {
    // docs/references.md §3 (derived): uniform R×C grid costs (R+1)/2 + (C+1)/2 = 7.0 for 6×6.
    const grid = uniformGrid(6, 6);
    const model = new AddOneModel(0, grid.rows.flat().join(''));
    const text = toCodePoints(grid.rows.flat().join('').repeat(3));
    const r = scanCosts(model, text, { layout: grid });
    expect(r.rowColumn).toBeCloseTo(7, 12);
    expect(r.rowColumnTrueText).toBeCloseTo(7, 12);
    // 36 equiprobable symbols: Huffman gives 28 codewords of 5 bits and 8 of 6 bits.
    expect(r.modelOrderedExpected).toBeCloseTo((28 * 5 + 8 * 6) / 36, 12);
    expect(r.bitsPerChar).toBeCloseTo(Math.log2(36), 12);
  });

  it('keeps the model-expected Huffman length within [H, H + 1) on text', () => {
    const m = new AddOneModel(2, 'abcdefgh ');
    m.train(toCodePoints('abc dab fac gad bead head face cafe '.repeat(20)));
    const r = scanCosts(m, toCodePoints('bead face cab fade '), { adaptive: true });
    expect(r.modelOrderedExpected).toBeGreaterThanOrEqual(r.meanEntropy - 1e-12);
    expect(r.modelOrderedExpected).toBeLessThan(r.meanEntropy + 1);
    expect(r.modelOrdered).toBeGreaterThan(0);
  });

  it('charges the default layout by row + column, folding case', () => {
    const cost = layoutCost(defaultScanLayout);
    expect(cost.steps(0x20)).toBe(2);
    expect(cost.steps('e'.codePointAt(0) as number)).toBe(3);
    expect(cost.steps('E'.codePointAt(0) as number)).toBe(3);
    expect(cost.steps('t'.codePointAt(0) as number)).toBe(3);
    expect(cost.steps('€'.codePointAt(0) as number)).toBe(6 + 7 + 7);
  });
});

/** A model with one fixed distribution at every position (named symbols and the unnamed rest). */
class FixedModel implements NextSymbolModel {
  readonly order = 0;
  constructor(
    private readonly named: readonly [string, number][],
    private readonly rest: number,
  ) {}
  distribution(_history: ArrayLike<number>, _end: number, out: Distribution): void {
    out.clear();
    for (const [char, p] of this.named) out.push(char.codePointAt(0) as number, p);
    out.rest = this.rest;
  }
  probability(_history: ArrayLike<number>, _end: number, symbol: number): number {
    const hit = this.named.find(([char]) => char.codePointAt(0) === symbol);
    return hit ? hit[1] : this.rest;
  }
  learn(): void {}
}

describe('scan steps on the keyboard’s own layouts', () => {
  it('matches the expected steps worked out by hand for a fixed distribution', () => {
    // Z 0.2 and z 0.2 (one key, case-folded: 0.4), e 0.2, space 0.2, 7 0.1, unnamed rest 0.1.
    // Steps (row + column over the key rows, suggestion row left out):
    //   space (4,1) = 5 on every layout; 7 = 123 key (5,2) 7 + (1,7) 8 on the symbols layer + ABC
    //   key (4,2) 6 = 21; the rest is charged the costliest key 11 + 7 = 18.
    //   Typewriter: z (3,1) = 4, e (1,3) = 4 → 0.4·4 + 0.2·4 + 0.2·5 + 0.1·21 + 0.1·18 = 7.3.
    //   Alphabetical: z (3,8) = 11, e (1,5) = 6 → 4.4 + 1.2 + 1.0 + 2.1 + 1.8 = 10.5.
    //   Ordered by the model: z first cell (1,1) = 2, e second (1,2) = 3 → 0.8 + 0.6 + 1.0 + 2.1 + 1.8 = 6.3.
    const model = new FixedModel(
      [
        ['Z', 0.2],
        ['z', 0.2],
        ['e', 0.2],
        [' ', 0.2],
        ['7', 0.1],
      ],
      0.1,
    );
    const r = scanCosts(model, toCodePoints('Ze 7z'));
    expect(r.keyboardRowColumn.typewriter).toBeCloseTo(7.3, 12);
    expect(r.keyboardRowColumn.alphabetical).toBeCloseTo(10.5, 12);
    expect(r.keyboardRowColumn['model-ordered']).toBeCloseTo(6.3, 12);
  });

  it('never costs more ordered by the model than in a fixed order, for any distribution', () => {
    // Likeliest letter in the cheapest cell minimises Σ p·steps over the same cells (the
    // rearrangement inequality, derived). The typewriter rows (10, 9, 7) have the same multiset of
    // cell steps as 9, 9, 8 (2, 3, 3, 4×3 … 10×3, 11×2), so the bound holds against them too.
    const letterOrDigit = fc.constantFrom(
      ...'abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ 0.,!#'.split(''),
    );
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.tuple(letterOrDigit, fc.double({ min: 0, max: 1, noNaN: true })), {
          selector: ([char]) => char,
          maxLength: 40,
        }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (pairs, restWeight) => {
          const total = pairs.reduce((s, [, w]) => s + w, 0) + restWeight;
          fc.pre(total > 0);
          const dist = new Distribution(64);
          for (const [char, w] of pairs) dist.push(char.codePointAt(0) as number, w / total);
          dist.rest = restWeight / total;
          const steps = keyboardScanStepsOf(dist);
          expect(steps['model-ordered']).toBeLessThanOrEqual(steps.alphabetical + 1e-9);
          expect(steps['model-ordered']).toBeLessThanOrEqual(steps.typewriter + 1e-9);
        },
      ),
      { numRuns: 500 },
    );
  });
});
