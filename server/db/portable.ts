import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';

interface InsertOptions {
  replacements?: Record<string, unknown> | unknown[];
  transaction?: Transaction;
}

/**
 * Runs a one-row INSERT and answers the new row's id on either dialect: SQLite's driver reports
 * the last rowid, PostgreSQL answers it through RETURNING.
 */
export async function insertReturningId(
  sequelize: Sequelize,
  sql: string,
  options: InsertOptions,
): Promise<number> {
  if (sequelize.getDialect() === 'postgres') {
    const rows = await sequelize.query<{ id: number }>(`${sql} RETURNING id`, {
      ...options,
      type: QueryTypes.SELECT,
    });
    return rows[0]!.id;
  }
  const [id] = await sequelize.query(sql, { ...options, type: QueryTypes.INSERT });
  return id as unknown as number;
}

/**
 * Runs reads side by side, or one after another when they share a transaction: a transaction is
 * one connection, and PostgreSQL's client does not take a query while another is running on it
 * (pg 8 queues it with a warning; later versions refuse it).
 */
export async function readTogether<T extends unknown[]>(
  transaction: Transaction | null | undefined,
  ...reads: { [K in keyof T]: () => Promise<T[K]> }
): Promise<T> {
  if (!transaction) return (await Promise.all(reads.map((read) => read()))) as T;
  const results: unknown[] = [];
  for (const read of reads) results.push(await read());
  return results as T;
}
