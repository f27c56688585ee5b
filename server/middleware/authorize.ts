import type { RequestHandler } from 'express';
import { can, type Right } from '#shared/auth/roles.ts';
import { forbidden, unauthenticated } from '../lib/errors.ts';
import { logger } from '../lib/logger.ts';

/** Lets the request through only if the signed-in user's role holds `right` (shared/auth/roles.ts). */
export function authorize(right: Right): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) return next(unauthenticated());
    if (!can(req.user.role, right)) {
      logger.warn(
        { requestId: req.requestId, userId: req.user.id, role: req.user.role, right },
        'forbidden',
      );
      return next(forbidden());
    }
    next();
  };
}
