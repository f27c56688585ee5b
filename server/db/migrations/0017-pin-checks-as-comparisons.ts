import { QueryTypes } from 'sequelize';
import type { Migration } from './index.ts';

/** `column IN ('a', 'b', …)`, a list of plain quoted words, as SQLite stores it in a CHECK. */
const IN_LIST = /\b([a-z_]+) IN \(((?:\s*'[a-z0-9_]+'\s*,?)+)\)/g;

/**
 * A table's SQL with every CHECK of the form `column IN ('a', 'b')` written as
 * `(column = 'a' OR column = 'b')`: the same rule (a NULL passes both, as NULL IN … and NULL = …
 * are both NULL; both compare with the column's affinity and collation), which SQLite checks on
 * each row without building the list first. Returns the new SQL and how many lists it rewrote.
 */
export function inListsAsComparisons(sql: string): { sql: string; rewritten: number } {
  let rewritten = 0;
  const out = sql.replace(IN_LIST, (_whole, column: string, list: string) => {
    rewritten += 1;
    const words = list.split(',').map((w) => w.trim());
    return `(${words.map((w) => `${column} = ${w}`).join(' OR ')})`;
  });
  return { sql: out, rewritten };
}

/** The pin columns whose CHECK is a list of words (0002: signal class, disposition; 0010; 0012). */
const PIN_LISTS = 4;

/**
 * The pins table's CHECKs on a list of words (signal class, disposition, driver type, pulse
 * signal) become comparisons joined by OR. SQLite builds the list again for every row it checks:
 * the four lists were a third of SQLite's own work when an import writes 5,000 pins (12 of 33 ms;
 * `npm run bench`, P4).
 *
 * SQLite cannot alter a CHECK, and rebuilding the table would need foreign keys off (pins are the
 * parent of four links), which cannot happen inside this migration's transaction. So the stored
 * table definition is edited in place, as SQLite documents for CHECK changes that leave the stored
 * rows as they are (sqlite.org/lang_altertable.html §7): in this transaction, the definition
 * rewritten with `writable_schema`, the schema version moved on so that every connection reads it
 * again, and the pins table checked (`integrity_check`, which checks CHECK constraints) before the
 * commit. Any surprise in the stored SQL refuses the migration and nothing changes.
 *
 * PostgreSQL checks a list once per statement; its tables keep their lists.
 */
export const pinChecksAsComparisons: Migration = {
  name: '0017-pin-checks-as-comparisons',
  async up(sequelize, transaction) {
    if (sequelize.getDialect() !== 'sqlite') return;
    const select = <T extends object>(sql: string) =>
      sequelize.query<T>(sql, { transaction, type: QueryTypes.SELECT });
    const [table] = await select<{ sql: string }>(
      `SELECT sql FROM sqlite_schema WHERE type = 'table' AND name = 'pins'`,
    );
    if (!table) throw new Error('0017: no pins table');
    const { sql, rewritten } = inListsAsComparisons(table.sql);
    if (rewritten !== PIN_LISTS) {
      throw new Error(
        `0017: expected ${PIN_LISTS} word lists in the pins table, found ${rewritten}`,
      );
    }
    const [{ schema_version: version } = { schema_version: NaN }] = await select<{
      schema_version: number;
    }>('PRAGMA schema_version');
    if (!Number.isSafeInteger(version)) throw new Error('0017: no schema version');
    await sequelize.query('PRAGMA writable_schema = ON', { transaction });
    try {
      await sequelize.query(
        `UPDATE sqlite_schema SET sql = ? WHERE type = 'table' AND name = 'pins'`,
        { transaction, replacements: [sql] },
      );
      await sequelize.query(`PRAGMA schema_version = ${version + 1}`, { transaction });
    } finally {
      await sequelize.query('PRAGMA writable_schema = OFF', { transaction });
    }
    const problems = await select<{ integrity_check: string }>('PRAGMA integrity_check(pins)');
    if (problems.length !== 1 || problems[0]!.integrity_check !== 'ok') {
      throw new Error(`0017: pins failed its check: ${JSON.stringify(problems.slice(0, 5))}`);
    }
  },
};
