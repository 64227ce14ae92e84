import type { MatrixMarketHeader } from '@sandbox/matrix-market/matrix-market-banner.ts';
import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';
import type { MatrixMarketLineReader } from '@sandbox/matrix-market/matrix-market-lines.ts';
import { splitFields } from '@sandbox/matrix-market/matrix-market-tokens.ts';

/**
 * Hands each data line after the size line to `onEntry` as its fields, one line per declared
 * entry (NISTIR 5935, §3.1 and §3.2): blank lines are skipped, a comment line is rejected
 * (comments belong before the size line, §2), as are more lines than `entries` and, at the end,
 * fewer. `declared` finishes the count messages, e.g. "entries declared on line 2".
 * Cost: O(bytes) time.
 */
export function readEntryLines(
  reader: MatrixMarketLineReader,
  entries: number,
  declared: string,
  onEntry: (tokens: string[], line: number) => void,
): void {
  let read = 0;
  for (let next = reader.next(); next !== undefined; next = reader.next()) {
    const { text, line } = next;
    const tokens = splitFields(text);
    if (tokens.length === 0) continue;
    if (read === entries)
      throw new MatrixMarketError(
        line,
        'too-many-entries',
        `more data after the ${entries} ${declared}`,
      );
    if (tokens[0]!.startsWith('%'))
      throw new MatrixMarketError(
        line,
        'bad-entry-line',
        'comment lines must come before the size line',
      );
    onEntry(tokens, line);
    read++;
  }
  if (read < entries)
    throw new MatrixMarketError(
      reader.lastLine,
      'too-few-entries',
      `the file ends after ${read} of the ${entries} ${declared}`,
    );
}

/**
 * Stores value at (i, j), 0-based, of the dense row-major m×n data (entry (i, j) at
 * data[i*n + j]) and, for a symmetric file, its mirror a_ji = a_ij off the diagonal; for a
 * skew-symmetric one a_ji = −a_ij (NISTIR 5935, §3, symmetry).
 */
export function storeEntry(
  data: Float64Array,
  n: number,
  i: number,
  j: number,
  value: number,
  symmetry: MatrixMarketHeader['symmetry'],
): void {
  data[i * n + j] = value;
  if (i !== j && symmetry === 'symmetric') data[j * n + i] = value;
  if (symmetry === 'skew-symmetric') data[j * n + i] = -value;
}
