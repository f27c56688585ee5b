import jwt from 'jsonwebtoken';
import { config } from '../../config/runtime.ts';

const ISSUER = 'loomwright';
const AUDIENCE = 'loomwright-api';

export interface TokenClaims {
  sub: string;
  /** The user's token version when the token was issued. */
  tv: number;
}

export function signSessionToken(userId: number, tokenVersion: number): string {
  const claims: TokenClaims = { sub: String(userId), tv: tokenVersion };
  return jwt.sign(claims, config().JWT_SECRET, {
    algorithm: 'HS256',
    expiresIn: Math.round(config().SESSION_HOURS * 3600),
    issuer: ISSUER,
    audience: AUDIENCE,
  });
}

/** Verifies signature, algorithm, issuer, audience and expiry; null when any check fails. */
export function verifySessionToken(token: string): TokenClaims | null {
  try {
    const payload = jwt.verify(token, config().JWT_SECRET, {
      algorithms: ['HS256'],
      issuer: ISSUER,
      audience: AUDIENCE,
    });
    if (typeof payload !== 'object' || payload === null) return null;
    const { sub, tv } = payload as Partial<TokenClaims>;
    if (typeof sub !== 'string' || !/^\d+$/.test(sub) || typeof tv !== 'number') return null;
    return { sub, tv };
  } catch {
    return null;
  }
}

export const SESSION_COOKIE = 'lw_session';
/** Over HTTPS the cookie takes the __Host- prefix: Secure, Path=/, no Domain. */
export const SECURE_SESSION_COOKIE = '__Host-lw_session';
