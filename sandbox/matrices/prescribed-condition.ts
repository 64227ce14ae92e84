import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { generalSquareProperties } from '@sandbox/matrices/general-square-properties.ts';
import { randomOrthogonal } from '@sandbox/matrices/random-orthogonal.ts';

/**
 * prescribed-condition: A = U·Σ·Vᵀ with U, V Haar orthogonal (random-orthogonal.ts, U drawn first)
 * and σ_i = cond^{−(i−1)/(n−1)}, geometrically spaced from 1 down to 1/cond (LAPACK DLATM1 MODE 3
 * with DLAGGE-style random orthogonal factors, references §4.9; Higham's randsvd, ASNA §28.3, from
 * memory). So κ₂(A) = cond exactly in exact arithmetic (σ_i via Math.pow, whose bits rely on V8's
 * own fdlibm-derived implementation, from memory); the stored matrix agrees to about n·u·cond
 * relative. κ₁ is not known exactly; κ₁ ≤ n·κ₂ bounds it. Cost about 10n³ flops, hence n ≤ 1024.
 */
export const prescribedConditionFamily: FamilyDefinition = {
  seeded: true,
  rectangular: false,
  params: {
    cond: {
      default: 1e6,
      check: (v) => (v >= 1 && v <= 1e300 ? undefined : 'cond must be from 1 to 1e300'),
    },
  },
  check: ({ n, params }) =>
    n === 1 && params.cond !== 1
      ? 'n = 1 has a single singular value: cond must be 1'
      : n > 1024
        ? 'prescribed-condition needs n ≤ 1024 (building it costs about 10n³ flops)'
        : undefined,
  build({ n, params, random }) {
    const cond = params.cond!;
    const u = randomOrthogonal(n, random);
    const v = randomOrthogonal(n, random);
    const sigma = new Float64Array(n);
    for (let i = 0; i < n; i++) sigma[i] = n === 1 ? 1 : Math.pow(cond, -i / (n - 1));
    const data = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let s = 0;
        for (let k = 0; k < n; k++) s += u[i * n + k]! * sigma[k]! * v[j * n + k]!;
        data[i * n + j] = s;
      }
    }
    const note = `Random U·Σ·Vᵀ with κ₂ = ${cond} by construction (σ geometric); κ₁ not exact.`;
    return {
      data,
      properties: generalSquareProperties(data, n, {
        note,
        kind: 'structured',
        condition1Bound: n * cond,
      }),
    };
  },
};
