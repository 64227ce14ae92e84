import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  MatrixMarketError,
  type MatrixMarketErrorCode,
} from '@sandbox/matrix-market/matrix-market-error.ts';
import type { MatrixMarketLimits } from '@sandbox/matrix-market/matrix-market-limits.ts';
import { parseMatrixMarket } from '@sandbox/matrix-market/read.ts';

/** Parses `text` and returns the MatrixMarketError it must throw. */
function rejection(text: string, limits?: Partial<MatrixMarketLimits>): MatrixMarketError {
  try {
    parseMatrixMarket(text, limits);
  } catch (error) {
    if (error instanceof MatrixMarketError) return error;
    throw error;
  }
  throw new Error('the file was accepted');
}

function expectRejected(
  text: string,
  line: number,
  code: MatrixMarketErrorCode,
  reason: string,
  limits?: Partial<MatrixMarketLimits>,
): void {
  const error = rejection(text, limits);
  expect({ line: error.line, code: error.code, reason: error.reason }).toEqual({
    line,
    code,
    reason,
  });
  expect(error.message).toBe(`line ${line}: ${reason}`);
}

/** A file that must be rejected: title, text, and the line, code and reason expected. */
type RejectCase = [
  title: string,
  text: string,
  line: number,
  code: MatrixMarketErrorCode,
  reason: string,
  limits?: Partial<MatrixMarketLimits>,
];

const expectCase = (...[, text, line, code, reason, limits]: RejectCase) =>
  expectRejected(text, line, code, reason, limits);

const GENERAL = '%%MatrixMarket matrix coordinate real general';
const SYMMETRIC = '%%MatrixMarket matrix coordinate real symmetric';
const SKEW = '%%MatrixMarket matrix coordinate real skew-symmetric';
const file = (...lines: string[]): string => lines.join('\n') + '\n';

// The rules come from NISTIR 5935 (§2 banner, §3.1 coordinate, §3.2 array) and from NIST's
// reference reader mmio.c (mm_read_banner, mm_is_valid), as summarised in
// numerics-references.md §7; the limits and the strictness beyond the spec are the service's own.
describe('parseMatrixMarket rejects: banner', () => {
  it.each<RejectCase>([
    ['an empty file', '', 1, 'empty-file', 'the file is empty'],
    [
      'a file whose first line is not the banner',
      file('% no banner', '1 1 1', '1 1 1'),
      1,
      'bad-banner',
      "the first line must be the banner '%%MatrixMarket matrix <format> <field> <symmetry>'",
    ],
    [
      'a banner on line 2 after a blank line (the banner must be line 1, NISTIR 5935 §2)',
      file('', GENERAL, '1 1 1', '1 1 1'),
      1,
      'bad-banner',
      "the first line must be the banner '%%MatrixMarket matrix <format> <field> <symmetry>'",
    ],
    [
      'a banner without the symmetry keyword',
      file('%%MatrixMarket matrix coordinate real', '1 1 1', '1 1 1'),
      1,
      'bad-banner',
      'the banner needs 4 keywords after %%MatrixMarket (object, format, field, symmetry), found 3',
    ],
    [
      'an unknown format',
      file('%%MatrixMarket matrix dense real general', '1 1', '1'),
      1,
      'bad-banner',
      "unknown format 'dense' (expected coordinate or array)",
    ],
    [
      'the vector object (valid in the framework, unsupported here)',
      file('%%MatrixMarket vector coordinate real general', '3 1', '1 1'),
      1,
      'unsupported-type',
      "object 'vector' is not supported; only 'matrix' is",
    ],
    [
      'the complex field, saying it is unsupported',
      file('%%MatrixMarket matrix coordinate complex general', '1 1 1', '1 1 1 0'),
      1,
      'unsupported-type',
      "field 'complex' is not supported: only real, integer and pattern matrices are read",
    ],
    [
      'hermitian symmetry, saying it is unsupported',
      file('%%MatrixMarket matrix coordinate real hermitian', '1 1 1', '1 1 1'),
      1,
      'unsupported-type',
      "symmetry 'hermitian' is not supported: it needs the complex field, which is not supported",
    ],
    // References §11 row 47: field `double` is on Burkardt's page, not in the spec; mmio rejects it.
    [
      "field 'double'",
      file('%%MatrixMarket matrix coordinate double general', '1 1 1', '1 1 1'),
      1,
      'bad-banner',
      "unknown field 'double' (expected real, integer, complex or pattern)",
    ],
    // References §11 row 47: mm_is_valid rejects pattern with array.
    [
      'pattern with the array format',
      file('%%MatrixMarket matrix array pattern general', '1 1'),
      1,
      'bad-banner',
      "field 'pattern' is only valid with the coordinate format",
    ],
    // mm_is_valid rejects pattern with skew-symmetric (references §7).
    [
      'pattern with skew-symmetric',
      file('%%MatrixMarket matrix coordinate pattern skew-symmetric', '2 2 1', '2 1'),
      1,
      'bad-banner',
      "field 'pattern' cannot be skew-symmetric (there are no values to negate)",
    ],
  ])('%s', expectCase);
});

describe('parseMatrixMarket rejects: size line', () => {
  it.each<RejectCase>([
    [
      'a file that ends before the size line',
      file(GENERAL, '% only a comment'),
      2,
      'bad-size-line',
      'the file ends before the size line',
    ],
    [
      'a coordinate size line with two fields',
      file(GENERAL, '5 5', '1 1 1'),
      2,
      'bad-size-line',
      "the size line of a coordinate file must be 'rows columns entries', found 2 fields",
    ],
    [
      'a non-integer size',
      file(GENERAL, '3.5 3 1', '1 1 1'),
      2,
      'bad-size-line',
      "row count '3.5' is not a non-negative integer",
    ],
    [
      'a negative size',
      file(GENERAL, '3 -3 1', '1 1 1'),
      2,
      'bad-size-line',
      'column count -3 is negative',
    ],
  ])('%s', expectCase);

  // Invented hostile fixture: a 10⁹ × 10⁹ declaration with a one-line body must fail on the size
  // line, before any allocation (allocating would raise a RangeError, not this error).
  it('a tiny file declaring 10^9 × 10^9 (fails on the size line, before allocating)', () => {
    const text = readFileSync(
      new URL('../../../fixtures/matrix-market/hostile-huge-size.mtx', import.meta.url),
      'utf8',
    );
    expectRejected(text, 3, 'too-large', '1000000000 rows exceed the limit of 4096');
  });

  it.each<RejectCase>([
    [
      'more columns than maxCols',
      file(GENERAL, '2 9 0'),
      2,
      'too-large',
      '9 columns exceed the limit of 8',
      {
        maxCols: 8,
      },
    ],
    [
      'm·n beyond maxDenseEntries even when each size is within its limit',
      file('%%MatrixMarket matrix array real general', '300 300'),
      2,
      'too-large',
      'a 300×300 matrix has 90000 entries, more than the limit of 65536',
      { maxDenseEntries: 65536 },
    ],
    [
      'a non-square symmetric declaration',
      file(SYMMETRIC, '3 4 1', '1 1 1'),
      2,
      'bad-size-line',
      'a symmetric matrix must be square, but the size line declares 3×4',
    ],
    [
      'more entries declared than a symmetric matrix has lower-triangle positions',
      file(SYMMETRIC, '3 3 1000000000', '1 1 1'),
      2,
      'too-many-entries',
      '1000000000 entries declared, but a 3×3 symmetric matrix has only 6 positions on or below the diagonal',
    ],
  ])('%s', expectCase);
});

describe('parseMatrixMarket rejects: entry count', () => {
  it.each<RejectCase>([
    [
      'too few entries (reported on the last line of the file)',
      file(GENERAL, '3 3 4', '1 1 1', '2 2 1', '3 3 1'),
      5,
      'too-few-entries',
      'the file ends after 3 of the 4 entries declared on line 2',
    ],
    [
      'too many entries',
      file(GENERAL, '3 3 2', '1 1 1', '2 2 1', '3 3 1'),
      5,
      'too-many-entries',
      'more data after the 2 entries declared on line 2',
    ],
    [
      'too few array values',
      file('%%MatrixMarket matrix array real general', '2 2', '1', '2', '3'),
      5,
      'too-few-entries',
      'the file ends after 3 of the 4 values declared by the size line (line 2)',
    ],
    [
      'too many values in a symmetric array (n(n+1)/2 = 3 for n = 2)',
      file('%%MatrixMarket matrix array real symmetric', '2 2', '1', '2', '3', '4'),
      6,
      'too-many-entries',
      'more data after the 3 values declared by the size line (line 2)',
    ],
  ])('%s', expectCase);
});

describe('parseMatrixMarket rejects: data lines', () => {
  it.each<RejectCase>([
    // The brief's own example message.
    [
      'a zero column index',
      file(GENERAL, '% a', '% b', '5 5 4', '1 1 1', '2 2 1', '3 0 1', '4 4 1'),
      7,
      'index-out-of-range',
      'column index 0 is out of range 1..5',
    ],
    [
      'a row index beyond the row count',
      file(GENERAL, '3 4 1', '4 1 2.0'),
      3,
      'index-out-of-range',
      'row index 4 is out of range 1..3',
    ],
    [
      'a negative index',
      file(GENERAL, '3 3 1', '2 -1 2.0'),
      3,
      'index-out-of-range',
      'column index -1 is out of range 1..3',
    ],
    [
      'a non-integer index',
      file(GENERAL, '3 3 1', '1.5 1 2.0'),
      3,
      'bad-entry-line',
      "row index '1.5' is not an integer",
    ],
    [
      'a missing value on a real coordinate line',
      file(GENERAL, '3 3 1', '1 1'),
      3,
      'bad-entry-line',
      "expected 'row column value', found 2 fields",
    ],
    [
      'a value on a pattern line',
      file('%%MatrixMarket matrix coordinate pattern general', '2 2 1', '1 1 5'),
      3,
      'bad-entry-line',
      "expected 'row column', found 3 fields",
    ],
    [
      'two values on one array line',
      file('%%MatrixMarket matrix array real general', '2 1', '1 2'),
      3,
      'bad-entry-line',
      'expected one value per line, found 2',
    ],
    [
      'a comment line among the data lines (comments precede the size line, NISTIR 5935 §2)',
      file(GENERAL, '2 2 2', '1 1 1', '% late comment', '2 2 1'),
      4,
      'bad-entry-line',
      'comment lines must come before the size line',
    ],
    [
      'a non-numeric value',
      file(GENERAL, '2 2 1', '1 1 abc'),
      3,
      'bad-value',
      "value 'abc' is not a number",
    ],
    [
      'a hexadecimal value (strtod would take it; the format is decimal)',
      file(GENERAL, '2 2 1', '1 1 0x1p3'),
      3,
      'bad-value',
      "value '0x1p3' is not a number",
    ],
    [
      'a Fortran D exponent',
      file(GENERAL, '2 2 1', '1 1 1.0D+00'),
      3,
      'bad-value',
      "value '1.0D+00' is not a number",
    ],
    [
      'a NaN value',
      file(GENERAL, '2 2 1', '1 1 NaN'),
      3,
      'not-finite',
      "value 'NaN' is NaN, which is not allowed",
    ],
    [
      'an infinite value',
      file(GENERAL, '2 2 1', '2 2 -inf'),
      3,
      'not-finite',
      "value '-inf' is Infinity, which is not allowed",
    ],
    [
      'a value that overflows to Infinity',
      file(GENERAL, '2 2 1', '2 1 1e400'),
      3,
      'not-finite',
      'value 1e400 overflows to Infinity',
    ],
    [
      'a non-integer value in an integer file',
      file('%%MatrixMarket matrix coordinate integer general', '2 2 1', '1 1 2.5'),
      3,
      'not-integer',
      'value 2.5 is not an integer, but the field is integer',
    ],
    [
      'an integer value a double cannot hold exactly',
      file('%%MatrixMarket matrix array integer general', '1 1', '9007199254740993'),
      3,
      'not-integer',
      'integer value 9007199254740993 is too large to hold exactly (limit 2^53 - 1)',
    ],
    [
      'a duplicated coordinate entry, naming the line it repeats',
      file(GENERAL, '3 3 3', '1 1 1', '2 3 5', '2 3 5'),
      5,
      'duplicate-entry',
      'entry (2, 3) repeats line 4',
    ],
    [
      'an upper-triangle entry in a symmetric file',
      file(SYMMETRIC, '3 3 2', '2 1 1', '1 3 4'),
      4,
      'upper-triangle-entry',
      'entry (1, 3) is above the diagonal; a symmetric file gives only entries with row ≥ column',
    ],
    [
      'a diagonal entry in a skew-symmetric file',
      file(SKEW, '3 3 2', '2 1 1', '2 2 0'),
      4,
      'skew-diagonal-entry',
      'diagonal entry (2, 2) in a skew-symmetric file; the diagonal is zero and must be omitted',
    ],
    [
      'an upper-triangle entry in a skew-symmetric file',
      file(SKEW, '3 3 1', '1 2 1'),
      3,
      'upper-triangle-entry',
      'entry (1, 2) is above the diagonal; a skew-symmetric file gives only entries with row > column',
    ],
  ])('%s', expectCase);
});

describe('parseMatrixMarket rejects: text', () => {
  it.each<RejectCase>([
    [
      'a line longer than maxLineLength',
      file(GENERAL, '% ' + 'x'.repeat(1100), '1 1 1', '1 1 1'),
      2,
      'line-too-long',
      'line is 1102 characters long; the limit is 1024',
    ],
    [
      'a file larger than maxBytes, naming the line where the limit is crossed',
      file(GENERAL, '2 2 1', '1 1 1'),
      2,
      'file-too-large',
      'the file exceeds the limit of 50 bytes',
      { maxBytes: 50 },
    ],
    [
      'a NUL character',
      file(GENERAL, '1 1 1', '1 1 1\u0000'),
      3,
      'bad-character',
      'NUL character (U+0000) is not allowed',
    ],
    [
      'a control character',
      file(GENERAL, '% bell \u0007', '1 1 1', '1 1 1'),
      2,
      'bad-character',
      'control character U+0007 is not allowed',
    ],
    [
      'a bare carriage return (old Mac line endings)',
      `${GENERAL}\r1 1 1\r1 1 1\r`,
      1,
      'bad-character',
      'carriage return not followed by a line feed',
    ],
    [
      'an unpaired surrogate (no valid UTF-8 decodes to one)',
      file(GENERAL, '% \uD800', '1 1 1', '1 1 1'),
      2,
      'invalid-utf8',
      'unpaired surrogate U+D800 is not valid UTF-8',
    ],
  ])('%s', expectCase);
});

describe('parseMatrixMarket: arguments', () => {
  it('throws TypeError for a non-string and RangeError naming a bad limit', () => {
    expect(() => parseMatrixMarket(new Uint8Array(3) as unknown as string)).toThrow(TypeError);
    expect(() => parseMatrixMarket(file(GENERAL, '1 1 0'), { maxRows: -1 })).toThrow(
      new RangeError('limits.maxRows must be a non-negative integer, got -1'),
    );
  });
});
