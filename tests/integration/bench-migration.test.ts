/**
 * Migration 0007 keeps every bench record made under 0006: a pin id becomes the cavity key read
 * from that revision's own snapshot, done/tested become ticks, and nothing else changes.
 */
import sqlite3 from 'sqlite3';
import type { Sequelize, Transaction } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { bench } from '#server/db/migrations/0006-bench.ts';
import { benchItems } from '#server/db/migrations/0007-bench-items.ts';

function open() {
  const raw = new sqlite3.Database(':memory:');
  const run = (sql: string) =>
    new Promise<void>((resolve, reject) => raw.exec(sql, (err) => (err ? reject(err) : resolve())));
  const all = (sql: string) =>
    new Promise<Record<string, unknown>[]>((resolve, reject) =>
      raw.all(sql, (err, rows) => (err ? reject(err) : resolve(rows as Record<string, unknown>[]))),
    );
  // Just enough of Sequelize for a plain-SQL migration.
  const sequelize = { query: (sql: string) => run(sql) } as unknown as Sequelize;
  return { raw, run, all, sequelize };
}

describe('migration 0007-bench-items', () => {
  it('turns pin records into cavity-keyed records with their ticks, reading and note', async () => {
    const db = open();
    await db.run(`CREATE TABLE revisions (id INTEGER PRIMARY KEY, snapshot_json TEXT NOT NULL);
      CREATE TABLE users (id INTEGER PRIMARY KEY); CREATE TABLE workshops (id INTEGER PRIMARY KEY);`);
    await bench.up(db.sequelize, undefined as unknown as Transaction);
    const snapshot = {
      connectors: [
        { id: 7, label: 'E1' },
        { id: 8, label: 'E2' },
      ],
      pins: [
        { id: 70, connectorId: 7, cavity: '12' },
        { id: 80, connectorId: 8, cavity: 'A3' },
      ],
    };
    await db.run(`INSERT INTO revisions VALUES (1, '${JSON.stringify(snapshot)}');
      INSERT INTO bench_records (id, revision_id, pin_id, done, tested, resistance_ohm, note,
        recorded_by_name, version, created_at, updated_at)
      VALUES (1, 1, 70, 1, 1, 0.07, 'Re-crimped', 'Sal Okafor', 2, '2026-12-01', '2026-12-01'),
             (2, 1, 80, 1, 0, NULL, '', 'Sal Okafor', 0, '2026-12-01', '2026-12-01'),
             (3, 1, 99, 0, 0, NULL, '', 'Sal Okafor', 0, '2026-12-01', '2026-12-01');`);
    await benchItems.up(db.sequelize, undefined as unknown as Transaction);
    const rows = await db.all(
      'SELECT id, item_key, ticks_json, reading, note, version FROM bench_records ORDER BY id',
    );
    expect(rows).toEqual([
      {
        id: 1,
        item_key: 'pin:E1-12',
        ticks_json: '{"done":true,"tested":true}',
        reading: 0.07,
        note: 'Re-crimped',
        version: 2,
      },
      {
        id: 2,
        item_key: 'pin:E2-A3',
        ticks_json: '{"done":true,"tested":false}',
        reading: null,
        note: '',
        version: 0,
      },
      // A pin the snapshot does not hold keeps its record under its old id.
      {
        id: 3,
        item_key: 'pin:#99',
        ticks_json: '{"done":false,"tested":false}',
        reading: null,
        note: '',
        version: 0,
      },
    ]);
    db.raw.close();
  });
});
