import type { Migration } from './index.ts';

// As in 0009: the WHERE keeps a cascade (a box's positions after the box is gone) from inserting a
// NULL id, and lets SQLite parse the upsert after a SELECT.
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

/** The harness tables (0011) that hold their conversion's id. */
export const HARNESS_DIRECT = ['wires', 'splices', 'ground_points', 'boxes'] as const;
/** Harness tables that reach their conversion through another row. */
export const HARNESS_THROUGH = {
  wire_ends: (row: 'NEW' | 'OLD') => `(SELECT conversion_id FROM wires WHERE id = ${row}.wire_id)`,
  box_positions: (row: 'NEW' | 'OLD') =>
    `(SELECT conversion_id FROM boxes WHERE id = ${row}.box_id)`,
} as const;

/**
 * The conversion's change counter (0009) moves on every write to its harness too, so a list made
 * of harness rows (the wire list) can be cached against it like the pin and feed lists. An end
 * whose pin, splice, ground point or box position is deleted is set to NULL by its foreign key, an
 * UPDATE of wire_ends that moves the counter as well. docs/decisions/0011-cached-lists.md
 */
export const harnessChangeCounters: Migration = {
  name: '0015-harness-change-counters',
  async up(sequelize, transaction) {
    const statements = [
      ...HARNESS_DIRECT.flatMap((table) => triggers(table, (row) => `${row}.conversion_id`)),
      ...Object.entries(HARNESS_THROUGH).flatMap(([table, of]) => triggers(table, of)),
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
