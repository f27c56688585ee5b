import type { Migration } from './index.ts';

export const foundation: Migration = {
  name: '0001-foundation',
  async up(sequelize, transaction) {
    const statements = [
      `CREATE TABLE workshops (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        name TEXT NOT NULL,
        paper_size TEXT NOT NULL DEFAULT 'A4' CHECK (paper_size IN ('A4', 'Letter')),
        size_unit TEXT NOT NULL DEFAULT 'mm2' CHECK (size_unit IN ('mm2', 'awg')),
        system_voltage INTEGER NOT NULL DEFAULT 12 CHECK (system_voltage IN (12, 24)),
        default_insulation_c INTEGER NOT NULL DEFAULT 105,
        service_allowance_pct REAL NOT NULL DEFAULT 15,
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL
      )`,
      `CREATE TABLE users (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        workshop_id INTEGER NOT NULL REFERENCES workshops(id) ON DELETE CASCADE,
        email TEXT NOT NULL COLLATE NOCASE UNIQUE,
        name TEXT NOT NULL,
        role TEXT NOT NULL CHECK (role IN ('admin', 'builder', 'technician', 'reviewer')),
        password_hash TEXT,
        active BOOLEAN NOT NULL DEFAULT 1,
        token_version INTEGER NOT NULL DEFAULT 0,
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL
      )`,
      `CREATE INDEX users_workshop ON users(workshop_id)`,
      `CREATE TABLE conversions (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        workshop_id INTEGER NOT NULL REFERENCES workshops(id) ON DELETE CASCADE,
        name TEXT NOT NULL,
        donor_engine TEXT NOT NULL,
        receiving_vehicle TEXT NOT NULL,
        system_voltage INTEGER NOT NULL CHECK (system_voltage IN (12, 24)),
        notes TEXT NOT NULL DEFAULT '',
        created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL
      )`,
      `CREATE INDEX conversions_workshop ON conversions(workshop_id)`,
      // Append-only: no foreign keys (a cascade would have to update or delete rows here) and
      // triggers that refuse any UPDATE or DELETE.
      `CREATE TABLE audit_events (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        workshop_id INTEGER NOT NULL,
        conversion_id INTEGER,
        actor_id INTEGER,
        actor_name TEXT NOT NULL,
        action TEXT NOT NULL,
        entity_type TEXT NOT NULL,
        entity_id INTEGER,
        summary TEXT NOT NULL,
        before_json TEXT,
        after_json TEXT,
        request_id TEXT,
        created_at DATETIME NOT NULL
      )`,
      `CREATE INDEX audit_events_conversion ON audit_events(workshop_id, conversion_id, id)`,
      `CREATE TRIGGER audit_events_no_update BEFORE UPDATE ON audit_events
        BEGIN SELECT RAISE(ABORT, 'audit_events is append-only'); END`,
      `CREATE TRIGGER audit_events_no_delete BEFORE DELETE ON audit_events
        BEGIN SELECT RAISE(ABORT, 'audit_events is append-only'); END`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
