/**
 * Family names the engine generates (sandbox/matrices/reference-matrix.ts), offered as
 * suggestions only: the server checks every recipe and says what is wrong with a bad one.
 */
export const suggestedFamilies = [
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
