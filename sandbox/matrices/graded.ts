import { exactFacts } from '@sandbox/matrices/exact-analysis.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { generalSquareProperties } from '@sandbox/matrices/general-square-properties.ts';
import { uniformEntries } from '@sandbox/matrices/uniform.ts';

/**
 * graded: A = D·B with B uniform on [−1, 1) and D = diag(2^{−e_i}), e_i = round(decades·log₂10 ·
 * i/(n−1)) for 0-based i: rows scaled over about `decades` decades by powers of two, so the scaling
 * is exact. Row scaling leaves GEPP's pivots scaled copies of an elimination on B — no pivot
 * comes near rounding noise — while κ(A) grows by about 10^decades (Higham, ASNA 2nd ed., §7.3 and
 * §9.8 on scaling, from memory). The expectations therefore follow B; exactCondition1 is A's.
 */
export const gradedFamily: FamilyDefinition = {
  seeded: true,
  rectangular: false,
  params: {
    decades: {
      default: 12,
      check: (v) => (v >= 0 && v <= 200 ? undefined : 'decades must be from 0 to 200'),
    },
  },
  build({ n, params, random }) {
    const b = uniformEntries(random, n * n);
    const data = new Float64Array(n * n);
    const bits = params.decades! * Math.log2(10);
    for (let i = 0; i < n; i++) {
      const scale = 2 ** -Math.round(n === 1 ? 0 : (bits * i) / (n - 1));
      for (let j = 0; j < n; j++) data[i * n + j] = b[i * n + j]! * scale;
    }
    const note = `Rows graded over ${params.decades} decades by exact powers of two: normwise κ is huge, LU is not hurt.`;
    const fromB = generalSquareProperties(b, n, { note, kind: 'random' });
    const facts = exactFacts(data, n);
    const { exactCondition1: _ofB, ...rest } = fromB;
    return {
      data,
      properties:
        facts?.condition1 !== undefined ? { ...rest, exactCondition1: facts.condition1 } : rest,
    };
  },
};
