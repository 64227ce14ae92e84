import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { generalSquareProperties } from '@sandbox/matrices/general-square-properties.ts';
import { uniformEntries } from '@sandbox/matrices/uniform.ts';

/** The scale 2^-996 ≈ 1.5e-300 (exact). */
export const NEAR_UNDERFLOW_SCALE = 2 ** -996;

/**
 * near-underflow: 2^-996·B with B uniform on [−1, 1): entries up to 1.5e-300, the small ones
 * subnormal (below 2^-1022 ≈ 2.2e-308) yet exact, since B's entries are multiples of 2^-52 and
 * 2^-1048 is a multiple of the smallest subnormal 2^-1074 (IEEE 754-2019, §3.4). Products of two
 * entries underflow to zero (a naive 2-norm in QR, the error terms of TwoProduct), while LU works
 * on the entries themselves. The scale is exact, so κ is that of B.
 */
export const nearUnderflowFamily: FamilyDefinition = {
  seeded: true,
  rectangular: false,
  params: {},
  build({ n, random }) {
    const data = uniformEntries(random, n * n);
    for (let k = 0; k < n * n; k++) data[k]! *= NEAR_UNDERFLOW_SCALE;
    const note =
      'Entries near 1e-300, some subnormal: products underflow, a naive QR norm becomes 0.';
    return { data, properties: generalSquareProperties(data, n, { note, kind: 'random' }) };
  },
};
