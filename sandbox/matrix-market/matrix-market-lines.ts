import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';
import type { MatrixMarketLimits } from '@sandbox/matrix-market/matrix-market-limits.ts';

/** One line of the file, without its line ending, with its 1-based number. */
export interface MatrixMarketLine {
  text: string;
  line: number;
}

/** Hands out the lines of a Matrix Market text one at a time. */
export interface MatrixMarketLineReader {
  /** The next line, or undefined at the end of the text. */
  next(): MatrixMarketLine | undefined;
  /** The number of the last line of the text (0 for an empty text). */
  readonly lastLine: number;
}

const LF = 10;
const CR = 13;
const TAB = 9;

/**
 * Rejects text that a well-formed file cannot contain, before any parsing: more than
 * `maxBytes` UTF-8 bytes, NUL and other control characters (C0 except tab and line endings,
 * DEL, C1), a carriage return not followed by a line feed, and unpaired UTF-16 surrogates (which
 * no valid UTF-8 decodes to). Cost: one pass, stopping at the first problem.
 * Method: UTF-8 lengths per code point from RFC 3629 §3 (from memory; 1 byte below U+0080, 2 below U+0800,
 * 4 for a surrogate pair, else 3).
 */
export function checkMatrixMarketText(text: string, maxBytes: number): void {
  let line = 1;
  let bytes = 0;
  for (let k = 0; k < text.length; k++) {
    const c = text.charCodeAt(k);
    if (c === LF) line++;
    else if (c === CR) {
      if (k + 1 < text.length && text.charCodeAt(k + 1) !== LF)
        throw new MatrixMarketError(
          line,
          'bad-character',
          'carriage return not followed by a line feed',
        );
    } else if ((c < 32 && c !== TAB) || (c >= 0x7f && c <= 0x9f)) {
      const name = c === 0 ? 'NUL character (U+0000)' : `control character ${codePoint(c)}`;
      throw new MatrixMarketError(line, 'bad-character', `${name} is not allowed`);
    }
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff) {
      const low = k + 1 < text.length ? text.charCodeAt(k + 1) : 0;
      if (low < 0xdc00 || low > 0xdfff)
        throw new MatrixMarketError(
          line,
          'invalid-utf8',
          `unpaired surrogate ${codePoint(c)} is not valid UTF-8`,
        );
      bytes += 4;
      k++;
    } else if (c >= 0xdc00 && c <= 0xdfff)
      throw new MatrixMarketError(
        line,
        'invalid-utf8',
        `unpaired surrogate ${codePoint(c)} is not valid UTF-8`,
      );
    else bytes += 3;
    if (bytes > maxBytes)
      throw new MatrixMarketError(
        line,
        'file-too-large',
        `the file exceeds the limit of ${maxBytes} bytes`,
      );
  }
}

/**
 * Splits checked text into lines on LF, dropping a CR before it (so CRLF files read as LF
 * files) and a byte-order mark at the very start; a final line with no line ending counts. A line
 * longer than `limits.maxLineLength` characters is rejected when it is reached.
 */
export function createLineReader(text: string, limits: MatrixMarketLimits): MatrixMarketLineReader {
  let position = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let line = 0;
  let lastLine = 0;
  for (let k = text.indexOf('\n'); k !== -1; k = text.indexOf('\n', k + 1)) lastLine++;
  if (text.length > 0 && text.charCodeAt(text.length - 1) !== LF) lastLine++;
  return {
    lastLine,
    next() {
      if (position >= text.length) return undefined;
      let end = text.indexOf('\n', position);
      if (end === -1) end = text.length;
      const stop = end > position && text.charCodeAt(end - 1) === CR ? end - 1 : end;
      line++;
      const length = stop - position;
      if (length > limits.maxLineLength)
        throw new MatrixMarketError(
          line,
          'line-too-long',
          `line is ${length} characters long; the limit is ${limits.maxLineLength}`,
        );
      const result = { text: text.slice(position, stop), line };
      position = end + 1;
      return result;
    },
  };
}

function codePoint(c: number): string {
  return `U+${c.toString(16).toUpperCase().padStart(4, '0')}`;
}
