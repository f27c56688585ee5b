import { chmodSync, closeSync, existsSync, mkdirSync, openSync } from 'node:fs';
import path from 'node:path';
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
  if (storage !== ':memory:') ownerOnly(storage);
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    storage,
    logging: false,
    transactionType: Transaction.TYPES.IMMEDIATE,
    // Sequelize retries a statement that met SQLITE_BUSY five more times by default, so a BEGIN
    // waiting on another process took 6 × the busy timeout before inTransaction() could answer.
    // Whole transactions are retried there instead (sequelize #10262).
    retry: { max: 1 },
    define: { underscored: true },
  });
  const manager = sequelize.connectionManager as unknown as ConnectionManager;
  const configured = new WeakSet<SqliteDatabase>();
  const open = manager.getConnection.bind(manager);
  const release = manager.releaseConnection.bind(manager);
  const closeAll = manager._onProcessExit.bind(manager);
  /**
   * The handle write transactions reuse. inTransaction() runs one transaction at a time per
   * process, so one handle serves them all; opening a fresh handle for each transaction (what
   * Sequelize does) costs file opens, a schema parse and the settings below, every time. A second
   * transaction at the same moment (a migration, a test calling sequelize.transaction directly)
   * still gets a handle of its own.
   */
  let writer: Handle | null = null;

  manager.getConnection = async (options?: { uuid?: string }) => {
    const uuid = options?.uuid;
    const forTransaction = uuid !== undefined && uuid !== 'default' && storage !== ':memory:';
    if (forTransaction && writer && writer.uuid === undefined) {
      manager.connections[uuid] = writer;
      return writer;
    }
    const connection = await open(options);
    if (!configured.has(connection)) {
      configured.add(connection);
      connection.configure('busyTimeout', BUSY_TIMEOUT_MS);
      await exec(connection, 'PRAGMA foreign_keys = ON');
      await exec(connection, 'PRAGMA synchronous = FULL');
    }
    if (forTransaction && !writer) writer = connection;
    return connection;
  };
  manager.releaseConnection = (connection: Handle) => {
    if (connection !== writer) return release(connection);
    if (connection.uuid) delete manager.connections[connection.uuid];
  };
  // Sequelize "destroys" a connection whose BEGIN, COMMIT or ROLLBACK failed (a busy database) by
  // handing it to a pool the sqlite dialect never uses, which ignores it: the sqlite3 handle, its
  // file descriptors and its map entry stayed open for good. Close it for real.
  manager.destroyConnection = async (connection: Handle) => {
    if (connection === writer) writer = null;
    const uuid = connection.uuid;
    if (uuid && manager.connections[uuid] === connection) delete manager.connections[uuid];
    await closeHandle(connection);
  };
  manager._onProcessExit = async () => {
    const idle = writer && writer.uuid === undefined ? writer : null;
    writer = null;
    if (idle) await closeHandle(idle);
    return closeAll();
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

/**
 * The database file readable and writable by its owner only (0600), created so before SQLite
 * opens it. SQLite gives the -wal and -shm files the main file's permissions.
 */
function ownerOnly(storage: string): void {
  mkdirSync(path.dirname(path.resolve(storage)), { recursive: true });
  closeSync(openSync(storage, 'a', 0o600));
  chmodSync(storage, 0o600);
  for (const companion of [`${storage}-wal`, `${storage}-shm`]) {
    if (existsSync(companion)) chmodSync(companion, 0o600);
  }
}

type Handle = SqliteDatabase & { uuid?: string };
interface ConnectionManager {
  connections: Record<string, Handle>;
  getConnection: (options?: { uuid?: string }) => Promise<Handle>;
  releaseConnection: (connection: Handle) => void;
  destroyConnection: (connection: Handle) => Promise<void>;
  _onProcessExit: () => Promise<void>;
}

function closeHandle(connection: SqliteDatabase): Promise<void> {
  return new Promise((resolve) => connection.close(() => resolve()));
}

function exec(connection: SqliteDatabase, sql: string): Promise<void> {
  return new Promise((resolve, reject) => {
    connection.exec(sql, (err) => (err ? reject(err) : resolve()));
  });
}
