import type { Feed } from './feeds.schema.ts';
import type { SnapshotHarness } from './harness.schema.ts';
import type { Connector, Pin } from './pin-map.schema.ts';

/**
 * Everything a conversion's plan holds at one moment: what the checks read, what a revision freezes
 * and hashes, and what a worksheet prints. Row versions and timestamps are left out: they say when
 * something changed, not what the plan is.
 */
export interface ConversionSnapshot {
  format: 1;
  conversion: {
    id: number;
    name: string;
    donorEngine: string;
    receivingVehicle: string;
    systemVoltage: number;
    notes: string;
  };
  workshop: { id: number; name: string };
  connectors: SnapshotConnector[];
  pins: SnapshotPin[];
  feeds: SnapshotFeed[];
  /** Wires, splices, ground points and boxes; absent in revisions frozen before the harness. */
  harness?: SnapshotHarness;
}

export type SnapshotConnector = Omit<Connector, 'version'>;
export type SnapshotPin = Omit<Pin, 'version' | 'updatedAt'>;
export type SnapshotFeed = Omit<Feed, 'version'>;
