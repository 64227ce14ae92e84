import type { MatrixMarketHeader } from '@sandbox/matrix-market/matrix-market-banner.ts';
import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';
import type { MatrixMarketLimits } from '@sandbox/matrix-market/matrix-market-limits.ts';
import { parseCount, splitFields } from '@sandbox/matrix-market/matrix-market-tokens.ts';

/** What the size line declares: an m×n matrix stored as `entries` data lines. */
export interface MatrixMarketSize {
  m: number;
  n: number;
  entries: number;
}

/**
 * Reads the size line: `M N L` for coordinate files, `M N` for array files (NISTIR 5935, §3.1 and
 * §3.2). Everything is checked here, before the caller allocates anything: the sizes against the
 * limits, squareness for symmetric and skew-symmetric matrices, and for coordinate files that L
 * does not exceed the number of distinct positions the symmetry allows (m·n; n(n+1)/2 on and below
 * the diagonal; n(n−1)/2 strictly below), since more entries would have to repeat a position.
 * For array files L is the number of values stored: m·n, n(n+1)/2 or n(n−1)/2.
 */
export function parseMatrixMarketSizeLine(
  text: string,
  line: number,
  header: MatrixMarketHeader,
  limits: MatrixMarketLimits,
): MatrixMarketSize {
  const tokens = splitFields(text);
  const coordinate = header.format === 'coordinate';
  const expected = coordinate ? 3 : 2;
  if (tokens.length !== expected) {
    const shape = coordinate ? "'rows columns entries'" : "'rows columns'";
    throw new MatrixMarketError(
      line,
      'bad-size-line',
      `the size line of ${header.format === 'array' ? 'an' : 'a'} ${header.format} file must be ${shape}, found ${tokens.length} fields`,
    );
  }
  const m = parseCount(tokens[0]!, 'row count', line);
  const n = parseCount(tokens[1]!, 'column count', line);
  const declared = coordinate ? parseCount(tokens[2]!, 'entry count', line) : 0;
  if (m > limits.maxRows)
    throw new MatrixMarketError(
      line,
      'too-large',
      `${tokens[0]} rows exceed the limit of ${limits.maxRows}`,
    );
  if (n > limits.maxCols)
    throw new MatrixMarketError(
      line,
      'too-large',
      `${tokens[1]} columns exceed the limit of ${limits.maxCols}`,
    );
  if (m * n > limits.maxDenseEntries)
    throw new MatrixMarketError(
      line,
      'too-large',
      `a ${m}×${n} matrix has ${m * n} entries, more than the limit of ${limits.maxDenseEntries}`,
    );
  if (header.symmetry !== 'general' && m !== n)
    throw new MatrixMarketError(
      line,
      'bad-size-line',
      `a ${header.symmetry} matrix must be square, but the size line declares ${m}×${n}`,
    );
  const positions =
    header.symmetry === 'general'
      ? m * n
      : header.symmetry === 'symmetric'
        ? (n * (n + 1)) / 2
        : (n * (n - 1)) / 2;
  if (!coordinate) return { m, n, entries: positions };
  if (declared > positions) {
    const where =
      header.symmetry === 'general'
        ? 'positions'
        : header.symmetry === 'symmetric'
          ? 'positions on or below the diagonal'
          : 'positions below the diagonal';
    throw new MatrixMarketError(
      line,
      'too-many-entries',
      `${declared} entries declared, but a ${m}×${n} ${header.symmetry} matrix has only ${positions} ${where}`,
    );
  }
  return { m, n, entries: declared };
}
