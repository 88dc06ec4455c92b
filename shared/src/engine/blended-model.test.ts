// Blending a personal and a base model (derived properties of a mixture;
// no published check value).
import { describe, expect, it } from 'vitest';
import { PpmModel } from './ppm-model';
import { BlendedModel, blendBits, tuneBaseWeight } from './blended-model';
import { Distribution } from './model-types';
import { codePointsOf } from './text-preparation';

const personalText = codePointsOf(
  'Biscuit the dog likes the park. Nan makes tea. Biscuit likes tea too. We walk Biscuit to the park every day.\n'.repeat(
    8,
  ),
);
const baseText = codePointsOf(
  'The committee said the report on the election was fair. The city and the county agreed on the plan for the park.\n'.repeat(
    8,
  ),
);
const heldOut = codePointsOf(
  'Nan and Biscuit walk to the park; the committee agreed the tea was fair. Zebra! 🐕',
);

const personal = (): PpmModel => PpmModel.train(personalText, { order: 4 }).freeze();
const base = (): PpmModel => PpmModel.train(baseText, { order: 5 }).freeze();

describe('BlendedModel', () => {
  it('equals the personal model at λ = 0 and the base model at λ = 1', () => {
    const p = personal();
    const b = base();
    const d0 = new Distribution();
    const dp = new Distribution();
    for (let i = 0; i < heldOut.length; i++) {
      expect(new BlendedModel(p, b, 0).probability(heldOut, i, heldOut[i])).toBe(
        p.probability(heldOut, i, heldOut[i]),
      );
      expect(new BlendedModel(p, b, 1).probability(heldOut, i, heldOut[i])).toBe(
        b.probability(heldOut, i, heldOut[i]),
      );
      new BlendedModel(p, b, 0).distribution(heldOut, i, d0);
      p.distribution(heldOut, i, dp);
      // every symbol the blend names has the personal model's probability
      // (named or not), and the unnamed mass matches what is left over
      const named = new Map<number, number>();
      for (let j = 0; j < dp.size; j++) named.set(dp.symbols[j], dp.probs[j]);
      let extra = 0;
      for (let k = 0; k < d0.size; k++) {
        const s = d0.symbols[k];
        expect(d0.probs[k]).toBeCloseTo(named.get(s) ?? dp.unnamed(s), 15);
        if (!named.has(s)) extra += d0.probs[k];
      }
      expect(d0.rest + extra).toBeCloseTo(dp.rest, 14);
    }
  });

  it('sums to 1 and agrees with probability() at every position', () => {
    const blend = new BlendedModel(personal(), base(), 0.37);
    const out = new Distribution();
    for (let i = 0; i < heldOut.length; i++) {
      blend.distribution(heldOut, i, out);
      let sum = out.rest;
      let px = out.unnamed(heldOut[i]);
      for (let j = 0; j < out.size; j++) {
        sum += out.probs[j];
        if (out.symbols[j] === heldOut[i]) px = out.probs[j];
      }
      expect(sum).toBeCloseTo(1, 12);
      expect(px).toBeCloseTo(blend.probability(heldOut, i, heldOut[i]), 14);
    }
  });

  it('tunes λ to no worse than either model alone on held-out text', () => {
    const p = personal();
    const b = base();
    const baseWeight = tuneBaseWeight(p, b, heldOut);
    expect(baseWeight).toBeGreaterThan(0);
    expect(baseWeight).toBeLessThan(1);
    const tuned = blendBits(p, b, heldOut, baseWeight);
    expect(tuned).toBeLessThanOrEqual(blendBits(p, b, heldOut, 0));
    expect(tuned).toBeLessThanOrEqual(blendBits(p, b, heldOut, 1));
    // and it is a minimum: nearby weights are no better
    expect(tuned).toBeLessThanOrEqual(blendBits(p, b, heldOut, Math.min(1, baseWeight + 0.01)) + 1e-9);
    expect(tuned).toBeLessThanOrEqual(blendBits(p, b, heldOut, Math.max(0, baseWeight - 0.01)) + 1e-9);
  });

  it('rejects a weight outside 0..1', () => {
    expect(() => new BlendedModel(personal(), base(), 1.5)).toThrow(RangeError);
  });
});
