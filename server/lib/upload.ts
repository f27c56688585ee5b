import type { Request, RequestHandler } from 'express';
import multer from 'multer';
import { textProblem } from '#shared/schemas/common.schema.ts';
import { AppError, badRequest } from './errors.ts';

export interface UploadedFile {
  buffer: Buffer;
  originalName: string;
  sizeBytes: number;
}

function megabytes(bytes: number): string {
  const mb = bytes / (1024 * 1024);
  return `${Number.isInteger(mb) ? mb : mb.toFixed(1)} MB`;
}

/**
 * Reads one file from the multipart field `file` into memory (nothing touches the disk, so no
 * temporary file can be left behind), with every multer limit set. A file over `maxBytes()` is a
 * 413; a cut-off or malformed body is a 400, and the process carries on.
 */
export function singleFileUpload(options: {
  maxBytes: () => number;
  /** Text fields the route accepts besides the file. */
  fields?: number;
  /** A request without a body this answers true for goes on without a file. */
  fileless?: (req: Request) => boolean;
}): RequestHandler {
  return (req, res, next) => {
    if (!req.is('multipart/form-data') && options.fileless?.(req) && !hasBody(req)) {
      next();
      return;
    }
    if (!req.is('multipart/form-data')) {
      next(badRequest('Send the file as multipart/form-data in the field "file".'));
      return;
    }
    const maxBytes = options.maxBytes();
    const fields = options.fields ?? 0;
    const middleware = multer({
      storage: multer.memoryStorage(),
      // Browsers send a file name as raw UTF-8; busboy would read it as Latin-1 ("GerÃ¤t").
      defParamCharset: 'utf8',
      limits: {
        fileSize: maxBytes,
        files: 1,
        fields,
        parts: fields + 1,
        fieldSize: 64 * 1024,
        fieldNameSize: 100,
        headerPairs: 20,
      },
    }).single('file');
    middleware(req, res, (err?: unknown) => {
      if (err) {
        next(translate(err, maxBytes));
        return;
      }
      if (!req.file) {
        next(badRequest('No file: send it in the multipart field "file".'));
        return;
      }
      next();
    });
  };
}

function translate(err: unknown, maxBytes: number): AppError {
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') {
      return new AppError(
        413,
        'too_large',
        `The file is larger than ${megabytes(maxBytes)}, the most this accepts. Nothing was saved.`,
      );
    }
    if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
      return badRequest('Send exactly one file, in the multipart field "file".');
    }
    return badRequest(`The upload was refused: ${err.message.toLowerCase()}.`);
  }
  // busboy: "Unexpected end of form", "Malformed part header"…; or the client went away.
  return new AppError(
    400,
    'malformed_upload',
    'The upload was cut off or malformed. Nothing was saved; try again.',
  );
}

/**
 * The uploaded name, for display only: no folders, NFC, and none of the characters stored text may
 * not hold (control, zero-width, text-direction: a right-to-left override could make "gpj.exe"
 * read as "exe.jpg"), not too long.
 */
export function displayFileName(name: string): string {
  const base = (name.split(/[\\/]/).pop() ?? '').normalize('NFC');
  const clean = Array.from(base)
    .filter((ch) => textProblem(ch) === null)
    .join('')
    .trim();
  return (clean || 'upload').slice(0, 200);
}

/** The file `singleFileUpload` read. */
export function uploadedFile(req: Express.Request): UploadedFile {
  const file = req.file;
  if (!file) throw badRequest('No file: send it in the multipart field "file".');
  return { buffer: file.buffer, originalName: file.originalname ?? '', sizeBytes: file.size };
}

/** Whether the request says it carries a body (RFC 9112 §6.3: a length or a transfer coding). */
function hasBody(req: Request): boolean {
  const length = req.headers['content-length'];
  return (length !== undefined && length !== '0') || req.headers['transfer-encoding'] !== undefined;
}
