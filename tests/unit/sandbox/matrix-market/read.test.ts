import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseMatrixMarket } from '@sandbox/matrix-market/read.ts';

const fixture = (name: string): string =>
  readFileSync(new URL(`../../../fixtures/matrix-market/${name}`, import.meta.url), 'utf8');

/** Expects the parsed dense data to be the matrix given by its rows (row-major). */
const expectRows = ({ data }: { data: Float64Array }, rows: number[][]): void =>
  expect(Array.from(data)).toEqual(rows.flat());

describe('parseMatrixMarket: check values from numerics-references.md §7 / §11', () => {
  // References §11 row 45: NISTIR 5935 §3.2 (lower triangle column by column); SciPy's
  // scipy.io.mmread reads the same body to this matrix.
  it('reads an array real symmetric file (lower triangle, column by column)', () => {
    const p = parseMatrixMarket(
      '%%MatrixMarket matrix array real symmetric\n3 3\n4\n1\n2\n5\n3\n6\n',
    );
    expectRows(p, [
      [4, 1, 2],
      [1, 5, 3],
      [2, 3, 6],
    ]);
    expect(p.entries).toBe(6);
  });

  // References §11 row 46: skew-symmetric array stores the strictly lower triangle; a_ji = −a_ij.
  it('reads an array real skew-symmetric file (strict lower triangle, negated mirror)', () => {
    const p = parseMatrixMarket('%%MatrixMarket matrix array real skew-symmetric\n3 3\n1\n2\n3\n');
    expectRows(p, [
      [0, -1, -2],
      [1, 0, -3],
      [2, 3, 0],
    ]);
    expect(p.entries).toBe(3);
  });

  // References §7 table: coordinate real symmetric body of T₃ = tridiag(−1, 2, −1).
  it('expands a coordinate real symmetric file (T₃)', () => {
    const text = [
      '%%MatrixMarket matrix coordinate real symmetric',
      '3 3 5',
      '1 1 2',
      '2 1 -1',
      '2 2 2',
      '3 2 -1',
      '3 3 2',
    ].join('\n');
    const p = parseMatrixMarket(text);
    expectRows(p, [
      [2, -1, 0],
      [-1, 2, -1],
      [0, -1, 2],
    ]);
    expect(p).toMatchObject({ m: 3, n: 3, entries: 5, symmetry: 'symmetric' });
  });

  // References §7 table: array values are column-major (NISTIR 5935 §3.2).
  it('reads array general values in column-major order', () => {
    const p = parseMatrixMarket(
      '%%MatrixMarket matrix array real general\n2 3\n1\n4\n2\n5\n3\n6\n',
    );
    expectRows(p, [
      [1, 2, 3],
      [4, 5, 6],
    ]);
    expect(p).toMatchObject({ m: 2, n: 3, entries: 6, format: 'array' });
  });

  // References §7 table: a pattern entry has no value and reads as 1.
  it('reads a coordinate pattern general file with ones at the listed positions', () => {
    const p = parseMatrixMarket(
      '%%MatrixMarket matrix coordinate pattern general\n2 2 2\n1 2\n2 1\n',
    );
    expectRows(p, [
      [0, 1],
      [1, 0],
    ]);
    expect(p.field).toBe('pattern');
  });
});

describe('parseMatrixMarket: files shaped like the spec', () => {
  // Invented fixture laid out like NISTIR 5935 §3.1's 5×5, 8-entry example; the expected
  // matrix is read off the fixture's lines by hand.
  it('reads the coordinate real general 5×5 fixture with 8 entries', () => {
    const p = parseMatrixMarket(fixture('general-5x5.mtx'));
    expect(p).toMatchObject({ m: 5, n: 5, entries: 8, format: 'coordinate', field: 'real' });
    expectRows(p, [
      [4, 0, 0, 0, 30],
      [0, -7.25, 0, -0.0015, 0],
      [0, 0, 0.125, 0, 0],
      [0, 62.5, 0, 0, 0],
      [-9, 0, 0, 0, 0.01],
    ]);
    expect(p.comments).toHaveLength(5);
    expect(p.comments[1]).toBe("Invented 5x5 test matrix for Stablehand's reader, shaped like the");
  });

  // Invented fixture: pattern + symmetric mirrors each off-diagonal position (NISTIR 5935 §3.1).
  it('expands a pattern symmetric fixture', () => {
    const p = parseMatrixMarket(fixture('pattern-symmetric-4x4.mtx'));
    expectRows(p, [
      [0, 1, 0, 1],
      [1, 0, 1, 0],
      [0, 1, 1, 1],
      [1, 0, 1, 0],
    ]);
    expect(p.entries).toBe(5);
  });

  // Skew-symmetric coordinate: a_ji = −a_ij, diagonal zero (NISTIR 5935 §3.1); invented values.
  it('expands a coordinate skew-symmetric file', () => {
    const text = '%%MatrixMarket matrix coordinate real skew-symmetric\n3 3 2\n2 1 1.5\n3 1 -4\n';
    expectRows(parseMatrixMarket(text), [
      [0, -1.5, 4],
      [1.5, 0, 0],
      [-4, 0, 0],
    ]);
  });

  // Skew-symmetric array of order 4: column 1 rows 2..4, column 2 rows 3..4, column 3 row 4.
  it('fills a 4×4 skew-symmetric array column by column below the diagonal', () => {
    const text = '%%MatrixMarket matrix array integer skew-symmetric\n4 4\n1\n2\n3\n4\n5\n6\n';
    expectRows(parseMatrixMarket(text), [
      [0, -1, -2, -3],
      [1, 0, -4, -5],
      [2, 4, 0, -6],
      [3, 5, 6, 0],
    ]);
  });

  it('reads an integer field exactly, including 2^53 − 1 (ECMA-262 Number.MAX_SAFE_INTEGER)', () => {
    const text =
      '%%MatrixMarket matrix coordinate integer general\n1 2 2\n1 1 9007199254740991\n1 2 -17\n';
    expect(Array.from(parseMatrixMarket(text).data)).toEqual([2 ** 53 - 1, -17]);
  });
});

describe('parseMatrixMarket: lenient where the format is', () => {
  // mmio.c lower-cases the four keywords before comparing (references §7); SciPy agrees.
  it('accepts banner keywords in any case', () => {
    const p = parseMatrixMarket('%%MatrixMarket MATRIX Coordinate REAL General\n1 1 1\n1 1 2\n');
    expect(p).toMatchObject({ format: 'coordinate', field: 'real', symmetry: 'general' });
  });

  it('accepts CRLF line endings', () => {
    const lf = '%%MatrixMarket matrix coordinate real general\n% note\n2 2 2\n1 1 3\n2 2 -4\n';
    const p = parseMatrixMarket(lf.replace(/\n/g, '\r\n'));
    expect(Array.from(p.data)).toEqual([3, 0, 0, -4]);
    expect(p.comments).toEqual(['note']);
  });

  it('accepts tabs, leading and trailing blanks, blank lines and a last line with no newline', () => {
    const text =
      '%%MatrixMarket\tmatrix  array real general  \n\n% c\n\n \t2\t1 \n  1.5E+02\t\n\n-2.5e-1';
    expect(Array.from(parseMatrixMarket(text).data)).toEqual([150, -0.25]);
  });

  it('accepts the number spellings of C strtod without hex (ISO C99 §7.20.1.3)', () => {
    const values = ['1.', '.5', '+3', '-0.0', '1e5', '2E-3', '007'];
    const text = `%%MatrixMarket matrix array real general\n${values.length} 1\n${values.join('\n')}\n`;
    const data = parseMatrixMarket(text).data;
    expect(Array.from(data)).toEqual([1, 0.5, 3, -0, 100000, 0.002, 7]);
    expect(Object.is(data[3], -0)).toBe(true);
  });

  it('keeps explicit zeros and −0 entries of a coordinate file', () => {
    const text = '%%MatrixMarket matrix coordinate real general\n1 2 2\n1 1 0\n1 2 -0\n';
    const data = parseMatrixMarket(text).data;
    expect(Object.is(data[0], 0)).toBe(true);
    expect(Object.is(data[1], -0)).toBe(true);
  });

  it('ignores a UTF-8 byte-order mark and keeps non-ASCII comments', () => {
    const p = parseMatrixMarket(
      '\uFEFF%%MatrixMarket matrix array real general\n%  Größe: 1×1\n1 1\n7\n',
    );
    expect(p.comments).toEqual([' Größe: 1×1']);
    expect(Array.from(p.data)).toEqual([7]);
  });

  it('reads empty matrices (0×0 coordinate, 3×0 array)', () => {
    expect(
      parseMatrixMarket('%%MatrixMarket matrix coordinate real general\n0 0 0\n').data,
    ).toHaveLength(0);
    expect(parseMatrixMarket('%%MatrixMarket matrix array real general\n3 0\n')).toMatchObject({
      m: 3,
      n: 0,
    });
  });
});

describe('parseMatrixMarket: size', () => {
  // Not a timing test: it checks that a 1000×1000 coordinate file with 50 000 entries (about
  // 1 MB of text) parses and every entry lands where it should.
  it('parses a 1000×1000 coordinate file with 50 000 entries', () => {
    const n = 1000;
    const count = 50_000;
    const lines = ['%%MatrixMarket matrix coordinate real general', `${n} ${n} ${count}`];
    // k ↦ 7919·k mod 10⁶ is one-to-one on 0..10⁶−1 because 7919 is prime and does not divide 10⁶.
    for (let k = 0; k < count; k++) {
      const p = (7919 * k) % (n * n);
      lines.push(`${Math.floor(p / n) + 1} ${(p % n) + 1} ${k + 0.5}`);
    }
    const parsed = parseMatrixMarket(lines.join('\n') + '\n');
    expect(parsed.entries).toBe(count);
    let nonzeros = 0;
    for (const v of parsed.data) if (v !== 0) nonzeros++;
    expect(nonzeros).toBe(count);
    for (const k of [0, 1, 12_345, count - 1])
      expect(parsed.data[(7919 * k) % (n * n)]).toBe(k + 0.5);
  });
});
