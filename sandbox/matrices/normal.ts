import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { generalSquareProperties } from '@sandbox/matrices/general-square-properties.ts';

/**
 * normal: n×n, entries independent standard normal (polar method, random.ts), row by row. GEPP's
 * growth on such matrices is modest, median about 5 at n = 100 (references §3, fact 4).
 */
export const normalFamily: FamilyDefinition = {
  seeded: true,
  rectangular: false,
  params: {},
  build({ n, random }) {
    const data = new Float64Array(n * n);
    for (let k = 0; k < n * n; k++) data[k] = random.normal();
    const note = 'Random Gaussian entries: typical growth and condition for dense LU.';
    return { data, properties: generalSquareProperties(data, n, { note, kind: 'random' }) };
  },
};
