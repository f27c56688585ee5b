import type { Migration } from './index.ts';

/**
 * What the electrical rules need beyond the first round: an ECU output's stage and rating on pins
 * (and library pinouts), the fuse's family and its distance from the source, the relay coil's
 * resistance, terminals along a feed, what each load is, and the workshop's drop allowances.
 */
export const electricalRules: Migration = {
  name: '0010-electrical-rules',
  async up(sequelize, transaction) {
    const drivers = `'low_side', 'high_side', 'push_pull', 'open_collector'`;
    const statements = [
      `ALTER TABLE pins ADD COLUMN driver_type TEXT CHECK (driver_type IN (${drivers}))`,
      `ALTER TABLE pins ADD COLUMN driver_rated_a REAL CHECK (driver_rated_a > 0)`,
      `ALTER TABLE pinout_template_pins ADD COLUMN driver_type TEXT CHECK (driver_type IN (${drivers}))`,
      `ALTER TABLE pinout_template_pins ADD COLUMN driver_rated_a REAL CHECK (driver_rated_a > 0)`,
      `ALTER TABLE feeds ADD COLUMN fuse_type TEXT NOT NULL DEFAULT 'standard_blade'
        CHECK (fuse_type IN ('mini_blade', 'standard_blade', 'maxi_blade', 'bolt_down', 'fusible_link'))`,
      `ALTER TABLE feeds ADD COLUMN unfused_length_mm REAL CHECK (unfused_length_mm >= 0)`,
      `ALTER TABLE feeds ADD COLUMN fuse_sheathed BOOLEAN NOT NULL DEFAULT 0`,
      `ALTER TABLE feeds ADD COLUMN relay_coil_resistance_ohm REAL CHECK (relay_coil_resistance_ohm > 0)`,
      `ALTER TABLE feeds ADD COLUMN wire_connections INTEGER NOT NULL DEFAULT 4 CHECK (wire_connections >= 0)`,
      `ALTER TABLE feed_loads ADD COLUMN kind TEXT NOT NULL DEFAULT 'resistive'
        CHECK (kind IN ('resistive', 'motor', 'lamp'))`,
      `ALTER TABLE workshops ADD COLUMN drop_fuse_v REAL NOT NULL DEFAULT 0.1`,
      `ALTER TABLE workshops ADD COLUMN drop_relay_contacts_v REAL NOT NULL DEFAULT 0.1`,
      `ALTER TABLE workshops ADD COLUMN drop_per_connection_v REAL NOT NULL DEFAULT 0.005`,
      `ALTER TABLE workshops ADD COLUMN drop_chassis_return_v REAL NOT NULL DEFAULT 0.05`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
  },
};
