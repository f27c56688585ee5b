import type { Transaction } from 'sequelize';
import type { Database as SqliteDatabase } from 'sqlite3';
import { db } from './index.ts';

/**
 * Runs one write statement with `?` placeholders inside the caller's transaction, for statements
 * carrying thousands of values (an import's multi-row INSERT). On SQLite the values are bound by
 * position straight on the transaction's handle: Sequelize binds SQLite values by name, and SQLite
 * finds each name by a linear search, so a statement of 10,000 values cost the square of that.
 * Other dialects get the same SQL through `sequelize.query` with replacements, escaped by Sequelize.
 */
export async function runBulkWrite(
  sql: string,
  values: readonly unknown[],
  t: Transaction,
): Promise<void> {
  const sequelize = db();
  const handle = (t as unknown as { connection?: SqliteDatabase }).connection;
  if (sequelize.getDialect() !== 'sqlite' || !handle) {
    await sequelize.query(sql, { replacements: [...values], transaction: t });
    return;
  }
  // sqlite3 stores booleans and dates as Sequelize would not: give it the forms Sequelize stores
  // (a statement's rows share their timestamps, so each date is formatted once).
  const dates = new Map<number, string>();
  const dateText = (d: Date) => {
    let text = dates.get(d.getTime());
    if (text === undefined) {
      text = sequelize.escape(d).slice(1, -1);
      dates.set(d.getTime(), text);
    }
    return text;
  };
  const bound = values.map((v) =>
    typeof v === 'boolean' ? (v ? 1 : 0) : v instanceof Date ? dateText(v) : v,
  );
  await new Promise<void>((resolve, reject) => {
    handle.run(sql, bound, (err: Error | null) => (err ? reject(err) : resolve()));
  });
}
