import type { SessionUser } from '#shared/schemas/auth.schema.ts';
import { db } from '../../db/index.ts';
import { readRows } from '../../db/fast-read.ts';
import { User, Workshop } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError, unauthenticated, unprocessable } from '../../lib/errors.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { recordAudit } from '../audit/audit.service.ts';
import {
  assertAcceptablePassword,
  dummyPasswordHash,
  hashPassword,
  verifyPassword,
} from './passwords.ts';
import { signSessionToken, verifySessionToken } from './tokens.ts';

const BAD_CREDENTIALS = 'E-mail or password is not right.';

export function toSessionUser(user: User, workshop: Workshop): SessionUser {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    workshopId: workshop.id,
    workshopName: workshop.name,
  };
}

/**
 * Checks the credentials. An unknown e-mail, an inactive account, a user without a password yet
 * and a wrong password all take the same path and give the same 401.
 */
export async function login(email: string, password: string) {
  const user = await User.findOne({ where: { email }, include: [Workshop] });
  const hash = user?.passwordHash ?? (await dummyPasswordHash());
  const matches = await verifyPassword(password, hash);
  if (!user || !user.passwordHash || !user.active || !matches) {
    throw new AppError(401, 'bad_credentials', BAD_CREDENTIALS);
  }
  const workshop = (user as User & { Workshop: Workshop }).Workshop;
  return {
    token: signSessionToken(user.id, user.tokenVersion),
    user: toSessionUser(user, workshop),
  };
}

type SessionRow = SessionUser & { active: number | boolean; tokenVersion: number };

/**
 * Resolves a bearer or cookie token to the user it belongs to, reading role and `active` from
 * the database on every request so a demotion or deactivation takes effect at once.
 */
export async function userForToken(token: string): Promise<SessionUser | null> {
  const claims = verifySessionToken(token);
  if (!claims) return null;
  // On every request: one prepared statement, no model.
  const [row] = await readRows<SessionRow>(
    `SELECT u.id, u.email, u.name, u.role, u.active, u.token_version AS "tokenVersion",
            w.id AS "workshopId", w.name AS "workshopName"
       FROM users u JOIN workshops w ON w.id = u.workshop_id
      WHERE u.id = ?`,
    [Number(claims.sub)],
  );
  if (!row || !row.active || row.tokenVersion !== claims.tv) return null;
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    workshopId: row.workshopId,
    workshopName: row.workshopName,
  };
}

/** Signing out revokes every token the user holds (the token version moves on). */
export async function logout(actor: Actor): Promise<void> {
  await User.increment('tokenVersion', { where: { id: actor.id } });
}

export async function changePassword(
  actor: Actor,
  currentPassword: string,
  newPassword: string,
): Promise<{ token: string }> {
  const user = await User.findByPk(actor.id);
  if (!user || !user.passwordHash) throw unauthenticated();
  if (!(await verifyPassword(currentPassword, user.passwordHash))) {
    throw unprocessable('bad_current_password', 'The current password is not right.', [
      { field: 'currentPassword', message: 'is not right' },
    ]);
  }
  assertAcceptablePassword(newPassword, 'newPassword');
  const passwordHash = await hashPassword(newPassword);
  return inTransaction(db(), async (t) => {
    const fresh = await User.findByPk(actor.id, { transaction: t });
    if (!fresh) throw unauthenticated();
    fresh.passwordHash = passwordHash;
    fresh.tokenVersion = fresh.tokenVersion + 1;
    await fresh.save({ transaction: t });
    await recordAudit(t, actor, {
      action: 'password_change',
      entityType: 'user',
      entityId: actor.id,
      summary: `${actor.name} changed their password`,
    });
    // The old tokens are revoked; hand back a fresh one so this session carries on.
    return { token: signSessionToken(fresh.id, fresh.tokenVersion) };
  });
}
