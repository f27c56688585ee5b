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

/**
 * Tokens already verified, with their claims and expiry: every request of a session carries the
 * same token, and checking its signature again each time was the largest single cost of a cached
 * list's request. Keyed by the whole token (signature included) and the key that verified it, so a
 * changed token or secret is verified afresh; an entry is used only until the token expires. The
 * user's role, `active` and token version are still read from the database on every request.
 */
const verified = new Map<string, { key: KeyObject; claims: TokenClaims; expiresMs: number }>();
const MAX_VERIFIED = 1000;

/** Verifies signature, algorithm, issuer, audience and expiry; null when any check fails. */
export function verifySessionToken(token: string): TokenClaims | null {
  const key = sessionKey();
  const known = verified.get(token);
  if (known && known.key === key && Date.now() < known.expiresMs) return known.claims;
  if (known) verified.delete(token);
  try {
    const payload = jwt.verify(token, key, {
      algorithms: ['HS256'],
      issuer: ISSUER,
      audience: AUDIENCE,
    });
    if (typeof payload !== 'object' || payload === null) return null;
    const { sub, tv, exp } = payload as Partial<TokenClaims> & { exp?: number };
    if (typeof sub !== 'string' || !/^\d+$/.test(sub) || typeof tv !== 'number') return null;
    const claims = { sub, tv };
    if (typeof exp === 'number') {
      verified.set(token, { key, claims, expiresMs: exp * 1000 });
      if (verified.size > MAX_VERIFIED) verified.delete(verified.keys().next().value!);
    }
    return claims;
  } catch {
    return null;
  }
}

export const SESSION_COOKIE = 'lw_session';
/** Over HTTPS the cookie takes the __Host- prefix: Secure, Path=/, no Domain. */
export const SECURE_SESSION_COOKIE = '__Host-lw_session';
