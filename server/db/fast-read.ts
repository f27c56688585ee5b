import { QueryTypes } from 'sequelize';
import type { Database as SqliteDatabase, Statement } from 'sqlite3';
import { db, onDatabaseClose } from './index.ts';

/**
 * Reads for the hottest paths (the session lookup, a list's change counter): plain SQL on
 * SQLite's shared connection through prepared statements kept for the life of the connection,
 * without a model, a `PRAGMA table_info` or a stack trace per query. Other dialects go through
 * `sequelize.query`. Always `all()`: a `get()` leaves its statement open, and an open statement
 * holds a read transaction on the shared connection, so later reads would see old data.
 */
const prepared = new Map<string, Statement>();
let preparedOn: SqliteDatabase | null = null;

export async function readRows<T extends object>(
  sql: string,
  params: Array<string | number>,
): Promise<T[]> {
  const sequelize = db();
  if (sequelize.getDialect() !== 'sqlite') {
    return sequelize.query<T>(sql, { replacements: params, type: QueryTypes.SELECT, raw: true });
  }
  const manager = sequelize.connectionManager as unknown as {
    getConnection: (options: object) => Promise<SqliteDatabase>;
  };
  const connection = await manager.getConnection({});
  if (connection !== preparedOn) {
    prepared.clear();
    preparedOn = connection;
  }
  let statement = prepared.get(sql);
  if (!statement) {
    // A failed prepare is reported again to the all() below.
    statement = connection.prepare(sql, () => undefined);
    prepared.set(sql, statement);
  }
  const ready = statement;
  return new Promise((resolve, reject) => {
    ready.all(params, (err: Error | null, rows: T[]) => {
      if (!err) return resolve(rows);
      if (prepared.get(sql) === ready) prepared.delete(sql);
      reject(err);
    });
  });
}

/**
 * A DATETIME column read without a model, in milliseconds: SQLite hands it back as
 * '2026-12-02 12:15:23.123 +00:00', PostgreSQL as a Date. 0 for none.
 */
export function storedTime(value: unknown): number {
  if (value == null) return 0;
  if (value instanceof Date) return value.getTime();
  const text = String(value)
    .replace(' ', 'T')
    .replace(/ ?([+-]\d\d:\d\d)$/, '$1');
  const ms = Date.parse(text);
  return Number.isNaN(ms) ? 0 : ms;
}

/** Finalizes the prepared statements; SQLite will not close a connection that still has some. */
async function finalizeStatements(): Promise<void> {
  const statements = [...prepared.values()];
  prepared.clear();
  preparedOn = null;
  await Promise.all(
    statements.map((s) => new Promise<void>((resolve) => s.finalize(() => resolve()))),
  );
}

onDatabaseClose(finalizeStatements);
