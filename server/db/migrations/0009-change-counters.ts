import type { Migration } from './index.ts';

/** The tables whose rows make up what the pin map, feeds and checks read of a conversion. */
const DIRECT = ['pins', 'connectors', 'feeds'] as const;

// The WHERE keeps a cascade (a feed's loads after the feed is gone) from inserting a NULL id,
// which SQLite would turn into a fresh rowid; it also lets SQLite parse the upsert after a SELECT.
const bump = (conversionId: string) =>
  `INSERT INTO conversion_changes (conversion_id, counter)
     SELECT id, 1 FROM (SELECT ${conversionId} AS id) WHERE id IS NOT NULL
     ON CONFLICT (conversion_id) DO UPDATE SET counter = counter + 1;`;

function triggers(table: string, conversionIdOf: (row: 'NEW' | 'OLD') => string): string[] {
  return [
    `CREATE TRIGGER ${table}_changes_insert AFTER INSERT ON ${table} BEGIN
       ${bump(conversionIdOf('NEW'))}
     END`,
    `CREATE TRIGGER ${table}_changes_update AFTER UPDATE ON ${table} BEGIN
       ${bump(conversionIdOf('NEW'))}
       ${bump(conversionIdOf('OLD'))}
     END`,
    `CREATE TRIGGER ${table}_changes_delete AFTER DELETE ON ${table} BEGIN
       ${bump(conversionIdOf('OLD'))}
     END`,
  ];
}

/**
 * A change counter per conversion, kept by triggers on every table a conversion's lists are read
 * from, so that a cached answer can be checked against one small row and no code path (service,
 * import, cascade, a future module) can forget to invalidate it. The counter only ever grows; rows
 * outlive deleted conversions on purpose (ids are AUTOINCREMENT and never come back).
 * docs/decisions/0011-cached-lists.md
 */
export const changeCounters: Migration = {
  name: '0009-change-counters',
  async up(sequelize, transaction) {
    const statements = [
      `CREATE TABLE conversion_changes (
        conversion_id INTEGER PRIMARY KEY,
        counter INTEGER NOT NULL DEFAULT 0
      )`,
      `INSERT INTO conversion_changes (conversion_id, counter) SELECT id, 1 FROM conversions`,
      ...triggers('conversions', (row) => `${row}.id`),
      ...DIRECT.flatMap((table) => triggers(table, (row) => `${row}.conversion_id`)),
      ...triggers(
        'feed_loads',
        (row) => `(SELECT conversion_id FROM feeds WHERE id = ${row}.feed_id)`,
      ),
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
