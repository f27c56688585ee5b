import type { Transaction } from 'sequelize';
import type { Database as SqliteDatabase } from 'sqlite3';
import { db } from './index.ts';

/**
 * A value as SQL text, escaped by Sequelize as it escapes `replacements` for the dialect in use.
 * A NUL would end the text SQLite reads, and callers may mark places in a statement with U+0001,
 * so a value holding either is refused (the text rules refuse control characters long before a
 * value gets here).
 */
export function sqlLiteral(value: unknown): string {
  if (value === null || value === undefined) return 'NULL';
  if (typeof value === 'number' && Number.isFinite(value)) return String(value);
  // eslint-disable-next-line no-control-regex -- finding those two characters is the point
  if (typeof value === 'string' && /[\0\u0001]/.test(value)) {
    throw new Error('A bulk write cannot carry a NUL or U+0001 character');
  }
  return db().escape(value as string | number | Date);
}

/**
 * Runs write statements whose values are already escaped into their text (`sqlLiteral`), one
 * after another inside the caller's transaction: an import's multi-row INSERTs. On SQLite each
 * goes straight to the transaction's handle as one `exec`, which node-sqlite3 runs alone and in the
 * order given, and the next statement is asked for while SQLite writes the one before, so
 * `statements` may be a generator that builds each one as it is asked for. Bound values cost
 * about a microsecond each to hand to sqlite3, and Sequelize's own SQLite binding is by name,
 * which SQLite looks up by a linear search (`npm run bench`, P4). Every statement handed over is
 * waited for before this answers or fails, so a caller rolling back never meets one still running.
 */
export async function runBulkWrites(statements: Iterable<string>, t: Transaction): Promise<void> {
  const sequelize = db();
  const handle = (t as unknown as { connection?: SqliteDatabase }).connection;
  if (sequelize.getDialect() !== 'sqlite' || !handle) {
    for (const sql of statements) await sequelize.query(sql, { transaction: t });
    return;
  }
  const running: Promise<void>[] = [];
  let failure: unknown = null;
  try {
    for (const sql of statements) {
      running.push(
        new Promise<void>((resolve, reject) => {
          handle.exec(sql, (err: Error | null) => (err ? reject(err) : resolve()));
        }),
      );
      // Let the statement before this one finish and this one start while the next is built.
      await new Promise<void>((resolve) => setImmediate(resolve));
    }
  } catch (error) {
    failure = error;
  }
  const settled = await Promise.allSettled(running);
  const failed = settled.find((s): s is PromiseRejectedResult => s.status === 'rejected');
  if (failure ?? failed) throw failure ?? failed!.reason;
}
