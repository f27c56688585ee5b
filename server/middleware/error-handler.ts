import type { ErrorRequestHandler, RequestHandler } from 'express';
import {
  ForeignKeyConstraintError,
  OptimisticLockError,
  UniqueConstraintError,
  ValidationError as SequelizeValidationError,
} from 'sequelize';
import { ZodError } from 'zod';
import type { ApiErrorBody, FieldIssue } from '#shared/schemas/common.schema.ts';
import { AppError, busy } from '../lib/errors.ts';
import { logger } from '../lib/logger.ts';
import { storageFailure } from '../lib/storage-errors.ts';
import { isBusyError } from '../lib/transaction.ts';

export function zodIssues(err: ZodError): FieldIssue[] {
  return err.issues.map((issue) => ({
    field: issue.path.length ? issue.path.join('.') : '(body)',
    message: issue.message,
  }));
}

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(
    new AppError(404, 'not_found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}.`),
  );
};

function toAppError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  if (err instanceof ZodError) {
    const issues = zodIssues(err);
    const first = issues[0];
    const message = first
      ? `${first.field}: ${first.message}` +
        (issues.length > 1 ? ` (and ${issues.length - 1} more)` : '')
      : 'The request is not valid.';
    return new AppError(400, 'validation_failed', message, issues);
  }
  if (err instanceof OptimisticLockError) {
    return new AppError(409, 'version_conflict', 'Someone else changed this record; reload it.');
  }
  if (err instanceof UniqueConstraintError) {
    const fields = Object.keys(err.fields ?? {});
    return new AppError(
      409,
      'duplicate',
      fields.length
        ? `That ${fields.join(', ')} is already in use.`
        : 'That record already exists.',
    );
  }
  if (err instanceof ForeignKeyConstraintError) {
    return new AppError(409, 'in_use', 'That record is linked to another one.');
  }
  if (err instanceof SequelizeValidationError) {
    return new AppError(400, 'validation_failed', err.errors.map((e) => e.message).join('; '));
  }
  if (isBusyError(err)) return busy();
  // A full or read-only disk, wherever it surfaced (SQLite, the upload folder, the S3 store).
  const storage = storageFailure(err);
  if (storage) return storage;
  const e = err as { status?: number; type?: string; code?: string; message?: string };
  // body-parser and multer errors carry their own status.
  if (e?.type === 'entity.parse.failed') {
    return new AppError(400, 'malformed_json', 'The request body is not valid JSON.');
  }
  if (e?.type === 'entity.too.large' || e?.code === 'LIMIT_FILE_SIZE') {
    return new AppError(413, 'too_large', 'The request is larger than this route accepts.');
  }
  if (e?.status === 415) {
    return new AppError(415, 'unsupported_media_type', e.message ?? 'Unsupported media type.');
  }
  if (typeof e?.status === 'number' && e.status >= 400 && e.status < 500) {
    return new AppError(
      e.status,
      e.code?.toLowerCase() ?? 'bad_request',
      'The request was not accepted.',
    );
  }
  return new AppError(500, 'internal', 'Something went wrong on the server. It has been logged.');
}

/** The one place errors become responses. No stack, SQL or path ever reaches the client. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  const appError = toAppError(err);
  if (appError.status >= 500) {
    logger.error({ requestId: req.requestId, err }, 'request failed');
  } else if (appError.status === 409 || appError.status === 403) {
    logger.warn({ requestId: req.requestId, userId: req.user?.id, code: appError.code }, 'refused');
  }
  // A streamed response (a PDF, say) that fails half-way can only be cut off.
  if (res.headersSent) {
    res.destroy();
    return;
  }
  for (const [name, value] of Object.entries(appError.headers ?? {})) res.setHeader(name, value);
  const body: ApiErrorBody & { requestId: string } = {
    error: { code: appError.code, message: appError.message },
    requestId: req.requestId,
  };
  if (appError.details !== undefined) body.error.details = appError.details;
  res.status(appError.status).json(body);
};
