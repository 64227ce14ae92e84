/**
 * Seeded random numbers for the statistics tests (test data only, never used by the engine).
 * mulberry32: a 32-bit generator by T. Ettinger (public domain, from memory); normal deviates by the
 * Box–Muller transform (G. E. P. Box & M. E. Muller, Ann. Math. Statist. 29 (1958) 610–611).
 */

/** Uniform deviates in [0, 1) from a 32-bit seed. */
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

/** Standard normal deviates from a seeded uniform generator (Box–Muller, one deviate per pair). */
export function seededNormal(seed: number): () => number {
  const uniform = mulberry32(seed);
  return () => {
    const u1 = 1 - uniform(); // in (0, 1], so the logarithm is finite
    const u2 = uniform();
    return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
  };
}
