import type { Random } from '@sandbox/matrices/random.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { generalSquareProperties } from '@sandbox/matrices/general-square-properties.ts';

/** count entries 2·U − 1 with U uniform on [0, 1): uniform on [−1, 1), multiples of 2^-52. */
export function uniformEntries(random: Random, count: number): Float64Array {
  const data = new Float64Array(count);
  for (let k = 0; k < count; k++) data[k] = 2 * random.uniform() - 1;
  return data;
}

/**
 * uniform: n×n, entries independent and uniform on [−1, 1), row by row from the seeded stream.
 * LAPACK's own tests run on such matrices (references §1.3–1.4).
 */
export const uniformFamily: FamilyDefinition = {
  seeded: true,
  rectangular: false,
  params: {},
  build({ n, random }) {
    const data = uniformEntries(random, n * n);
    const note =
      'Random entries uniform on [−1, 1): well conditioned, the baseline for every ratio.';
    return { data, properties: generalSquareProperties(data, n, { note, kind: 'random' }) };
  },
};
