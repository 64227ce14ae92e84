import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { generalSquareProperties } from '@sandbox/matrices/general-square-properties.ts';

/**
 * vandermonde: V_ij = x_i^{j−1} (increasing powers, 1-based) on the equispaced integer nodes
 * x_i = i — a fixed grid, not seeded. Powers by repeated multiplication, exact while n^{n−1} < 2^53
 * (n ≤ 14). det V = ∏_{i<j}(x_j − x_i), the superfactorial ∏_{k<n} k! for these nodes (references
 * §4.13; MATLAB's vander uses decreasing powers, which flips the sign by (−1)^{n(n−1)/2}). κ grows
 * exponentially (Gautschi; Beckermann, Numer. Math. 85 (2000) 553–577, as cited in references
 * §4.13). n ≤ 128 keeps n^{n−1} finite.
 */
export const vandermondeFamily: FamilyDefinition = {
  seeded: false,
  rectangular: false,
  params: {},
  check: ({ n }) => (n > 128 ? 'vandermonde needs n ≤ 128 (larger powers overflow)' : undefined),
  build({ n }) {
    const data = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      let p = 1;
      for (let j = 0; j < n; j++) {
        data[i * n + j] = p;
        p *= i + 1;
      }
    }
    const note =
      'Vandermonde on nodes 1..n (increasing powers): det is the superfactorial, κ explodes.';
    return { data, properties: generalSquareProperties(data, n, { note, kind: 'structured' }) };
  },
};
