import type { MatrixMarketHeader } from '@sandbox/matrix-market/matrix-market-banner.ts';
import { readEntryLines, storeEntry } from '@sandbox/matrix-market/matrix-market-entries.ts';
import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';
import type { MatrixMarketLineReader } from '@sandbox/matrix-market/matrix-market-lines.ts';
import type { MatrixMarketSize } from '@sandbox/matrix-market/matrix-market-size-line.ts';
import { parseIndex, parseValue } from '@sandbox/matrix-market/matrix-market-tokens.ts';

/**
 * Reads the data lines of a coordinate file into a dense row-major m×n matrix: entry (i, j),
 * 0-based, lands at data[i*n + j]; positions not listed are 0.
 * Layout of the file (NISTIR 5935, §3.1): one entry per line, `I J value` with 1-based indices in
 * any order, `I J` for the pattern field (value 1). Symmetric files list only entries with I ≥ J
 * and the reader sets a_JI = a_IJ; skew-symmetric files only I > J, and a_JI = −a_IJ (§3.1,
 * symmetry). The spec does not say what a repeated position means, so a repeat is rejected, naming
 * the earlier line. Blank lines are skipped; comment lines belong before the size line (§2).
 * Cost: O(m·n) memory (the result and a line-number table of 4 bytes per position), O(bytes) time.
 */
export function readCoordinateBody(
  reader: MatrixMarketLineReader,
  header: MatrixMarketHeader,
  size: MatrixMarketSize,
  sizeLine: number,
): Float64Array {
  const { m, n, entries } = size;
  const data = new Float64Array(m * n);
  // seenAt[p] is the line that gave position p, or 0 if none has yet.
  const seenAt = new Uint32Array(m * n);
  const pattern = header.field === 'pattern';
  const fieldCount = pattern ? 2 : 3;
  readEntryLines(reader, entries, `entries declared on line ${sizeLine}`, (tokens, line) => {
    if (tokens.length !== fieldCount) {
      const shape = pattern ? "'row column'" : "'row column value'";
      throw new MatrixMarketError(
        line,
        'bad-entry-line',
        `expected ${shape}, found ${tokens.length} field${tokens.length === 1 ? '' : 's'}`,
      );
    }
    const i = parseIndex(tokens[0]!, 'row', m, line);
    const j = parseIndex(tokens[1]!, 'column', n, line);
    const value = pattern ? 1 : parseValue(tokens[2]!, header.field as 'real' | 'integer', line);
    checkTriangle(header.symmetry, i, j, line);
    const p = (i - 1) * n + (j - 1);
    const earlier = seenAt[p]!;
    if (earlier !== 0)
      throw new MatrixMarketError(
        line,
        'duplicate-entry',
        `entry (${i}, ${j}) repeats line ${earlier}`,
      );
    seenAt[p] = line;
    storeEntry(data, n, i - 1, j - 1, value, header.symmetry);
  });
  return data;
}

function checkTriangle(
  symmetry: MatrixMarketHeader['symmetry'],
  i: number,
  j: number,
  line: number,
): void {
  if (symmetry === 'symmetric' && i < j)
    throw new MatrixMarketError(
      line,
      'upper-triangle-entry',
      `entry (${i}, ${j}) is above the diagonal; a symmetric file gives only entries with row ≥ column`,
    );
  if (symmetry !== 'skew-symmetric') return;
  if (i === j)
    throw new MatrixMarketError(
      line,
      'skew-diagonal-entry',
      `diagonal entry (${i}, ${j}) in a skew-symmetric file; the diagonal is zero and must be omitted`,
    );
  if (i < j)
    throw new MatrixMarketError(
      line,
      'upper-triangle-entry',
      `entry (${i}, ${j}) is above the diagonal; a skew-symmetric file gives only entries with row > column`,
    );
}
