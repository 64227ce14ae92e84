import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { generalSquareProperties } from '@sandbox/matrices/general-square-properties.ts';
import { uniformEntries } from '@sandbox/matrices/uniform.ts';

/**
 * diagonally-dominant: off-diagonal entries uniform on [−1, 1) (with param upper = 1, the strict
 * lower triangle is zero), diagonal a_jj = max(row j sum, column j sum of the off-diagonal |a|) + 1.
 * So A is strictly diagonally dominant by rows and by columns with margin ≥ 1 (up to the rounding of
 * the sums): GEPP makes no row exchanges and LU without pivoting has growth ≤ 2 (Wilkinson 1961;
 * Higham, ASNA 2nd ed., §9.5, from memory), and ‖A⁻¹‖₁ ≤ 1/margin (J. M. Varah, Linear Algebra
 * Appl. 11 (1975) 3–5, applied to Aᵀ), so κ₁(A) ≤ ‖A‖₁ with a little room for that rounding.
 */
export const diagonallyDominantFamily: FamilyDefinition = {
  seeded: true,
  rectangular: false,
  params: {
    upper: {
      default: 0,
      check: (v) =>
        v === 0 || v === 1 ? undefined : 'upper must be 0 (full) or 1 (upper triangular)',
    },
  },
  build({ n, params, random }) {
    const data = uniformEntries(random, n * n);
    if (params.upper === 1) for (let i = 1; i < n; i++) data.fill(0, i * n, i * n + i);
    const rows = new Float64Array(n);
    const cols = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        if (i === j) continue;
        const v = Math.abs(data[i * n + j]!);
        rows[i]! += v;
        cols[j]! += v;
      }
    }
    for (let j = 0; j < n; j++) data[j * n + j] = Math.max(rows[j]!, cols[j]!) + 1;
    const note =
      params.upper === 1
        ? 'Upper triangular and strictly diagonally dominant: a well-conditioned back-substitution input.'
        : 'Strictly diagonally dominant by rows and columns: no row exchanges, growth ≤ 2 without pivoting.';
    return { data, properties: generalSquareProperties(data, n, { note, kind: 'random' }) };
  },
};
