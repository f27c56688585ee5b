import type { CookieOptions, Request, Response } from 'express';
import type {
  ChangePasswordRequest,
  LoginRequest,
  SetPasswordRequest,
} from '#shared/schemas/auth.schema.ts';
import { config } from '../../config/runtime.ts';
import { actorOf } from '../../lib/actor.ts';
import { logger } from '../../lib/logger.ts';
import * as authService from './auth.service.ts';
import { acceptInvitation } from './invitations.service.ts';
import { SECURE_SESSION_COOKIE, SESSION_COOKIE } from './tokens.ts';

function cookieFor(req: Request): { name: string; options: CookieOptions } {
  const secure = req.secure;
  return {
    name: secure ? SECURE_SESSION_COOKIE : SESSION_COOKIE,
    options: {
      httpOnly: true,
      sameSite: 'strict',
      secure,
      path: '/',
      maxAge: config().SESSION_HOURS * 3600 * 1000,
    },
  };
}

function setSessionCookie(req: Request, res: Response, token: string) {
  const { name, options } = cookieFor(req);
  res.cookie(name, token, options);
}

export async function login(req: Request, res: Response) {
  const { email, password } = req.body as LoginRequest;
  try {
    const session = await authService.login(email, password);
    // JSON.stringify escapes control characters, so a crafted e-mail cannot forge a log line.
    logger.info({ requestId: req.requestId, email, userId: session.user.id }, 'login succeeded');
    setSessionCookie(req, res, session.token);
    res.json(session);
  } catch (err) {
    logger.warn({ requestId: req.requestId, email, ip: req.ip }, 'login failed');
    throw err;
  }
}

export async function logout(req: Request, res: Response) {
  await authService.logout(actorOf(req));
  for (const name of [SESSION_COOKIE, SECURE_SESSION_COOKIE]) {
    res.clearCookie(name, {
      path: '/',
      httpOnly: true,
      sameSite: 'strict',
      secure: name.startsWith('__Host-'),
    });
  }
  res.status(204).end();
}

export function me(req: Request, res: Response) {
  res.json({ user: req.user });
}

export async function changePassword(req: Request, res: Response) {
  const { currentPassword, newPassword } = req.body as ChangePasswordRequest;
  const { token } = await authService.changePassword(actorOf(req), currentPassword, newPassword);
  setSessionCookie(req, res, token);
  res.json({ token });
}

export async function setPassword(req: Request, res: Response) {
  const { token, password } = req.body as SetPasswordRequest;
  const session = await acceptInvitation(token, password);
  logger.info({ requestId: req.requestId, userId: session.user.id }, 'invitation accepted');
  setSessionCookie(req, res, session.token);
  res.json(session);
}
