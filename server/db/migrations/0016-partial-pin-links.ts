import type { Migration } from './index.ts';

/**
 * The indexes on a pin's links (to another cavity, to a feed) hold only the pins that have one:
 * most pins are joined to nothing, and every pin an import writes used to add two NULL entries.
 * A lookup by a link (`= ?`, the foreign keys' ON DELETE SET NULL included) implies NOT NULL, so
 * SQLite and PostgreSQL both still use them. An applied 5,000-row import writes some 6 % faster
 * inside SQLite (`npm run bench`, P4).
 */
export const partialPinLinks: Migration = {
  name: '0016-partial-pin-links',
  async up(sequelize, transaction) {
    const statements = [
      `DROP INDEX pins_destination`,
      `CREATE INDEX pins_destination ON pins(destination_pin_id)
         WHERE destination_pin_id IS NOT NULL`,
      `DROP INDEX pins_destination_feed`,
      `CREATE INDEX pins_destination_feed ON pins(destination_feed_id)
         WHERE destination_feed_id IS NOT NULL`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
