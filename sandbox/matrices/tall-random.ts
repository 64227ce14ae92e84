import { expectations } from '@sandbox/matrices/expectation-rules.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { uniformEntries } from '@sandbox/matrices/uniform.ts';

/** Largest number of entries m·n of a tall-random matrix (that of a 4096×4096 matrix). */
export const TALL_MAX_ENTRIES = 4096 * 4096;

/**
 * tall-random: m×n with m ≥ n (default m = 2n), entries uniform on [−1, 1), row by row; for
 * Householder QR only. Full column rank with probability one, and well conditioned.
 */
export const tallRandomFamily: FamilyDefinition = {
  seeded: true,
  rectangular: true,
  params: {},
  check: ({ n, m }) =>
    m < n
      ? `tall-random needs m ≥ n, got m = ${m}, n = ${n}`
      : m * n > TALL_MAX_ENTRIES
        ? `tall-random needs m·n ≤ ${TALL_MAX_ENTRIES}, got ${m * n}`
        : undefined,
  build({ n, m, random }) {
    return {
      data: uniformEntries(random, m * n),
      properties: {
        positiveDefinite: false,
        singular: false,
        expectations: expectations({ 'householder-qr': 'factor' }),
        note: `Tall ${m}×${n} random matrix (uniform on [−1, 1)) for Householder QR.`,
      },
    };
  },
};
