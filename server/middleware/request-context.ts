import { randomUUID } from 'node:crypto';
import type { RequestHandler } from 'express';
import { logger } from '../lib/logger.ts';

/** Gives each request an id (echoed in X-Request-Id and in error bodies) and logs it when done. */
export const requestContext: RequestHandler = (req, res, next) => {
  req.requestId = randomUUID();
  res.setHeader('X-Request-Id', req.requestId);
  const started = process.hrtime.bigint();
  res.on('finish', () => {
    if (!req.originalUrl.startsWith('/api/')) return;
    const ms = Number(process.hrtime.bigint() - started) / 1e6;
    logger.info(
      {
        requestId: req.requestId,
        method: req.method,
        // The path only: query strings are not logged.
        path: req.originalUrl.split('?')[0],
        status: res.statusCode,
        ms: Math.round(ms * 10) / 10,
        userId: req.user?.id,
      },
      'request',
    );
  });
  next();
};

const UNSAFE = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * Writes carry JSON (or multipart for uploads). A cross-site form can only send text/plain,
 * urlencoded or multipart without a preflight, so this closes the text/plain and urlencoded
 * routes; SameSite=Strict on the session cookie closes the rest.
 */
export const requireJsonForWrites: RequestHandler = (req, _res, next) => {
  if (!UNSAFE.has(req.method)) return next();
  const hasBody = Number(req.get('content-length') ?? 0) > 0 || req.get('transfer-encoding');
  if (!hasBody) return next();
  if (req.is('application/json') || req.is('multipart/form-data')) return next();
  const err = Object.assign(new Error('Send the request body as application/json.'), {
    status: 415,
    code: 'unsupported_media_type',
  });
  next(err);
};
