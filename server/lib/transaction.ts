import type { Sequelize, Transaction } from 'sequelize';
import { busy } from './errors.ts';

const MAX_TRIES = 3;
/** Once a try has already waited out the busy timeout, another try would only keep the client waiting. */
const STOP_RETRYING_AFTER_MS = 4000;

export function isBusyError(err: unknown): boolean {
  const e = err as { original?: { code?: string }; parent?: { code?: string }; code?: string };
  const code = e?.original?.code ?? e?.parent?.code ?? e?.code;
  return code === 'SQLITE_BUSY' || code === 'SQLITE_LOCKED';
}

/**
 * Runs `work` in one managed IMMEDIATE transaction. If SQLite reports the database busy, the
 * whole transaction is retried (not single statements: sequelize #10262) up to three tries with
 * jitter, then the caller gets 503 with Retry-After and nothing partial.
 */
export async function inTransaction<T>(
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
