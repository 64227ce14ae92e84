import type { RequestHandler } from 'express';
import multer from 'multer';
import { maxKernelSourceBytes } from '@shared/api/revisions.ts';
import { requireUser } from '@server/auth/current-user.ts';
import { AppError } from '@server/http/errors.ts';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: maxKernelSourceBytes, files: 1, fields: 10, fieldSize: 64 * 1024 },
}).single('source');

function refusal(err: unknown): AppError {
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') {
      return new AppError(
        'payload-too-large',
        `The kernel file may be at most ${maxKernelSourceBytes} bytes.`,
      );
    }
    if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
      return new AppError('validation-failed', 'Send one file, in the field `source`.');
    }
    return new AppError('validation-failed', `The upload is not valid (${err.code}).`);
  }
  return new AppError('validation-failed', 'The upload could not be read.');
}

const decoder = new TextDecoder('utf-8', { fatal: true });

/**
 * Lets a kernel arrive as a multipart upload: a `.ts` file in the field `source` (at most
 * 200 kB of UTF-8), beside text fields such as `title`. The file's text replaces `source` in
 * the body, so the route parses one shape whichever way the kernel came. JSON requests pass.
 * Anonymous requests are refused before any upload is read.
 */
export const kernelUpload: RequestHandler = (req, res, next) => {
  requireUser(req);
  upload(req, res, (err: unknown) => {
    if (err) {
      next(refusal(err));
      return;
    }
    const file = req.file;
    if (!file) {
      next();
      return;
    }
    if (!/\.ts$/i.test(file.originalname) || /\.d\.ts$/i.test(file.originalname)) {
      next(new AppError('validation-failed', 'The kernel file must be a TypeScript `.ts` file.'));
      return;
    }
    let source: string;
    try {
      source = decoder.decode(file.buffer);
    } catch {
      next(new AppError('validation-failed', 'The kernel file is not UTF-8 text.'));
      return;
    }
    req.body = { ...(req.body as Record<string, unknown>), source };
    next();
  });
};
