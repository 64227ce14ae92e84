/**
 * Seeded random numbers for test data (never used by the engine, whose matrices draw from
 * sandbox/matrices/random.ts). mulberry32: a 32-bit generator by T. Ettinger (public domain, from
 * memory); normal deviates by the Box–Muller transform (G. E. P. Box & M. E. Muller, Ann. Math.
 * Statist. 29 (1958) 610–611). Each call of a factory starts a fresh, reproducible stream.
 */

/** Uniform deviates in [0, 1), multiples of 2^-32, from a 32-bit seed (mulberry32). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Uniform deviates in [−1, 1) from a 32-bit seed: 2·mulberry32 − 1 (exact in double). */
export function seededUniform(seed: number): () => number {
  const uniform = mulberry32(seed);
  return () => uniform() * 2 - 1;
}

/** Standard normal deviates from a seeded uniform generator (Box–Muller, one deviate per pair). */
export function seededNormal(seed: number): () => number {
  const uniform = mulberry32(seed);
  return () => {
    const u1 = 1 - uniform(); // in (0, 1], so the logarithm is finite
    const u2 = uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  };
}
