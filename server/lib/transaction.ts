import { AsyncLocalStorage } from 'node:async_hooks';
import { E_TIMEOUT, Mutex, withTimeout, type MutexInterface } from 'async-mutex';
import type { Sequelize, Transaction } from 'sequelize';
import { busy } from './errors.ts';

const MAX_TRIES = 3;
/** Once a try has already waited out the busy timeout, another try would only keep the client waiting. */
const STOP_RETRYING_AFTER_MS = 4000;
/**
 * How long a write waits for its turn in this process before the client gets 503. Far above what
 * a queue of ordinary writes takes (a few milliseconds each), so only a stuck writer trips it.
 */
export const WRITE_QUEUE_WAIT_MS = 10_000;

/**
 * Errors that mean "another writer got there first; the same work may succeed if run again":
 * SQLite's busy and locked, PostgreSQL's serialisation failure, deadlock and lock timeout.
 */
const BUSY_CODES = new Set(['SQLITE_BUSY', 'SQLITE_LOCKED', '40001', '40P01', '55P03']);

export function isBusyError(err: unknown): boolean {
  const e = err as { original?: { code?: string }; parent?: { code?: string }; code?: string };
  const code = e?.original?.code ?? e?.parent?.code ?? e?.code;
  return code !== undefined && BUSY_CODES.has(code);
}

/**
 * One writer at a time per database in this process (docs/decisions/0010-write-queue-and-seal.md).
 * SQLite allows one writer anyway; without this queue every waiting `BEGIN IMMEDIATE` sits in the
 * busy handler inside one of libuv's four worker threads, and four waiting writers starve the one
 * that holds the lock. Waiting here costs a promise, not a thread. The busy timeout still covers
 * other processes (the sqlite3 CLI, a backup).
 */
const writeQueues = new WeakMap<Sequelize, MutexInterface>();
const holdingTurn = new AsyncLocalStorage<Sequelize>();

function writeQueueOf(sequelize: Sequelize): MutexInterface {
  let queue = writeQueues.get(sequelize);
  if (!queue) {
    queue = withTimeout(new Mutex(), WRITE_QUEUE_WAIT_MS);
    writeQueues.set(sequelize, queue);
  }
  return queue;
}

/**
 * Runs `work` in one managed IMMEDIATE transaction, after the writes queued before it. If SQLite
 * reports the database busy (another process holds the lock), the whole transaction is retried
 * (not single statements: sequelize #10262) up to three tries with jitter, then the caller gets 503
 * with Retry-After and nothing partial. On PostgreSQL the transaction is SERIALIZABLE and a
 * serialisation failure, deadlock or lock timeout is retried the same way.
 */
export async function inTransaction<T>(
  sequelize: Sequelize,
  work: (t: Transaction) => Promise<T>,
): Promise<T> {
  if (holdingTurn.getStore() === sequelize) {
    // Waiting for our own turn would never end: the caller must pass its transaction down.
    throw new Error('inTransaction called inside a transaction; pass the transaction instead');
  }
  let release: MutexInterface.Releaser;
  try {
    release = await writeQueueOf(sequelize).acquire();
  } catch (err) {
    if (err === E_TIMEOUT) throw busy();
    throw err;
  }
  try {
    return await holdingTurn.run(sequelize, () => withRetries(sequelize, work));
  } finally {
    release();
  }
}

async function withRetries<T>(
  sequelize: Sequelize,
  work: (t: Transaction) => Promise<T>,
): Promise<T> {
  const started = Date.now();
  for (let attempt = 1; ; attempt++) {
    try {
      return await sequelize.transaction(work);
    } catch (err) {
      if (!isBusyError(err)) throw err;
      if (attempt >= MAX_TRIES || Date.now() - started > STOP_RETRYING_AFTER_MS) throw busy();
      await new Promise((r) => setTimeout(r, 50 * attempt + Math.random() * 100));
    }
  }
}

/** Runs `work` in the caller's transaction when there is one, else in a transaction of its own. */
export function inTransactionOf<T>(
  sequelize: Sequelize,
  transaction: Transaction | undefined,
  work: (t: Transaction) => Promise<T>,
): Promise<T> {
  return transaction ? work(transaction) : inTransaction(sequelize, work);
}
