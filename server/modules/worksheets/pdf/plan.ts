/** Lookups the worksheet sections share, read from a snapshot. Pure. */
import { DISPOSITIONS, type Disposition } from '#shared/domain/dispositions.ts';
import { cavityName } from '#shared/domain/pin-names.ts';
import type {
  ConversionSnapshot,
  SnapshotConnector,
  SnapshotFeed,
  SnapshotPin,
} from '#shared/schemas/snapshot.schema.ts';

export interface PlanIndex {
  snapshot: ConversionSnapshot;
  connectors: Map<number, SnapshotConnector>;
  pins: Map<number, SnapshotPin>;
  feeds: Map<number, SnapshotFeed>;
  /** Each connector's pins in cavity order (their position on the face). */
  pinsByConnector: Map<number, SnapshotPin[]>;
}

export function indexPlan(snapshot: ConversionSnapshot): PlanIndex {
  const pinsByConnector = new Map<number, SnapshotPin[]>(
    snapshot.connectors.map((c) => [c.id, []]),
  );
  for (const pin of snapshot.pins) {
    const list = pinsByConnector.get(pin.connectorId);
    if (list) list.push(pin);
    else pinsByConnector.set(pin.connectorId, [pin]);
  }
  for (const list of pinsByConnector.values()) list.sort((a, b) => a.position - b.position);
  return {
    snapshot,
    connectors: new Map(snapshot.connectors.map((c) => [c.id, c])),
    pins: new Map(snapshot.pins.map((p) => [p.id, p])),
    feeds: new Map(snapshot.feeds.map((f) => [f.id, f])),
    pinsByConnector,
  };
}

/** Pins in the order a technician meets them: connector by connector, cavity by cavity. */
export function pinsInOrder(index: PlanIndex): SnapshotPin[] {
  const ordered: SnapshotPin[] = [];
  const seen = new Set<number>();
  for (const c of index.snapshot.connectors) {
    for (const p of index.pinsByConnector.get(c.id) ?? []) {
      ordered.push(p);
      seen.add(p.id);
    }
  }
  // Pins of a connector missing from the snapshot still print, at the end.
  for (const p of index.snapshot.pins) if (!seen.has(p.id)) ordered.push(p);
  return ordered;
}

/** "E2-5": the connector's label and the cavity. */
export function pinName(index: PlanIndex, pinOrId: SnapshotPin | number): string {
  const pin = typeof pinOrId === 'number' ? index.pins.get(pinOrId) : pinOrId;
  if (!pin) return `pin #${String(pinOrId)}`;
  return cavityName(index.connectors.get(pin.connectorId)?.label ?? '?', pin.cavity);
}

export interface Destination {
  kind: 'pin' | 'feed' | 'text' | 'none';
  text: string;
}

/** Where a pin goes: a linked vehicle cavity ("V1-3"), a linked feed ("Feed: ECU main"), or text. */
export function destinationOf(index: PlanIndex, pin: SnapshotPin): Destination {
  if (pin.destinationPinId != null) {
    return { kind: 'pin', text: pinName(index, pin.destinationPinId) };
  }
  if (pin.destinationFeedId != null) {
    const feed = index.feeds.get(pin.destinationFeedId);
    return { kind: 'feed', text: `Feed: ${feed?.name ?? `#${pin.destinationFeedId}`}` };
  }
  if (pin.destination.trim()) return { kind: 'text', text: pin.destination };
  return { kind: 'none', text: '' };
}

export function dispositionCounts(snapshot: ConversionSnapshot): Record<Disposition, number> {
  const counts = Object.fromEntries(DISPOSITIONS.map((d) => [d, 0])) as Record<Disposition, number>;
  for (const p of snapshot.pins) counts[p.disposition] += 1;
  return counts;
}

/** The bench steps, in the order they are worked: take out, cut back, lengthen, connect. */
export const ACTION_STEPS = ['depin', 'cut', 'extend', 'join'] as const;
export type ActionStep = (typeof ACTION_STEPS)[number];

export function actionLists(index: PlanIndex): Record<ActionStep | 'undecided', SnapshotPin[]> {
  const lists: Record<ActionStep | 'undecided', SnapshotPin[]> = {
    depin: [],
    cut: [],
    extend: [],
    join: [],
    undecided: [],
  };
  for (const pin of pinsInOrder(index)) {
    if (pin.disposition in lists) lists[pin.disposition as ActionStep | 'undecided'].push(pin);
  }
  return lists;
}
