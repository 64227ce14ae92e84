/**
 * Why a Matrix Market file was rejected. The codes form a closed list so that callers (the upload
 * route, the command-line evaluator) can react to a kind of failure without parsing the message.
 */
export type MatrixMarketErrorCode =
  | 'empty-file'
  | 'bad-banner'
  | 'unsupported-type'
  | 'bad-size-line'
  | 'too-large'
  | 'too-few-entries'
  | 'too-many-entries'
  | 'bad-entry-line'
  | 'index-out-of-range'
  | 'bad-value'
  | 'not-finite'
  | 'not-integer'
  | 'duplicate-entry'
  | 'upper-triangle-entry'
  | 'skew-diagonal-entry'
  | 'line-too-long'
  | 'bad-character'
  | 'invalid-utf8'
  | 'file-too-large';

/**
 * A Matrix Market file that cannot be read: `line` is the 1-based line the problem was found on
 * and `reason` says what is wrong there; the message is `line <line>: <reason>`.
 */
export class MatrixMarketError extends Error {
  readonly line: number;
  readonly reason: string;
  readonly code: MatrixMarketErrorCode;

  constructor(line: number, code: MatrixMarketErrorCode, reason: string) {
    super(`line ${line}: ${reason}`);
    this.name = 'MatrixMarketError';
    this.line = line;
    this.reason = reason;
    this.code = code;
  }
}
