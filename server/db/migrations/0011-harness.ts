import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { insertReturningId, readTogether } from '../portable.ts';
import type { Migration } from './index.ts';

/**
 * The harness as it is built: wires with two ends, splices, ground points and the relay and fuse
 * box. Existing plans are carried over by deriveHarness: every joined or extended pin gets its wire,
 * every feed its box positions and the wires from its source through its fuse and relay.
 */
export const harness: Migration = {
  name: '0011-harness',
  async up(sequelize, transaction) {
    const statements = [
      `CREATE TABLE ground_points (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        conversion_id INTEGER NOT NULL REFERENCES conversions(id) ON DELETE CASCADE,
        label TEXT NOT NULL,
        location TEXT NOT NULL CHECK (location IN ('engine_block', 'chassis', 'body', 'ecu_local')),
        strap_size_mm2 REAL,
        notes TEXT NOT NULL DEFAULT '',
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (conversion_id, label)
      )`,
      `CREATE TABLE splices (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        conversion_id INTEGER NOT NULL REFERENCES conversions(id) ON DELETE CASCADE,
        label TEXT NOT NULL,
        sealed BOOLEAN NOT NULL DEFAULT 1,
        branch TEXT NOT NULL DEFAULT '',
        distance_mm REAL,
        notes TEXT NOT NULL DEFAULT '',
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (conversion_id, label)
      )`,
      `CREATE TABLE boxes (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        conversion_id INTEGER NOT NULL REFERENCES conversions(id) ON DELETE CASCADE,
        label TEXT NOT NULL,
        notes TEXT NOT NULL DEFAULT '',
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (conversion_id, label)
      )`,
      `CREATE TABLE box_positions (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        box_id INTEGER NOT NULL REFERENCES boxes(id) ON DELETE CASCADE,
        kind TEXT NOT NULL CHECK (kind IN ('relay', 'fuse')),
        label TEXT NOT NULL,
        contact_rating_a REAL,
        coil_resistance_ohm REAL,
        fuse_type TEXT,
        rating_a REAL,
        feed_id INTEGER REFERENCES feeds(id) ON DELETE SET NULL,
        position INTEGER NOT NULL DEFAULT 0,
        CHECK ((kind = 'relay' AND contact_rating_a > 0) OR (kind = 'fuse' AND rating_a > 0)),
        UNIQUE (box_id, label)
      )`,
      `CREATE INDEX box_positions_box ON box_positions(box_id)`,
      `CREATE TABLE wires (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        conversion_id INTEGER NOT NULL REFERENCES conversions(id) ON DELETE CASCADE,
        label TEXT NOT NULL,
        colour TEXT NOT NULL DEFAULT '',
        size_mm2 REAL,
        insulation_rating_c INTEGER,
        length_m REAL,
        zone TEXT NOT NULL DEFAULT 'cabin' CHECK (zone IN ('cabin', 'engine_bay')),
        branch TEXT NOT NULL DEFAULT '',
        notes TEXT NOT NULL DEFAULT '',
        version INTEGER NOT NULL DEFAULT 0,
        created_at DATETIME NOT NULL,
        updated_at DATETIME NOT NULL,
        UNIQUE (conversion_id, label)
      )`,
      `CREATE INDEX wires_conversion ON wires(conversion_id)`,
      `CREATE TABLE wire_ends (
        id INTEGER PRIMARY KEY AUTOINCREMENT,
        wire_id INTEGER NOT NULL REFERENCES wires(id) ON DELETE CASCADE,
        end_index INTEGER NOT NULL CHECK (end_index IN (0, 1)),
        kind TEXT NOT NULL CHECK (kind IN ('pin', 'splice', 'ground', 'relay', 'fuse', 'source', 'unresolved')),
        pin_id INTEGER REFERENCES pins(id) ON DELETE SET NULL,
        splice_id INTEGER REFERENCES splices(id) ON DELETE SET NULL,
        ground_point_id INTEGER REFERENCES ground_points(id) ON DELETE SET NULL,
        box_position_id INTEGER REFERENCES box_positions(id) ON DELETE SET NULL,
        terminal TEXT,
        source TEXT CHECK (source IS NULL OR source IN ('battery', 'ignition', 'starter')),
        text TEXT NOT NULL DEFAULT '',
        UNIQUE (wire_id, end_index)
      )`,
      `CREATE INDEX wire_ends_pin ON wire_ends(pin_id)`,
      `CREATE INDEX wire_ends_splice ON wire_ends(splice_id)`,
    ];
    for (const sql of statements) await sequelize.query(sql, { transaction });
    const conversions = await sequelize.query<{ id: number }>('SELECT id FROM conversions', {
      type: QueryTypes.SELECT,
      transaction,
    });
    for (const c of conversions) await deriveHarness(sequelize, c.id, transaction);
  },
};

interface PinRow {
  id: number;
  disposition: string;
  destination: string;
  destination_pin_id: number | null;
  destination_feed_id: number | null;
  colour: string;
  size_mm2: number | null;
  insulation_rating_c: number | null;
  run_length_m: number | null;
  side: string;
}
interface FeedRow {
  id: number;
  name: string;
  source: 'battery' | 'ignition' | 'relay_output';
  source_feed_id: number | null;
  fuse_a: number | null;
  fuse_type: string | null;
  has_relay: number;
  relay_contact_rating_a: number | null;
  relay_coil_resistance_ohm: number | null;
  relay_coil_pin_id: number | null;
  wire_size_mm2: number;
  wire_insulation_rating_c: number;
  wire_length_m: number;
  wire_zone: string;
  wire_colour: string;
}
interface LoadRow {
  feed_id: number;
  pin_id: number | null;
  name: string;
}

type End =
  | { kind: 'pin'; pinId: number }
  | { kind: 'relay' | 'fuse'; positionId: number; terminal: string }
  | { kind: 'source'; source: 'battery' | 'ignition' }
  | { kind: 'unresolved'; text: string };

/**
 * Builds the harness of one conversion from its pin destinations and feeds: a box with a fuse and a
 * relay position per feed, the wires from each feed's source through its fuse and relay, a wire
 * for every pin joined to a vehicle cavity or a feed, and a wire with an unresolved far end for a
 * destination that is only words. Run once per conversion, on a conversion with no harness yet;
 * the seed uses it too.
 */
export async function deriveHarness(
  sequelize: Sequelize,
  conversionId: number,
  transaction: Transaction,
): Promise<void> {
  const select = <T extends object>(sql: string) =>
    sequelize.query<T>(sql, {
      type: QueryTypes.SELECT,
      replacements: { conversionId },
      transaction,
    });
  // One after another: they share the transaction's connection (the rows read are the same).
  const [pins, feeds, loads] = await readTogether(
    transaction,
    () =>
      select<PinRow>(
        `SELECT p.id, p.disposition, p.destination, p.destination_pin_id, p.destination_feed_id,
              p.colour, p.size_mm2, p.insulation_rating_c, p.run_length_m, c.side
         FROM pins p JOIN connectors c ON c.id = p.connector_id
        WHERE p.conversion_id = :conversionId ORDER BY p.connector_id, p.position`,
      ),
    () => select<FeedRow>(`SELECT * FROM feeds WHERE conversion_id = :conversionId ORDER BY id`),
    () =>
      select<LoadRow>(
        `SELECT l.feed_id, l.pin_id, l.name FROM feed_loads l JOIN feeds f ON f.id = l.feed_id
        WHERE f.conversion_id = :conversionId ORDER BY l.feed_id, l.position`,
      ),
  );
  const now = new Date().toISOString();
  const insert = (sql: string, replacements: Record<string, unknown>) =>
    insertReturningId(sequelize, sql, {
      replacements: { now, conversionId, ...replacements },
      transaction,
    });

  // The box: a fuse and a relay position per feed, named in feed order.
  const fuseOf = new Map<number, number>();
  const relayOf = new Map<number, number>();
  if (feeds.length) {
    const boxId = await insert(
      `INSERT INTO boxes (conversion_id, label, notes, version, created_at, updated_at)
       VALUES (:conversionId, 'Fuse and relay box', '', 0, :now, :now)`,
      {},
    );
    let position = 0;
    for (const [i, f] of feeds.entries()) {
      if (f.fuse_a != null) {
        fuseOf.set(
          f.id,
          await insert(
            `INSERT INTO box_positions (box_id, kind, label, fuse_type, rating_a, feed_id, position)
             VALUES (:boxId, 'fuse', :label, :type, :rating, :feedId, :position)`,
            {
              boxId,
              label: `F${i + 1}`,
              type: f.fuse_type ?? 'standard_blade',
              rating: f.fuse_a,
              feedId: f.id,
              position: position++,
            },
          ),
        );
      }
      if (f.has_relay && f.relay_contact_rating_a != null) {
        relayOf.set(
          f.id,
          await insert(
            `INSERT INTO box_positions (box_id, kind, label, contact_rating_a, coil_resistance_ohm, feed_id, position)
             VALUES (:boxId, 'relay', :label, :rating, :coil, :feedId, :position)`,
            {
              boxId,
              label: `R${i + 1}`,
              rating: f.relay_contact_rating_a,
              coil: f.relay_coil_resistance_ohm,
              feedId: f.id,
              position: position++,
            },
          ),
        );
      }
    }
  }

  let counter = 0;
  const addWire = async (
    a: End,
    b: End,
    wire: {
      colour: string;
      sizeMm2: number | null;
      insulationC: number | null;
      lengthM: number | null;
      zone: string;
    },
  ) => {
    counter += 1;
    const wireId = await insert(
      `INSERT INTO wires (conversion_id, label, colour, size_mm2, insulation_rating_c, length_m, zone, branch, notes, version, created_at, updated_at)
       VALUES (:conversionId, :label, :colour, :size, :insulation, :length, :zone, '', '', 0, :now, :now)`,
      {
        label: `W-${String(counter).padStart(3, '0')}`,
        colour: wire.colour,
        size: wire.sizeMm2,
        insulation: wire.insulationC,
        length: wire.lengthM,
        zone: wire.zone,
      },
    );
    for (const [index, end] of [a, b].entries()) {
      await insert(
        `INSERT INTO wire_ends (wire_id, end_index, kind, pin_id, box_position_id, terminal, source, text)
         VALUES (:wireId, :index, :kind, :pinId, :positionId, :terminal, :source, :text)`,
        {
          wireId,
          index,
          kind: end.kind,
          pinId: end.kind === 'pin' ? end.pinId : null,
          positionId: end.kind === 'relay' || end.kind === 'fuse' ? end.positionId : null,
          terminal: end.kind === 'relay' || end.kind === 'fuse' ? end.terminal : null,
          source: end.kind === 'source' ? end.source : null,
          text: end.kind === 'unresolved' ? end.text : '',
        },
      );
    }
  };

  // Where a feed's power comes out: its relay's 87, else its fuse's output, else its source.
  const feedById = new Map(feeds.map((f) => [f.id, f]));
  const outputOf = (f: FeedRow): End => {
    const relay = relayOf.get(f.id);
    if (relay != null) return { kind: 'relay', positionId: relay, terminal: '87' };
    const fuse = fuseOf.get(f.id);
    if (fuse != null) return { kind: 'fuse', positionId: fuse, terminal: 'out' };
    return inputOf(f);
  };
  // Where a feed takes its power from, before its own fuse.
  const inputOf = (f: FeedRow): End => {
    if (f.source === 'relay_output' && f.source_feed_id != null) {
      const upstream = feedById.get(f.source_feed_id);
      if (upstream && upstream.id !== f.id) return outputOf(upstream);
    }
    return { kind: 'source', source: f.source === 'ignition' ? 'ignition' : 'battery' };
  };

  for (const f of feeds) {
    const wire = {
      colour: f.wire_colour,
      sizeMm2: f.wire_size_mm2,
      insulationC: f.wire_insulation_rating_c,
      lengthM: null,
      zone: f.wire_zone,
    };
    const fuse = fuseOf.get(f.id);
    const relay = relayOf.get(f.id);
    if (fuse != null)
      await addWire(inputOf(f), { kind: 'fuse', positionId: fuse, terminal: 'in' }, wire);
    if (relay != null) {
      const feedSide: End =
        fuse != null ? { kind: 'fuse', positionId: fuse, terminal: 'out' } : inputOf(f);
      await addWire(feedSide, { kind: 'relay', positionId: relay, terminal: '30' }, wire);
      const coil = { ...wire, colour: '', sizeMm2: 0.5 };
      await addWire(
        { kind: 'source', source: 'ignition' },
        { kind: 'relay', positionId: relay, terminal: '86' },
        coil,
      );
      await addWire(
        { kind: 'relay', positionId: relay, terminal: '85' },
        f.relay_coil_pin_id != null
          ? { kind: 'pin', pinId: f.relay_coil_pin_id }
          : { kind: 'unresolved', text: `coil control of ${f.name}` },
        coil,
      );
    }
    // Loads that are named devices: from the feed's output to the device, its far end to be named.
    for (const l of loads.filter((x) => x.feed_id === f.id && x.pin_id == null)) {
      await addWire(
        outputOf(f),
        { kind: 'unresolved', text: l.name || `load of ${f.name}` },
        {
          ...wire,
          lengthM: f.wire_length_m,
        },
      );
    }
  }

  // Every pin that goes somewhere: to a vehicle cavity, to a feed, or to words (on the new
  // harness's side only).
  const coilPins = new Set(feeds.map((f) => f.relay_coil_pin_id).filter((id) => id != null));
  const loadPinsByFeed = new Map<number, number>();
  for (const l of loads) if (l.pin_id != null) loadPinsByFeed.set(l.pin_id, l.feed_id);
  const linked = new Set<string>();
  for (const p of pins) {
    const wire = {
      colour: p.colour,
      sizeMm2: p.size_mm2,
      insulationC: p.insulation_rating_c,
      lengthM: p.run_length_m,
      zone: 'cabin',
    };
    if (p.disposition === 'depin' || p.disposition === 'cut' || p.disposition === 'empty') continue;
    const feedId = p.destination_feed_id ?? loadPinsByFeed.get(p.id) ?? null;
    const feed = feedId != null ? feedById.get(feedId) : undefined;
    if (p.destination_pin_id != null) {
      // A pair of pins linked both ways is one wire.
      const key = [p.id, p.destination_pin_id].sort((x, y) => x - y).join('-');
      if (linked.has(key)) continue;
      linked.add(key);
      await addWire(
        { kind: 'pin', pinId: p.id },
        { kind: 'pin', pinId: p.destination_pin_id },
        wire,
      );
    } else if (feed) {
      await addWire(outputOf(feed), { kind: 'pin', pinId: p.id }, wire);
    } else if (coilPins.has(p.id)) {
      continue; // its wire is the relay coil's, above
    } else if (
      p.side !== 'vehicle' &&
      (p.disposition === 'join' || p.disposition === 'extend') &&
      p.destination.trim()
    ) {
      // A vehicle-side cavity's words say where the vehicle's own wiring goes: not a new wire.
      await addWire(
        { kind: 'pin', pinId: p.id },
        { kind: 'unresolved', text: p.destination.trim() },
        wire,
      );
    }
  }
}
