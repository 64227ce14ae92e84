import type { RequestHandler } from 'express';
import multer from 'multer';
import { maxUploadBytes } from '@shared/api/uploads.ts';
import { AppError } from '@server/http/errors.ts';

/** An uploaded file as the service sees it: a cleaned-up name and the raw bytes. */
export interface ReceivedFile {
  fileName: string;
  bytes: Uint8Array;
}

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: maxUploadBytes, files: 1, fields: 5, fieldSize: 1024, parts: 10 },
  defParamCharset: 'utf8',
}).single('file');

function refusal(err: unknown): AppError {
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') {
      return new AppError(
        'payload-too-large',
        `A Matrix Market file may be at most ${maxUploadBytes} bytes (8 MiB).`,
      );
    }
    if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
      return new AppError('validation-failed', 'Send one file, in the field `file`.');
    }
    return new AppError('validation-failed', `The upload is not valid (${err.code}).`);
  }
  return new AppError('validation-failed', 'The upload could not be read as multipart form data.');
}

/** The file's own name without any folder part or control characters, at most 200 characters. */
export function cleanFileName(original: string): string {
  const base = original.split(/[\\/]/).pop() ?? '';
  const printable = [...base].filter((c) => c >= ' ' && c !== '\u007f').join('');
  return printable.trim().slice(-200);
}

/**
 * Reads a multipart upload with one `.mtx` file in the field `file` (at most 8 MiB, else 413)
 * into `res.locals.file` as a ReceivedFile. Mount it after the access check, so nobody outside
 * the team can make the server read 8 MiB.
 */
export const matrixMarketFile: RequestHandler = (req, res, next) => {
  if (!req.is('multipart/form-data')) {
    next(new AppError('validation-failed', 'Send the file as multipart/form-data, field `file`.'));
    return;
  }
  upload(req, res, (err: unknown) => {
    if (err) {
      next(refusal(err));
      return;
    }
    const file = req.file;
    if (!file) {
      next(new AppError('validation-failed', 'Send one file, in the field `file`.'));
      return;
    }
    const fileName = cleanFileName(file.originalname);
    if (!/\.mtx$/i.test(fileName) || fileName.length < 5) {
      next(new AppError('validation-failed', 'The file must be a Matrix Market file (.mtx).'));
      return;
    }
    const received: ReceivedFile = { fileName, bytes: new Uint8Array(file.buffer) };
    res.locals.file = received;
    next();
  });
};
