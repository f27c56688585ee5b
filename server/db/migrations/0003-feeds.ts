import type { Migration } from './index.ts';

export const feeds: Migration = {
  name: '0003-feeds',
  async up(sequelize, transaction) {
    const statements = [
      `CREATE TABLE feeds (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        conversion_id INTEGER NOT NULL REFERENCES conversions(id) ON DELETE CASCADE,
        name TEXT NOT NULL,
        source TEXT NOT NULL CHECK (source IN ('battery', 'ignition', 'relay_output')),
        source_feed_id INTEGER REFERENCES feeds(id) ON DELETE SET NULL,
        fuse_a REAL,
        has_relay BOOLEAN NOT NULL DEFAULT 0,
        relay_contact_rating_a REAL,
        relay_coil_current_a REAL,
        relay_coil_pin_id INTEGER REFERENCES pins(id) ON DELETE SET NULL,
        wire_size_mm2 REAL NOT NULL,
        wire_insulation_rating_c INTEGER NOT NULL,
        wire_length_m REAL NOT NULL,
        wire_zone TEXT NOT NULL CHECK (wire_zone IN ('cabin', 'engine_bay')),
        wire_bundled INTEGER NOT NULL DEFAULT 1,
        wire_return_path TEXT NOT NULL CHECK (wire_return_path IN ('wire', 'chassis')),
        wire_colour TEXT NOT NULL DEFAULT '',
        drop_class TEXT NOT NULL CHECK (drop_class IN ('critical', 'general')),
        drop_limit_pct REAL,
        notes TEXT NOT NULL DEFAULT '',
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (conversion_id, name)
      )`,
      `CREATE INDEX feeds_conversion ON feeds(conversion_id)`,
      `CREATE TABLE feed_loads (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        feed_id INTEGER NOT NULL REFERENCES feeds(id) ON DELETE CASCADE,
        pin_id INTEGER REFERENCES pins(id) ON DELETE SET NULL,
        name TEXT NOT NULL DEFAULT '',
        current_a REAL NOT NULL,
        continuous BOOLEAN NOT NULL DEFAULT 1,
        position INTEGER NOT NULL DEFAULT 0
      )`,
      `CREATE INDEX feed_loads_feed ON feed_loads(feed_id)`,
      // A pin joined to a new feed points at it.
      `ALTER TABLE pins ADD COLUMN destination_feed_id INTEGER REFERENCES feeds(id) ON DELETE SET NULL`,
      `CREATE INDEX pins_destination_feed ON pins(destination_feed_id)`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
