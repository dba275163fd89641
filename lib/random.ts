/*
 * Seeded random numbers for the demo data generator, the benchmarks and the tests, so that every
 * run draws the same numbers and a failing case can be replayed. Not for secrets.
 */

/** Uniform deviates on [0, 1) from mulberry32, a small 32-bit generator (common practice, no source). */
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

/** Standard normal deviates from uniform ones by the Box–Muller transform (common practice, no source). */
export function gaussianFrom(uniform: () => number): () => number {
  return () => {
    const u1 = 1 - uniform();
    const u2 = uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  };
}

export const seededGaussian = (seed: number): (() => number) => gaussianFrom(seededRandom(seed));
