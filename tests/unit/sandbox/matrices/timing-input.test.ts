import { describe, expect, it } from 'vitest';
import { routineSlugs } from '@shared/routines.ts';
import { timingMatrix } from '@sandbox/matrices/timing-input.ts';

describe('timingMatrix', () => {
  it('gives each routine a square matrix it must factor, reproducibly', () => {
    for (const routine of routineSlugs) {
      const a = timingMatrix(routine, 24, 5);
      expect([a.m, a.n]).toEqual([24, 24]);
      expect(a.properties.expectations[routine]).toBe('factor');
      expect(Array.from(timingMatrix(routine, 24, 5).data)).toEqual(Array.from(a.data));
      expect(Array.from(timingMatrix(routine, 24, 6).data)).not.toEqual(Array.from(a.data));
    }
  });

  it('picks the kind of matrix each routine needs', () => {
    expect(timingMatrix('lu-partial-pivoting', 16, 1).family).toBe('uniform');
    expect(timingMatrix('lu-no-pivoting', 16, 1).family).toBe('diagonally-dominant');
    expect(timingMatrix('cholesky', 16, 1).properties.positiveDefinite).toBe(true);
    expect(timingMatrix('ldlt', 16, 1).properties.positiveDefinite).toBe(true);
    expect(timingMatrix('householder-qr', 16, 1).family).toBe('uniform');
    const u = timingMatrix('back-substitution', 16, 1);
    expect(u.properties.upperTriangular).toBe(true);
    // Strict diagonal dominance bounds κ∞ by about 2n (Varah 1975): well conditioned.
    expect(u.properties.exactCondition1).toBeLessThan(100);
    expect(() => timingMatrix('lu-partial-pivoting', 0, 1)).toThrow(RangeError);
  });
});
