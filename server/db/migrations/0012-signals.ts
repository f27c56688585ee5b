import type { Migration } from './index.ts';

/**
 * What the signal rules read off a pin: how a speed signal is carried and its pulses per
 * revolution (or km), and a bus termination at the node. On pins and on library pinouts alike.
 */
export const signals: Migration = {
  name: '0012-signals',
  async up(sequelize, transaction) {
    const pulse = `'open_collector', 'square_5v', 'square_12v', 'ac_sine'`;
    const statements = ['pins', 'pinout_template_pins'].flatMap((table) => [
      `ALTER TABLE ${table} ADD COLUMN pulse_signal TEXT CHECK (pulse_signal IN (${pulse}))`,
      `ALTER TABLE ${table} ADD COLUMN pulses_per_rev REAL CHECK (pulses_per_rev > 0)`,
      `ALTER TABLE ${table} ADD COLUMN termination_ohm REAL CHECK (termination_ohm > 0)`,
    ]);
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
