import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';
import { DEFAULT_MATRIX_MARKET_LIMITS } from '@sandbox/matrix-market/matrix-market-limits.ts';

const LF = 0x0a;

/**
 * Decodes the bytes of an uploaded Matrix Market file as UTF-8, refusing more than `maxBytes`
 * bytes and any invalid UTF-8 (WHATWG Encoding Standard, TextDecoder with `fatal: true`: overlong
 * forms, encoded surrogates and truncated sequences all fail). A leading byte-order mark is
 * dropped. The result still has to pass parseMatrixMarket, which rejects control characters.
 * Cost: O(bytes); on failure the offending line is found by decoding line by line, which is
 * sound because the byte 0x0A never occurs inside a multi-byte UTF-8 sequence (RFC 3629 §3, from memory).
 * Throws MatrixMarketError (`file-too-large`, `invalid-utf8`) with the 1-based line;
 * TypeError if `bytes` is not a Uint8Array, RangeError if `maxBytes` is not a non-negative integer.
 */
export function decodeMatrixMarketBytes(
  bytes: Uint8Array,
  maxBytes: number = DEFAULT_MATRIX_MARKET_LIMITS.maxBytes,
): string {
  if (!(bytes instanceof Uint8Array)) throw new TypeError('bytes must be a Uint8Array');
  if (!Number.isSafeInteger(maxBytes) || maxBytes < 0)
    throw new RangeError(`maxBytes must be a non-negative integer, got ${maxBytes}`);
  if (bytes.length > maxBytes)
    throw new MatrixMarketError(
      lineAt(bytes, maxBytes),
      'file-too-large',
      `the file exceeds the limit of ${maxBytes} bytes`,
    );
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    const line = firstInvalidLine(bytes);
    throw new MatrixMarketError(line, 'invalid-utf8', 'the text is not valid UTF-8');
  }
}

/** The 1-based line holding byte offset `offset`. */
function lineAt(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let k = 0; k < offset && k < bytes.length; k++) if (bytes[k] === LF) line++;
  return line;
}

/** The first line whose bytes alone are not valid UTF-8. */
function firstInvalidLine(bytes: Uint8Array): number {
  const decoder = new TextDecoder('utf-8', { fatal: true });
  let start = 0;
  let line = 1;
  while (start <= bytes.length) {
    let end = bytes.indexOf(LF, start);
    if (end === -1) end = bytes.length;
    try {
      decoder.decode(bytes.subarray(start, end));
    } catch {
      return line;
    }
    start = end + 1;
    line++;
  }
  return line;
}
