import { describe, expect, it } from 'vitest';
import { validateResult } from '@sandbox/contracts/validate-result.ts';

// Every expected message below is the wording the contract promises (routine-signatures.ts and
// result-structure.ts); the inputs are invented.
const dims = (n: number, m = n) => ({ m, n });
const perm = (...p: number[]) => Int32Array.from(p);
const identity = (n: number) => perm(...Array.from({ length: n }, (_, i) => i));

describe('validateResult for lu-partial-pivoting', () => {
  it('accepts exact typed arrays and keeps only the contract fields', () => {
    const lu = new Float64Array(9).fill(1);
    const out = validateResult(
      'lu-partial-pivoting',
      { lu, perm: perm(2, 0, 1), extra: 1 },
      dims(3),
    );
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(Object.keys(out.result).sort()).toEqual(['lu', 'perm']);
    expect(out.result.lu).toBe(lu);
  });

  it('rejects a value that is not an object of fields', () => {
    expect(validateResult('lu-partial-pivoting', undefined, dims(3))).toEqual({
      ok: false,
      status: 'invalid-output',
      message: 'factor must return an object with lu and perm, got undefined',
    });
    const typed = validateResult('lu-partial-pivoting', new Float64Array(9), dims(3));
    expect(typed.ok || typed.message).toBe(
      'factor must return an object with lu and perm, got Float64Array of length 9',
    );
  });

  it('rejects a Promise from an async kernel', () => {
    const out = validateResult('lu-partial-pivoting', Promise.resolve({}), dims(3));
    expect(out.ok || out.message).toBe(
      'factor returned a Promise: kernels must be synchronous (async functions are not supported)',
    );
  });

  it('rejects plain arrays, other typed arrays and wrong lengths, naming the field', () => {
    const cases: [unknown, unknown, string][] = [
      [
        [1, 2, 3, 4, 5, 6, 7, 8, 9],
        identity(3),
        'lu must be a Float64Array of length n·n = 9, got Array',
      ],
      [
        new Float64Array(8),
        identity(3),
        'lu must be a Float64Array of length n·n = 9, got Float64Array of length 8',
      ],
      [
        new Float32Array(9),
        identity(3),
        'lu must be a Float64Array of length n·n = 9, got Float32Array of length 9',
      ],
      [
        new Float64Array(9),
        new Float64Array(3),
        'perm must be an Int32Array of length n = 3, got Float64Array of length 3',
      ],
      [new Float64Array(9), undefined, 'perm must be an Int32Array of length n = 3, got undefined'],
    ];
    for (const [lu, p, message] of cases) {
      expect(validateResult('lu-partial-pivoting', { lu, perm: p }, dims(3))).toEqual({
        ok: false,
        status: 'invalid-output',
        message,
      });
    }
  });

  it('reports the first non-finite entry with its row and column', () => {
    const lu = new Float64Array(9);
    lu[5] = NaN;
    lu[7] = Infinity;
    const out = validateResult('lu-partial-pivoting', { lu, perm: identity(3) }, dims(3));
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.status).toBe('non-finite');
    expect(out.message).toMatch(/^lu\[1, 2\] = NaN: a non-finite number/);
  });

  it('says which perm entry is out of range, or which value repeats where', () => {
    const lu = new Float64Array(36);
    const outOfRange = validateResult(
      'lu-partial-pivoting',
      { lu, perm: perm(0, 1, 2, 7, 4, 5) },
      dims(6),
    );
    expect(outOfRange.ok || outOfRange.message).toBe('perm[3] = 7 is out of range 0..5');
    const negative = validateResult(
      'lu-partial-pivoting',
      { lu, perm: perm(0, -1, 2, 3, 4, 5) },
      dims(6),
    );
    expect(negative.ok || negative.message).toBe('perm[1] = -1 is out of range 0..5');
    const repeated = validateResult(
      'lu-partial-pivoting',
      { lu, perm: perm(0, 2, 1, 3, 2, 5) },
      dims(6),
    );
    expect(repeated.ok || repeated.message).toBe('perm repeats 2 at positions 1 and 4');
  });
});

describe('validateResult for the other routines', () => {
  it('lu-no-pivoting returns lu alone', () => {
    const out = validateResult(
      'lu-no-pivoting',
      { lu: new Float64Array(4), perm: perm(1, 0) },
      dims(2),
    );
    expect(out.ok && Object.keys(out.result)).toEqual(['lu']);
  });

  it('cholesky ignores the upper triangle and demands a positive diagonal', () => {
    const l = Float64Array.from([2, NaN, 1, 3]);
    expect(validateResult('cholesky', { l }, dims(2)).ok).toBe(true);
    const negative = validateResult('cholesky', { l: Float64Array.from([2, 0, 1, -3]) }, dims(2));
    expect(negative).toEqual({
      ok: false,
      status: 'invalid-output',
      message: 'l[1, 1] = -3 is not positive: the diagonal of L must be positive',
    });
    const zero = validateResult('cholesky', { l: Float64Array.from([0, 0, 1, 3]) }, dims(2));
    expect(zero.ok || zero.message).toMatch(/^l\[0, 0\] = 0 is not positive/);
  });

  it('ldlt reads only the strict lower part of l, and all of d', () => {
    const l = Float64Array.from([NaN, Infinity, 0.5, NaN]);
    expect(validateResult('ldlt', { l, d: Float64Array.from([1, -2]) }, dims(2)).ok).toBe(true);
    const out = validateResult('ldlt', { l, d: Float64Array.from([1, NaN]) }, dims(2));
    expect(out.ok || [out.status, out.message.slice(0, 9)]).toEqual(['non-finite', 'd[1] = Na']);
  });

  it('householder-qr checks q as m×n and only the upper part of r', () => {
    const q = new Float64Array(6);
    const r = Float64Array.from([1, 2, -Infinity, 3]);
    expect(validateResult('householder-qr', { q, r }, dims(2, 3)).ok).toBe(true);
    const short = validateResult('householder-qr', { q: new Float64Array(4), r }, dims(2, 3));
    expect(short.ok || short.message).toBe(
      'q must be a Float64Array of length m·n = 6, got Float64Array of length 4',
    );
    q[5] = Infinity;
    const bad = validateResult('householder-qr', { q, r }, dims(2, 3));
    expect(bad.ok || [bad.status, bad.message.slice(0, 17)]).toEqual([
      'non-finite',
      'q[2, 1] = Infinit',
    ]);
  });

  it('back-substitution takes the returned array itself', () => {
    const x = Float64Array.from([1, 2, 3]);
    const out = validateResult('back-substitution', x, dims(3));
    expect(out.ok && out.result.x).toBe(x);
    const wrong = validateResult('back-substitution', [1, 2, 3], dims(3));
    expect(wrong.ok || wrong.message).toBe(
      'the result of solve must be a Float64Array of length n = 3, got Array',
    );
    const inf = validateResult('back-substitution', Float64Array.from([1, Infinity, 3]), dims(3));
    expect(inf.ok || inf.message).toMatch(/^x\[1\] = Infinity: /);
  });
});
