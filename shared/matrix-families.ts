/**
 * The generated reference-matrix families the engine knows (sandbox/matrices/), by slug: the
 * engine generates them, the client offers them when a maintainer adds one to a matrix set.
 */
export const familySlugs = [
  'uniform',
  'normal',
  'diagonally-dominant',
  'spd-random',
  'prescribed-condition',
  'hilbert',
  'pascal',
  'lehmer',
  'minij',
  'moler',
  'frank',
  'kahan',
  'worst-growth',
  'poisson-1d',
  'poisson-2d',
  'vandermonde',
  'graded',
  'near-overflow',
  'near-underflow',
  'needs-row-exchange',
  'singular',
  'nearly-singular',
  'indefinite',
  'tall-random',
] as const;
export type FamilySlug = (typeof familySlugs)[number];
