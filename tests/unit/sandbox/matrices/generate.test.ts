import { describe, expect, it } from 'vitest';
import {
  DEFAULT_SEED,
  familyDefinitions,
  generateMatrix,
  matrixId,
  resolveMatrixSpec,
} from '@sandbox/matrices/generate.ts';
import {
  familySlugs,
  type FamilySlug,
  type MatrixSpec,
} from '@sandbox/matrices/reference-matrix.ts';

/** Small valid sizes for each family (poisson-2d needs squares, some families a minimum order). */
const smallSizes: Record<FamilySlug, number[]> = {
  uniform: [1, 2, 5],
  normal: [1, 2, 5],
  'diagonally-dominant': [1, 3, 6],
  'spd-random': [1, 3, 6],
  'prescribed-condition': [2, 5],
  hilbert: [1, 2, 7],
  pascal: [1, 2, 7],
  lehmer: [1, 2, 7],
  minij: [1, 2, 7],
  moler: [1, 2, 7],
  frank: [1, 2, 7],
  kahan: [1, 2, 7],
  'worst-growth': [1, 2, 7],
  'poisson-1d': [1, 2, 7],
  'poisson-2d': [1, 4, 9],
  vandermonde: [1, 2, 7],
  graded: [1, 2, 7],
  'near-overflow': [1, 2, 7],
  'near-underflow': [1, 2, 7],
  'needs-row-exchange': [2, 3, 7],
  singular: [2, 3, 7],
  'nearly-singular': [3, 4, 7],
  indefinite: [2, 3, 7],
  'tall-random': [1, 2, 7],
};

const bits = (a: Float64Array) => Array.from(new Uint8Array(a.buffer, a.byteOffset, a.byteLength));

describe('generateMatrix', () => {
  it('builds every family at small n with finite entries and consistent shapes', () => {
    for (const family of familySlugs) {
      for (const n of smallSizes[family]) {
        const r = generateMatrix({ family, n });
        expect(r.family).toBe(family);
        expect(r.n).toBe(n);
        expect(r.data.length).toBe(r.m * r.n);
        expect(r.data.every(Number.isFinite)).toBe(true);
        expect(r.properties.note.length).toBeGreaterThan(10);
        expect(r.properties.expectations['householder-qr']).toBe('factor');
      }
    }
  });

  it('gives identical bits for the same spec and different ones for another seed', () => {
    for (const family of familySlugs.filter((f) => familyDefinitions[f].seeded)) {
      const n = family === 'tall-random' ? 4 : 6;
      const spec: MatrixSpec = { family, n, seed: 12 };
      expect(bits(generateMatrix(spec).data)).toEqual(bits(generateMatrix({ ...spec }).data));
      expect(bits(generateMatrix(spec).data)).not.toEqual(
        bits(generateMatrix({ ...spec, seed: 13 }).data),
      );
    }
    // Families draw from separate streams: the same seed gives unrelated numbers.
    const u = generateMatrix({ family: 'uniform', n: 4, seed: 1 }).data;
    const g = generateMatrix({ family: 'graded', n: 4, seed: 1, params: { decades: 0 } }).data;
    expect(bits(u)).not.toEqual(bits(g));
  });

  it('draws the uniform family from the documented stream', () => {
    // Check values from an independent C program: FNV-1a("uniform") = 3728169555, state words
    // splitmix32(1) xor splitmix32(3728169555), xoshiro128**, 53-bit uniforms mapped to 2u − 1.
    const r = generateMatrix({ family: 'uniform', n: 2, seed: 1 });
    expect(Array.from(r.data)).toEqual([
      0.073414312847815522, -0.98948944486134405, 0.11333398587912136, -0.85669213479940787,
    ]);
  });

  it('names matrices by family, size, seed and non-default parameters', () => {
    expect(generateMatrix({ family: 'hilbert', n: 8 }).id).toBe('hilbert-n8');
    expect(generateMatrix({ family: 'uniform', n: 64, seed: 3 }).id).toBe('uniform-n64-s3');
    expect(generateMatrix({ family: 'uniform', n: 4 }).id).toBe(`uniform-n4-s${DEFAULT_SEED}`);
    expect(generateMatrix({ family: 'worst-growth', n: 40, params: { alpha: 0.5 } }).id).toBe(
      'worst-growth-n40-alpha0.5',
    );
    expect(generateMatrix({ family: 'worst-growth', n: 40, params: { alpha: 1 } }).id).toBe(
      'worst-growth-n40',
    );
    expect(
      matrixId(resolveMatrixSpec({ family: 'prescribed-condition', n: 9, params: { cond: 1e12 } })),
    ).toBe('prescribed-condition-n9-s1-cond1e12');
    // Unseeded families ignore a seed.
    const h = generateMatrix({ family: 'hilbert', n: 3, seed: 99 });
    expect([h.id, h.seed]).toEqual(['hilbert-n3', 0]);
  });

  it('fills in default parameters', () => {
    expect(generateMatrix({ family: 'kahan', n: 3 }).params).toEqual({ theta: 1.2 });
    expect(generateMatrix({ family: 'graded', n: 3 }).params).toEqual({ decades: 12 });
    expect(generateMatrix({ family: 'prescribed-condition', n: 3 }).params).toEqual({ cond: 1e6 });
    expect(generateMatrix({ family: 'moler', n: 3 }).params).toEqual({ alpha: -1 });
    expect(generateMatrix({ family: 'minij', n: 3 }).params).toEqual({});
  });

  it('rejects bad specs with RangeErrors that name the field', () => {
    const bad: [MatrixSpec, RegExp][] = [
      [{ family: 'nope' as FamilySlug, n: 3 }, /family must be one of/],
      [{ family: 'uniform', n: 0 }, /n must be an integer from 1 to 4096/],
      [{ family: 'uniform', n: 4097 }, /n must be/],
      [{ family: 'uniform', n: 2.5 }, /n must be/],
      [{ family: 'uniform', n: 3, m: 4 }, /m must equal n/],
      [{ family: 'uniform', n: 3, seed: -1 }, /seed/],
      [{ family: 'uniform', n: 3, seed: 2 ** 32 }, /seed/],
      [
        { family: 'hilbert', n: 3, params: { alpha: 1 } },
        /params.alpha is not a parameter of hilbert \(it takes none\)/,
      ],
      [{ family: 'kahan', n: 3, params: { theta: NaN } }, /params.theta must be a finite number/],
      [{ family: 'kahan', n: 3, params: { theta: 2 } }, /params.theta: theta must be in/],
      [{ family: 'kahan', n: 3000, params: { theta: 0.1 } }, /underflow/],
      [{ family: 'prescribed-condition', n: 1, params: { cond: 10 } }, /cond must be 1/],
      [{ family: 'pascal', n: 600 }, /n ≤ 512/],
      [{ family: 'graded', n: 3, params: { decades: 500 } }, /decades/],
      [{ family: 'diagonally-dominant', n: 3, params: { upper: 0.5 } }, /upper/],
      [{ family: 'tall-random', n: 3000, m: 8000 }, /m·n/],
    ];
    for (const [spec, message] of bad) expect(() => generateMatrix(spec)).toThrow(message);
    for (const [spec] of bad) expect(() => generateMatrix(spec)).toThrow(RangeError);
  });
});
