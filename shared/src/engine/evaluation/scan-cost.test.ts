import { describe, expect, it } from 'vitest';
import { AddOneModel, seededRandom } from '../search/reference-models';
import { toCodePoints } from '../search/word-chars';
import { entropyBits, huffmanLengths } from './huffman';
import { scanCosts } from './scan-cost';
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
