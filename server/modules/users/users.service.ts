import { Op, QueryTypes, type Transaction } from 'sequelize';
import type {
  CreateUserRequest,
  UpdateUserRequest,
  UserSummary,
} from '#shared/schemas/users.schema.ts';
import { db } from '../../db/index.ts';
import { User } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError, notFound } from '../../lib/errors.ts';
import { logger } from '../../lib/logger.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { changedFields, recordAudit } from '../audit/audit.service.ts';
import { inviteUser } from '../auth/invitations.service.ts';
import { assertAcceptablePassword, hashPassword } from '../auth/passwords.ts';
import { kickMail, queueMail } from '../mail/outbox.service.ts';

export function toUserSummary(user: User): UserSummary {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    active: user.active,
    invited: user.passwordHash == null,
    createdAt: user.createdAt.toISOString(),
  };
}

export async function listUsers(actor: Actor): Promise<UserSummary[]> {
  const users = await User.findAll({
    where: { workshopId: actor.workshopId },
    order: [['name', 'ASC']],
  });
  return users.map(toUserSummary);
}

/**
 * Adds a person. With a first password they can sign in at once; without one they get an e-mailed
 * invitation with a one-time link to set their own (the e-mail goes through the outbox).
 *
 * An address already used in this workshop is refused (409): the admin sees that person in their
 * own list. An address used in another workshop gets the same answer as a new one — telling the
 * two apart would let any admin find out who holds an account elsewhere. Nobody is created; the
 * address gets a notice instead (see `noticeToTakenAddress`), and the person decides.
 */
export async function createUser(actor: Actor, input: CreateUserRequest): Promise<UserSummary> {
  if (input.password) assertAcceptablePassword(input.password);
  const passwordHash = input.password ? await hashPassword(input.password) : null;
  const created = await inTransaction(db(), async (t) => {
    const taken = await User.findOne({ where: { email: input.email }, transaction: t });
    if (taken?.workshopId === actor.workshopId) {
      throw new AppError(409, 'duplicate', 'A user with that e-mail already exists.');
    }
    if (taken) return answerForTakenAddress(t, actor, input);
    const user = await User.create(
      {
        workshopId: actor.workshopId,
        email: input.email,
        name: input.name,
        role: input.role,
        passwordHash,
      },
      { transaction: t },
    );
    await recordAudit(t, actor, {
      action: 'create',
      entityType: 'user',
      entityId: user.id,
      summary: passwordHash
        ? `Added ${user.name} (${user.email}) as ${user.role}`
        : `Invited ${user.name} (${user.email}) as ${user.role}`,
      after: { email: user.email, name: user.name, role: user.role, invited: !passwordHash },
    });
    if (!passwordHash) await inviteUser(t, actor, user);
    return toUserSummary(user);
  });
  kickMail();
  return created;
}

/**
 * The answer to adding an address that belongs to another workshop: shaped like a new person's,
 * with an id drawn from the users sequence (so the next real id does not give it away), an audit
 * entry and an outbox row like an invitation's, and a notice to the address explaining that
 * nothing changed. Whether to join under another address is the person's call.
 */
async function answerForTakenAddress(
  t: Transaction,
  actor: Actor,
  input: CreateUserRequest,
): Promise<UserSummary> {
  const [row] = await db().query<{ seq: number }>(
    db().getDialect() === 'postgres'
      ? "SELECT nextval(pg_get_serial_sequence('users', 'id')) AS seq"
      : "UPDATE sqlite_sequence SET seq = seq + 1 WHERE name = 'users' RETURNING seq",
    { transaction: t, type: QueryTypes.SELECT },
  );
  // The sequence row exists once any user has been created, and an admin is asking.
  if (!row) throw new Error('users has no AUTOINCREMENT sequence row');
  const id = Number(row.seq);
  await recordAudit(t, actor, {
    action: 'create',
    entityType: 'user',
    entityId: id,
    summary: `Invited ${input.name} (${input.email}) as ${input.role}`,
    after: { email: input.email, name: input.name, role: input.role, invited: true },
  });
  await queueMail(t, {
    workshopId: actor.workshopId,
    kind: 'invitation',
    to: input.email,
    subject: `You are invited to Loomwright at ${actor.workshopName}`,
    text:
      `${actor.name} tried to add you to ${actor.workshopName} on Loomwright as ${input.role}.\n\n` +
      `This address already belongs to a Loomwright account in another workshop, and one address ` +
      `can belong to one workshop only, so nothing has changed: your account is as it was.\n\n` +
      `If you want to work in ${actor.workshopName} too, ask ${actor.name} to add you with another ` +
      `address. If this was not meant for you, there is nothing to do.\n\n— Loomwright`,
  });
  logger.info(
    { requestId: actor.requestId, workshopId: actor.workshopId },
    'address already in use in another workshop; answered as a new invitation',
  );
  return {
    id,
    email: input.email,
    name: input.name,
    role: input.role,
    active: true,
    // Answered exactly as a new account would be, so the answer tells nothing about the address.
    invited: !input.password,
    createdAt: new Date().toISOString(),
  };
}

export async function updateUser(
  actor: Actor,
  userId: number,
  input: UpdateUserRequest,
): Promise<UserSummary> {
  return inTransaction(db(), async (t) => {
    const user = await User.findOne({
      where: { id: userId, workshopId: actor.workshopId },
      transaction: t,
    });
    if (!user) throw notFound('That user');
    const losesAdmin =
      user.role === 'admin' &&
      user.active &&
      ((input.role !== undefined && input.role !== 'admin') || input.active === false);
    if (losesAdmin) {
      const otherAdmins = await User.count({
        where: {
          workshopId: actor.workshopId,
          role: 'admin',
          active: true,
          id: { [Op.ne]: user.id },
        },
        transaction: t,
      });
      if (otherAdmins === 0) {
        throw new AppError(409, 'last_admin', 'The workshop must keep at least one active admin.');
      }
    }
    const before = { name: user.name, role: user.role, active: user.active };
    const changes = changedFields(before, input);
    user.set(input);
    // A deactivation ends the user's sessions at once. A role change needs no new token: the role
    // is read from the database on every request, so the old token gets the new role's rights.
    if (input.active === false) user.tokenVersion = user.tokenVersion + 1;
    await user.save({ transaction: t });
    await recordAudit(t, actor, {
      action: 'update',
      entityType: 'user',
      entityId: user.id,
      summary: `Changed ${user.name}: ${Object.keys(changes).join(', ') || 'nothing'}`,
      before,
      after: { name: user.name, role: user.role, active: user.active },
    });
    return toUserSummary(user);
  });
}
