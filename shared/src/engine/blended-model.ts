// A personal model and a base model mixed into one distribution:
// P(x) = (1 - λ) · P_personal(x) + λ · P_base(x), λ = weight of the base.
import { Distribution, type NextSymbolModel } from './model-types';
import { markArray, nextToken, slotArray } from './symbol-marks';

export class BlendedModel implements NextSymbolModel {
  readonly order: number;
  private readonly d1 = new Distribution(256);
  private readonly d2 = new Distribution(256);

  /**
   * @param personal the client's model
   * @param base the general model
   * @param baseWeight λ in 0..1: 0 = personal alone, 1 = base alone
   */
  constructor(
    readonly personal: NextSymbolModel,
    readonly base: NextSymbolModel,
    readonly baseWeight: number,
  ) {
    if (!(baseWeight >= 0 && baseWeight <= 1))
      throw new RangeError(`blend weight must be in 0..1, got ${baseWeight}`);
    this.order = Math.max(personal.order, base.order);
  }

  probability(history: ArrayLike<number>, end: number, symbol: number): number {
    const w = this.baseWeight;
    if (w === 0) return this.personal.probability(history, end, symbol);
    if (w === 1) return this.base.probability(history, end, symbol);
    return (
      (1 - w) * this.personal.probability(history, end, symbol) +
      w * this.base.probability(history, end, symbol)
    );
  }

  /**
   * Fills `out` with the mixture. The unnamed probabilities are exact when
   * both models use the same split (order -1 alphabet size); otherwise the
   * smaller split is used and the per-code-point values between the two
   * splits are approximate.
   */
  distribution(history: ArrayLike<number>, end: number, out: Distribution): void {
    const w = this.baseWeight;
    const d1 = this.d1;
    const d2 = this.d2;
    this.personal.distribution(history, end, d1);
    this.base.distribution(history, end, d2);
    out.clear();
    const mark = markArray();
    const slot = slotArray();
    const token = nextToken();
    for (let i = 0; i < d2.size; i++) {
      mark[d2.symbols[i]] = token;
      slot[d2.symbols[i]] = i;
    }
    let movedFrom1 = 0; // d1's unnamed mass now given to symbols only d2 names
    let movedFrom2 = 0;
    for (let i = 0; i < d1.size; i++) {
      const s = d1.symbols[i];
      let p2: number;
      if (mark[s] === token) {
        p2 = d2.probs[slot[s]];
        mark[s] = 0; // consumed
      } else {
        p2 = d2.unnamed(s);
        movedFrom2 += p2;
      }
      out.push(s, (1 - w) * d1.probs[i] + w * p2);
    }
    for (let i = 0; i < d2.size; i++) {
      const s = d2.symbols[i];
      if (mark[s] !== token) continue;
      const p1 = d1.unnamed(s);
      movedFrom1 += p1;
      out.push(s, (1 - w) * p1 + w * d2.probs[i]);
    }
    out.rest = Math.max(0, (1 - w) * (d1.rest - movedFrom1) + w * (d2.rest - movedFrom2));
    out.split = Math.min(d1.split, d2.split);
    out.unnamedBelow = (1 - w) * d1.unnamedBelow + w * d2.unnamedBelow;
    out.unnamedAbove = (1 - w) * d1.unnamedAbove + w * d2.unnamedAbove;
  }

  /** Passes the symbol to both models (each learns only if it is adaptive). */
  learn(history: ArrayLike<number>, end: number): void {
    this.personal.learn(history, end);
    this.base.learn(history, end);
  }
}

/**
 * The λ in 0..1 that minimises the bits of `heldOut` under the blend, with
 * both models held still (no learning during tuning). The cost
 * f(λ) = -Σ log2((1-λ)·p1 + λ·p2) is convex in λ, so bisection on its
 * derivative (60 halvings, far below any useful precision) finds the
 * global minimum; an endpoint is returned when the slope there already
 * points outward. Empty held-out text gives 0.5.
 */
export function tuneBaseWeight(
  personal: NextSymbolModel,
  base: NextSymbolModel,
  heldOut: ArrayLike<number>,
): number {
  const n = heldOut.length;
  if (n === 0) return 0.5;
  const p1 = new Float64Array(n);
  const p2 = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    p1[i] = personal.probability(heldOut, i, heldOut[i]);
    p2[i] = base.probability(heldOut, i, heldOut[i]);
  }
  // slope(λ) is proportional to f'(λ) = -(1/ln 2) Σ (p2 - p1) / mix(λ).
  const slope = (lambda: number): number => {
    let s = 0;
    for (let i = 0; i < n; i++) s -= (p2[i] - p1[i]) / ((1 - lambda) * p1[i] + lambda * p2[i]);
    return s;
  };
  if (slope(0) >= 0) return 0;
  if (slope(1) <= 0) return 1;
  let lo = 0;
  let hi = 1;
  for (let k = 0; k < 60; k++) {
    const mid = (lo + hi) / 2;
    if (slope(mid) < 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Bits of `heldOut` under the blend with weight λ, models held still (for checking a tuned weight). */
export function blendBits(
  personal: NextSymbolModel,
  base: NextSymbolModel,
  heldOut: ArrayLike<number>,
  baseWeight: number,
): number {
  const blend = new BlendedModel(personal, base, baseWeight);
  let bits = 0;
  for (let i = 0; i < heldOut.length; i++) bits -= Math.log2(blend.probability(heldOut, i, heldOut[i]));
  return bits;
}
