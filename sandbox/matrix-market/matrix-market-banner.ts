import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';
import { splitFields } from '@sandbox/matrix-market/matrix-market-tokens.ts';

/** The supported part of the Matrix Market type: what the banner line declares. */
export interface MatrixMarketHeader {
  format: 'coordinate' | 'array';
  field: 'real' | 'integer' | 'pattern';
  symmetry: 'general' | 'symmetric' | 'skew-symmetric';
}

const BANNER_SHAPE = '%%MatrixMarket matrix <format> <field> <symmetry>';

/**
 * Reads the banner `%%MatrixMarket object format field symmetry`, which must be line 1
 * (Boisvert, Pozo & Remington, NISTIR 5935, 1996, §2). Keywords are compared case-insensitively,
 * as NIST's reader `mmio.c` lower-cases them before comparing (its `mm_read_banner`); this reader
 * also accepts the `%%MatrixMarket` token in any case, which `mmio.c` does not. Combinations that
 * `mmio.c`'s `mm_is_valid` rejects are rejected here too: pattern with array, pattern with
 * skew-symmetric, hermitian without complex. Complex and hermitian matrices and vectors are valid
 * Matrix Market but not supported by this service, and are rejected as such.
 */
export function parseMatrixMarketBanner(text: string, line: number): MatrixMarketHeader {
  const tokens = splitFields(text).map((t) => t.toLowerCase());
  if (tokens[0] !== '%%matrixmarket')
    throw new MatrixMarketError(
      line,
      'bad-banner',
      `the first line must be the banner '${BANNER_SHAPE}'`,
    );
  if (tokens.length !== 5)
    throw new MatrixMarketError(
      line,
      'bad-banner',
      `the banner needs 4 keywords after %%MatrixMarket (object, format, field, symmetry), found ${tokens.length - 1}`,
    );
  const [, object, format, field, symmetry] = tokens as [string, string, string, string, string];
  if (object === 'vector')
    throw new MatrixMarketError(
      line,
      'unsupported-type',
      "object 'vector' is not supported; only 'matrix' is",
    );
  if (object !== 'matrix')
    throw new MatrixMarketError(
      line,
      'bad-banner',
      `unknown object '${object}' (expected 'matrix')`,
    );
  if (format !== 'coordinate' && format !== 'array')
    throw new MatrixMarketError(
      line,
      'bad-banner',
      `unknown format '${format}' (expected coordinate or array)`,
    );
  if (field === 'complex')
    throw new MatrixMarketError(
      line,
      'unsupported-type',
      "field 'complex' is not supported: only real, integer and pattern matrices are read",
    );
  if (field !== 'real' && field !== 'integer' && field !== 'pattern')
    throw new MatrixMarketError(
      line,
      'bad-banner',
      `unknown field '${field}' (expected real, integer, complex or pattern)`,
    );
  if (symmetry === 'hermitian')
    throw new MatrixMarketError(
      line,
      'unsupported-type',
      "symmetry 'hermitian' is not supported: it needs the complex field, which is not supported",
    );
  if (symmetry !== 'general' && symmetry !== 'symmetric' && symmetry !== 'skew-symmetric')
    throw new MatrixMarketError(
      line,
      'bad-banner',
      `unknown symmetry '${symmetry}' (expected general, symmetric, skew-symmetric or hermitian)`,
    );
  if (field === 'pattern' && format === 'array')
    throw new MatrixMarketError(
      line,
      'bad-banner',
      "field 'pattern' is only valid with the coordinate format",
    );
  if (field === 'pattern' && symmetry === 'skew-symmetric')
    throw new MatrixMarketError(
      line,
      'bad-banner',
      "field 'pattern' cannot be skew-symmetric (there are no values to negate)",
    );
  return { format, field, symmetry };
}
