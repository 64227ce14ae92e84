import type { MatrixMarketHeader } from '@sandbox/matrix-market/matrix-market-banner.ts';
import { readEntryLines, storeEntry } from '@sandbox/matrix-market/matrix-market-entries.ts';
import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';
import type { MatrixMarketLineReader } from '@sandbox/matrix-market/matrix-market-lines.ts';
import type { MatrixMarketSize } from '@sandbox/matrix-market/matrix-market-size-line.ts';
import { parseValue } from '@sandbox/matrix-market/matrix-market-tokens.ts';

/**
 * Reads the data lines of an array file into a dense row-major m×n matrix: entry (i, j), 0-based,
 * lands at data[i*n + j].
 * Layout of the file (NISTIR 5935, §3.2): one value per line in column-major order. A symmetric
 * file gives only the lower triangle, column by column (column j from row j down), and the reader
 * sets a_ji = a_ij; a skew-symmetric file gives only the strictly lower triangle (column j from row
 * j+1 down) and the reader sets a_ji = −a_ij, the diagonal being zero. Blank lines are skipped.
 * Cost: O(m·n) memory and O(bytes) time.
 */
export function readArrayBody(
  reader: MatrixMarketLineReader,
  header: MatrixMarketHeader,
  size: MatrixMarketSize,
  sizeLine: number,
): Float64Array {
  const { m, n, entries } = size;
  const data = new Float64Array(m * n);
  const field = header.field as 'real' | 'integer';
  const firstRow = header.symmetry === 'skew-symmetric' ? 1 : 0;
  // The next position to fill is row i of column j; when not general, column j starts at row
  // j + firstRow.
  let i = firstRow;
  let j = 0;
  const declared = `values declared by the size line (line ${sizeLine})`;
  readEntryLines(reader, entries, declared, (tokens, line) => {
    if (tokens.length !== 1)
      throw new MatrixMarketError(
        line,
        'bad-entry-line',
        `expected one value per line, found ${tokens.length}`,
      );
    storeEntry(data, n, i, j, parseValue(tokens[0]!, field, line), header.symmetry);
    i++;
    if (i === m) {
      j++;
      i = header.symmetry === 'general' ? 0 : j + firstRow;
    }
  });
  return data;
}
