import { describe, expect, it } from 'vitest';
import { subtractRowProducts } from '@sandbox/reference/row-block-update.ts';
import { randomMatrix } from '@tests/helpers/test-matrices.ts';

// The row-block kernel unrolls over target rows (pairs), source rows (fours) and columns (fours,
// twos for a lone row), each with its own leftover path. Every path must subtract the products
// one at a time in increasing source-row order, so the plain triple loop below gives the same
// numbers exactly (===): that order is what makes the blocked LU and Cholesky bit-for-bit equal
// to their unblocked loops (the specification in sandbox/reference/gepp.ts and cholesky.ts).
function plain(
  w: Float64Array,
  n: number,
  [i0, i1, p0, p1, j0, j1]: number[],
  s: Float64Array,
  s0: number,
): void {
  for (let i = i0!; i < i1!; i++)
    for (let j = j0!; j < j1!; j++) {
      let x = w[i * n + j]!;
      for (let p = p0!; p < p1!; p++) x = x - w[i * n + p]! * s[(p - p0! + s0) * n + j]!;
      w[i * n + j] = x;
    }
}

function differing(x: Float64Array, y: Float64Array): number {
  let count = 0;
  for (let k = 0; k < x.length; k++) if (x[k] !== y[k]) count++;
  return count;
}

describe('subtractRowProducts', () => {
  const n = 48;
  // [i0, i1, p0, p1, j0, j1]: targets below and right of the sources, with even and odd row
  // counts, source counts 1…9 and 37 (beyond one chunk of 32), column counts 1…7 and 31.
  const ranges = [
    [20, 22, 0, 4, 20, 24],
    [20, 23, 0, 5, 20, 27],
    [21, 48, 3, 12, 21, 26],
    [40, 41, 0, 3, 40, 41],
    [41, 48, 1, 38, 41, 48],
    [17, 48, 0, 9, 17, 48],
    [30, 33, 2, 3, 30, 37],
    [38, 48, 0, 37, 38, 40],
  ];

  it('equals the plain loop exactly on every leftover path (one array)', () => {
    for (const [index, r] of ranges.entries()) {
      const w = randomMatrix(n, n, 300 + index);
      const expected = Float64Array.from(w);
      plain(expected, n, r, expected, r[2]!);
      subtractRowProducts(w, n, r[0]!, r[1]!, r[2]!, r[3]!, r[4]!, r[5]!);
      expect(differing(w, expected)).toBe(0);
    }
  });

  it('equals the plain loop exactly with the source rows in a separate array', () => {
    for (const [index, r] of ranges.entries()) {
      const w = randomMatrix(n, n, 400 + index);
      const s = randomMatrix(40, n, 500 + index);
      const s0 = 1 + (index % 2);
      const expected = Float64Array.from(w);
      plain(expected, n, r, s, s0);
      subtractRowProducts(w, n, r[0]!, r[1]!, r[2]!, r[3]!, r[4]!, r[5]!, s, s0);
      expect(differing(w, expected)).toBe(0);
    }
  });

  it('leaves every entry outside the target block alone', () => {
    const w = randomMatrix(n, n, 7);
    const before = Float64Array.from(w);
    subtractRowProducts(w, n, 21, 30, 3, 12, 21, 26);
    for (let i = 0; i < n; i++)
      for (let j = 0; j < n; j++)
        if (i < 21 || i >= 30 || j < 21 || j >= 26) expect(w[i * n + j]).toBe(before[i * n + j]);
  });
});
