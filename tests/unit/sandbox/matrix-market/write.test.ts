import { describe, expect, it } from 'vitest';
import { parseMatrixMarket } from '@sandbox/matrix-market/read.ts';
import { writeMatrixMarket } from '@sandbox/matrix-market/write.ts';
import { mulberry32 } from '@tests/helpers/seeded-random.ts';

/** The bit patterns of a Float64Array, for exact comparison (−0 and +0 differ). */
const bits = (a: Float64Array): bigint[] =>
  Array.from(new BigUint64Array(a.buffer, a.byteOffset, a.length));

// Values whose decimal form is hard to get right: non-terminating binary fractions, the smallest
// normal and subnormal numbers, the largest finite number, −0 (IEEE 754-2019 §3.4, from memory; ECMA-262
// Number.MIN_VALUE = 2^-1074, Number.MAX_VALUE = (2 − 2^-52)·2^1023).
const HARD = [
  0.1,
  1 / 3,
  1e-300,
  5e-324,
  -0,
  1e308,
  -1e308,
  2 ** -1022,
  Number.MAX_VALUE,
  1 + 2 ** -52,
  -2 / 3,
  123456789.123,
];

/** A random m×n matrix mixing HARD values, random doubles of all magnitudes, zeros and −0. */
function randomMatrix(m: number, n: number, seed: number): Float64Array {
  const next = mulberry32(seed);
  const a = new Float64Array(m * n);
  for (let k = 0; k < a.length; k++) {
    const r = next();
    if (r < 0.3) a[k] = HARD[Math.floor(next() * HARD.length)]!;
    else if (r < 0.45) a[k] = 0;
    else a[k] = (next() - 0.5) * 2 ** Math.floor(next() * 400 - 200);
  }
  return a;
}

/** Random finite doubles from random 64-bit patterns (every exponent, subnormals included). */
function randomBitPatterns(count: number, seed: number): Float64Array {
  const next = mulberry32(seed);
  const words = new Uint32Array(2 * count);
  for (let k = 0; k < words.length; k++) words[k] = Math.floor(next() * 2 ** 32);
  const a = new Float64Array(words.buffer);
  for (let k = 0; k < count; k++) if (!Number.isFinite(a[k]!)) a[k] = k; // NaN/Inf patterns → k
  return a;
}

describe('writeMatrixMarket → parseMatrixMarket round trips bit for bit', () => {
  for (const format of ['coordinate', 'array'] as const) {
    it(`general ${format}: random rectangular matrices with hard values`, () => {
      for (const [m, n, seed] of [
        [7, 5, 1],
        [1, 9, 2],
        [12, 12, 3],
      ] as const) {
        const a = randomMatrix(m, n, seed);
        const p = parseMatrixMarket(writeMatrixMarket(a, m, n, { format }));
        expect({ m: p.m, n: p.n, format: p.format }).toEqual({ m, n, format });
        expect(bits(p.data)).toEqual(bits(a));
      }
    });

    it(`symmetric ${format}: random symmetric matrices including −0 off the diagonal`, () => {
      const n = 9;
      const b = randomMatrix(n, n, 11);
      const a = new Float64Array(n * n);
      for (let i = 0; i < n; i++)
        for (let j = 0; j <= i; j++) a[i * n + j] = a[j * n + i] = b[i * n + j]!;
      a[1 * n + 0] = a[0 * n + 1] = -0;
      const p = parseMatrixMarket(writeMatrixMarket(a, n, n, { format, symmetry: 'symmetric' }));
      expect(p.symmetry).toBe('symmetric');
      expect(bits(p.data)).toEqual(bits(a));
    });
  }

  it('every finite bit pattern of a random sample (2000 values, all exponents)', () => {
    const a = randomBitPatterns(2000, 7);
    const p = parseMatrixMarket(writeMatrixMarket(a, 40, 50, { format: 'array' }));
    expect(bits(p.data)).toEqual(bits(a));
  });

  it('each hard value on its own', () => {
    for (const v of HARD) {
      const a = new Float64Array([v]);
      expect(bits(parseMatrixMarket(writeMatrixMarket(a, 1, 1)).data)).toEqual(bits(a));
    }
  });

  it('keeps a comment, line by line', () => {
    const comment = 'produced by the test suite\n\n  indented line\r\nlast';
    const p = parseMatrixMarket(writeMatrixMarket(new Float64Array([1]), 1, 1, { comment }));
    expect(p.comments).toEqual(['produced by the test suite', '', '  indented line', 'last']);
  });
});

describe('writeMatrixMarket: layout', () => {
  // NISTIR 5935 §3.1: banner, size line `M N L`, then `I J value` with 1-based indices.
  it('writes a coordinate file with 1-based indices and only the nonzero entries', () => {
    const text = writeMatrixMarket(new Float64Array([1, 0, 0, 2.5]), 2, 2);
    expect(text).toBe('%%MatrixMarket matrix coordinate real general\n2 2 2\n1 1 1\n2 2 2.5\n');
  });

  // NISTIR 5935 §3.2: array values are column-major.
  it('writes an array file in column-major order', () => {
    const text = writeMatrixMarket(new Float64Array([1, 2, 3, 4, 5, 6]), 2, 3, { format: 'array' });
    expect(text).toBe('%%MatrixMarket matrix array real general\n2 3\n1\n4\n2\n5\n3\n6\n');
  });

  // References §7 table: for [[4,1,2],[1,5,3],[2,3,6]] SciPy's writer emits `4 1 2 5 3 6`.
  it('writes a symmetric array as its lower triangle, column by column', () => {
    const a = new Float64Array([4, 1, 2, 1, 5, 3, 2, 3, 6]);
    const text = writeMatrixMarket(a, 3, 3, { format: 'array', symmetry: 'symmetric' });
    expect(text).toBe('%%MatrixMarket matrix array real symmetric\n3 3\n4\n1\n2\n5\n3\n6\n');
  });

  it('writes a symmetric coordinate file with entries on or below the diagonal only', () => {
    const a = new Float64Array([2, -1, 0, -1, 2, -1, 0, -1, 2]);
    const text = writeMatrixMarket(a, 3, 3, { symmetry: 'symmetric' });
    expect(text).toBe(
      '%%MatrixMarket matrix coordinate real symmetric\n3 3 5\n1 1 2\n2 1 -1\n2 2 2\n3 2 -1\n3 3 2\n',
    );
  });
});

describe('writeMatrixMarket: bad arguments', () => {
  it('refuses a matrix declared symmetric that is not', () => {
    expect(() =>
      writeMatrixMarket(new Float64Array([1, 2, 3, 4]), 2, 2, { symmetry: 'symmetric' }),
    ).toThrow(
      new RangeError(
        "options.symmetry is 'symmetric' but a is not: entry (2, 1) is 3, entry (1, 2) is 2",
      ),
    );
  });

  it('refuses symmetric when the off-diagonal zeros differ in sign (the bits would not survive)', () => {
    expect(() =>
      writeMatrixMarket(new Float64Array([1, 0, -0, 1]), 2, 2, { symmetry: 'symmetric' }),
    ).toThrow(RangeError);
  });

  it('refuses a non-square matrix declared symmetric', () => {
    expect(() => writeMatrixMarket(new Float64Array(6), 2, 3, { symmetry: 'symmetric' })).toThrow(
      new RangeError("options.symmetry is 'symmetric' but a is 2×3, not square"),
    );
  });

  it('refuses NaN and Infinity, naming the entry', () => {
    expect(() => writeMatrixMarket(new Float64Array([1, NaN]), 1, 2)).toThrow(
      new RangeError('a holds NaN at entry (1, 2); Matrix Market values must be finite'),
    );
    expect(() => writeMatrixMarket(new Float64Array([Infinity]), 1, 1)).toThrow(RangeError);
  });

  it('refuses a length that does not match m·n, bad sizes, a non-Float64Array and bad options', () => {
    expect(() => writeMatrixMarket(new Float64Array(5), 2, 3)).toThrow(
      new RangeError('a must hold m*n = 6 entries, has 5'),
    );
    expect(() => writeMatrixMarket(new Float64Array(0), -1, 0)).toThrow(/^m must be/);
    expect(() => writeMatrixMarket([1] as unknown as Float64Array, 1, 1)).toThrow(TypeError);
    const bad = { format: 'dense' } as unknown as { format: 'array' };
    expect(() => writeMatrixMarket(new Float64Array(1), 1, 1, bad)).toThrow(/^options.format/);
  });

  it('refuses comment text the reader would reject', () => {
    expect(() => writeMatrixMarket(new Float64Array(1), 1, 1, { comment: 'bell \u0007' })).toThrow(
      /^options.comment must not contain control characters/,
    );
    expect(() =>
      writeMatrixMarket(new Float64Array(1), 1, 1, { comment: 'x'.repeat(1023) }),
    ).toThrow(/^options.comment has a line of 1023 characters/);
  });
});
