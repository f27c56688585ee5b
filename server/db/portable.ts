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
