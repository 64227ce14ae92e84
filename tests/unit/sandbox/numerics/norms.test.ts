import { describe, expect, it } from 'vitest';
import { maxAbs, norm1, normInf, vectorNorm1, vectorNormInf } from '@sandbox/numerics/norms.ts';

// A 2×3 matrix [[1, −2, 3], [−4, 5, −6]]: column sums 5, 7, 9; row sums 6, 15.
const A = Float64Array.from([1, -2, 3, -4, 5, -6]);

describe('norms', () => {
  it('‖A‖₁ is the largest column sum, ‖A‖∞ the largest row sum (rectangular)', () => {
    // Definitions: Golub & Van Loan, 4th ed., §2.3.2 (from memory); sums worked by hand.
    expect(norm1(A, 2, 3)).toBe(9);
    expect(normInf(A, 2, 3)).toBe(15);
    // The transpose swaps the two norms.
    const At = Float64Array.from([1, -4, -2, 5, 3, -6]);
    expect(norm1(At, 3, 2)).toBe(15);
    expect(normInf(At, 3, 2)).toBe(9);
  });

  it('maxAbs and vector norms on a small vector', () => {
    const x = Float64Array.from([3, -7, 0.5]);
    expect(maxAbs(x)).toBe(7);
    expect(maxAbs(x, 1)).toBe(3); // only the first entry
    expect(vectorNormInf(x)).toBe(7);
    expect(vectorNorm1(x)).toBe(10.5);
  });

  it('empty inputs give 0', () => {
    expect(norm1(new Float64Array(0), 0, 0)).toBe(0);
    expect(normInf(new Float64Array(0), 0, 0)).toBe(0);
    expect(norm1(new Float64Array(0), 0, 3)).toBe(0);
    expect(vectorNorm1(new Float64Array(0))).toBe(0);
    expect(vectorNormInf(new Float64Array(0))).toBe(0);
  });

  it('a NaN entry makes every norm NaN rather than being skipped', () => {
    const a = Float64Array.from([1, NaN, 3, 4]);
    expect(norm1(a, 2, 2)).toBeNaN();
    expect(normInf(a, 2, 2)).toBeNaN();
    expect(maxAbs(a)).toBeNaN();
    expect(vectorNorm1(a)).toBeNaN();
  });

  it('Infinity entries give Infinity', () => {
    const a = Float64Array.from([1, -Infinity, 3, 4]);
    expect(norm1(a, 2, 2)).toBe(Infinity);
    expect(normInf(a, 2, 2)).toBe(Infinity);
    expect(vectorNormInf(a)).toBe(Infinity);
  });
});
