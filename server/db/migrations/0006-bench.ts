import type { Migration } from './index.ts';

export const bench: Migration = {
  name: '0006-bench',
  async up(sequelize, transaction) {
    const statements = [
      // What the technician did at the bench, pin by pin, against a signed-off revision. The pin id
      // is the one in the revision's frozen snapshot.
      `CREATE TABLE bench_records (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        revision_id INTEGER NOT NULL REFERENCES revisions(id),
        pin_id INTEGER NOT NULL,
        done BOOLEAN NOT NULL DEFAULT 0,
        tested BOOLEAN NOT NULL DEFAULT 0,
        resistance_ohm REAL CHECK (resistance_ohm IS NULL OR resistance_ohm >= 0),
        note TEXT NOT NULL DEFAULT '',
        recorded_by_id INTEGER REFERENCES users(id),
        recorded_by_name TEXT NOT NULL,
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (revision_id, pin_id)
      )`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
