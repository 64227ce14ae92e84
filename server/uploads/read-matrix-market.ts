import type { MatrixMarketSummary } from '@shared/api/uploads.ts';
import { maxUploadBytes } from '@shared/api/uploads.ts';
import { decodeMatrixMarketBytes } from '@sandbox/matrix-market/matrix-market-decode.ts';
import { MatrixMarketError } from '@sandbox/matrix-market/matrix-market-error.ts';
import { parseMatrixMarket } from '@sandbox/matrix-market/read.ts';
import { AppError } from '@server/http/errors.ts';
import type { ReceivedFile } from './matrix-market-file.ts';

export interface ReadMatrixMarket {
  summary: MatrixMarketSummary;
  /** The decoded text, stored as it came. */
  text: string;
}

/**
 * Decodes and parses an uploaded file with the engine's reader, which checks everything the
 * trials will rely on (size limits, values, symmetry, entry count). A file it refuses is a 400
 * `validation-failed` naming the line and the reason; an oversized one a 413.
 */
export function readMatrixMarket(file: ReceivedFile): ReadMatrixMarket {
  try {
    const text = decodeMatrixMarketBytes(file.bytes, maxUploadBytes);
    const parsed = parseMatrixMarket(text, { maxBytes: maxUploadBytes });
    return {
      text,
      summary: {
        fileName: file.fileName,
        bytes: file.bytes.length,
        rows: parsed.m,
        cols: parsed.n,
        entries: parsed.entries,
        symmetry: parsed.symmetry,
        field: parsed.field,
        format: parsed.format,
      },
    };
  } catch (err) {
    if (!(err instanceof MatrixMarketError)) throw err;
    if (err.code === 'file-too-large') {
      throw new AppError('payload-too-large', `${file.fileName}: ${err.reason}.`);
    }
    throw new AppError(
      'validation-failed',
      `${file.fileName} is not a valid Matrix Market file: ${err.message}.`,
      {
        line: err.line,
        reason: err.reason,
        code: err.code,
      },
    );
  }
}
