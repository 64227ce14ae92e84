import { DEFAULT_MATRIX_MARKET_LIMITS } from '@sandbox/matrix-market/matrix-market-limits.ts';

/** How writeMatrixMarket lays out the file. */
export interface WriteMatrixMarketOptions {
  /** `coordinate` (default) lists the nonzero entries; `array` lists every value. */
  format?: 'coordinate' | 'array';
  /** `symmetric` stores only the lower triangle; the matrix must be exactly symmetric. */
  symmetry?: 'general' | 'symmetric';
  /** Comment text; each of its lines becomes a `% ...` line after the banner. */
  comment?: string;
}

/**
 * Writes a dense row-major m×n matrix (entry (i, j) at a[i*n + j]) as a Matrix Market file with
 * field `real` (Boisvert, Pozo & Remington, NISTIR 5935, 1996): banner, comment lines, size line,
 * then for `coordinate` the entries `i j value` in row-major order, for `array` the values in
 * column-major order (§3.1, §3.2). With `symmetric` only entries on or below the diagonal are
 * written (the array form column by column from the diagonal down).
 * Values are written as ECMAScript's Number::toString, the shortest decimal string that reads back
 * as the same double (ECMA-262 §6.1.6.1.20, from memory), and −0 as `-0`, so parseMatrixMarket gives back the
 * same bits. Coordinate files list every entry that is not +0, so −0 survives too; for the same
 * reason `symmetric` requires a_ij and a_ji to be the same double (Object.is), sign of zero included.
 * Cost: O(m·n). Throws TypeError/RangeError naming the bad argument (non-finite values included).
 */
export function writeMatrixMarket(
  a: Float64Array,
  m: number,
  n: number,
  options: WriteMatrixMarketOptions = {},
): string {
  const { format = 'coordinate', symmetry = 'general', comment } = options;
  checkArguments(a, m, n, format, symmetry);
  const lines = [`%%MatrixMarket matrix ${format} real ${symmetry}`];
  if (comment !== undefined) lines.push(...commentLines(comment));
  const lower = symmetry === 'symmetric';
  if (format === 'array') {
    lines.push(`${m} ${n}`);
    for (let j = 0; j < n; j++)
      for (let i = lower ? j : 0; i < m; i++) lines.push(formatValue(a[i * n + j]!));
  } else {
    const entries: string[] = [];
    for (let i = 0; i < m; i++)
      for (let j = 0; j < (lower ? i + 1 : n); j++) {
        const v = a[i * n + j]!;
        if (!Object.is(v, 0)) entries.push(`${i + 1} ${j + 1} ${formatValue(v)}`);
      }
    lines.push(`${m} ${n} ${entries.length}`, ...entries);
  }
  return lines.join('\n') + '\n';
}

function formatValue(v: number): string {
  return Object.is(v, -0) ? '-0' : String(v);
}

function checkArguments(
  a: Float64Array,
  m: number,
  n: number,
  format: string,
  symmetry: string,
): void {
  if (!(a instanceof Float64Array)) throw new TypeError('a must be a Float64Array');
  if (!Number.isSafeInteger(m) || m < 0)
    throw new RangeError(`m must be a non-negative integer, got ${m}`);
  if (!Number.isSafeInteger(n) || n < 0)
    throw new RangeError(`n must be a non-negative integer, got ${n}`);
  if (a.length !== m * n)
    throw new RangeError(`a must hold m*n = ${m * n} entries, has ${a.length}`);
  if (format !== 'coordinate' && format !== 'array')
    throw new RangeError(`options.format must be 'coordinate' or 'array', got '${format}'`);
  if (symmetry !== 'general' && symmetry !== 'symmetric')
    throw new RangeError(`options.symmetry must be 'general' or 'symmetric', got '${symmetry}'`);
  for (let k = 0; k < a.length; k++)
    if (!Number.isFinite(a[k]!))
      throw new RangeError(
        `a holds ${a[k]} at entry (${Math.floor(k / n) + 1}, ${(k % n) + 1}); Matrix Market values must be finite`,
      );
  if (symmetry !== 'symmetric') return;
  if (m !== n)
    throw new RangeError(`options.symmetry is 'symmetric' but a is ${m}×${n}, not square`);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < i; j++)
      if (!Object.is(a[i * n + j], a[j * n + i]))
        throw new RangeError(
          `options.symmetry is 'symmetric' but a is not: entry (${i + 1}, ${j + 1}) is ${formatValue(a[i * n + j]!)}, entry (${j + 1}, ${i + 1}) is ${formatValue(a[j * n + i]!)}`,
        );
}

/** `% text` per line of the comment; a line the default reader would refuse is a RangeError. */
function commentLines(comment: string): string[] {
  if (typeof comment !== 'string') throw new TypeError('options.comment must be a string');
  return comment.split(/\r?\n/).map((line) => {
    if (!isPlainText(line))
      throw new RangeError(
        'options.comment must not contain control characters (other than tab) or unpaired surrogates',
      );
    const written = line === '' ? '%' : `% ${line}`;
    if (written.length > DEFAULT_MATRIX_MARKET_LIMITS.maxLineLength)
      throw new RangeError(
        `options.comment has a line of ${line.length} characters; the limit is ${DEFAULT_MATRIX_MARKET_LIMITS.maxLineLength - 2}`,
      );
    return written;
  });
}

/** True if the reader's text check would let the line through (see checkMatrixMarketText). */
function isPlainText(line: string): boolean {
  for (let k = 0; k < line.length; k++) {
    const c = line.charCodeAt(k);
    if ((c < 32 && c !== 9) || (c >= 0x7f && c <= 0x9f)) return false;
    if (c >= 0xd800 && c <= 0xdbff) {
      const low = line.charCodeAt(k + 1);
      if (!(low >= 0xdc00 && low <= 0xdfff)) return false;
      k++;
    } else if (c >= 0xdc00 && c <= 0xdfff) return false;
  }
  return true;
}
