/**
 * Resource limits for reading an untrusted Matrix Market file. Sizes are checked against them
 * before anything proportional to the declared size is allocated, so a tiny file declaring a
 * 10⁹ × 10⁹ matrix fails at once.
 */
export interface MatrixMarketLimits {
  /** Largest accepted number of rows M. */
  maxRows: number;
  /** Largest accepted number of columns N. */
  maxCols: number;
  /** Largest accepted M·N: the dense result holds M·N doubles (8 bytes each). */
  maxDenseEntries: number;
  /** Longest accepted line in characters, not counting the line ending. */
  maxLineLength: number;
  /** Largest accepted file size in UTF-8 bytes. */
  maxBytes: number;
}

/**
 * Defaults. The line length is about that of NIST's reference reader `mmio.h`, whose line buffer
 * holds MM_MAX_LINE_LENGTH = 1025 characters (from memory; vendored copies vary). The others are
 * this service's choice (common practice: bound memory by what the largest expected use needs):
 * 2048² doubles are 32 MiB, and 8 MiB of text holds a coordinate file with a few hundred thousand
 * entries.
 */
export const DEFAULT_MATRIX_MARKET_LIMITS: Readonly<MatrixMarketLimits> = Object.freeze({
  maxRows: 4096,
  maxCols: 4096,
  maxDenseEntries: 2048 * 2048,
  maxLineLength: 1024,
  maxBytes: 8 * 1024 * 1024,
});

/** Fills in the defaults; throws RangeError naming a limit that is not a non-negative integer. */
export function resolveMatrixMarketLimits(
  limits: Partial<MatrixMarketLimits> = {},
): MatrixMarketLimits {
  const resolved = { ...DEFAULT_MATRIX_MARKET_LIMITS, ...limits };
  for (const key of Object.keys(DEFAULT_MATRIX_MARKET_LIMITS) as (keyof MatrixMarketLimits)[]) {
    const value = resolved[key];
    if (!Number.isSafeInteger(value) || value < 0)
      throw new RangeError(`limits.${key} must be a non-negative integer, got ${String(value)}`);
  }
  return resolved;
}
