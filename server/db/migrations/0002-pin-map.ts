import type { Migration } from './index.ts';

export const pinMap: Migration = {
  name: '0002-pin-map',
  async up(sequelize, transaction) {
    const statements = [
      `CREATE TABLE connectors (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        conversion_id INTEGER NOT NULL REFERENCES conversions(id) ON DELETE CASCADE,
        label TEXT NOT NULL,
        side TEXT NOT NULL CHECK (side IN ('ecu', 'engine', 'vehicle', 'other')),
        cavity_count INTEGER NOT NULL CHECK (cavity_count BETWEEN 1 AND 400),
        rows INTEGER NOT NULL CHECK (rows >= 1),
        columns INTEGER NOT NULL CHECK (columns >= 1),
        notes TEXT NOT NULL DEFAULT '',
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (conversion_id, label)
      )`,
      `CREATE TABLE pins (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        conversion_id INTEGER NOT NULL REFERENCES conversions(id) ON DELETE CASCADE,
        connector_id INTEGER NOT NULL REFERENCES connectors(id) ON DELETE CASCADE,
        cavity TEXT NOT NULL,
        position INTEGER NOT NULL,
        function TEXT NOT NULL DEFAULT '',
        signal_class TEXT NOT NULL DEFAULT 'none' CHECK (signal_class IN ('power_feed', 'power_ground',
          'sensor_ground', 'sensor_signal', 'sensor_reference', 'actuator_output', 'switched_input',
          'communication', 'output_signal', 'shield', 'none')),
        colour TEXT NOT NULL DEFAULT '',
        size_mm2 REAL,
        insulation_rating_c INTEGER,
        disposition TEXT NOT NULL DEFAULT 'undecided' CHECK (disposition IN ('undecided', 'keep',
          'extend', 'join', 'depin', 'cut', 'empty')),
        destination TEXT NOT NULL DEFAULT '',
        destination_pin_id INTEGER REFERENCES pins(id) ON DELETE SET NULL,
        run_length_m REAL,
        load_current_a REAL,
        notes TEXT NOT NULL DEFAULT '',
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (connector_id, cavity)
      )`,
      `CREATE INDEX pins_conversion ON pins(conversion_id, connector_id, position)`,
      `CREATE INDEX pins_destination ON pins(destination_pin_id)`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
