/**
 * The wire cut list and the parts count, read from the plan. Pure.
 *
 * New wire (one piece each, grouped by size × colour):
 *  - each feed's wire, fuse (or relay) to load, at its `wire.lengthM`, in its size and colour;
 *  - for a feed with its own return wire (two-wire), a return conductor of the same size and
 *    length — the checks compute the voltage drop over that round trip — colour not set;
 *  - each extended or joined pin's own run at its `runLengthM`, in the pin's size and colour, when
 *    the length is recorded. Extended or joined pins without a length are listed to measure.
 * Each group's length is increased by the workshop's service allowance.
 *
 * Parts (estimates from the plan; check them against the connector kit):
 *  - splices: two per extended pin (a length let into the cut wire, one joint at each end), and one
 *    per feed that pins are joined to (the feed wire and all its pins' wires in one joint);
 *  - terminals: one per joined pin whose destination is not a feed (its far end, in a vehicle
 *    cavity, on a stud or a relay), one per feed at its fuse or relay end, one per feed load that is
 *    a device rather than a pin, and two per return wire;
 *  - end caps: one per cut-and-insulated pin; seal plugs: one per de-pinned cavity (sealed housings).
 */
import type { SnapshotPin } from '#shared/schemas/snapshot.schema.ts';
import { pinName, pinsInOrder, type PlanIndex } from './plan.ts';

export interface CutPart {
  label: string;
  lengthM: number;
}

export interface CutRow {
  /** Null when the plan records no size. */
  sizeMm2: number | null;
  /** "" when the plan records no colour. */
  colour: string;
  pieces: number;
  lengthM: number;
  /** Length with the service allowance added. */
  cutM: number;
  parts: CutPart[];
}

export interface PartsCount {
  splices: number;
  terminals: number;
  endCaps: number;
  sealPlugs: number;
}

export interface CutList {
  rows: CutRow[];
  allowancePct: number;
  totalLengthM: number;
  totalCutM: number;
  parts: PartsCount;
  /** Extended or joined pins whose run length is not recorded: measure them at the bench. */
  unmeasured: SnapshotPin[];
}

const NEEDS_WIRE = new Set(['extend', 'join']);

export function withAllowance(lengthM: number, allowancePct: number): number {
  return lengthM * (1 + allowancePct / 100);
}

export function buildCutList(index: PlanIndex, allowancePct: number): CutList {
  const groups = new Map<string, CutRow>();
  const add = (sizeMm2: number | null, colour: string, part: CutPart) => {
    const key = `${sizeMm2 ?? ''}|${colour}`;
    let row = groups.get(key);
    if (!row) {
      row = { sizeMm2, colour, pieces: 0, lengthM: 0, cutM: 0, parts: [] };
      groups.set(key, row);
    }
    row.pieces += 1;
    row.lengthM += part.lengthM;
    row.parts.push(part);
  };

  const parts: PartsCount = { splices: 0, terminals: 0, endCaps: 0, sealPlugs: 0 };
  const unmeasured: SnapshotPin[] = [];
  const feedsWithPins = new Set<number>();

  for (const feed of index.snapshot.feeds) {
    add(feed.wire.sizeMm2, feed.wire.colour, {
      label: `Feed ${feed.name}`,
      lengthM: feed.wire.lengthM,
    });
    parts.terminals += 1;
    parts.terminals += feed.loads.filter((l) => l.pinId == null).length;
    if (feed.wire.returnPath === 'wire') {
      add(feed.wire.sizeMm2, '', { label: `Feed ${feed.name} return`, lengthM: feed.wire.lengthM });
      parts.terminals += 2;
    }
  }

  for (const pin of pinsInOrder(index)) {
    switch (pin.disposition) {
      case 'depin':
        parts.sealPlugs += 1;
        break;
      case 'cut':
        parts.endCaps += 1;
        break;
      case 'extend':
        parts.splices += 2;
        break;
      case 'join':
        if (pin.destinationFeedId != null && index.feeds.has(pin.destinationFeedId)) {
          feedsWithPins.add(pin.destinationFeedId);
        } else {
          parts.terminals += 1;
        }
        break;
      default:
        break;
    }
    if (!NEEDS_WIRE.has(pin.disposition)) continue;
    if (pin.runLengthM != null && pin.runLengthM > 0) {
      add(pin.sizeMm2, pin.colour, { label: pinName(index, pin), lengthM: pin.runLengthM });
    } else {
      unmeasured.push(pin);
    }
  }
  parts.splices += feedsWithPins.size;

  const rows = [...groups.values()]
    .map((row) => ({ ...row, cutM: withAllowance(row.lengthM, allowancePct) }))
    .sort(
      (a, b) =>
        (a.sizeMm2 ?? Infinity) - (b.sizeMm2 ?? Infinity) ||
        (a.colour === '' ? 1 : 0) - (b.colour === '' ? 1 : 0) ||
        a.colour.localeCompare(b.colour),
    );
  const totalLengthM = rows.reduce((s, r) => s + r.lengthM, 0);
  return {
    rows,
    allowancePct,
    totalLengthM,
    totalCutM: withAllowance(totalLengthM, allowancePct),
    parts,
    unmeasured,
  };
}

/** Lengths print in metres to the centimetre. */
export function formatMetres(m: number): string {
  return m.toFixed(2);
}

/** The rules above, as the worksheet's small print says them. */
export const CUT_LIST_RULES = [
  'New wire: each feed’s wire from its fuse or relay to its load at the feed’s length; a return wire of the same size and length for each feed with its own return wire (colour not set in the plan); and each extended or joined pin’s own run where its length is recorded. Pins without a recorded length are listed above: measure them at the bench and add them.',
  'The service allowance is added to every length: cut to the “Cut” column.',
  'Splices: two per extended pin (one at each end of the added length) and one per feed that pins are joined to (the feed wire and all its pins in one joint).',
  'Terminals: one at the far end of each joined pin that does not go to a feed, one at each feed’s fuse or relay, one per feed load that is a device rather than a pin, and two per return wire.',
  'End caps: one per cut-and-insulated wire. Seal plugs: one per de-pinned cavity of a sealed housing.',
  'Counts are estimates from the plan: check them against the connector kit and the terminals’ wire ranges.',
];
