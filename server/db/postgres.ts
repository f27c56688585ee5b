import pg from 'pg';
import { Sequelize, Transaction } from 'sequelize';

/**
 * How long a statement waits for a row lock another process holds before it gives up: the
 * counterpart of SQLite's busy timeout. inTransaction() retries the transaction, then answers 503.
 */
export const LOCK_TIMEOUT_MS = 5000;

// COUNT(*) and SUM over integers are int8, which pg hands over as strings so as not to lose
// precision past 2^53; no count here comes near that, and the SQLite side answers numbers.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));

/**
 * Opens a PostgreSQL database through Sequelize's own postgres dialect
 * (docs/decisions/0015-postgresql.md). Transactions are SERIALIZABLE: the code was written for
 * SQLite, where one writer runs at a time and a transaction never sees another's half-done work,
 * and SERIALIZABLE keeps that meaning with several processes. A transaction that loses a race fails
 * with a serialisation error, and inTransaction() retries it whole as it does SQLite's busy errors.
 */
export async function openPostgres(url: string): Promise<Sequelize> {
  const sequelize = new Sequelize(url, {
    dialect: 'postgres',
    logging: false,
    isolationLevel: Transaction.ISOLATION_LEVELS.SERIALIZABLE,
    retry: { max: 1 },
    define: { underscored: true },
    pool: { max: 10, min: 0, idle: 10_000 },
    dialectOptions: {
      lock_timeout: LOCK_TIMEOUT_MS,
      application_name: 'loomwright',
    },
  });
  await sequelize.authenticate();
  return sequelize;
}

export function isPostgresUrl(target: string): boolean {
  return /^postgres(ql)?:\/\//.test(target);
}
