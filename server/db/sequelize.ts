import { Sequelize, Transaction } from 'sequelize';
import type { Database as SqliteDatabase } from 'sqlite3';

export const BUSY_TIMEOUT_MS = 5000;

/**
 * Opens the SQLite file through Sequelize with the settings that keep concurrent writers safe
 * (docs/decisions/0002-sqlite-settings.md):
 * - WAL journal, asserted at start;
 * - IMMEDIATE transactions, so a read-then-write never dead-ends in SQLITE_BUSY;
 * - foreign keys, synchronous=FULL and a 5 s busy timeout on *every* connection. Sequelize opens a
 *   new sqlite3 handle for each transaction and never runs an afterConnect hook for sqlite, so the
 *   connection manager is wrapped here.
 */
export async function openDatabase(storage: string): Promise<Sequelize> {
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    storage,
    logging: false,
    transactionType: Transaction.TYPES.IMMEDIATE,
    define: { underscored: true },
  });
  const manager = sequelize.connectionManager as unknown as {
    getConnection: (options?: unknown) => Promise<SqliteDatabase>;
  };
  const configured = new WeakSet<SqliteDatabase>();
  const original = manager.getConnection.bind(manager);
  manager.getConnection = async (options?: unknown) => {
    const connection = await original(options);
    if (!configured.has(connection)) {
      configured.add(connection);
      connection.configure('busyTimeout', BUSY_TIMEOUT_MS);
      await exec(connection, 'PRAGMA foreign_keys = ON');
      await exec(connection, 'PRAGMA synchronous = FULL');
    }
    return connection;
  };

  const [rows] = (await sequelize.query('PRAGMA journal_mode = WAL')) as [
    Array<{ journal_mode: string }>,
    unknown,
  ];
  const mode = rows[0]?.journal_mode;
  if (storage !== ':memory:' && mode !== 'wal') {
    throw new Error(`SQLite refused WAL journal mode (got ${mode}) for ${storage}`);
  }
  return sequelize;
}

function exec(connection: SqliteDatabase, sql: string): Promise<void> {
  return new Promise((resolve, reject) => {
    connection.exec(sql, (err) => (err ? reject(err) : resolve()));
  });
}
