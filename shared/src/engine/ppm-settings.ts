// Settings of a PPM model and their validation.

/** Escape methods (docs/references.md §1): A and B (Cleary & Witten 1984; B is the reduced-count definition), C (Moffat 1990), D (Howard 1993). */
export type EscapeMethod = 'A' | 'B' | 'C' | 'D';

/** Number of Unicode code points (0..0x10FFFF). */
export const CODE_POINT_LIMIT = 0x110000;

export type PpmSettings = {
  /** Maximum context order k, 0..12. */
  order: number;
  escape: EscapeMethod;
  /** Full exclusion: symbols of a context escaped from are removed from lower orders. */
  exclusion: boolean;
  /** Update exclusion: after coding, counts grow only in the contexts escaped from and the one that coded the symbol. */
  updateExclusion: boolean;
  /** Adaptive models keep learning through NextSymbolModel.learn; frozen ones ignore it. */
  adaptive: boolean;
  /**
   * Order -1 base alphabet: code points 0..alphabetSize-1 (1..0x110000),
   * each equally likely. Default 256. Code points at or above it are reached
   * through the literal escape (see `literals`).
   */
  alphabetSize?: number;
  /**
   * Order -1 holds one extra "literal" index (weight 1) that leads to a
   * uniform choice among the code points alphabetSize..0x10FFFF not yet
   * excluded. Default true. False gives the textbook order -1 (uniform over
   * the base alphabet only; docs/references.md §1 uses |A| = 256 this way); then
   * code points >= alphabetSize cannot be coded.
   */
  literals?: boolean;
};

/** Order 5, method C, full exclusion, update exclusion, adaptive. */
export const defaultPpmSettings: PpmSettings = {
  order: 5,
  escape: 'C',
  exclusion: true,
  updateExclusion: true,
  adaptive: true,
  alphabetSize: 256,
  literals: true,
};

/** Settings with every optional member filled in. */
export type ResolvedPpmSettings = Required<PpmSettings>;

/** Fills defaults and checks ranges; throws RangeError naming the bad field. */
export function resolvePpmSettings(settings: Partial<PpmSettings>): ResolvedPpmSettings {
  const s: ResolvedPpmSettings = {
    ...(defaultPpmSettings as ResolvedPpmSettings),
    ...stripUndefined(settings),
  };
  if (!Number.isInteger(s.order) || s.order < 0 || s.order > 12)
    throw new RangeError(`order must be an integer 0..12, got ${s.order}`);
  if (!['A', 'B', 'C', 'D'].includes(s.escape))
    throw new RangeError(`escape must be A, B, C or D, got ${String(s.escape)}`);
  if (!Number.isInteger(s.alphabetSize) || s.alphabetSize < 1 || s.alphabetSize > CODE_POINT_LIMIT) {
    throw new RangeError(`alphabetSize must be an integer 1..${CODE_POINT_LIMIT}, got ${s.alphabetSize}`);
  }
  for (const key of ['exclusion', 'updateExclusion', 'adaptive', 'literals'] as const) {
    if (typeof s[key] !== 'boolean') throw new RangeError(`${key} must be true or false`);
  }
  return s;
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  const out: Partial<T> = {};
  for (const [k, v] of Object.entries(o)) if (v !== undefined) (out as Record<string, unknown>)[k] = v;
  return out;
}
