import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';

/** The fields of a line, separated by spaces and tabs; leading and trailing blanks are ignored. */
export function splitFields(text: string): string[] {
  const trimmed = text.replace(/^[ \t]+|[ \t]+$/g, '');
  return trimmed === '' ? [] : trimmed.split(/[ \t]+/);
}

const UNSIGNED = /^[0-9]+$/;
const SIGNED = /^[+-]?[0-9]+$/;
// A C decimal floating constant as strtod reads it (ISO C99 §7.20.1.3, from memory), without hexadecimal
// forms, infinities and NaNs: digits with an optional point, then an optional exponent.
const DECIMAL = /^[+-]?(?:[0-9]+\.?[0-9]*|\.[0-9]+)(?:[eE][+-]?[0-9]+)?$/;
const NON_FINITE = /^[+-]?(?:nan|inf|infinity)$/i;

/** A size (rows, columns or entries) from the size line: a non-negative decimal integer. */
export function parseCount(token: string, what: string, line: number): number {
  if (UNSIGNED.test(token)) return Number(token);
  if (/^-[0-9]+$/.test(token))
    throw new MatrixMarketError(line, 'bad-size-line', `${what} ${token} is negative`);
  throw new MatrixMarketError(
    line,
    'bad-size-line',
    `${what} '${token}' is not a non-negative integer`,
  );
}

/** A 1-based row or column index, which must lie in 1..size. */
export function parseIndex(token: string, what: string, size: number, line: number): number {
  if (!SIGNED.test(token))
    throw new MatrixMarketError(
      line,
      'bad-entry-line',
      `${what} index '${token}' is not an integer`,
    );
  const index = Number(token);
  if (index < 1 || index > size)
    throw new MatrixMarketError(
      line,
      'index-out-of-range',
      `${what} index ${token} is out of range 1..${size}`,
    );
  return index;
}

/**
 * A value of a real or integer field. Real values must be finite decimal numbers; integer values
 * must be integers that a double holds exactly (|v| ≤ 2^53 − 1, ECMA-262 Number.MAX_SAFE_INTEGER).
 */
export function parseValue(token: string, field: 'real' | 'integer', line: number): number {
  if (NON_FINITE.test(token)) {
    const name = /nan/i.test(token) ? 'NaN' : 'Infinity';
    throw new MatrixMarketError(
      line,
      'not-finite',
      `value '${token}' is ${name}, which is not allowed`,
    );
  }
  if (!DECIMAL.test(token))
    throw new MatrixMarketError(line, 'bad-value', `value '${token}' is not a number`);
  if (field === 'integer' && !SIGNED.test(token))
    throw new MatrixMarketError(
      line,
      'not-integer',
      `value ${token} is not an integer, but the field is integer`,
    );
  const value = Number(token);
  if (!Number.isFinite(value))
    throw new MatrixMarketError(line, 'not-finite', `value ${token} overflows to Infinity`);
  if (field === 'integer' && !Number.isSafeInteger(value))
    throw new MatrixMarketError(
      line,
      'not-integer',
      `integer value ${token} is too large to hold exactly (limit 2^53 - 1)`,
    );
  return value;
}
