import type { FieldIssue } from '#shared/schemas/common.schema.ts';

/** An error the API reports to its caller as `{error: {code, message, details?}}`. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const badRequest = (message: string, details?: FieldIssue[] | unknown) =>
  new AppError(400, 'validation_failed', message, details);
export const unauthenticated = (message = 'Sign in to continue.') =>
  new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'Your role does not allow this.') =>
  new AppError(403, 'forbidden', message);
export const notFound = (what = 'That record') =>
  new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, details?: unknown) =>
  new AppError(409, 'conflict', message, details);
/** Optimistic lock: the client edited an old copy. `current` is the server's copy now. */
export const versionConflict = (current: unknown) =>
  new AppError(
    409,
    'version_conflict',
    'Someone else changed this record since you loaded it. Your change was not saved; the current copy is attached.',
    { current },
  );
export const unprocessable = (code: string, message: string, details?: unknown) =>
  new AppError(422, code, message, details);
export const busy = () =>
  new AppError(
    503,
    'busy',
    'The database is busy with another change. Nothing was saved; try again in a moment.',
    undefined,
    { 'Retry-After': '2' },
  );
