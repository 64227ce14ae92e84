import { describe, expect, it } from 'vitest';
import type { RoutineSlug } from '@shared/routines.ts';
import { generateMatrix } from '@sandbox/matrices/generate.ts';
import { familySlugs, type ReferenceMatrix } from '@sandbox/matrices/reference-matrix.ts';
import { checkMatrixSetJson, namedSet, parseMatrixSetJson } from '@sandbox/matrices/sets.ts';
import { cholesky, gepp, ldlt, luNoPivot, luSolve } from '@tests/helpers/factorizations.ts';

function generated(name: 'quick' | 'standard'): ReferenceMatrix[] {
  return namedSet(name).items.map((item) => {
    if (item.kind !== 'generated') throw new Error('named sets hold only generated matrices');
    return generateMatrix(item.spec);
  });
}

/** κ₁ from the inverse built column by column with GEPP solves (fine while κ·u is small). */
function condition1ByGepp(a: Float64Array, n: number): number {
  const out = gepp(a, n);
  const colSum = (get: (i: number) => number) =>
    Array.from({ length: n }, (_, i) => Math.abs(get(i))).reduce((s, v) => s + v, 0);
  let normA = 0;
  let normInv = 0;
  for (let j = 0; j < n; j++) {
    normA = Math.max(
      normA,
      colSum((i) => a[i * n + j]!),
    );
    const e = new Float64Array(n);
    e[j] = 1;
    const x = luSolve(out, e, n);
    normInv = Math.max(
      normInv,
      colSum((i) => x[i]!),
    );
  }
  return normA * normInv;
}

/** Checks each expectation against small independent factorisations of the stored matrix. */
function checkExpectations(r: ReferenceMatrix): void {
  const { expectations: e, positiveDefinite, symmetric, singular, exactCondition1 } = r.properties;
  const n = r.n;
  const square = r.m === r.n;
  const where = r.id;
  if (!square) {
    expect(Object.keys(e), where).toEqual(['householder-qr']);
    return;
  }
  if (positiveDefinite || e.cholesky || e.ldlt) expect(symmetric, where).toBe(true);
  if (singular) expect(exactCondition1, where).toBeUndefined();
  const check = (routine: RoutineSlug, met: boolean) => {
    if (e[routine] === 'reject')
      expect(met, `${where} ${routine} should meet a failure`).toBe(true);
    if (e[routine] === 'factor') expect(met, `${where} ${routine} should succeed`).toBe(false);
  };
  for (const tie of ['first', 'last'] as const) {
    const out = gepp(r.data, n, tie);
    const failed = out.zeroPivotAt !== undefined || !out.lu.every(Number.isFinite);
    check('lu-partial-pivoting', failed);
    if (tie === 'first') check('back-substitution', failed);
  }
  const none = luNoPivot(r.data, n);
  check('lu-no-pivoting', none.zeroPivotAt !== undefined || !none.lu.every(Number.isFinite));
  if (e.cholesky) check('cholesky', cholesky(r.data, n).failedAt !== undefined);
  if (e.ldlt) {
    const out = ldlt(r.data, n);
    check('ldlt', out.zeroPivotAt !== undefined);
  }
  if (exactCondition1 !== undefined && exactCondition1 < 1e8 && n > 1) {
    expect(Math.abs(condition1ByGepp(r.data, n) / exactCondition1 - 1), where).toBeLessThan(1e-6);
  }
}

describe('named sets', () => {
  it('quick: small, every family, and a must-reject matrix for every routine that can reject', () => {
    const set = namedSet('quick');
    expect(set.timingSizes).toEqual([16, 32]);
    const matrices = generated('quick');
    expect(Math.max(...matrices.map((r) => Math.max(r.m, r.n)))).toBeLessThanOrEqual(12);
    expect(new Set(matrices.map((r) => r.family))).toEqual(new Set(familySlugs));
    const routines: RoutineSlug[] = [
      'lu-partial-pivoting',
      'lu-no-pivoting',
      'cholesky',
      'ldlt',
      'back-substitution',
    ];
    for (const routine of routines)
      expect(
        matrices.some((r) => r.properties.expectations[routine] === 'reject'),
        routine,
      ).toBe(true);
    // The traps: a tiny leading pivot, an ill-conditioned matrix, a graded one, worst growth.
    expect(matrices.some((r) => r.id === 'needs-row-exchange-n2')).toBe(true);
    expect(
      matrices.some(
        (r) =>
          (r.properties.exactCondition1 ?? 0) > 1e10 &&
          r.properties.expectations['lu-partial-pivoting'] === 'factor',
      ),
    ).toBe(true);
    expect(matrices.some((r) => r.family === 'graded')).toBe(true);
    expect(matrices.some((r) => r.id === 'worst-growth-n12-alpha0.5')).toBe(true);
    expect(new Set(matrices.map((r) => r.id)).size).toBe(matrices.length);
  });

  it('standard: every family at a few sizes, mostly small, a handful at 128–256', () => {
    const set = namedSet('standard');
    expect(set.timingSizes).toEqual([64, 128, 256, 512]);
    const matrices = generated('standard');
    expect(new Set(matrices.map((r) => r.family))).toEqual(new Set(familySlugs));
    const orders = matrices.map((r) => Math.max(r.m, r.n));
    expect(Math.max(...matrices.map((r) => r.n))).toBeLessThanOrEqual(256);
    const large = orders.filter((n) => n >= 128).length;
    expect(large).toBeGreaterThanOrEqual(3);
    expect(large).toBeLessThanOrEqual(8);
    expect(orders.filter((n) => n <= 64).length / orders.length).toBeGreaterThan(0.75);
    expect(new Set(matrices.map((r) => r.id)).size).toBe(matrices.length);
  });

  it('returns fresh copies and rejects unknown names', () => {
    const a = namedSet('quick');
    a.items.pop();
    expect(namedSet('quick').items.length).toBe(a.items.length + 1);
    expect(() => namedSet('huge' as 'quick')).toThrow(RangeError);
  });

  it('has expectations that small independent factorisations confirm', () => {
    for (const r of generated('quick')) checkExpectations(r);
    for (const r of generated('standard')) if (r.n <= 128) checkExpectations(r);
    for (const family of familySlugs)
      for (const n of [2, 3, 4, 9]) {
        let r: ReferenceMatrix;
        try {
          r = generateMatrix({ family, n });
        } catch {
          continue; // a size the family does not take
        }
        checkExpectations(r);
      }
  });
});

describe('parseMatrixSetJson', () => {
  it('accepts generated recipes, files and one timing entry', () => {
    const set = parseMatrixSetJson(
      [
        { family: 'hilbert', n: 8 },
        { family: 'worst-growth', n: 40, params: { alpha: 0.5 } },
        { family: 'tall-random', n: 10, m: 30, seed: 4 },
        { file: 'uploads/frame-stiffness.mtx' },
        { timing: [128, 64, 64] },
      ],
      'team set',
    );
    expect(set.name).toBe('team set');
    expect(set.timingSizes).toEqual([64, 128]);
    expect(set.items).toEqual([
      { kind: 'generated', spec: { family: 'hilbert', n: 8 } },
      { kind: 'generated', spec: { family: 'worst-growth', n: 40, params: { alpha: 0.5 } } },
      { kind: 'generated', spec: { family: 'tall-random', n: 10, m: 30, seed: 4 } },
      { kind: 'file', path: 'uploads/frame-stiffness.mtx' },
    ]);
    expect(parseMatrixSetJson([{ family: 'minij', n: 3 }], 'x').timingSizes).toEqual([]);
  });

  it('rejects bad input with messages naming the entry', () => {
    const cases: [unknown, RegExp][] = [
      [{ family: 'hilbert', n: 3 }, /JSON array/],
      [[{ family: 'hilbert', n: 3, colour: 'red' }], /entry 0/],
      [
        [
          { family: 'hilbert', n: 3 },
          { family: 'warp', n: 3 },
        ],
        /entry 1/,
      ],
      [[{ family: 'hilbert', n: 0 }], /entry 0/],
      [[{ family: 'hilbert', n: 5000 }], /entry 0/],
      [[{ family: 'uniform', n: 3, seed: -2 }], /entry 0/],
      [[{ family: 'uniform', n: 3, params: { cond: 'high' } }], /entry 0/],
      [
        [{ family: 'uniform', n: 3, params: { cond: 2 } }],
        /entry 0: params.cond is not a parameter of uniform/,
      ],
      [[{ family: 'poisson-2d', n: 10 }], /entry 0: poisson-2d needs n = k²/],
      [[{ timing: [64] }, { timing: [128] }], /entry 1: only one timing entry/],
      [[{ timing: [] }], /entry 0/],
      [[{ timing: [0] }], /entry 0/],
      [
        [
          { family: 'hilbert', n: 4 },
          { family: 'hilbert', n: 4, seed: 7 },
        ],
        /entry 1: repeats entry 0/,
      ],
      [[{ file: '../secret.mtx' }], /entry 0/],
      [[{ file: '/etc/passwd.mtx' }], /entry 0/],
      [[{ file: 'matrix.txt' }], /entry 0/],
      [[42], /entry 0/],
    ];
    for (const [value, message] of cases) {
      expect(() => parseMatrixSetJson(value, 'bad')).toThrow(message);
      expect(() => parseMatrixSetJson(value, 'bad')).toThrow(RangeError);
    }
    const result = checkMatrixSetJson([{ family: 'warp', n: 1 }, { file: 'a.txt' }], 'bad');
    expect(result.ok).toBe(false);
    if (!result.ok)
      expect(result.problems.map((p) => p.slice(0, 7))).toEqual(['entry 0', 'entry 1']);
  });
});
