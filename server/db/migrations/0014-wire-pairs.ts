import type { Migration } from './index.ts';

/**
 * How a wire is run beside others, for the signal rules: a twist group (wires sharing one are
 * twisted together, e.g. a CAN pair or a crank sensor's two wires) and whether it runs inside a
 * shielded cable. Wires frozen in earlier revisions read as untwisted and unshielded.
 */
export const wirePairs: Migration = {
  name: '0014-wire-pairs',
  async up(sequelize, transaction) {
    const statements = [
      `ALTER TABLE wires ADD COLUMN twist_group TEXT NOT NULL DEFAULT ''`,
      `ALTER TABLE wires ADD COLUMN shielded BOOLEAN NOT NULL DEFAULT FALSE`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
