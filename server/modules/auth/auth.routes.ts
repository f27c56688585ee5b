import { Router } from 'express';
import { ipKeyGenerator, rateLimit, type Options } from 'express-rate-limit';
import {
  ChangePasswordRequest,
  LoginRequest,
  SetPasswordRequest,
} from '#shared/schemas/auth.schema.ts';
import type { Env } from '../../config/env.ts';
import { AppError } from '../../lib/errors.ts';
import { authenticate } from '../../middleware/authenticate.ts';
import { validate } from '../../middleware/validate.ts';
import * as controller from './auth.controller.ts';

const tooMany: Options['handler'] = (_req, res, next, options) => {
  const retryAfter = res.getHeader('Retry-After') ?? String(Math.ceil(options.windowMs / 1000));
  next(
    new AppError(
      429,
      'rate_limited',
      'Too many sign-in attempts. Wait a minute and try again.',
      undefined,
      {
        'Retry-After': String(retryAfter),
      },
    ),
  );
};

export function authRoutes(env: Env): Router {
  const router = Router();

  // Every /api/auth/* request, by client address.
  router.use(
    rateLimit({
      windowMs: 60_000,
      limit: Math.max(60, env.LOGIN_LIMIT_PER_MINUTE * 6),
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: tooMany,
    }),
  );

  // Failed sign-ins by client address, and by e-mail address across all clients.
  const failedByAddress = rateLimit({
    windowMs: 60_000,
    limit: env.LOGIN_LIMIT_PER_MINUTE,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: tooMany,
  });
  const failedByEmail = rateLimit({
    windowMs: 15 * 60_000,
    limit: env.LOGIN_LIMIT_PER_MINUTE * 2,
    skipSuccessfulRequests: true,
    standardHeaders: false,
    legacyHeaders: false,
    keyGenerator: (req) => {
      const email = (req.body as { email?: unknown } | undefined)?.email;
      return typeof email === 'string'
        ? `email:${email.trim().toLowerCase()}`
        : `ip:${ipKeyGenerator(req.ip ?? '')}`;
    },
    handler: tooMany,
  });

  router.post(
    '/login',
    failedByAddress,
    failedByEmail,
    validate({ body: LoginRequest }),
    controller.login,
  );
  router.post(
    '/set-password',
    failedByAddress,
    validate({ body: SetPasswordRequest }),
    controller.setPassword,
  );
  router.post('/logout', authenticate, controller.logout);
  router.get('/me', authenticate, controller.me);
  router.post(
    '/password',
    authenticate,
    validate({ body: ChangePasswordRequest }),
    controller.changePassword,
  );
  return router;
}
