import { readArrayBody } from '@sandbox/matrix-market/matrix-market-array.ts';
import { parseMatrixMarketBanner } from '@sandbox/matrix-market/matrix-market-banner.ts';
import { readCoordinateBody } from '@sandbox/matrix-market/matrix-market-coordinate.ts';
import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';
import {
  resolveMatrixMarketLimits,
  type MatrixMarketLimits,
} from '@sandbox/matrix-market/matrix-market-limits.ts';
import {
  checkMatrixMarketText,
  createLineReader,
} from '@sandbox/matrix-market/matrix-market-lines.ts';
import { parseMatrixMarketSizeLine } from '@sandbox/matrix-market/matrix-market-size-line.ts';

/** A Matrix Market file read into a dense matrix. */
export interface ParsedMatrixMarket {
  m: number;
  n: number;
  /** Dense row-major m×n: entry (i, j), 0-based, at data[i*n + j]; symmetry already expanded. */
  data: Float64Array;
  format: 'coordinate' | 'array';
  field: 'real' | 'integer' | 'pattern';
  symmetry: 'general' | 'symmetric' | 'skew-symmetric';
  /** Entries stored in the file: L from a coordinate size line, the number of values of an array. */
  entries: number;
  /** The comment lines in order, without the leading `%` and one space after it if present. */
  comments: string[];
}

/**
 * Reads a Matrix Market file (R. F. Boisvert, R. Pozo, K. A. Remington, "The Matrix Market
 * Exchange Formats: Initial Design", NISTIR 5935, NIST, 1996) into a dense row-major m×n
 * Float64Array, entry (i, j) at data[i*n + j].
 * Supported: object `matrix`; formats `coordinate` and `array`; fields `real`, `integer`,
 * `pattern` (entries read as 1); symmetries `general`, `symmetric`, `skew-symmetric`, expanded on
 * read. Line 1 is the banner (§2), then come comment lines starting with `%`, the size line and
 * the data (§3); blank lines may appear anywhere after the banner. CRLF line endings,
 * tabs, surrounding blanks and a last line without a line ending are accepted.
 * Everything untrusted is checked before it is used: text (size in bytes, control characters,
 * unpaired surrogates), line lengths, the declared size against `limits` before allocating,
 * indices, values (finite; integers exact), duplicates, the triangle a symmetric file may use,
 * and the entry count. Cost: O(bytes) time, O(m·n) memory.
 * Throws MatrixMarketError (with `line`, `reason` and `code`) for a file it cannot accept,
 * TypeError if `text` is not a string, RangeError for a bad limit.
 */
export function parseMatrixMarket(
  text: string,
  limits?: Partial<MatrixMarketLimits>,
): ParsedMatrixMarket {
  if (typeof text !== 'string') throw new TypeError('text must be a string');
  const resolved = resolveMatrixMarketLimits(limits);
  checkMatrixMarketText(text, resolved.maxBytes);
  const reader = createLineReader(text, resolved);
  const first = reader.next();
  if (first === undefined) throw new MatrixMarketError(1, 'empty-file', 'the file is empty');
  const header = parseMatrixMarketBanner(first.text, first.line);
  const comments: string[] = [];
  let next = reader.next();
  for (; next !== undefined; next = reader.next()) {
    if (next.text.startsWith('%')) comments.push(next.text.replace(/^% ?/, ''));
    else if (!/^[ \t]*$/.test(next.text)) break;
  }
  if (next === undefined)
    throw new MatrixMarketError(
      reader.lastLine,
      'bad-size-line',
      'the file ends before the size line',
    );
  const size = parseMatrixMarketSizeLine(next.text, next.line, header, resolved);
  const data =
    header.format === 'coordinate'
      ? readCoordinateBody(reader, header, size, next.line)
      : readArrayBody(reader, header, size, next.line);
  return { m: size.m, n: size.n, data, ...header, entries: size.entries, comments };
}
