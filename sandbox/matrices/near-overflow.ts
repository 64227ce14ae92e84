import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { generalSquareProperties } from '@sandbox/matrices/general-square-properties.ts';
import { uniformEntries } from '@sandbox/matrices/uniform.ts';

/** The scale 2^996 ≈ 6.7e299: exact, and below where Veltkamp's split overflows (about 1.3e300). */
export const NEAR_OVERFLOW_SCALE = 2 ** 996;

/**
 * near-overflow: 2^996·B with B uniform on [−1, 1): entries up to 6.7e299, so any product of two
 * entries (a naive sum of squares, a Frobenius norm) overflows, while LU's multipliers stay ≤ 1 and
 * its factors stay near the entries. The power-of-two scale is exact, so κ is that of B. Dekker's
 * split, and with it TwoProduct/Dot2, overflows above about 1.3e300 (references §11, row 43):
 * accurate residuals must rescale by a power of two first.
 */
export const nearOverflowFamily: FamilyDefinition = {
  seeded: true,
  rectangular: false,
  params: {},
  build({ n, random }) {
    const data = uniformEntries(random, n * n);
    for (let k = 0; k < n * n; k++) data[k]! *= NEAR_OVERFLOW_SCALE;
    const note =
      'Entries near 1e300: products overflow, a naive 2-norm in QR overflows; LU is fine.';
    return { data, properties: generalSquareProperties(data, n, { note, kind: 'random' }) };
  },
};
