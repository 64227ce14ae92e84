import type { ParsedMatrixMarket } from '@sandbox/matrix-market/read.ts';

/** What an upload preview shows about a parsed Matrix Market file (no matrix data). */
export interface MatrixMarketSummary {
  m: number;
  n: number;
  entries: number;
  symmetry: ParsedMatrixMarket['symmetry'];
  field: ParsedMatrixMarket['field'];
  format: ParsedMatrixMarket['format'];
}

/** The summary of a parsed file: its size, stored entry count and declared type. Cost O(1). */
export function describeMatrixMarket(parsed: ParsedMatrixMarket): MatrixMarketSummary {
  const { m, n, entries, symmetry, field, format } = parsed;
  return { m, n, entries, symmetry, field, format };
}
