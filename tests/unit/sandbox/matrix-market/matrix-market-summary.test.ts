import { describe, expect, it } from 'vitest';
import { parseMatrixMarket } from '@sandbox/matrix-market/read.ts';
import { describeMatrixMarket } from '@sandbox/matrix-market/matrix-market-summary.ts';

describe('describeMatrixMarket', () => {
  // A symmetric coordinate file of order 3 with 4 stored entries (invented); the summary reports
  // what the file stores, not the 7 nonzeros of the expanded matrix.
  it('summarises size, stored entries and type without the data', () => {
    const parsed = parseMatrixMarket(
      '%%MatrixMarket matrix coordinate integer symmetric\n% c\n3 3 4\n1 1 1\n2 1 2\n3 1 3\n3 3 4\n',
    );
    const summary = describeMatrixMarket(parsed);
    expect(summary).toEqual({
      m: 3,
      n: 3,
      entries: 4,
      symmetry: 'symmetric',
      field: 'integer',
      format: 'coordinate',
    });
    expect(Object.keys(summary)).not.toContain('data');
  });
});
