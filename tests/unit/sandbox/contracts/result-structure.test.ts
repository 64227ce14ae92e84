import { describe, expect, it } from 'vitest';
import {
  firstNonFinite,
  nonPositiveDiagonalProblem,
  permutationProblem,
} from '@sandbox/contracts/result-structure.ts';

// 3×3 row-major with NaN at (0, 2) (upper), (2, 0) (strict lower) and (1, 1) (diagonal): each
// region must find exactly the NaN it reads (invented data).
const a = Float64Array.from([1, 1, NaN, 1, NaN, 1, NaN, 1, 1]);

describe('firstNonFinite', () => {
  it('looks only inside the region the checks read', () => {
    expect(firstNonFinite(a, 3, 3, 'all')).toBe(2);
    expect(firstNonFinite(a, 3, 3, 'upper')).toBe(2);
    expect(firstNonFinite(a, 3, 3, 'lower')).toBe(4);
    expect(firstNonFinite(a, 3, 3, 'strict-lower')).toBe(6);
    expect(firstNonFinite(new Float64Array(9), 3, 3, 'all')).toBe(-1);
  });
});

describe('permutationProblem', () => {
  it('accepts a permutation and the empty one', () => {
    expect(permutationProblem([2, 0, 1], 3)).toBeNull();
    expect(permutationProblem([], 0)).toBeNull();
  });
  it('reports the first problem in order', () => {
    expect(permutationProblem([1, 1, 3], 3)).toBe('perm repeats 1 at positions 0 and 1');
    expect(permutationProblem([0, 3, 1], 3)).toBe('perm[1] = 3 is out of range 0..2');
  });
});

describe('nonPositiveDiagonalProblem', () => {
  it('rejects zero, negative and NaN diagonals, not off-diagonal entries', () => {
    expect(nonPositiveDiagonalProblem([1, -5, -5, 2], 2)).toBeNull();
    expect(nonPositiveDiagonalProblem([1, 0, 0, NaN], 2)).toMatch(/^l\[1, 1\] = NaN/);
  });
});
