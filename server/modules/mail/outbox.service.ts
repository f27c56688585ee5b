import nodemailer, { type Transporter } from 'nodemailer';
import { Op, Transaction } from 'sequelize';
import { EmailSchema } from '#shared/schemas/auth.schema.ts';
import { config } from '../../config/runtime.ts';
import { MailOutbox } from '../../db/models/index.ts';
import { logger } from '../../lib/logger.ts';
import type { FakeSmtp } from './fake-smtp.ts';

export interface MailSettings {
  host: string;
  port: number;
  secure: boolean;
  user?: string;
  pass?: string;
  from: string;
}

const MAX_ATTEMPTS = 12;

let transport: Transporter | null = null;
let fromAddress = 'Loomwright <loomwright@localhost>';
let fakeSmtp: FakeSmtp | null = null;

/** Points the outbox at an SMTP server (real, or the local fake in demo mode and tests). */
export function configureMail(settings: MailSettings | null, fake: FakeSmtp | null = null): void {
  transport?.close();
  transport = settings
    ? nodemailer.createTransport({
        host: settings.host,
        port: settings.port,
        secure: settings.secure,
        auth: settings.user ? { user: settings.user, pass: settings.pass ?? '' } : undefined,
        // A local fake speaks plain SMTP; real servers negotiate TLS as usual.
        ignoreTLS: fake !== null,
        connectionTimeout: 5000,
        greetingTimeout: 5000,
        socketTimeout: 10000,
      })
    : null;
  if (settings) fromAddress = settings.from;
  fakeSmtp = fake;
}

export function fakeInbox(): FakeSmtp | null {
  return fakeSmtp;
}

/** An absolute link into the app for a notice: under PUBLIC_URL, else this machine's port. */
export function appLink(path: string): string {
  const base = config().PUBLIC_URL ?? `http://localhost:${config().PORT}`;
  return `${base.replace(/\/$/, '')}${path}`;
}

export interface Notice {
  workshopId: number;
  kind: string;
  to: string;
  subject: string;
  text: string;
}

/**
 * Queues a notice in the caller's transaction, so it exists exactly when the event does. The
 * address must be one plain address: no display name, CR, LF, comma or semicolon.
 */
export async function queueMail(t: Transaction, notice: Notice): Promise<void> {
  const to = EmailSchema.parse(notice.to);
  await MailOutbox.create(
    {
      workshopId: notice.workshopId,
      kind: notice.kind,
      toAddress: to,
      subject: notice.subject.replace(/[\r\n]+/g, ' ').slice(0, 200),
      textBody: notice.text,
      nextAttemptAt: new Date(),
    },
    { transaction: t },
  );
}

/** The domain part of the sender's address: Message-IDs are made under it (RFC 5322 §3.6.4). */
function senderDomain(): string {
  const m = /@([^\s>@]+)>?\s*$/.exec(fromAddress);
  return m?.[1]?.toLowerCase() ?? 'loomwright.invalid';
}

/**
 * The Message-ID of a notice, made from its outbox row (id, workshop, time queued) and nothing that
 * changes between tries. If the process dies after the mail server took a notice but before the
 * row was marked sent, the notice goes out again after restart with the same Message-ID, so the
 * recipient's mail client and most servers see one message, not two.
 * (docs/decisions/0012-notice-message-ids.md)
 */
export function noticeMessageId(row: Pick<MailOutbox, 'id' | 'workshopId' | 'createdAt'>): string {
  return `<notice.${row.id}.w${row.workshopId}.${row.createdAt.getTime().toString(36)}@${senderDomain()}>`;
}

let queue: Promise<unknown> = Promise.resolve();

/**
 * Sends every due notice once: a row is claimed (pending → sending) before it goes out, marked sent
 * after, and put back with a later attempt time when the server is unreachable. Returns how many
 * went out. Runs one at a time: a call made during a run gets its own pass after it, so a notice
 * queued meanwhile is not missed.
 */
export function deliverDueMail(): Promise<number> {
  const pass = queue.then(deliver, deliver);
  queue = pass.catch(() => undefined);
  return pass;
}

const DUE = () => ({ status: 'pending', nextAttemptAt: { [Op.lte]: new Date() } });
const BATCH = 50;

async function deliver(): Promise<number> {
  if (!transport) return 0;
  if (MailOutbox.sequelize!.getDialect() === 'postgres') return deliverClaimingRows();
  const due = await MailOutbox.findAll({ where: DUE(), order: [['id', 'ASC']], limit: BATCH });
  let sent = 0;
  for (const row of due) {
    const [claimed] = await MailOutbox.update(
      { status: 'sending' },
      { where: { id: row.id, status: 'pending' } },
    );
    if (claimed !== 1) continue;
    const outcome = await sendOne(row);
    await MailOutbox.update(outcome, { where: { id: row.id } });
    if (outcome.status === 'sent') sent += 1;
  }
  return sent;
}

/**
 * PostgreSQL, where several app processes send from one outbox: each notice is sent inside a
 * transaction that holds its row locked (`FOR UPDATE SKIP LOCKED`), so another process passes it
 * by, and the row is marked in the same transaction. A process that dies mid-send leaves no
 * 'sending' row behind for a restart to reset: its lock goes with its connection and the notice is
 * still pending (sent again with the same Message-ID, as after a crash on SQLite).
 * docs/decisions/0015-postgresql.md
 */
async function deliverClaimingRows(): Promise<number> {
  const sequelize = MailOutbox.sequelize!;
  let sent = 0;
  for (let n = 0; n < BATCH; n++) {
    const outcome = await sequelize.transaction(
      { isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED },
      async (t) => {
        const row = await MailOutbox.findOne({
          where: DUE(),
          order: [['id', 'ASC']],
          lock: t.LOCK.UPDATE,
          skipLocked: true,
          transaction: t,
        });
        if (!row) return null;
        const result = await sendOne(row);
        await MailOutbox.update(result, { where: { id: row.id }, transaction: t });
        return result;
      },
    );
    if (!outcome) break;
    if (outcome.status === 'sent') sent += 1;
  }
  return sent;
}

/** Sends one notice and answers what its row becomes: sent, or pending again later (or failed). */
async function sendOne(row: MailOutbox) {
  try {
    const messageId = noticeMessageId(row);
    await transport!.sendMail({
      messageId,
      from: fromAddress,
      to: row.toAddress,
      subject: row.subject,
      text: row.textBody,
    });
    return {
      status: 'sent' as const,
      sentAt: new Date(),
      messageId,
      attempts: row.attempts + 1,
      // A sent invitation's one-time link is not kept anywhere.
      ...(row.kind === 'invitation' ? { textBody: '[sent; the one-time link is not kept]' } : {}),
    };
  } catch (err) {
    const attempts = row.attempts + 1;
    const delayS = Math.min(15 * 60, 5 * 2 ** (attempts - 1));
    logger.warn(
      { outboxId: row.id, attempts, err: (err as Error).message },
      'mail not sent; will retry',
    );
    return {
      status: attempts >= MAX_ATTEMPTS ? ('failed' as const) : ('pending' as const),
      attempts,
      lastError: (err as Error).message.slice(0, 300),
      nextAttemptAt: new Date(Date.now() + delayS * 1000),
    };
  }
}

let timer: NodeJS.Timeout | null = null;

/** Sends due mail every `intervalMs`; `kickMail()` sends at once after a commit. */
export function startOutboxWorker(intervalMs: number): void {
  stopOutboxWorker();
  timer = setInterval(
    () => void deliverDueMail().catch((err) => logger.error({ err }, 'outbox run failed')),
    intervalMs,
  );
  timer.unref();
}

export function stopOutboxWorker(): void {
  if (timer) clearInterval(timer);
  timer = null;
}

export function kickMail(): void {
  setImmediate(
    () => void deliverDueMail().catch((err) => logger.error({ err }, 'outbox run failed')),
  );
}

/** Rows stuck in 'sending' after a crash go back to pending at start. */
export async function recoverOutbox(): Promise<void> {
  await MailOutbox.update({ status: 'pending' }, { where: { status: 'sending' } });
}
