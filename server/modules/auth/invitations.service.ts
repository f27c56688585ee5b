import { createHash, randomBytes } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { db } from '../../db/index.ts';
import { Invitation, User, Workshop } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError } from '../../lib/errors.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { appLink, queueMail } from '../mail/outbox.service.ts';
import { toSessionUser } from './auth.service.ts';
import { assertAcceptablePassword, hashPassword } from './passwords.ts';
import { signSessionToken } from './tokens.ts';

const VALID_DAYS = 7;
const tokenHash = (token: string) => createHash('sha256').update(token).digest('hex');

/**
 * Creates a one-time set-password link and queues the invitation e-mail in the caller's
 * transaction. The token travels in the link's fragment (after #), so it never reaches a server log.
 */
export async function inviteUser(t: Transaction, actor: Actor, user: User): Promise<void> {
  const token = randomBytes(32).toString('base64url');
  await Invitation.create(
    {
      userId: user.id,
      tokenHash: tokenHash(token),
      expiresAt: new Date(Date.now() + VALID_DAYS * 86_400_000),
    },
    { transaction: t },
  );
  await queueMail(t, {
    workshopId: actor.workshopId,
    kind: 'invitation',
    to: user.email,
    subject: `You are invited to Loomwright at ${actor.workshopName}`,
    text:
      `${actor.name} has added you to ${actor.workshopName} on Loomwright as ${user.role}.\n\n` +
      `Set your password here (the link works once, for ${VALID_DAYS} days):\n${appLink(`/set-password#token=${token}`)}\n\n` +
      `Then sign in with ${user.email}.\n\n— Loomwright`,
  });
}

/** Sets the password of an invited user from their one-time token and signs them in. */
export async function acceptInvitation(token: string, password: string) {
  assertAcceptablePassword(password);
  const passwordHash = await hashPassword(password);
  return inTransaction(db(), async (t) => {
    const invitation = await Invitation.findOne({
      where: { tokenHash: tokenHash(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
      transaction: t,
    });
    const user = invitation
      ? await User.findByPk(invitation.userId, { include: [Workshop], transaction: t })
      : null;
    if (!invitation || !user || !user.active) {
      throw new AppError(
        400,
        'invalid_invitation',
        'This link is not valid any more. Ask the workshop admin for a new invitation.',
      );
    }
    invitation.usedAt = new Date();
    await invitation.save({ transaction: t });
    user.passwordHash = passwordHash;
    user.tokenVersion = user.tokenVersion + 1;
    await user.save({ transaction: t });
    const workshop = (user as User & { Workshop: Workshop }).Workshop;
    await recordAudit(
      t,
      { id: user.id, name: user.name, workshopId: workshop.id, requestId: '' },
      {
        action: 'accept_invitation',
        entityType: 'user',
        entityId: user.id,
        summary: `${user.name} set their password`,
      },
    );
    return {
      token: signSessionToken(user.id, user.tokenVersion),
      user: toSessionUser(user, workshop),
    };
  });
}
