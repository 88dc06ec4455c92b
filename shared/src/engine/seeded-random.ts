// A small seeded generator (mulberry32) so tests and benchmarks see the same
// data in every run. Not for anything that needs unpredictability.

/** Returns a function giving numbers in [0, 1), determined by `seed` (any 32-bit integer). */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
