import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import { config } from '../../config/runtime.ts';

const ISSUER = 'loomwright';
const AUDIENCE = 'loomwright-api';

export interface TokenClaims {
  sub: string;
  /** The user's token version when the token was issued. */
  tv: number;
}

let prepared: { secret: string; key: KeyObject } | null = null;

/**
 * The secret as a prepared key. Given a string, jsonwebtoken first tries to read it as a public
 * key on every call; a secret KeyObject skips that (about a millisecond per request).
 */
function sessionKey(): KeyObject {
  const secret = config().JWT_SECRET;
  if (prepared?.secret !== secret) prepared = { secret, key: createSecretKey(secret, 'utf8') };
  return prepared.key;
}

export function signSessionToken(userId: number, tokenVersion: number): string {
  const claims: TokenClaims = { sub: String(userId), tv: tokenVersion };
  return jwt.sign(claims, sessionKey(), {
    algorithm: 'HS256',
    expiresIn: Math.round(config().SESSION_HOURS * 3600),
    issuer: ISSUER,
    audience: AUDIENCE,
  });
}

/** Verifies signature, algorithm, issuer, audience and expiry; null when any check fails. */
export function verifySessionToken(token: string): TokenClaims | null {
  try {
    const payload = jwt.verify(token, sessionKey(), {
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
