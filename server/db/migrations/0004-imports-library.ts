import type { Migration } from './index.ts';

const SIDES = `'ecu', 'engine', 'vehicle', 'other'`;
const SIGNAL_CLASSES = `'power_feed', 'power_ground', 'sensor_ground', 'sensor_signal',
  'sensor_reference', 'actuator_output', 'switched_input', 'communication', 'output_signal',
  'shield', 'none'`;
const DISPOSITIONS = `'undecided', 'keep', 'extend', 'join', 'depin', 'cut', 'empty'`;

/**
 * SAE J1962 16-pin diagnostic connector (open standard): 4 chassis ground, 5 signal ground,
 * 6 CAN high, 14 CAN low, 7 K-line, 15 L-line (optional), 2 and 10 SAE J1850 bus + and −,
 * 16 battery + unswitched; 1, 3, 8, 9, 11, 12 and 13 at the maker's discretion. Two rows of
 * eight, numbered 1–8 along the top row and 9–16 along the bottom as on the connector face.
 */
const J1962_PINS: Array<[cavity: string, fn: string, signalClass: string, notes: string]> = [
  ['1', "Maker's discretion", 'none', ''],
  ['2', 'SAE J1850 bus +', 'communication', 'Used only by vehicles with SAE J1850 (PWM or VPW).'],
  ['3', "Maker's discretion", 'none', ''],
  ['4', 'Chassis ground', 'power_ground', ''],
  [
    '5',
    'Signal ground',
    'sensor_ground',
    "The diagnostic signal return; join it to the ECU's signal ground, not to a chassis stud.",
  ],
  ['6', 'CAN high (ISO 15765-4)', 'communication', ''],
  ['7', 'K-line (ISO 9141-2 / ISO 14230-4)', 'communication', ''],
  ['8', "Maker's discretion", 'none', ''],
  ['9', "Maker's discretion", 'none', ''],
  ['10', 'SAE J1850 bus −', 'communication', 'Used only by SAE J1850 PWM.'],
  ['11', "Maker's discretion", 'none', ''],
  ['12', "Maker's discretion", 'none', ''],
  ['13', "Maker's discretion", 'none', ''],
  ['14', 'CAN low (ISO 15765-4)', 'communication', ''],
  ['15', 'L-line (ISO 9141-2 / ISO 14230-4), optional', 'communication', ''],
  [
    '16',
    'Battery + (unswitched)',
    'power_feed',
    'Live with the ignition off; give it its own fuse near the battery.',
  ],
];

export const importsLibrary: Migration = {
  name: '0004-imports-library',
  async up(sequelize, transaction) {
    const statements = [
      // The column choices a workshop last applied to a file with exactly these headers.
      `CREATE TABLE import_mappings (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        workshop_id INTEGER NOT NULL REFERENCES workshops(id) ON DELETE CASCADE,
        header_signature TEXT NOT NULL,
        headers_json TEXT NOT NULL,
        targets_json TEXT NOT NULL,
        updated_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (workshop_id, header_signature)
      )`,
      // One row per applied pinout import, with the file's SHA-256.
      `CREATE TABLE pin_imports (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        workshop_id INTEGER NOT NULL REFERENCES workshops(id) ON DELETE CASCADE,
        conversion_id INTEGER NOT NULL REFERENCES conversions(id) ON DELETE CASCADE,
        connector_id INTEGER REFERENCES connectors(id) ON DELETE SET NULL,
        file_name TEXT NOT NULL,
        sha256 TEXT NOT NULL,
        row_count INTEGER NOT NULL,
        added_count INTEGER NOT NULL,
        changed_count INTEGER NOT NULL,
        removed_count INTEGER NOT NULL,
        imported_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
        created_at DATETIME NOT NULL
      )`,
      `CREATE INDEX pin_imports_file ON pin_imports(conversion_id, sha256)`,
      // Built-in templates have no workshop and are read-only (triggers below).
      `CREATE TABLE pinout_templates (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        workshop_id INTEGER REFERENCES workshops(id) ON DELETE CASCADE,
        built_in BOOLEAN NOT NULL DEFAULT 0,
        name TEXT NOT NULL,
        side TEXT NOT NULL CHECK (side IN (${SIDES})),
        description TEXT NOT NULL DEFAULT '',
        cavity_count INTEGER NOT NULL CHECK (cavity_count BETWEEN 1 AND 400),
        rows INTEGER NOT NULL CHECK (rows >= 1),
        columns INTEGER NOT NULL CHECK (columns >= 1),
        created_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        CHECK ((built_in = 1) = (workshop_id IS NULL))
      )`,
      `CREATE UNIQUE INDEX pinout_templates_name ON pinout_templates(workshop_id, name)
        WHERE workshop_id IS NOT NULL`,
      `CREATE TABLE pinout_template_pins (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        template_id INTEGER NOT NULL REFERENCES pinout_templates(id) ON DELETE CASCADE,
        cavity TEXT NOT NULL,
        position INTEGER NOT NULL,
        function TEXT NOT NULL DEFAULT '',
        signal_class TEXT NOT NULL DEFAULT 'none' CHECK (signal_class IN (${SIGNAL_CLASSES})),
        colour TEXT NOT NULL DEFAULT '',
        size_mm2 REAL,
        insulation_rating_c INTEGER,
        disposition TEXT NOT NULL DEFAULT 'undecided' CHECK (disposition IN (${DISPOSITIONS})),
        notes TEXT NOT NULL DEFAULT '',
        UNIQUE (template_id, cavity)
      )`,
      `CREATE TABLE attachments (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        workshop_id INTEGER NOT NULL REFERENCES workshops(id) ON DELETE CASCADE,
        conversion_id INTEGER NOT NULL REFERENCES conversions(id) ON DELETE CASCADE,
        connector_id INTEGER NOT NULL REFERENCES connectors(id) ON DELETE CASCADE,
        storage_key TEXT NOT NULL UNIQUE,
        file_name TEXT NOT NULL,
        content_type TEXT NOT NULL CHECK (content_type IN ('application/pdf', 'image/png', 'image/jpeg')),
        size_bytes INTEGER NOT NULL CHECK (size_bytes > 0),
        sha256 TEXT NOT NULL,
        uploaded_by_id INTEGER REFERENCES users(id) ON DELETE SET NULL,
        created_at DATETIME NOT NULL
      )`,
      `CREATE INDEX attachments_connector ON attachments(connector_id, id)`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });

    const now = new Date();
    await sequelize.query(
      `INSERT INTO pinout_templates
        (workshop_id, built_in, name, side, description, cavity_count, rows, columns, created_at, updated_at)
       VALUES (NULL, 1, :name, 'vehicle', :description, 16, 2, 8, :now, :now)`,
      {
        transaction,
        replacements: {
          name: '16-pin diagnostic connector (SAE J1962)',
          description:
            'The standard vehicle diagnostic connector, laid out per SAE J1962 (an open standard). ' +
            "Cavities the standard leaves to the maker's discretion are named so.",
          now,
        },
      },
    );
    const [[template]] = (await sequelize.query(
      `SELECT id FROM pinout_templates WHERE built_in = 1 AND name = :name`,
      { transaction, replacements: { name: '16-pin diagnostic connector (SAE J1962)' } },
    )) as [[{ id: number }], unknown];
    for (const [position, [cavity, fn, signalClass, notes]] of J1962_PINS.entries()) {
      await sequelize.query(
        `INSERT INTO pinout_template_pins (template_id, cavity, position, function, signal_class, notes)
         VALUES (:templateId, :cavity, :position, :fn, :signalClass, :notes)`,
        {
          transaction,
          replacements: { templateId: template.id, cavity, position, fn, signalClass, notes },
        },
      );
    }

    // Built-in templates are the same for every workshop: nobody changes or deletes them.
    const readOnly = [
      `CREATE TRIGGER pinout_templates_builtin_no_update BEFORE UPDATE ON pinout_templates
        WHEN OLD.built_in = 1
        BEGIN SELECT RAISE(ABORT, 'built-in templates are read-only'); END`,
      `CREATE TRIGGER pinout_templates_builtin_no_delete BEFORE DELETE ON pinout_templates
        WHEN OLD.built_in = 1
        BEGIN SELECT RAISE(ABORT, 'built-in templates are read-only'); END`,
      `CREATE TRIGGER pinout_template_pins_builtin_no_update BEFORE UPDATE ON pinout_template_pins
        WHEN (SELECT built_in FROM pinout_templates WHERE id = OLD.template_id) = 1
        BEGIN SELECT RAISE(ABORT, 'built-in templates are read-only'); END`,
      `CREATE TRIGGER pinout_template_pins_builtin_no_delete BEFORE DELETE ON pinout_template_pins
        WHEN (SELECT built_in FROM pinout_templates WHERE id = OLD.template_id) = 1
        BEGIN SELECT RAISE(ABORT, 'built-in templates are read-only'); END`,
      `CREATE TRIGGER pinout_template_pins_builtin_no_insert BEFORE INSERT ON pinout_template_pins
        WHEN (SELECT built_in FROM pinout_templates WHERE id = NEW.template_id) = 1
        BEGIN SELECT RAISE(ABORT, 'built-in templates are read-only'); END`,
    ];
    for (const sql of readOnly) await sequelize.query(sql, { transaction });
  },
};
