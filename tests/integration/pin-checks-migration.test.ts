/**
 * Migration 0017 writes the pins table's word-list CHECKs as comparisons joined by OR, editing the
 * stored definition in place: the rows stay as they were, every connection reads the new
 * definition, and the rule is the same (each word the app knows is taken, anything else refused,
 * NULL taken where the column allows it).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { QueryTypes, Sequelize } from 'sequelize';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { MIGRATIONS } from '#server/db/migrations/index.ts';
import {
  inListsAsComparisons,
  pinChecksAsComparisons,
} from '#server/db/migrations/0017-pin-checks-as-comparisons.ts';
import { DISPOSITIONS } from '#shared/domain/dispositions.ts';
import { DRIVER_TYPES } from '#shared/domain/electrical/relays.ts';
import { PULSE_SIGNALS } from '#shared/domain/fields/text-parsers.ts';
import { SIGNAL_CLASSES } from '#shared/domain/signal-classes.ts';

describe('inListsAsComparisons', () => {
  it('writes each list of words as comparisons joined by OR, and leaves other checks alone', () => {
    const { sql, rewritten } = inListsAsComparisons(
      `CREATE TABLE t (a TEXT CHECK (a IN ('x', 'y_2',
          'z')), b REAL CHECK (b > 0), c TEXT CHECK (c IN ('q')))`,
    );
    expect(rewritten).toBe(2);
    expect(sql).toBe(
      `CREATE TABLE t (a TEXT CHECK ((a = 'x' OR a = 'y_2' OR a = 'z')), b REAL CHECK (b > 0), c TEXT CHECK ((c = 'q')))`,
    );
  });
});

const NOW = '2026-12-03T10:00:00.000Z';

describe('migration 0017-pin-checks-as-comparisons', () => {
  let dir: string;
  let sequelize: Sequelize;
  /** A second connection, open before the migration runs, as a running server's would be. */
  let other: Sequelize;
  const index = MIGRATIONS.findIndex((m) => m.name === pinChecksAsComparisons.name);

  beforeEach(async () => {
    dir = mkdtempSync(path.join(tmpdir(), 'lw-mig-'));
    const open = () =>
      new Sequelize({ dialect: 'sqlite', storage: path.join(dir, 'db.sqlite'), logging: false });
    sequelize = open();
    await sequelize.query('PRAGMA journal_mode = WAL');
    // A database as the round before left it: every migration before this one, and some pins.
    for (const m of MIGRATIONS.slice(0, index)) {
      await sequelize.transaction((t) => m.up(sequelize, t));
    }
    for (const sql of [
      `INSERT INTO workshops (id, name, created_at, updated_at) VALUES (1, 'W', '${NOW}', '${NOW}')`,
      `INSERT INTO conversions (id, workshop_id, name, donor_engine, receiving_vehicle, system_voltage, created_at, updated_at)
        VALUES (1, 1, 'C', 'KT-20', 'Corran 100', 12, '${NOW}', '${NOW}')`,
      `INSERT INTO connectors (id, conversion_id, label, side, cavity_count, rows, columns, created_at, updated_at)
        VALUES (1, 1, 'E1', 'ecu', 90, 1, 90, '${NOW}', '${NOW}')`,
      `INSERT INTO pins (id, conversion_id, connector_id, cavity, position, function, signal_class, disposition,
         driver_type, driver_rated_a, pulse_signal, pulses_per_rev, created_at, updated_at) VALUES
         (1, 1, 1, '1', 0, 'Injector 1', 'actuator_output', 'keep', 'low_side', 2, NULL, NULL, '${NOW}', '${NOW}'),
         (2, 1, 1, '2', 1, 'Crank speed', 'sensor_signal', 'extend', NULL, NULL, 'ac_sine', 36, '${NOW}', '${NOW}'),
         (3, 1, 1, '3', 2, '', 'none', 'undecided', NULL, NULL, NULL, NULL, '${NOW}', '${NOW}')`,
    ]) {
      await sequelize.query(sql);
    }
    other = open();
    await other.query('SELECT count(*) FROM pins');
  });

  afterEach(async () => {
    await other.close();
    await sequelize.close();
    rmSync(dir, { recursive: true });
  });

  const pinsSql = async (s: Sequelize) =>
    (
      await s.query<{ sql: string }>(`SELECT sql FROM sqlite_schema WHERE name = 'pins'`, {
        type: QueryTypes.SELECT,
      })
    )[0]!.sql;
  const allPins = (s: Sequelize) =>
    s.query('SELECT * FROM pins ORDER BY id', { type: QueryTypes.SELECT });

  it('keeps every row, and every connection then checks each word the app knows and nothing else', async () => {
    const before = await allPins(sequelize);
    expect(await pinsSql(sequelize)).toContain('signal_class IN (');

    await sequelize.transaction((t) => pinChecksAsComparisons.up(sequelize, t));

    expect(await allPins(sequelize)).toEqual(before);
    const sql = await pinsSql(other);
    expect(sql).not.toMatch(/ IN \(/);
    expect(sql).toContain(`signal_class = 'power_feed' OR signal_class = 'power_ground'`);
    const [check] = await sequelize.query<{ integrity_check: string }>('PRAGMA integrity_check', {
      type: QueryTypes.SELECT,
    });
    expect(check!.integrity_check).toBe('ok');

    // Written through the connection opened before the migration: it reads the new definition.
    let cavity = 100;
    const insert = (column: string, value: string | null) =>
      other.query(
        `INSERT INTO pins (conversion_id, connector_id, cavity, position, ${column}, created_at, updated_at)
         VALUES (1, 1, ?, 0, ?, '${NOW}', '${NOW}')`,
        { replacements: [String(cavity++), value] },
      );
    const lists: Array<[string, readonly string[], boolean]> = [
      ['signal_class', SIGNAL_CLASSES, false],
      ['disposition', DISPOSITIONS, false],
      ['driver_type', DRIVER_TYPES, true],
      ['pulse_signal', PULSE_SIGNALS, true],
    ];
    for (const [column, words, nullable] of lists) {
      for (const word of words) await expect(insert(column, word), word).resolves.toBeDefined();
      for (const wrong of ['bogus', words[0]!.toUpperCase(), ` ${words[0]}`, '']) {
        // Sequelize words a constraint failure as a validation error; SQLite's own is its cause.
        const refused = await insert(column, wrong).then(
          () => 'taken',
          (err: { parent?: Error }) => err.parent?.message,
        );
        expect(refused, `${column} ${wrong}`).toMatch(/CHECK constraint failed: \(/);
      }
      if (nullable) await expect(insert(column, null), column).resolves.toBeDefined();
    }
  });

  it('refuses a pins table it does not recognise, and changes nothing', async () => {
    await sequelize.transaction((t) => pinChecksAsComparisons.up(sequelize, t));
    const once = await pinsSql(sequelize);
    // Run again, the table no longer has its four lists: refused, rolled back.
    await expect(
      sequelize.transaction((t) => pinChecksAsComparisons.up(sequelize, t)),
    ).rejects.toThrow(/expected 4 word lists in the pins table, found 0/);
    expect(await pinsSql(other)).toBe(once);
  });
});
