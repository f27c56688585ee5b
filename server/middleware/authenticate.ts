import type { RequestHandler } from 'express';
import { userForToken } from '../modules/auth/auth.service.ts';
import { SECURE_SESSION_COOKIE, SESSION_COOKIE } from '../modules/auth/tokens.ts';
import { unauthenticated } from '../lib/errors.ts';

function tokenOf(req: Parameters<RequestHandler>[0]): string | null {
  const header = req.get('authorization');
  if (header) {
    const match = /^Bearer ([A-Za-z0-9._~+/-]+=*)$/.exec(header);
    return match ? match[1]! : null;
  }
  const cookies = (req.cookies ?? {}) as Record<string, string | undefined>;
  return cookies[SECURE_SESSION_COOKIE] ?? cookies[SESSION_COOKIE] ?? null;
}

/**
 * Requires a valid session; sets `req.user` from the database. What an authenticated request
 * answers is one person's view of their workshop: no cache may keep it (ASVS 14.2.2).
 */
export const authenticate: RequestHandler = async (req, res, next) => {
  res.set('Cache-Control', 'no-store');
  const token = tokenOf(req);
  const user = token ? await userForToken(token) : null;
  if (!user) return next(unauthenticated());
  req.user = user;
  next();
};
